import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import type { Express } from 'express';
import { PNG } from 'pngjs';
import type { Sequelize } from 'sequelize';
import request from 'supertest';
import { fromUtm } from '@/shared/geo/from-utm';
import { TerrainMeshResponseSchema, TerrainProfileResponseSchema, SiteTerrainResponseSchema } from '@/shared/schemas/terrain';
import { decimateTerrain } from '@/shared/terrain/decimate-terrain';
import { writeEsriAsciiGrid } from '@/shared/terrain/formats/esri-ascii-grid-writer';
import { readGeoTiff } from '@/shared/terrain/formats/geotiff-reader';
import { writeGeoTiff } from '@/shared/terrain/formats/geotiff-writer';
import { gridProjection } from '@/shared/terrain/grid-projection';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { elevationAt } from '@/shared/terrain/terrain-elevation';
import { terrainProfile } from '@/shared/terrain/terrain-profile';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { createApp } from '@/server/app';
import { AuditEventModel, SiteTerrainModel } from '@/server/data/models';
import { DEMO_SITES, DEMO_TERRAIN_FILE } from '@/server/seeders/demo';
import type { FileStore } from '@/server/storage/file-store';
import { DEMO, signedInAgent } from '@/tests/support/agents';
import { createTestApp, TEST_CONFIG } from '@/tests/support/test-db';

jest.setTimeout(180_000);

let app: Express;
let db: Sequelize;
let files: FileStore;
let filesDir: string;
let uploadsDir: string;
let close: () => Promise<void>;
let planner: request.Agent;
let observer: request.Agent;
let otherPlanner: request.Agent;
let siteId: string;
let demoSiteId: string;

// An invented grid in UTM zone 33N (EPSG:32633): 200 × 160 cells of 25 m, 5 km × 4 km.
const GRID = { width: 200, height: 160, cellSize: 25, xll: 600_000, yll: 5_760_000 };
const terrain = generateSyntheticTerrain({ ...GRID, seed: 7, crs: { epsg: 32633, wkt: null } });
const tif = Buffer.from(writeGeoTiff(terrain, terrain.heights));
const { asc, prj } = writeEsriAsciiGrid(terrain, terrain.heights);
const lonLat = (e: number, n: number): [number, number] => {
  const p = fromUtm({ zone: 33, hemisphere: 'N', easting: e, northing: n });
  return [p.lonDeg, p.latDeg];
};
const latLon = (e: number, n: number) => {
  const [lonDeg, latDeg] = lonLat(e, n);
  return { latDeg, lonDeg };
};

const filesUnder = (dir: string): string[] =>
  readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? filesUnder(path.join(dir, e.name)) : [path.join(dir, e.name)],
  );

beforeAll(async () => {
  ({ app, db, files, filesDir, uploadsDir, close } = await createTestApp());
  [planner, observer, otherPlanner] = await Promise.all([
    signedInAgent(app, DEMO.planner),
    signedInAgent(app, DEMO.observer),
    signedInAgent(app, DEMO.otherPlanner),
  ]);
  const site = await planner
    .post('/api/v1/sites')
    .send({
      name: 'Terrain test district',
      kind: 'forest-district',
      boundary: [lonLat(601_000, 5_761_000), lonLat(604_000, 5_761_000), lonLat(604_000, 5_763_000), lonLat(601_000, 5_763_000)],
      priorityZones: [],
    })
    .expect(201);
  siteId = site.body.site.id;
  const sites = (await planner.get('/api/v1/sites').expect(200)).body.items as { id: string; name: string }[];
  demoSiteId = sites.find((s) => s.name === 'Harrowmere Forest District')!.id;
});
afterAll(() => close());

/** Asserts a failed upload left nothing behind: no new row, no stored file, no temporary folder. */
async function expectNothingStored(run: () => Promise<request.Response>, status: number, code: string, field?: string) {
  const rowsBefore = await SiteTerrainModel.count();
  const filesBefore = filesUnder(filesDir).sort();
  const res = await run();
  expect({ status: res.status, code: res.body.error?.code }).toEqual({ status, code });
  expect(res.body.error.message.length).toBeGreaterThan(20);
  if (field) expect(res.body.error.fields?.[field]).toEqual(expect.any(String));
  expect(await SiteTerrainModel.count()).toBe(rowsBefore);
  expect(filesUnder(filesDir).sort()).toEqual(filesBefore);
  expect(readdirSync(uploadsDir)).toEqual([]);
  return res;
}

