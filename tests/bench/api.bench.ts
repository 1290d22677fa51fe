/**
 * `npm run bench -- api`: the API as production runs it — `server/start.ts` with one
 * process per core (WEB_CONCURRENCY, default every core), NODE_ENV=production,
 * connected as the application's role — against a bare Express JSON handler in one
 * process on the same loopback, with autocannon in this process:
 *
 * - POST /api/v1/sightline (session check + 3 conditions) at 50 connections,
 * - GET /api/v1/sites (session check + one query) at 50 connections,
 * - the bare handler at 50 connections (the reference),
 * - both API routes alternating for 60 s at 200 connections (errors, timeouts, non-2xx).
 *
 * After a 5 s warm-up of each route, each short load runs KENNING_BENCH_RUNS times (default 3) for KENNING_BENCH_SECONDS
 * (default 10); the medians are printed with the load average, because the machine is
 * shared. KENNING_BENCH_CPU_PROF=DIR writes a V8 CPU profile of every server process
 * there (`--cpu-prof`). Measurement only, never a pass or fail.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { DEMO_PASSWORD } from '@/server/seeders/demo';
import { freePort } from '@/tests/support/free-port';

const root = path.resolve(__dirname, '../..');

const BODY = JSON.stringify({
  observerHeightM: 30,
  targetHeightM: 10,
  distanceM: 25000,
  visibilityM: 20000,
  targetSizeM: 3,
  conditions: [{ k: 0.13 }, { preset: 'radio-four-thirds' }, { pressureHpa: 1013.25, temperatureC: 15, lapseRateKPerM: 0.0065 }],
});

const BARE_HANDLER = `
const express = require('express');
const app = express();
app.post('/x', express.json(), (req, res) => res.json({ ok: true, n: Object.keys(req.body).length }));
const s = app.listen(0, '127.0.0.1', () => console.log('listening ' + s.address().port));
process.on('disconnect', () => process.exit(0));
`;

/** Starts a child and resolves once `ready` matches a line of its output. */
function startChild(command: string[], env: NodeJS.ProcessEnv, ready: RegExp) {
  const child = spawn(process.execPath, command, { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe', 'ipc'] });
  return new Promise<{ child: ChildProcess; match: RegExpMatchArray }>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`${command.join(' ')} did not start within 120 s`)), 120_000);
    let out = '';
    const onData = (chunk: Buffer) => {
      out += String(chunk);
      const match = out.match(ready);
      if (match) {
        clearTimeout(timer);
        resolve({ child, match });
      }
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', (chunk: Buffer) => process.stderr.write(chunk));
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`${command.join(' ')} exited with ${code}:\n${out}`));
    });
  });
}

const stopChild = (child: ChildProcess) =>
  new Promise<void>((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve();
    child.once('exit', () => resolve());
    child.kill('SIGTERM');
    setTimeout(() => child.kill('SIGKILL'), 15_000).unref();
  });

interface Load {
  rps: number;
  p50: number;
  p99: number;
  non2xx: number;
  errors: number;
  timeouts: number;
  load1: number;
}

async function load(options: autocannon.Options): Promise<Load> {
  const r = await autocannon(options);
  return {
    rps: r.requests.average,
    p50: r.latency.p50,
    p99: r.latency.p99,
    non2xx: r.non2xx,
    errors: r.errors,
    timeouts: r.timeouts,
    load1: os.loadavg()[0]!,
  };
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};

const summary = (runs: Load[]) => ({
  rps: median(runs.map((r) => r.rps)),
  p50: median(runs.map((r) => r.p50)),
  p99: median(runs.map((r) => r.p99)),
  detail: `median of ${runs.length}: p50 ${median(runs.map((r) => r.p50))} ms, p99 ${median(runs.map((r) => r.p99))} ms; runs ${runs
    .map((r) => Math.round(r.rps))
    .join(' / ')} req/s; non-2xx ${runs.reduce((n, r) => n + r.non2xx, 0)}, errors ${runs.reduce(
    (n, r) => n + r.errors + r.timeouts,
    0,
  )}; load average ${runs.map((r) => r.load1.toFixed(1)).join(' / ')}`,
});

