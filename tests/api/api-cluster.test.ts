import { execFile, spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { promisify } from 'node:util';
import { createTestDatabase, scratchFileStore } from '@/tests/support/test-db';
import { DEMO } from '@/tests/support/agents';
import { DEMO_PASSWORD } from '@/server/seeders/demo';
import { freePort } from '@/tests/support/free-port';

// `server/start.ts` as `npm start` runs it: two API processes behind one port
// (Node's cluster), each keeping signed-in users in memory for a few seconds. A
// copied cookie is refused by both right after sign-out; an API process killed
// outright is replaced while the other keeps answering; SIGTERM stops them all.

const run = promisify(execFile);
let drop: () => Promise<void>;
let primary: ChildProcess;
let base: string;
let output = '';

/** The primary's children: the API processes. */
const apiProcesses = async () => {
  const { stdout } = await run('pgrep', ['-P', String(primary.pid)]).catch(() => ({ stdout: '' }));
  return stdout.split('\n').filter(Boolean).map(Number);
};

beforeAll(async () => {
  const database = await createTestDatabase();
  drop = async () => {
    await database.drop();
  };
  await database.db.close();
  const port = await freePort();
  base = `http://127.0.0.1:${port}`;
  const root = path.resolve(__dirname, '../..');
  primary = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server/start.ts')], {
    cwd: root,
    env: {
      ...process.env,
      DATABASE_URL: database.url,
      PORT: String(port),
      HOST: '127.0.0.1',
      NODE_ENV: 'test',
      WEB_CONCURRENCY: '2',
      SESSION_CACHE_SECONDS: '30',
      FILE_STORE_DIR: scratchFileStore().filesDir,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  primary.stdout!.on('data', (chunk: Buffer) => (output += String(chunk)));
  primary.stderr!.on('data', (chunk: Buffer) => (output += String(chunk)));
  const until = Date.now() + 90_000;
  while (!output.includes('serving on') || (await apiProcesses()).length < 2) {
    if (Date.now() > until || primary.exitCode !== null) throw new Error(`the server did not start:\n${output}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}, 120_000);
afterAll(async () => {
  if (primary.exitCode === null && primary.signalCode === null) primary.kill('SIGKILL');
  for (const pid of await apiProcesses()) process.kill(pid, 'SIGKILL');
  await drop();
});

/** `count` requests on fresh connections, so the primary deals them to both processes. */
const statuses = async (count: number, pathname: string, cookie?: string) => {
  const out: number[] = [];
  for (let i = 0; i < count; i++) {
    const res = await fetch(base + pathname, {
      headers: { connection: 'close', ...(cookie && { cookie }) },
      signal: AbortSignal.timeout(10_000),
    });
    await res.arrayBuffer();
    out.push(res.status);
  }
  return out;
};

it('refuses a copied cookie on every API process right after sign-out, with their caches warm', async () => {
  const signIn = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', connection: 'close' },
    body: JSON.stringify({ email: DEMO.planner, password: DEMO_PASSWORD }),
  });
  expect(signIn.status).toBe(200);
  const cookie = signIn.headers.getSetCookie()[0]!.split(';')[0]!;
  // Both processes have seen (and kept) the session.
  expect(await statuses(8, '/api/me', cookie)).toEqual(Array(8).fill(200));

  const out = await fetch(`${base}/api/auth/sign-out`, { method: 'POST', headers: { cookie, connection: 'close' } });
  expect(out.status).toBe(204);
  expect(await statuses(8, '/api/me', cookie)).toEqual(Array(8).fill(401));
}, 60_000);

it('replaces an API process killed outright while the other keeps answering, and stops them all on SIGTERM', async () => {
  const [victim, survivor] = await apiProcesses();
  expect(survivor).toBeDefined();
  process.kill(victim!, 'SIGKILL');
  // Once the primary has seen it go (a connection dealt to it in that instant is lost with it),
  // the other process answers everything.
  const noticed = Date.now() + 10_000;
  while (!/API process \d+ stopped unexpectedly/.test(output) && Date.now() < noticed)
    await new Promise((r) => setTimeout(r, 50));
  expect(await statuses(6, '/api/health')).toEqual(Array(6).fill(200));

  const until = Date.now() + 30_000;
  let now = await apiProcesses();
  while ((now.length < 2 || now.includes(victim!)) && Date.now() < until) {
    await new Promise((r) => setTimeout(r, 250));
    now = await apiProcesses();
  }
  expect(now).toHaveLength(2);
  expect(now).toContain(survivor);
  expect(output).toMatch(/API process \d+ stopped unexpectedly \(SIGKILL\); starting another in 1 s/);
  // The new process serves too (fresh connections reach both).
  await new Promise((r) => setTimeout(r, 3000));
  expect(await statuses(6, '/api/health')).toEqual(Array(6).fill(200));

  const exited = new Promise<number | null>((resolve) => primary.once('exit', (code) => resolve(code)));
  primary.kill('SIGTERM');
  expect(await exited).toBe(0);
  expect(await apiProcesses()).toEqual([]);
}, 90_000);