const upload = (agent: request.Agent, id: string) => agent.post(`/api/v1/sites/${id}/terrain`);

describe('POST /api/v1/sites/:siteId/terrain', () => {
  it('takes a GeoTIFF: metadata, base layer, boundary coverage, stored normalised grid and audit event', async () => {
    const res = await upload(planner, siteId).attach('file', tif, 'district.tif').expect(201);
    const { terrain: t } = SiteTerrainResponseSchema.parse(res.body);
    expect(t).toMatchObject({
      siteId,
      active: true,
      originalName: 'district.tif',
      originalFormat: 'geotiff',
      width: 200,
      height: 160,
      cellSizeM: 25,
      xllM: 600_000,
      yllM: 5_760_000,
      crs: { epsg: 32633, label: 'WGS 84 / UTM zone 33N (EPSG:32633)' },
      nodataCells: 0,
      coversBoundary: true,
      uploadedBy: { name: 'Teodor Ashby' },
    });
    let min = Infinity;
    let max = -Infinity;
    for (const v of terrain.heights) {
      min = Math.min(min, v);
      max = Math.max(max, v);
    }
    expect(t.minElevationM).toBe(min);
    expect(t.maxElevationM).toBe(max);
    expect(t.baseLayer).toMatchObject({
      kind: 'image',
      widthPx: 200,
      heightPx: 160,
      gridBounds: { west: 600_000, south: 5_760_000, east: 605_000, north: 5_764_000 },
    });
    const nw = latLon(600_000, 5_764_000);
    expect(t.baseLayer.corners.northWest.latDeg).toBeCloseTo(nw.latDeg, 9);
    expect(t.baseLayer.corners.northWest.lonDeg).toBeCloseTo(nw.lonDeg, 9);

    // The stored grid is a Float32 GeoTIFF with the same heights, and its sha256 is recorded.
    const row = await SiteTerrainModel.findByPk(t.id);
    const stored = readFileSync(files.localPath(row!.storeKey));
    const reread = await readGeoTiff(
      stored.buffer.slice(stored.byteOffset, stored.byteOffset + stored.byteLength) as ArrayBuffer,
    );
    expect(reread.heights).toEqual(terrain.heights);
    expect(t.sha256).toBe(require('node:crypto').createHash('sha256').update(stored).digest('hex'));

    const audit = await AuditEventModel.findAll({ where: { entityType: 'site_terrain', entityId: t.id } });
    expect(audit.map((a) => a.action)).toEqual(['upload']);
    expect(readdirSync(uploadsDir)).toEqual([]);

    const got = await observer.get(`/api/v1/sites/${siteId}/terrain`).expect(200);
    expect(got.body.terrain.id).toBe(t.id);
  });

  it('takes an ESRI ASCII grid with its .prj, and replacing keeps the old terrain (inactive) and its file', async () => {
    const before = (await planner.get(`/api/v1/sites/${siteId}/terrain`).expect(200)).body.terrain;
    const res = await upload(planner, siteId)
      .attach('file', Buffer.from(asc), 'district.asc')
      .attach('prj', Buffer.from(prj!), 'district.prj')
      .expect(201);
    const t = res.body.terrain;
    expect(t).toMatchObject({ originalFormat: 'esri-ascii', width: 200, height: 160, crs: { epsg: 32633 } });
    expect(t.crs.wkt).toContain('UTM zone 33N');
    expect(t.id).not.toBe(before.id);
    const old = await SiteTerrainModel.findByPk(before.id);
    expect(old!.active).toBe(false);
    expect(filesUnder(filesDir)).toContain(files.localPath(old!.storeKey));
    // The old picture stays reachable by id (plan revisions refer to it).
    await planner.get(`/api/v1/sites/${siteId}/terrain/hillshade.png?terrainId=${before.id}`).expect(200);
    expect((await planner.get(`/api/v1/sites/${siteId}/terrain`)).body.terrain.id).toBe(t.id);
  });

  it('asks for an EPSG code when the grid carries no CRS, and takes it when given', async () => {
    await expectNothingStored(
      () => upload(planner, siteId).attach('file', Buffer.from(asc), 'bare.asc'),
      422,
      'terrain_crs_missing',
      'epsg',
    );
    const res = await upload(planner, siteId).attach('file', Buffer.from(asc), 'bare.asc').field('epsg', '32633').expect(201);
    expect(res.body.terrain.crs).toMatchObject({ epsg: 32633, label: 'WGS 84 / UTM zone 33N (EPSG:32633)' });
    await expectNothingStored(
      () => upload(planner, siteId).attach('file', Buffer.from(asc), 'bare.asc').field('epsg', 'utm33'),
      400,
      'invalid_input',
      'epsg',
    );
  });

  it('refuses a grid in degrees with advice to reproject', async () => {
    const degrees = 'ncols 3\nnrows 2\nxllcorner 15.2\nyllcorner 51.7\ncellsize 0.0002\n1 2 3\n4 5 6\n';
    const res = await expectNothingStored(
      () => upload(planner, siteId).attach('file', Buffer.from(degrees), 'degrees.asc'),
      422,
      'terrain_in_degrees',
      'file',
    );
    expect(res.body.error.message).toMatch(/gdalwarp -t_srs EPSG:326/);
    const geographicPrj =
      'GEOGCS["WGS 84",DATUM["WGS_1984",SPHEROID["WGS 84",6378137,298.257223563]],PRIMEM["Greenwich",0],UNIT["degree",0.0174532925199433]]';
    await expectNothingStored(
      () =>
        upload(planner, siteId)
          .attach('file', Buffer.from(degrees), 'degrees.asc')
          .attach('prj', Buffer.from(geographicPrj), 'degrees.prj'),
      422,
      'terrain_in_degrees',
    );
    await expectNothingStored(
      () => upload(planner, siteId).attach('file', Buffer.from(asc), 'bare.asc').field('epsg', '4326'),
      422,
      'terrain_in_degrees',
      'epsg',
    );
  });

  it('refuses corrupt, truncated and wrong-type files, storing nothing', async () => {
    // A TIFF whose Compression tag (the 4th directory entry) claims JPEG for plain float data.
    const corruptTif = Buffer.from(tif);
    expect(corruptTif.readUInt16LE(8 + 2 + 3 * 12)).toBe(259);
    corruptTif.writeUInt16LE(7, 8 + 2 + 3 * 12 + 8);
    await expectNothingStored(
      () => upload(planner, siteId).attach('file', corruptTif, 'corrupt.tif'),
      422,
      'terrain_corrupt',
      'file',
    );
    const badAsc = asc.replace(/\n([\d.]+) /, '\n12x.5 ');
    await expectNothingStored(
      () => upload(planner, siteId).attach('file', Buffer.from(badAsc), 'bad.asc').field('epsg', '32633'),
      422,
      'terrain_corrupt',
      'file',
    );
    await expectNothingStored(
      () => upload(planner, siteId).attach('file', tif.subarray(0, Math.floor(tif.length / 2)), 'half.tif'),
      422,
      'terrain_truncated',
      'file',
    );
    await expectNothingStored(
      () =>
        upload(planner, siteId)
          .attach('file', Buffer.from(asc.slice(0, Math.floor(asc.length * 0.6))), 'half.asc')
          .field('epsg', '32633'),
      422,
      'terrain_truncated',
      'file',
    );
    const png = PNG.sync.write(Object.assign(new PNG({ width: 2, height: 2 }), { data: Buffer.alloc(16, 200) }));
    await expectNothingStored(
      () => upload(planner, siteId).attach('file', png, 'picture.png'),
      415,
      'terrain_wrong_type',
      'file',
    );
    await expectNothingStored(
      () => upload(planner, siteId).attach('file', png, 'picture.tif'),
      415,
      'terrain_wrong_type',
      'file',
    );
    await expectNothingStored(() => upload(planner, siteId).attach('file', tif, 'grid.asc'), 415, 'terrain_wrong_type', 'file');
    await expectNothingStored(() => upload(planner, siteId).field('epsg', '32633'), 400, 'invalid_input', 'file');
    await expectNothingStored(
      () => upload(planner, siteId).attach('file', tif, 'a.tif').attach('extra', tif, 'b.tif'),
      400,
      'invalid_input',
      'extra',
    );
  });

  it('refuses heights that are not plausible metres (an undeclared nodata value)', async () => {
    const heights = new Float32Array(terrain.heights);
    heights[5] = -32768;
    await expectNothingStored(
      () => upload(planner, siteId).attach('file', Buffer.from(writeGeoTiff(terrain, heights, { nodata: null })), 'holes.tif'),
      422,
      'terrain_implausible',
      'file',
    );
  });

  it('keeps nodata as nodata: a declared marker and NaN', async () => {
    const heights = new Float32Array(terrain.heights);
    for (let i = 0; i < 200; i++) heights[i] = -9999; // the top row
    const { asc: holed } = writeEsriAsciiGrid(terrain, heights.map((v) => v) as Float32Array, { nodata: -9999 });
    const res = await upload(planner, siteId)
      .attach('file', Buffer.from(holed), 'holed.asc')
      .attach('prj', Buffer.from(prj!), 'holed.prj')
      .expect(201);
    expect(res.body.terrain).toMatchObject({ nodataValue: -9999, nodataCells: 200, coversBoundary: true });
    // Elevation on the nodata row is refused with a field error.
    const top = latLon(602_000, 5_763_990);
    const e = await planner.get(`/api/v1/sites/${siteId}/terrain/elevation`).query(top).expect(422);
    expect(e.body.error).toMatchObject({
      code: 'no_elevation',
      fields: { latDeg: expect.any(String), lonDeg: expect.any(String) },
    });
    // NaN cells in a GeoTIFF are nodata too.
    const nan = new Float32Array(terrain.heights);
    nan.fill(NaN, 0, 400); // the top two rows
    const withNaN = await upload(planner, siteId)
      .attach('file', Buffer.from(writeGeoTiff(terrain, nan)), 'nan.tif')
      .expect(201);
    expect(withNaN.body.terrain).toMatchObject({ nodataCells: 400, coversBoundary: true });
    // Restore the plain terrain for the tests below.
    await upload(planner, siteId).attach('file', tif, 'district.tif').expect(201);
  });

  it('refuses files over the byte limit and grids over the cell limit (limits from config)', async () => {
    const small = createApp({
      db,
      config: { ...TEST_CONFIG, TERRAIN_UPLOAD_DIR: uploadsDir, TERRAIN_MAX_UPLOAD_BYTES: 50_000 },
      files,
    });
    const smallPlanner = await signedInAgent(small, DEMO.planner);
    const res = await expectNothingStored(
      () => upload(smallPlanner, siteId).attach('file', tif, 'big.tif'),
      413,
      'terrain_too_large',
      'file',
    );
    expect(res.body.error.message).toMatch(/larger than 50 kB/);
    const few = createApp({ db, config: { ...TEST_CONFIG, TERRAIN_UPLOAD_DIR: uploadsDir, TERRAIN_MAX_CELLS: 10_000 }, files });
    const fewPlanner = await signedInAgent(few, DEMO.planner);
    const cells = await expectNothingStored(
      () => upload(fewPlanner, siteId).attach('file', tif, 'big.tif'),
      413,
      'terrain_too_large',
      'file',
    );
    expect(cells.body.error.message).toMatch(/32000 cells|10000/);
  });

  it('lets only planners upload, and hides other organisations’ sites', async () => {
    for (const email of [DEMO.observer, DEMO.reviewer, DEMO.admin]) {
      const agent = await signedInAgent(app, email);
      await expectNothingStored(() => upload(agent, siteId).attach('file', tif, 'x.tif'), 403, 'forbidden');
    }
    await expectNothingStored(() => upload(otherPlanner, siteId).attach('file', tif, 'x.tif'), 404, 'not_found');
    await request(app).post(`/api/v1/sites/${siteId}/terrain`).attach('file', tif, 'x.tif').expect(401);
    await otherPlanner.get(`/api/v1/sites/${siteId}/terrain`).expect(404);
    await otherPlanner.get(`/api/v1/sites/${siteId}/terrain/hillshade.png`).expect(404);
    await otherPlanner.get(`/api/v1/sites/${siteId}/terrain/elevation`).query(latLon(602_000, 5_762_000)).expect(404);
    await otherPlanner
      .post(`/api/v1/sites/${siteId}/terrain/profile`)
      .send({
        observer: { ...latLon(601_000, 5_761_000), eyeHeightM: 10 },
        target: latLon(604_000, 5_763_000),
        targetHeightM: 0,
        conditions: [{ k: 0.13 }],
      })
      .expect(404);
  });

  it('keeps the server answering while a large grid is ingested (the ingest runs in a worker thread)', async () => {
    const size = 2000;
    const big: TerrainRaster = { ...terrain, width: size, height: size, heights: new Float32Array(size * size) };
    for (let r = 0; r < size; r++)
      for (let c = 0; c < size; c++) big.heights[r * size + c] = 300 + 80 * Math.sin(c / 40) * Math.cos(r / 55);
    const order: string[] = [];
    const uploading = upload(planner, siteId)
      .attach('file', Buffer.from(writeGeoTiff(big, big.heights)), 'large.tif')
      .then((res) => {
        order.push('upload');
        return res;
      });
    // Ask for something else a moment later, while the upload is being ingested.
    await new Promise((resolve) => setTimeout(resolve, 300));
    const other = planner.get('/api/v1/sites').then((res) => {
      order.push('sites');
      return res;
    });
    const [up, list] = await Promise.all([uploading, other]);
    expect(up.status).toBe(201);
    expect(list.status).toBe(200);
    expect(order).toEqual(['sites', 'upload']);
    await upload(planner, siteId).attach('file', tif, 'district.tif').expect(201);
  });
});

