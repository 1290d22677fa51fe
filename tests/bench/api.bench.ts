/**
 * Requests per second of POST /api/v1/sightline (session check + evaluation)
 * against a bare Express JSON handler, both on loopback with autocannon.
 * Measurement only. Needs the bench database `npm run bench` prepares.
 */
import type { AddressInfo } from 'node:net';
import autocannon from 'autocannon';
import express from 'express';
import request from 'supertest';
import { createApp } from '@/server/app';
import { createDatabase } from '@/server/data/database';
import { DEMO_PASSWORD } from '@/server/seeders/demo';
import { scratchFileStore, TEST_CONFIG } from '@/tests/support/test-db';

const BODY = JSON.stringify({
  observerHeightM: 30,
  targetHeightM: 10,
  distanceM: 25000,
  visibilityM: 20000,
  targetSizeM: 3,
  conditions: [{ k: 0.13 }, { preset: 'radio-four-thirds' }, { pressureHpa: 1013.25, temperatureC: 15, lapseRateKPerM: 0.0065 }],
});

async function listen(app: express.Express) {
  return new Promise<import('node:http').Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
}

async function load(url: string, headers: Record<string, string>, seconds: number) {
  const r = await autocannon({ url, method: 'POST', body: BODY, headers: { 'content-type': 'application/json', ...headers }, connections: 10, duration: seconds });
  return { rps: r.requests.average, p50: r.latency.p50, p99: r.latency.p99, non2xx: r.non2xx };
}

export async function benchApi(databaseUrl: string, seconds = 5) {
  const db = createDatabase(databaseUrl);
  const app = createApp({ db, config: TEST_CONFIG, files: scratchFileStore().files });
  const server = await listen(app);
  const bare = express();
  bare.post('/x', express.json(), (req, res) => res.json({ ok: true, n: Object.keys(req.body as object).length }));
  const bareServer = await listen(bare);
  try {
    const signIn = await request(app).post('/api/auth/sign-in').send({ email: 'observer@demo.kenning.test', password: DEMO_PASSWORD });
    const cookie = (signIn.headers['set-cookie'] as unknown as string[])[0]!.split(';')[0]!;
    const port = (server.address() as AddressInfo).port;
    const barePort = (bareServer.address() as AddressInfo).port;
    const kenning = await load(`http://127.0.0.1:${port}/api/v1/sightline`, { cookie }, seconds);
    const plain = await load(`http://127.0.0.1:${barePort}/x`, {}, seconds);
    return [
      { name: 'POST /api/v1/sightline (3 conditions), requests/s', value: kenning.rps, unit: 'req/s', detail: `p50 ${kenning.p50} ms, p99 ${kenning.p99} ms, non-2xx ${kenning.non2xx}` },
      { name: 'bare Express JSON handler, requests/s', value: plain.rps, unit: 'req/s', detail: `p50 ${plain.p50} ms, p99 ${plain.p99} ms` },
      { name: 'sightline route / bare handler', value: kenning.rps / plain.rps, unit: 'ratio', detail: '' },
    ];
  } finally {
    server.close();
    bareServer.close();
    await db.close();
  }
}
