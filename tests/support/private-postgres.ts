import { execFile } from 'node:child_process';
import { chownSync, existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { freePort } from './free-port';

const run = promisify(execFile);

function postgresBinDir(): string {
  const base = '/usr/lib/postgresql';
  const versions = existsSync(base)
    ? readdirSync(base)
        .filter((v) => existsSync(path.join(base, v, 'bin', 'pg_ctl')))
        .sort((a, b) => Number(b) - Number(a))
    : [];
  if (!versions[0]) throw new Error('PostgreSQL is not installed (no /usr/lib/postgresql/*/bin/pg_ctl)');
  return path.join(base, versions[0], 'bin');
}

/**
 * A PostgreSQL cluster of the test's own (initdb in a temporary folder, loopback, trust),
 * for fault tests that stop and start the server itself: stopping the shared test
 * cluster would break every other test file running at the same time. PostgreSQL
 * refuses to run as root, so as root the server tools run as `postgres`.
 */
export async function startPrivatePostgres() {
  const bin = postgresBinDir();
  const root = process.getuid?.() === 0;
  const dir = mkdtempSync(path.join(os.tmpdir(), 'kenning-private-pg-'));
  if (root) {
    const uid = Number((await run('id', ['-u', 'postgres'])).stdout.trim());
    const gid = Number((await run('id', ['-g', 'postgres'])).stdout.trim());
    chownSync(dir, uid, gid);
  }
  const asServer = (tool: string, args: string[]) =>
    root
      ? run('runuser', ['-u', 'postgres', '--', path.join(bin, tool), ...args], { cwd: '/' })
      : run(path.join(bin, tool), args, { cwd: '/' });
  const data = path.join(dir, 'data');
  const port = await freePort();
  await asServer('initdb', ['-D', data, '-U', 'kenning', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
  const options = `-c listen_addresses=127.0.0.1 -c port=${port} -c unix_socket_directories=${dir} -c fsync=off`;
  const start = () => asServer('pg_ctl', ['-D', data, '-l', path.join(dir, 'log'), '-w', '-t', '60', '-o', options, 'start']);
  /** A fast shutdown: clients are disconnected (57P01), new connections refused. */
  const stop = () => asServer('pg_ctl', ['-D', data, '-m', 'fast', '-w', 'stop']);
  await start();
  return {
    port,
    url: (database: string) => `postgres://kenning@127.0.0.1:${port}/${database}`,
    /** Runs a client tool of this PostgreSQL version (psql, pg_dump, pg_restore). */
    client: (tool: string, args: string[]) => run(path.join(bin, tool), args, { maxBuffer: 64 * 2 ** 20 }),
    start,
    stop,
    async destroy() {
      await stop().catch(() => {});
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