describe('GET /api/v1/sites/:siteId/terrain', () => {
  it('answers 404 no_terrain for a site without terrain', async () => {
    const site = await planner
      .post('/api/v1/sites')
      .send({ name: 'Bare district', kind: 'search-area', boundary: null, priorityZones: [] })
      .expect(201);
    const res = await observer.get(`/api/v1/sites/${site.body.site.id}/terrain`).expect(404);
    expect(res.body.error.code).toBe('no_terrain');
    await observer.get(`/api/v1/sites/${site.body.site.id}/terrain/hillshade.png`).expect(404);
  });

  it('serves the demo district’s seeded terrain and hillshade to every role', async () => {
    const res = await observer.get(`/api/v1/sites/${demoSiteId}/terrain`).expect(200);
    expect(res.body.terrain).toMatchObject({
      width: 600,
      height: 600,
      cellSizeM: 25,
      crs: { epsg: 32633 },
      coversBoundary: true,
    });
    const png = await observer
      .get(res.body.terrain.baseLayer.url)
      .buffer(true)
      .parse((r, done) => {
        const parts: Buffer[] = [];
        r.on('data', (c: Buffer) => parts.push(c));
        r.on('end', () => done(null, Buffer.concat(parts)));
      })
      .expect(200);
    expect(png.headers['content-type']).toBe('image/png');
    expect(png.headers['cache-control']).toMatch(/immutable/);
    const image = PNG.sync.read(png.body as Buffer);
    expect([image.width, image.height]).toEqual([600, 600]);
  });
});

