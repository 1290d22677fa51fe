import os from 'node:os';
import path from 'node:path';
import type { Sequelize } from 'sequelize';
import { createApp } from '@/server/app';
import { createTestDatabase, scratchFileStore, TEST_CONFIG } from '@/tests/support/test-db';
import { DEMO } from '@/tests/support/agents';
import { listen } from '@/tests/support/live-server';
import { startTcpProxy } from '@/tests/support/tcp-proxy';
import { waitFor } from '@/tests/support/wait';

// PostgreSQL goes away under load and comes back. The app reaches it through a
// relay the test cuts (every connection reset, new ones refused) and restores: the
// shared test cluster itself keeps running for the other test files.

let proxy: Awaited<ReturnType<typeof startTcpProxy>>;
let db: Sequelize;
let drop: () => Promise<void>;
let live: Awaited<ReturnType<typeof listen>>;

beforeAll(async () => {
  const admin = new URL(process.env.KENNING_ADMIN_DATABASE_URL ?? 'postgres://x@127.0.0.1:5432/postgres');
  proxy = await startTcpProxy({ host: admin.hostname, port: Number(admin.port || 5432) });
  ({ db, drop } = await createTestDatabase({
    connectThrough: (url) => {
      url.port = String(proxy.port);
      return url;
    },
  }));
  const { files } = scratchFileStore();
  live = await listen(
    createApp({ db, files, config: { ...TEST_CONFIG, TERRAIN_UPLOAD_DIR: path.join(os.tmpdir(), 'kenning-outage-uploads') } }),
  );
});
afterAll(async () => {
  await live.close();
  await drop();
  await proxy.stop();
});

it('answers 503 database_unavailable with Retry-After while it is away, logs once, and recovers', async () => {
  const cookie = await live.signIn(DEMO.planner);
  expect((await live.call('GET', '/api/v1/sites', { cookie })).status).toBe(200);

  const errors = jest.spyOn(console, 'error').mockImplementation(() => {});
  const warnings = jest.spyOn(console, 'warn').mockImplementation(() => {});
  try {
    await proxy.stop();

    // A burst of reads and writes while it is away.
    const away = await Promise.all(
      Array.from({ length: 40 }, (_, i) =>
        i % 4 === 0
          ? live.call('POST', '/api/v1/targets', {
              cookie,
              json: { name: `Outage ${i}`, kind: 'vehicle', heightM: 3, widthM: 2 },
            })
          : live.call('GET', '/api/v1/sites', { cookie }),
      ),
    );
    for (const r of away) {
      expect(r.status).toBe(503);
      expect(r.body.error.code).toBe('database_unavailable');
      expect(Number(r.headers.get('retry-after'))).toBeGreaterThan(0);
    }
    const health = await live.call('GET', '/api/health');
    expect(health.status).toBe(503);
    expect(health.body.db).toBe('down');

    // One line for the outage, not one per request.
    const outageLines = errors.mock.calls.filter((c) => String(c[0]).includes('database unavailable'));
    expect(outageLines).toHaveLength(1);
    expect(errors.mock.calls.filter((c) => String(c[0]).includes('failed:'))).toHaveLength(0);

    await proxy.start();
    const back = await waitFor(async () => (await live.call('GET', '/api/v1/sites', { cookie })).status === 200, 15);
    expect(back).toBe(true);
    expect((await live.call('GET', '/api/health')).status).toBe(200);
    // The recovery is logged once, with how many requests were refused.
    const recovered = await waitFor(
      async () => warnings.mock.calls.some((c) => /reachable again .* (\d+) request/.test(String(c[0]))),
      5,
    );
    expect(recovered).toBe(true);
  } finally {
    errors.mockRestore();
    warnings.mockRestore();
  }
}, 60_000);