export async function benchApi(appDatabaseUrl: string, filesDir: string) {
  const runs = Number(process.env.KENNING_BENCH_RUNS ?? 3);
  const seconds = Number(process.env.KENNING_BENCH_SECONDS ?? 10);
  const soakSeconds = Number(process.env.KENNING_BENCH_SOAK_SECONDS ?? 60);
  const profileDir = process.env.KENNING_BENCH_CPU_PROF;
  const processes = process.env.WEB_CONCURRENCY ?? String(os.availableParallelism());
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const server = await startChild(
    [
      ...(profileDir ? ['--cpu-prof', `--cpu-prof-dir=${profileDir}`] : []),
      '--import',
      'tsx',
      path.join(root, 'server/start.ts'),
    ],
    {
      ...process.env,
      NODE_ENV: 'production',
      DATABASE_URL: appDatabaseUrl,
      SESSION_SECRET: randomBytes(32).toString('base64url'),
      PUBLIC_URL: base,
      HOST: '127.0.0.1',
      PORT: String(port),
      WEB_CONCURRENCY: processes,
      FILE_STORE_DIR: filesDir,
    },
    /serving on/,
  );
  const bare = await startChild(['-e', BARE_HANDLER], process.env, /listening (\d+)/);
  const barePort = Number(bare.match[1]);
  try {
    // Production checks Origin on writes: a browser on the public URL sends it.
    const origin = base;
    const signIn = await fetch(`${base}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin },
      body: JSON.stringify({ email: 'planner@demo.kenning.test', password: DEMO_PASSWORD }),
    });
    if (signIn.status !== 200) throw new Error(`sign-in failed: ${signIn.status} ${await signIn.text()}`);
    const cookie = signIn.headers.getSetCookie()[0]!.split(';')[0]!;
    const sightline = {
      method: 'POST' as const,
      path: '/api/v1/sightline',
      body: BODY,
      headers: { 'content-type': 'application/json', cookie, origin },
    };
    const sites = { method: 'GET' as const, path: '/api/v1/sites', headers: { cookie } };

    // Warm-up, not counted: each process compiles (tsx) and optimises (V8) on its first requests.
    await load({ url: base, connections: 50, duration: 5, requests: [sightline] });
    await load({ url: base, connections: 50, duration: 5, requests: [sites] });
    const sightlineRuns: Load[] = [];
    const siteRuns: Load[] = [];
    const bareRuns: Load[] = [];
    // Interleaved, so a burst of someone else's work falls on all three alike.
    for (let i = 0; i < runs; i++) {
      sightlineRuns.push(await load({ url: base, connections: 50, duration: seconds, requests: [sightline] }));
      siteRuns.push(await load({ url: base, connections: 50, duration: seconds, requests: [sites] }));
      bareRuns.push(
        await load({
          url: `http://127.0.0.1:${barePort}/x`,
          method: 'POST',
          body: BODY,
          headers: { 'content-type': 'application/json' },
          connections: 50,
          duration: seconds,
        }),
      );
    }
    const soak = await load({ url: base, connections: 200, duration: soakSeconds, requests: [sightline, sites], timeout: 10 });

    const s = summary(sightlineRuns);
    const l = summary(siteRuns);
    const b = summary(bareRuns);
    return [
      { name: `POST /api/v1/sightline, 50 connections (${processes} processes)`, value: s.rps, unit: 'req/s', detail: s.detail },
      { name: `GET /api/v1/sites, 50 connections (${processes} processes)`, value: l.rps, unit: 'req/s', detail: l.detail },
      { name: 'bare Express JSON handler, 50 connections (1 process)', value: b.rps, unit: 'req/s', detail: b.detail },
      { name: 'sightline route / bare handler', value: s.rps / b.rps, unit: 'ratio', detail: '' },
      { name: 'site list / bare handler', value: l.rps / b.rps, unit: 'ratio', detail: '' },
      {
        name: `sightline + site list alternating, 200 connections, ${soakSeconds} s`,
        value: soak.rps,
        unit: 'req/s',
        detail: `p50 ${soak.p50} ms, p99 ${soak.p99} ms, non-2xx ${soak.non2xx}, errors ${soak.errors}, timeouts ${soak.timeouts}, load average ${soak.load1.toFixed(1)}`,
      },
    ];
  } finally {
    await stopChild(server.child);
    await stopChild(bare.child);
  }
}
