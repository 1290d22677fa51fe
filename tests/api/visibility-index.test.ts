import { mkdtempSync, readFileSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import type request from 'supertest';
import {
  VISIBILITY_INDEX_CLASS_COUNT,
  VisibilityIndexResponseSchema,
  type VisibilityIndex,
} from '@/shared/schemas/visibility-index';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import { computeVisibilityIndex } from '@/shared/terrain/visibility-index';
import { createApp } from '@/server/app';
import { visibilityIndexRepository } from '@/server/data/repositories/visibility-index-repository';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
import { processVisibilityIndex } from '@/server/domain/visibility-index/process-visibility-index';
import { startCoverageBoss, type CoverageBoss } from '@/server/queue/coverage-queue';
import { visibilityIndexQueue, workVisibilityIndexQueue } from '@/server/queue/visibility-index-queue';
import { createTerrainCache, type TerrainCache } from '@/server/terrain/terrain-cache';
import { threadedVisibilityIndex } from '@/server/workers/visibility-index-pool';
import { DEMO, signedInAgent } from '@/tests/support/agents';
import { createTestDatabase, scratchFileStore, TEST_CONFIG } from '@/tests/support/test-db';

/*
 * The visibility index through the real job queue (pg-boss on the test
 * database): the API queues, a worker on its own pg-boss (as the worker
 * process has) computes on two threads, the API answers the layer.
 */

jest.setTimeout(180_000);

// The invented fixture terrain: 160 × 150 cells of 30 m in WGS 84 / UTM zone 29N (tests/fixtures/terrain/README.md).
const TIF = readFileSync(path.join(__dirname, '..', 'fixtures', 'terrain', 'small-hill-utm29.tif'));

let drop: () => Promise<void>;
let filesDir: string;
let uploadsDir: string;
let cache: TerrainCache;
let apiBoss: CoverageBoss;
let workerBoss: CoverageBoss;
let app: Express;
let planner: request.Agent;
let observer: request.Agent;
let otherPlanner: request.Agent;
const outcomes: string[] = [];

const wait = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function siteWithTerrain(name: string): Promise<string> {
  const site = (await planner.post('/api/v1/sites').send({ name, kind: 'forest-district' }).expect(201)).body.site;
  await planner.post(`/api/v1/sites/${site.id}/terrain`).attach('file', TIF, 'small-hill-utm29.tif').expect(201);
  return site.id as string;
}

async function pollUntilDone(agent: request.Agent, url: string): Promise<VisibilityIndex> {
  for (let i = 0; i < 600; i++) {
    const res = await agent.get(url);
    const { index } = VisibilityIndexResponseSchema.parse(res.body);
    if (index.status === 'done') {
      expect(res.status).toBe(200);
      return index;
    }
    expect(res.status).toBe(index.status === 'failed' ? 200 : 202);
    if (index.status === 'failed') throw new Error(`the layer failed: ${index.error}`);
    await wait(200);
  }
  throw new Error('the layer was not computed in time');
}

beforeAll(async () => {
  const database = await createTestDatabase();
  drop = database.drop;
  const store = scratchFileStore();
  filesDir = store.filesDir;
  uploadsDir = mkdtempSync(path.join(os.tmpdir(), 'kenning-uploads-'));
  cache = createTerrainCache({ files: store.files, maxBytes: 2 ** 28 });
  apiBoss = await startCoverageBoss(database.url, { supervise: false });
  app = createApp({
    db: database.db,
    config: { ...TEST_CONFIG, TERRAIN_UPLOAD_DIR: uploadsDir },
    files: store.files,
    terrainCache: cache,
    visibilityIndexQueue: await visibilityIndexQueue(apiBoss.boss),
  });
  workerBoss = await startCoverageBoss(database.url, { supervise: false });
  const compute = threadedVisibilityIndex(2);
  await workVisibilityIndexQueue(workerBoss.boss, async (layerId) => {
    outcomes.push(await processVisibilityIndex({ cache, compute }, layerId));
  });
  [planner, observer, otherPlanner] = await Promise.all([
    signedInAgent(app, DEMO.planner),
    signedInAgent(app, DEMO.observer),
    signedInAgent(app, DEMO.otherPlanner),
  ]);
});
afterAll(async () => {
  await workerBoss.stop();
  await apiBoss.stop();
  await drop();
  await rm(filesDir, { recursive: true, force: true });
  await rm(uploadsDir, { recursive: true, force: true });
});

describe('GET /api/v1/sites/:siteId/visibility-index', () => {
  it('queues a job (202), then answers the layer (200), the same one again without a new job', async () => {
    const siteId = await siteWithTerrain('Heat map hills');
    const url = `/api/v1/sites/${siteId}/visibility-index?heightM=15&radiusM=1500`;
    const first = await observer.get(url).expect(202);
    const queued = VisibilityIndexResponseSchema.parse(first.body).index;
    expect(['queued', 'running']).toContain(queued.status);
    expect(queued.layer).toBeNull();

    const done = await pollUntilDone(observer, url);
    expect(done.id).toBe(queued.id);
    expect(done.rays).toBe(64);
    expect(done.strideCells).toBeGreaterThanOrEqual(1);
    expect(done.layer).not.toBeNull();
    const layer = done.layer!;
    // Classes are equal steps of seen area up to the largest; every evaluated cell falls in one.
    expect(layer.classUpperM2).toHaveLength(VISIBILITY_INDEX_CLASS_COUNT);
    expect(layer.classUpperM2.at(-1)).toBeGreaterThanOrEqual(layer.maxSeenM2);
    const classes = decodeClassRaster(layer.raster);
    expect(classes.length).toBe(layer.raster.width * layer.raster.height);
    expect(classes.every((c) => c >= 1 && c <= VISIBILITY_INDEX_CLASS_COUNT)).toBe(true);
    expect(layer.raster.epsg).toBe(32629);

    // The stored seen areas are the core's own on the same terrain (the site has no boundary: the whole grid counts).
    const terrainRow = await terrainRepository.findInSite(
      (await visibilityIndexRepository.findById(done.id))!.organizationId,
      siteId,
      done.terrainId,
    );
    const terrain = await cache.loadTerrain(terrainRow!);
    const direct = computeVisibilityIndex(terrain, { heightM: 15, radiusM: 1500, rays: 64, strideCells: done.strideCells! });
    const stored = (await visibilityIndexRepository.findById(done.id))!.seenM2!;
    expect(Array.from(stored)).toEqual(Array.from(direct.seenM2));
    expect(done.siteAreaM2).toBeCloseTo(terrain.width * terrain.height * terrain.cellSize ** 2, 0);

    // Asked again: the stored layer at once, no second job.
    const jobsBefore = outcomes.length;
    const again = VisibilityIndexResponseSchema.parse((await planner.get(url).expect(200)).body).index;
    expect(again.id).toBe(done.id);
    await wait(1500);
    expect(outcomes.length).toBe(jobsBefore);
  });

  it('refuses bad parameters with 400 naming the field', async () => {
    const siteId = await siteWithTerrain('Heat map refusals');
    const cases: [string, string][] = [
      ['heightM=-1&radiusM=2000', 'heightM'],
      ['heightM=abc&radiusM=2000', 'heightM'],
      ['heightM=10&radiusM=10', 'radiusM'],
      ['heightM=10&radiusM=90000', 'radiusM'],
      ['heightM=10', 'radiusM'],
    ];
    for (const [query, field] of cases) {
      const res = await planner.get(`/api/v1/sites/${siteId}/visibility-index?${query}`).expect(400);
      expect(res.body.error.code).toBe('invalid_input');
      expect(Object.keys(res.body.error.fields)).toEqual([field]);
    }
  });

  it('answers 404 for a site without terrain and for another organisation’s site', async () => {
    const bare = (await planner.post('/api/v1/sites').send({ name: 'Heat map bare', kind: 'forest-district' }).expect(201)).body
      .site;
    const noTerrain = await planner.get(`/api/v1/sites/${bare.id}/visibility-index?heightM=10&radiusM=2000`).expect(404);
    expect(noTerrain.body.error.code).toBe('no_terrain');
    const siteId = await siteWithTerrain('Heat map private');
    await otherPlanner.get(`/api/v1/sites/${siteId}/visibility-index?heightM=10&radiusM=2000`).expect(404);
  });
});