describe('GET /api/v1/sites/:siteId/terrain/elevation', () => {
  it('gives the bilinear ground at a position', async () => {
    const e = 602_012.5;
    const n = 5_762_037.5; // a cell centre: the cell's own height
    const res = await observer.get(`/api/v1/sites/${siteId}/terrain/elevation`).query(latLon(e, n)).expect(200);
    const col = (e - GRID.xll) / 25 - 0.5;
    const row = (GRID.yll + GRID.height * 25 - n) / 25 - 0.5;
    expect(res.body.elevationM).toBeCloseTo(terrain.heights[row * GRID.width + col] as number, 3);
    expect(res.body.xM).toBeCloseTo(e, 3);
  });

  it('agrees with the demo posts’ ground elevations (seed data checked against the terrain)', async () => {
    const posts = (await observer.get(`/api/v1/sites/${demoSiteId}/posts`).expect(200)).body.items as {
      name: string;
      location: { latDeg: number; lonDeg: number };
      groundElevationM: number;
    }[];
    expect(posts).toHaveLength(DEMO_SITES[0]!.posts.length);
    for (const post of posts) {
      const res = await observer.get(`/api/v1/sites/${demoSiteId}/terrain/elevation`).query(post.location).expect(200);
      expect(Math.abs(res.body.elevationM - post.groundElevationM)).toBeLessThan(0.1);
    }
  });

  it('refuses a position outside the grid and bad numbers with field errors', async () => {
    const res = await observer.get(`/api/v1/sites/${siteId}/terrain/elevation`).query(latLon(590_000, 5_762_000)).expect(422);
    expect(res.body.error).toMatchObject({
      code: 'outside_terrain',
      fields: { latDeg: expect.any(String), lonDeg: expect.any(String) },
    });
    const bad = await observer
      .get(`/api/v1/sites/${siteId}/terrain/elevation`)
      .query({ latDeg: 'north', lonDeg: 200 })
      .expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['latDeg', 'lonDeg']);
  });
});

