import { rm } from 'node:fs/promises';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import type request from 'supertest';
import { createApp } from '@/server/app';
import type { ComputeViewsheds } from '@/server/domain/coverage/compute-coverage';
import { poolViewsheds } from '@/server/domain/coverage/process-coverage-run';
import { startCoverageBoss, type CoverageBoss } from '@/server/queue/coverage-queue';
import { createTerrainCache, type TerrainCache } from '@/server/terrain/terrain-cache';
import { createViewshedPool, type ViewshedPool } from '@/server/workers/viewshed-pool';
import { DEMO, signedInAgent } from '@/tests/support/agents';
import { createTestDatabase, scratchFileStore, TEST_CONFIG } from '@/tests/support/test-db';

/**
 * What a test of queued runs stands on: its own database, a terrain cache on
 * scratch files, a one-thread viewshed pool, the job queue (pg-boss on the
 * test database) and the app on them, with the demo planner signed in. A test
 * may replace `boss` (a restart of the queue); `close` stops the one it holds.
 */
export interface QueueTestbed {
  readonly db: Sequelize;
  readonly url: string;
  readonly cache: TerrainCache;
  readonly pool: ViewshedPool;
  boss: CoverageBoss;
  readonly app: Express;
  readonly planner: request.Agent;
  /** Stops the queue and the pool, drops the database and removes the scratch files. */
  close(): Promise<void>;
}

/** Opens a testbed; `sitingQueue` also gives the app the siting queue. */
export async function openQueueTestbed(options: { sitingQueue?: boolean } = {}): Promise<QueueTestbed> {
  const { db, url, drop } = await createTestDatabase();
  const store = scratchFileStore();
  const cache = createTerrainCache({ files: store.files, maxBytes: 2 ** 28 });
  const pool = createViewshedPool({ size: 1 });
  const boss = await startCoverageBoss(url);
  const app = createApp({
    db,
    config: TEST_CONFIG,
    files: store.files,
    terrainCache: cache,
    coverageQueue: boss.queue,
    ...(options.sitingQueue ? { sitingQueue: boss.sitingQueue } : {}),
  });
  const planner = await signedInAgent(app, DEMO.planner);
  const testbed: QueueTestbed = {
    db,
    url,
    cache,
    pool,
    boss,
    app,
    planner,
    close: async () => {
      await testbed.boss.stop();
      await pool.close();
      await drop();
      await rm(store.filesDir, { recursive: true, force: true });
    },
  };
  return testbed;
}

/** The pool's viewsheds, each batch first waiting for `gate` when one is given (to hold a run mid-way). */
export function gatedViewsheds(pool: ViewshedPool, gate?: () => Promise<void>): ComputeViewsheds {
  const viewsheds = poolViewsheds(pool);
  return async (terrain, jobs, onDone) => {
    await gate?.();
    return viewsheds(terrain, jobs, onDone);
  };
}

/**
 * A gate that holds every viewshed batch until `release` is called; `inside`
 * settles once the first batch has reached it (the run is then mid-way).
 */
export function holdingGate(): { gate: () => Promise<void>; inside: Promise<void>; release: () => void } {
  let release!: () => void;
  const held = new Promise<void>((r) => (release = r));
  let entered!: () => void;
  const inside = new Promise<void>((r) => (entered = r));
  const gate = async () => {
    entered();
    await held;
  };
  return { gate, inside, release };
}