describe('POST /api/v1/sites/:siteId/terrain/profile', () => {
  it('profiles from a demo post to a target under several conditions, as the core computes it', async () => {
    const posts = (await planner.get(`/api/v1/sites/${demoSiteId}/posts`).expect(200)).body.items as {
      id: string;
      name: string;
      location: { latDeg: number; lonDeg: number };
      structureHeightM: number;
      eyeHeightM: number;
    }[];
    const crane = posts.find((p) => p.name === 'Crane Knoll Tower')!;
    const target = latLon(521_000, 5_736_000);
    const res = await observer
      .post(`/api/v1/sites/${demoSiteId}/terrain/profile`)
      .send({ postId: crane.id, target, targetHeightM: 30, conditions: [{ preset: 'no-refraction' }, { k: 0.13 }, { k: -0.2 }] })
      .expect(200);
    const body = TerrainProfileResponseSchema.parse(res.body);
    expect(body.observer.postId).toBe(crane.id);
    expect(body.observer.eyeHeightM).toBeCloseTo(crane.structureHeightM + crane.eyeHeightM, 9);
    expect(body.results.map((r) => r.k)).toEqual([0, 0.13, -0.2]);
    expect(body.cautions.map((c) => c.code)).toEqual([
      'estimates-only',
      'refraction-varies',
      'visibility-not-detection',
      'follow-procedures',
    ]);
    expect(body.samples.length).toBeLessThanOrEqual(2001);
    expect(body.spacingM).toBeCloseTo(12.5, 9);

    // The same profile straight from the core on the committed file.
    const bytes = readFileSync(DEMO_TERRAIN_FILE);
    const demo = await readGeoTiff(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
    const grid = gridProjection(demo.crs);
    const direct = terrainProfile(demo, {
      observer: { ...grid.toGrid(crane.location), eyeHeight: crane.structureHeightM + crane.eyeHeightM },
      target: { ...grid.toGrid(target), height: 30 },
      conditions: [0, 0.13, -0.2].map((k) => ({ refractionCoefficient: k })),
    });
    body.results.forEach((r, i) => expect(r.hiddenHeightM).toBeCloseTo(direct.conditions[i]!.hiddenHeight, 6));
    // Lowered ground: ground minus (1 − k)·d²/(2R) at the last sample.
    const last = body.samples.length - 1;
    const d = body.samples[last]!.distanceM;
    expect(body.samples[last]!.groundElevationM! - body.results[1]!.loweredGroundM[last]!).toBeCloseTo(
      (0.87 * d * d) / (2 * 6_371_008.8),
      6,
    );
    const hidden = body.results.find((r) => !r.targetTopSeen);
    if (hidden) expect(hidden.firstObstruction).not.toBeNull();
    // The eye-level check: ground under the post from the terrain.
    const ground = elevationAt(demo, ...(Object.values(grid.toGrid(crane.location)) as [number, number]));
    expect(body.observer.groundElevationM).toBeCloseTo(ground as number, 6);
  });

  it('takes an observer position with an eye height', async () => {
    const res = await observer
      .post(`/api/v1/sites/${siteId}/terrain/profile`)
      .send({
        observer: { ...latLon(600_500, 5_761_000), eyeHeightM: 12 },
        target: latLon(604_500, 5_763_500),
        targetHeightM: 0,
        conditions: [{ k: 0.13 }],
      })
      .expect(200);
    expect(res.body.observer.recordedGroundElevationM).toBeNull();
    expect(res.body.distanceM).toBeCloseTo(Math.hypot(4000, 2500), 0);
  });

  it('answers bad requests with field errors', async () => {
    const bad = await observer
      .post(`/api/v1/sites/${siteId}/terrain/profile`)
      .send({ target: { latDeg: 95, lonDeg: 10 }, targetHeightM: -1, conditions: [] })
      .expect(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(
      expect.arrayContaining(['observer', 'target.latDeg', 'targetHeightM', 'conditions']),
    );
    const outside = await observer
      .post(`/api/v1/sites/${siteId}/terrain/profile`)
      .send({
        observer: { ...latLon(600_500, 5_761_000), eyeHeightM: 12 },
        target: latLon(640_000, 5_763_500),
        targetHeightM: 0,
        conditions: [{ k: 0.13 }],
      })
      .expect(422);
    expect(outside.body.error).toMatchObject({ code: 'outside_terrain', fields: { 'target.latDeg': expect.any(String) } });
    const noPost = await observer
      .post(`/api/v1/sites/${siteId}/terrain/profile`)
      .send({
        postId: '00000000-0000-4000-8000-000000000000',
        target: latLon(602_000, 5_762_000),
        targetHeightM: 0,
        conditions: [{ k: 0 }],
      })
      .expect(404);
    expect(noPost.body.error.fields.postId).toEqual(expect.any(String));
  });
});

describe('GET /api/v1/sites/:siteId/terrain/mesh', () => {
  it('gives the demo terrain decimated to at most maxEdge cells, as little-endian Float32 in base64', async () => {
    const res = await observer.get(`/api/v1/sites/${demoSiteId}/terrain/mesh`).query({ maxEdge: 256 }).expect(200);
    const mesh = TerrainMeshResponseSchema.parse(res.body);
    // 600 × 600 cells of 25 m → factor ceil(600 / 256) = 3 → 200 × 200 cells of 75 m.
    expect([mesh.width, mesh.height, mesh.factor, mesh.cellSizeM]).toEqual([200, 200, 3, 75]);
    const bytes = Buffer.from(mesh.heights, 'base64');
    expect(bytes.length).toBe(200 * 200 * 4);
    const heights = new Float32Array(200 * 200);
    for (let i = 0; i < heights.length; i++) heights[i] = bytes.readFloatLE(i * 4);
    // Source: the decimation core on the same file (itself checked against gdal_translate -r average).
    const demo = await readGeoTiff(readFileSync(DEMO_TERRAIN_FILE).buffer.slice(0) as ArrayBuffer);
    const expected = decimateTerrain(demo, 256);
    expect(heights).toEqual(expected.heights);
    expect([mesh.xllM, mesh.yllM]).toEqual([expected.xll, expected.yll]);
    expect(mesh.minElevationM).toBeLessThanOrEqual(mesh.maxElevationM);
    const small = await observer.get(`/api/v1/sites/${demoSiteId}/terrain/mesh`).query({ maxEdge: 16 }).expect(200);
    expect([small.body.width, small.body.factor]).toEqual([16, 38]);
    const standard = await observer.get(`/api/v1/sites/${demoSiteId}/terrain/mesh`).expect(200);
    expect(standard.body.width).toBe(200); // default maxEdge 256
  });

  it('refuses a bad maxEdge with a field error, and answers no_terrain and 404 across organisations', async () => {
    const bad = await observer.get(`/api/v1/sites/${demoSiteId}/terrain/mesh`).query({ maxEdge: 5 }).expect(400);
    expect(bad.body.error.fields.maxEdge).toMatch(/at least 16/);
    const notNumber = await observer.get(`/api/v1/sites/${demoSiteId}/terrain/mesh`).query({ maxEdge: 'many' }).expect(400);
    expect(notNumber.body.error.fields.maxEdge).toEqual(expect.any(String));
    const bare = await planner
      .post('/api/v1/sites')
      .send({ name: 'Bare mesh district', kind: 'search-area', boundary: null, priorityZones: [] })
      .expect(201);
    const none = await observer.get(`/api/v1/sites/${bare.body.site.id}/terrain/mesh`).expect(404);
    expect(none.body.error.code).toBe('no_terrain');
    await otherPlanner.get(`/api/v1/sites/${demoSiteId}/terrain/mesh`).expect(404);
  });
});
