import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { Geodesic } from 'geographiclib-geodesic';
import proj4 from 'proj4';
import request from 'supertest';
import type { Sequelize } from 'sequelize';
import { DEMO_PASSWORD } from '@/server/seeders/demo';
import type { ViewshedPool } from '@/server/workers/viewshed-pool';
import { RevisionByHashSchema } from '@/shared/schemas/printout';
import type { PlanSnapshot } from '@/shared/schemas/plan';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import { DEMO } from '@/tests/support/agents';
import { appWithInlineCoverage, createTestDatabase } from '@/tests/support/test-db';

let app: Express;
let db: Sequelize;
let drop: () => Promise<void>;
let pool: ViewshedPool;
let planner: request.Agent;
let reviewer: request.Agent;
let observer: request.Agent;
let stranger: request.Agent;
let tmp: string;

/** The demo's approved forest plan and its only revision. */
let approved: { id: string; title: string; siteId: string };
let snapshot: PlanSnapshot;
let contentHash: string;
/** The demo's submitted coast plan (never approved). */
let submitted: { id: string };

const agentFor = async (email: string) => {
  const agent = request.agent(app);
  await agent.post('/api/auth/sign-in').send({ email, password: DEMO_PASSWORD }).expect(200);
  return agent;
};

/** Collects a binary answer (supertest leaves unknown types unparsed). */
const binary = (res: request.Response, callback: (error: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => callback(null, Buffer.concat(chunks)));
};

beforeAll(async () => {
  ({ db, drop } = await createTestDatabase());
  ({ app, pool } = appWithInlineCoverage(db));
  [planner, reviewer, observer, stranger] = await Promise.all([
    agentFor(DEMO.planner),
    agentFor(DEMO.reviewer),
    agentFor(DEMO.observer),
    agentFor(DEMO.otherPlanner),
  ]);
  const plans = (await planner.get('/api/v1/plans?pageSize=100').expect(200)).body.items;
  approved = plans.find((p: { title: string }) => p.title === 'Fire season cover 2026');
  submitted = plans.find((p: { title: string }) => p.title === 'Summer watch, Tallow Strand');
  const revision = (await planner.get(`/api/v1/plans/${approved.id}/revisions/1`).expect(200)).body.revision;
  snapshot = revision.snapshot;
  contentHash = revision.contentHash;
  tmp = mkdtempSync(path.join(os.tmpdir(), 'kenning-exports-'));
});
afterAll(async () => {
  rmSync(tmp, { recursive: true, force: true });
  await pool.close();
  await drop();
});

// ---------------------------------------------------------------------------------------------
// A reader of RFC 4180 written for this test (no CSV package is installed): fields separated by
// commas, records by CRLF, a quoted field may hold commas, CR, LF and "" for one double quote.
// Source: RFC 4180 §2 (rules 1–7) and the ABNF grammar in §2.
function parseCsv(text: string): string[][] {
  const records: string[][] = [];
  let record: string[] = [];
  let field = '';
  let i = 0;
  let quoted = false;
  while (i < text.length) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        field += '"';
        i += 2;
      } else if (ch === '"') {
        quoted = false;
        i += 1;
      } else {
        field += ch;
        i += 1;
      }
    } else if (ch === '"' && field === '') {
      quoted = true;
      i += 1;
    } else if (ch === ',') {
      record.push(field);
      field = '';
      i += 1;
    } else if (ch === '\r' && text[i + 1] === '\n') {
      record.push(field);
      records.push(record);
      record = [];
      field = '';
      i += 2;
    } else {
      // A bare LF or CR outside quotes is not RFC 4180.
      if (ch === '\n' || ch === '\r') throw new Error(`bare line break at ${i}`);
      field += ch;
      i += 1;
    }
  }
  if (field !== '' || record.length > 0) throw new Error('the last record does not end in CRLF');
  return records;
}

// Point in polygon by ray casting (even–odd rule), in lon/lat.
// Source: W. R. Franklin, "PNPOLY — Point Inclusion in Polygon Test" (from memory).
function insideRing(ring: number[][], [x, y]: [number, number]) {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i]!;
    const [xj, yj] = ring[j]!;
    if (yi! > y !== yj! > y && x < ((xj! - xi!) * (y - yi!)) / (yj! - yi!) + xi!) inside = !inside;
  }
  return inside;
}
const insidePolygon = (rings: number[][][], p: [number, number]) =>
  insideRing(rings[0]!, p) && !rings.slice(1).some((hole) => insideRing(hole, p));

/** Twice the signed area by the shoelace formula: > 0 counter-clockwise (x east, y north). Common practice, no source. */
const shoelace = (ring: number[][]) =>
  ring.slice(0, -1).reduce((sum, [x1, y1], i) => sum + x1! * ring[i + 1]![1]! - ring[i + 1]![0]! * y1!, 0);

const decimals = (v: number) => (String(v).split('.')[1] ?? '').length;

/** What is wrong with one position by RFC 7946, if anything (collected, then asserted once: Jest's expect is slow per call). */
function positionProblem(p: unknown): string | null {
  // Source: RFC 7946 §3.1.1 — a position is [longitude, latitude(, altitude)], numbers; §4 WGS84 degrees.
  if (!Array.isArray(p) || p.length !== 2 || !p.every((v) => typeof v === 'number'))
    return `not [lon, lat]: ${JSON.stringify(p)}`;
  const [lon, lat] = p as number[];
  if (lon! < -180 || lon! > 180 || lat! < -90 || lat! > 90) return `out of range: ${JSON.stringify(p)}`;
  // Source: RFC 7946 §11.2 — 6 decimal places (about 10 cm) are enough; the brief asks for no more.
  if (decimals(lon!) > 6 || decimals(lat!) > 6) return `more than 6 decimals: ${JSON.stringify(p)}`;
  return null;
}

/** What is wrong with a Polygon's rings by RFC 7946. */
function polygonProblems(rings: number[][][]): string[] {
  const problems: string[] = [];
  rings.forEach((ring, i) => {
    // Source: RFC 7946 §3.1.6 — a linear ring is closed, with four or more positions, first = last.
    if (ring.length < 4) problems.push(`ring ${i} has ${ring.length} positions`);
    if (JSON.stringify(ring[0]) !== JSON.stringify(ring[ring.length - 1])) problems.push(`ring ${i} is not closed`);
    for (const p of ring) {
      const problem = positionProblem(p);
      if (problem) problems.push(problem);
    }
    // Source: RFC 7946 §3.1.6 — right-hand rule: exterior rings counter-clockwise, holes clockwise.
    const area = shoelace(ring);
    if (i === 0 ? area <= 0 : area >= 0) problems.push(`ring ${i} winds the wrong way`);
  });
  return problems;
}

const checkPolygon = (rings: number[][][]) => expect(polygonProblems(rings)).toEqual([]);

const gdalinfo = (file: string) => JSON.parse(execFileSync('gdalinfo', ['-json', file], { encoding: 'utf8' }));
const gdalValue = (file: string, col: number, row: number) =>
  Number(execFileSync('gdallocationinfo', ['-valonly', file, String(col), String(row)], { encoding: 'utf8' }).trim());

describe('GET /plans/:planId/revisions/:n/results.csv', () => {
  it('is one RFC 4180 row per post × target × condition, with units in the header, from the frozen revision', async () => {
    const res = await observer.get(`/api/v1/plans/${approved.id}/revisions/1/results.csv`).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    // The file's name says the site, the plan, its version and revision, and the date.
    expect(res.headers['content-disposition']).toMatch(
      /^attachment; filename="?Harrowmere-Forest-District_Fire-season-cover-2026_v1_rev1_\d{4}-\d{2}-\d{2}_results\.csv"?$/,
    );
    const [header, ...rows] = parseCsv(res.text);
    // Source: RFC 4180 §2 rule 3 — an optional header line; the units are in the names (common practice, no source).
    for (const column of [
      'horizon_range_m',
      'geographic_range_m',
      'detection_range_m',
      'height_of_eye_m',
      'dip_deg',
      'limiting_factor',
    ]) {
      expect(header).toContain(column);
    }
    // Source: RFC 4180 §2 rule 4 — every record has the same number of fields.
    for (const row of rows) expect(row).toHaveLength(header!.length);

    const sets = snapshot.inputs.conditionSets as { conditions: unknown[] }[];
    const conditions = sets.reduce((n, s) => n + s.conditions.length, 0);
    expect(rows).toHaveLength(snapshot.inputs.posts.length * snapshot.inputs.targets.length * conditions);
    const col = (name: string) => header!.indexOf(name);
    const keys = new Set(
      rows.map((r) => [r[col('post_id')], r[col('target_id')], r[col('condition_set_id')], r[col('condition_index')]].join('|')),
    );
    expect(keys.size).toBe(rows.length);
    // Each row carries the frozen figures of its post, target and condition.
    for (const row of rows) {
      const frozen = snapshot.results.find(
        (r) =>
          r.postId === row[col('post_id')] &&
          r.targetId === row[col('target_id')] &&
          r.conditionSetId === row[col('condition_set_id')] &&
          r.conditionIndex === Number(row[col('condition_index')]),
      )!;
      expect(row[col('post_name')]).toBe(frozen.postName);
      expect(Number(row[col('detection_range_m')])).toBeCloseTo(frozen.result.detectionRangeM!, 5);
      expect(Number(row[col('horizon_range_m')])).toBeCloseTo(frozen.result.horizonDistanceM!, 5);
      expect(row[col('limiting_factor')]).toBe(frozen.result.limitedBy ?? '');
    }
  });

  it('quotes names with commas, quotes and line breaks so they read back unchanged, and keeps formulas as text', async () => {
    const { plan } = await frozenTestPlan();
    const res = await planner.get(`/api/v1/plans/${plan.id}/revisions/1/results.csv`).expect(200);
    const [header, ...rows] = parseCsv(res.text);
    const names = new Set(rows.map((r) => r[header!.indexOf('post_name')]));
    // Source: RFC 4180 §2 rules 6–7 — fields with commas, quotes or line breaks are quoted, quotes doubled.
    expect(names).toContain(TRICKY_POST);
    // A name starting with "=" would run as a formula in a spreadsheet: it starts with an apostrophe.
    // Source: OWASP, "CSV Injection" (from memory).
    expect(names).toContain(`'${FORMULA_POST}`);
  });
});

describe('GET /plans/:planId/revisions/:n/features.geojson', () => {
  it('is an RFC 7946 FeatureCollection in lon/lat with posts, sectors, range rings, zones, boundary and blind areas', async () => {
    const res = await observer.get(`/api/v1/plans/${approved.id}/revisions/1/features.geojson`).expect(200);
    expect(res.headers['content-type']).toMatch(/^application\/geo\+json/);
    expect(res.headers['content-disposition']).toMatch(/_v1_rev1_\d{4}-\d{2}-\d{2}_features\.geojson"?$/);
    const collection = JSON.parse(res.text);
    // Source: RFC 7946 §3.3 — a FeatureCollection has "features", an array of Features (§3.2).
    expect(collection.type).toBe('FeatureCollection');
    const kinds = new Set<string>();
    const problems: string[] = [];
    for (const f of collection.features) {
      if (f.type !== 'Feature') problems.push(`a ${f.type} among the features`);
      kinds.add(f.properties.kind);
      const g = f.geometry;
      if (g.type === 'Point') problems.push(...[positionProblem(g.coordinates)].filter((x): x is string => x !== null));
      else if (g.type === 'Polygon') problems.push(...polygonProblems(g.coordinates));
      else if (g.type === 'MultiPolygon') for (const polygon of g.coordinates) problems.push(...polygonProblems(polygon));
      else problems.push(`unexpected geometry ${g.type}`);
    }
    expect(problems).toEqual([]);
    expect([...kinds].sort()).toEqual(['blind-area', 'boundary', 'post', 'priority-zone', 'range-ring']);

    // Longitude first: the demo forest lies near 51.8° N, 15.2° E (an invented district), so a post's
    // first coordinate is its longitude. Source: RFC 7946 §3.1.1.
    for (const post of snapshot.inputs.posts as {
      id: string;
      location: { latDeg: number; lonDeg: number };
      eyeHeightM: number;
    }[]) {
      const f = collection.features.find(
        (x: { properties: { kind: string; postId: string } }) => x.properties.kind === 'post' && x.properties.postId === post.id,
      );
      expect(f.geometry.coordinates[0]).toBeCloseTo(post.location.lonDeg, 6);
      expect(f.geometry.coordinates[1]).toBeCloseTo(post.location.latDeg, 6);
      expect(f.properties.eyeHeightM).toBe(post.eyeHeightM);
    }

    // A range ring's vertices lie at the detection range from the post along the geodesic.
    // Source: C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87 (2013), inverse problem (geographiclib).
    const ring = collection.features.find((x: { properties: { kind: string } }) => x.properties.kind === 'range-ring');
    const post = (snapshot.inputs.posts as { id: string; location: { latDeg: number; lonDeg: number } }[]).find(
      (p) => p.id === ring.properties.postId,
    )!;
    for (const [lon, lat] of ring.geometry.coordinates[0].slice(0, 10)) {
      const { s12 } = Geodesic.WGS84.Inverse(post.location.latDeg, post.location.lonDeg, lat, lon);
      // 6 decimals of a degree move a point by at most ≈ 0.11 m.
      expect(Math.abs(s12! - ring.properties.detectionRangeM)).toBeLessThan(0.3);
    }

    // Every listed blind area of every case is a polygon holding the point the coverage reports inside it.
    const cases = snapshot.coverage!.cases;
    let checked = 0;
    for (const c of cases) {
      c.blindAreas.forEach((area, i) => {
        const f = collection.features.find(
          (x: { properties: { kind: string; caseKey: string; rank: number } }) =>
            x.properties.kind === 'blind-area' && x.properties.caseKey === c.key && x.properties.rank === i + 1,
        );
        expect(f).toBeDefined();
        expect(f.properties.areaM2).toBe(area.area);
        const point: [number, number] = [area.interior!.lonDeg, area.interior!.latDeg];
        expect(f.geometry.coordinates.some((polygon: number[][][]) => insidePolygon(polygon, point))).toBe(true);
        checked += 1;
      });
    }
    expect(checked).toBeGreaterThan(0);

    // The outlines follow the terrain grid: taken back into the grid's CRS by proj4 (an outside reference for
    // WGS 84 / UTM zone 33N), every vertex lies on an edge middle between two cells — one grid coordinate whole,
    // the other a half — within the 6-decimal rounding (≈ 0.1 m of 25 m cells).
    // Source: proj4 (npm), the transverse Mercator of Snyder, USGS PP 1395; d3-contour without smoothing.
    const grid = snapshot.coverage!.grid;
    const toGrid = proj4('EPSG:4326', `+proj=utm +zone=${grid.epsg! - 32600} +datum=WGS84 +units=m +no_defs`);
    const yTop = grid.yllM + grid.height * grid.cellSizeM;
    const offLattice: string[] = [];
    const blind = collection.features.filter((x: { properties: { kind: string } }) => x.properties.kind === 'blind-area');
    for (const f of blind.slice(0, 6)) {
      for (const polygon of f.geometry.coordinates as number[][][][]) {
        for (const [lon, lat] of polygon[0]!.slice(0, 40)) {
          const [x, y] = toGrid.forward([lon!, lat!]);
          const u = (x! - grid.xllM) / grid.cellSizeM;
          const v = (yTop - y!) / grid.cellSizeM;
          const near = (a: number) => Math.abs(a - Math.round(a)) < 0.01;
          if (!((near(u) && near(v - 0.5)) || (near(u - 0.5) && near(v)))) offLattice.push(`${u.toFixed(3)},${v.toFixed(3)}`);
        }
      }
    }
    expect(offLattice).toEqual([]);

    // GDAL's GeoJSON driver reads it: every feature, in one layer.
    const file = path.join(tmp, 'features.geojson');
    writeFileSync(file, res.text);
    const summary = execFileSync('ogrinfo', ['-ro', '-so', '-al', file], { encoding: 'utf8' });
    expect(summary).toMatch(new RegExp(`Feature Count: ${collection.features.length}\\b`));
  });
});

describe('sectors in the GeoJSON', () => {
  it('draws each post’s viewing sector as a geodesic wedge between its bearings, out to its farthest range', async () => {
    // The coast plan (submitted, read by a reviewer): its shore posts watch sectors across north.
    const res = await reviewer.get(`/api/v1/plans/${submitted.id}/revisions/1/features.geojson`).expect(200);
    const features = JSON.parse(res.text).features as {
      geometry: { type: string; coordinates: number[][][] & number[] };
      properties: Record<string, number & string>;
    }[];
    const sectors = features.filter((f) => f.properties.kind === 'sector');
    expect(sectors.length).toBeGreaterThan(0);
    for (const sector of sectors) {
      checkPolygon(sector.geometry.coordinates);
      const post = features.find((f) => f.properties.kind === 'post' && f.properties.postId === sector.properties.postId)!;
      const [lon0, lat0] = post.geometry.coordinates as unknown as [number, number];
      const { fromDeg, toDeg, radiusM } = sector.properties as unknown as { fromDeg: number; toDeg: number; radiusM: number };
      const span = (toDeg - fromDeg + 360) % 360;
      for (const [lon, lat] of sector.geometry.coordinates[0]!) {
        // Source: Karney (2013), inverse problem (geographiclib): azimuth and distance from the post.
        const { s12, azi1 } = Geodesic.WGS84.Inverse(lat0, lon0, lat!, lon!);
        if (s12! < 1) continue; // the post itself
        expect(Math.abs(s12! - radiusM)).toBeLessThan(0.3);
        const along = (((azi1! - fromDeg) % 360) + 360) % 360;
        // Clockwise from `fromDeg` to `toDeg` (true bearings), within rounding to 6 decimals.
        expect(Math.min(along, 360 - along) < 0.01 || along <= span + 0.01).toBe(true);
      }
    }
  });
});

describe('GET /coverage-runs/:runId/layers/:layer.tif and .asc', () => {
  it('writes the stored layer as a GeoTIFF that GDAL reads with the terrain’s CRS, size and origin, cell for cell', async () => {
    const terrain = (await observer.get(`/api/v1/sites/${approved.siteId}/terrain`).expect(200)).body.terrain;
    const { runId, cases } = snapshot.coverage!;
    const caseKey = cases[0]!.key;
    const query = `caseKey=${encodeURIComponent(caseKey)}`;
    const res = await observer
      .get(`/api/v1/coverage-runs/${runId}/layers/posts-per-cell.tif?${query}`)
      .buffer(true)
      .parse(binary)
      .expect(200);
    expect(res.headers['content-type']).toBe('image/tiff');
    expect(res.headers['content-disposition']).toMatch(
      /Harrowmere-Forest-District_Fire-season-cover-2026_v1_rev1_\d{4}-\d{2}-\d{2}_posts-per-cell/,
    );
    const file = path.join(tmp, 'layer.tif');
    writeFileSync(file, res.body as Buffer);
    const info = gdalinfo(file);
    // Source: GDAL gdalinfo JSON output (size, geoTransform = [x origin, pixel width, 0, y origin, 0, −pixel height]);
    // OGC GeoTIFF 1.1 ProjectedCSTypeGeoKey → the EPSG code.
    expect(info.driverShortName).toBe('GTiff');
    expect(info.size).toEqual([terrain.width, terrain.height]);
    expect(info.coordinateSystem.wkt).toContain(`ID["EPSG",${terrain.crs.epsg}]`);
    const [x0, dx, rx, y0, ry, dy] = info.geoTransform;
    expect(x0).toBeCloseTo(terrain.xllM, 6);
    expect(y0).toBeCloseTo(terrain.yllM + terrain.height * terrain.cellSizeM, 6);
    expect([dx, rx, ry, dy]).toEqual([terrain.cellSizeM, 0, 0, -terrain.cellSizeM]);
    expect(info.bands[0].type).toBe('Byte');
    expect(info.bands[0].noDataValue).toBe(0);

    // GDAL's value at cells of every class equals the layer the map gets.
    const layer = (await observer.get(`/api/v1/coverage-runs/${runId}/layers/posts-per-cell?${query}`).expect(200)).body;
    const codes = decodeClassRaster(layer);
    const firstOf = new Map<number, number>();
    codes.forEach((v, i) => {
      if (!firstOf.has(v)) firstOf.set(v, i);
    });
    expect(firstOf.size).toBeGreaterThan(2);
    const probes = [...firstOf.values(), codes.length - 1, Math.floor(codes.length / 2) + 17];
    for (const i of probes) {
      const colIndex = i % terrain.width;
      const rowIndex = Math.floor(i / terrain.width);
      expect(gdalValue(file, colIndex, rowIndex)).toBe(codes[i]);
    }

    // The ESRI ASCII grid of the same layer: the same grid and the same values for GDAL.
    const asc = await observer.get(`/api/v1/coverage-runs/${runId}/layers/posts-per-cell.asc?${query}`).expect(200);
    expect(asc.text).toMatch(/^ncols \d+\nnrows \d+\nxllcorner [\d.]+\nyllcorner [\d.]+\ncellsize [\d.]+\nNODATA_value 0\n/);
    const ascFile = path.join(tmp, 'layer.asc');
    writeFileSync(ascFile, asc.text);
    // Source: GDAL AAIGrid driver — the header's xllcorner/yllcorner is the lower-left corner of the grid.
    const ascInfo = gdalinfo(ascFile);
    expect(ascInfo.driverShortName).toBe('AAIGrid');
    expect(ascInfo.size).toEqual([terrain.width, terrain.height]);
    expect(ascInfo.geoTransform[0]).toBeCloseTo(terrain.xllM, 6);
    expect(ascInfo.geoTransform[3]).toBeCloseTo(terrain.yllM + terrain.height * terrain.cellSizeM, 6);
    expect(ascInfo.geoTransform[1]).toBeCloseTo(terrain.cellSizeM, 9);
    for (const i of probes) expect(gdalValue(ascFile, i % terrain.width, Math.floor(i / terrain.width))).toBe(codes[i]);
  });

  it('exports one post’s view too, and says which field is wrong', async () => {
    const { runId, cases } = snapshot.coverage!;
    const c = cases[0]!;
    const postId = c.posts[0]!.postId;
    const res = await planner
      .get(`/api/v1/coverage-runs/${runId}/layers/post-visibility.tif?caseKey=${encodeURIComponent(c.key)}&postId=${postId}`)
      .buffer(true)
      .parse(binary)
      .expect(200);
    const file = path.join(tmp, 'post.tif');
    writeFileSync(file, res.body as Buffer);
    expect(gdalinfo(file).size).toEqual([snapshot.coverage!.grid.width, snapshot.coverage!.grid.height]);

    const noCase = await planner.get(`/api/v1/coverage-runs/${runId}/layers/posts-per-cell.tif`).expect(400);
    expect(noCase.body.error.fields).toHaveProperty('caseKey');
    const noPost = await planner
      .get(`/api/v1/coverage-runs/${runId}/layers/post-visibility.asc?caseKey=${encodeURIComponent(c.key)}`)
      .expect(400);
    expect(noPost.body.error.fields).toHaveProperty('postId');
    const badFormat = await planner.get(`/api/v1/coverage-runs/${runId}/layers/posts-per-cell.png?caseKey=x`).expect(400);
    expect(badFormat.body.error.fields).toHaveProperty('format');
  });
});

describe('who may export', () => {
  it('answers 404 to another organisation, and to observers for plans not approved', async () => {
    const { runId, cases } = snapshot.coverage!;
    const caseKey = encodeURIComponent(cases[0]!.key);
    for (const url of [
      `/api/v1/plans/${approved.id}/revisions/1/results.csv`,
      `/api/v1/plans/${approved.id}/revisions/1/features.geojson`,
      `/api/v1/coverage-runs/${runId}/layers/posts-per-cell.tif?caseKey=${caseKey}`,
      `/api/v1/coverage-runs/${runId}/layers/cross-bearing.asc?caseKey=${caseKey}`,
      `/api/v1/revisions/by-hash/${contentHash}`,
    ]) {
      expect((await stranger.get(url)).status).toBe(404);
    }
    // The coast plan is submitted, not approved: observers do not see it; reviewers do.
    expect((await observer.get(`/api/v1/plans/${submitted.id}/revisions/1/results.csv`)).status).toBe(404);
    expect((await observer.get(`/api/v1/plans/${submitted.id}/revisions/1/features.geojson`)).status).toBe(404);
    expect((await reviewer.get(`/api/v1/plans/${submitted.id}/revisions/1/results.csv`)).status).toBe(200);
    // Signed out: 401.
    expect((await request(app).get(`/api/v1/plans/${approved.id}/revisions/1/results.csv`)).status).toBe(401);
  });
});

// ---------------------------------------------------------------------------------------------
// A plan of this test's own, approved and then superseded by a newer version.

const TRICKY_POST = 'Knoll, "west"\nlookout';
const FORMULA_POST = '=1+2 hut';
let testPlan: Promise<{ plan: { id: string }; next: { id: string } }> | null = null;

/**
 * Two posts with awkward names on the forest site and a plan of them, approved; then a second
 * version of it (a draft). The exception note and justification count only if the standard fails.
 */
function frozenTestPlan() {
  testPlan ??= (async () => {
    const crane = (snapshot.inputs.posts as { location: { latDeg: number; lonDeg: number } }[])[0]!;
    const posts: string[] = [];
    for (const [name, lonShift] of [
      [TRICKY_POST, 0.002],
      [FORMULA_POST, 0.01],
    ] as const) {
      const created = await planner
        .post(`/api/v1/sites/${approved.siteId}/posts`)
        .send({
          name,
          kind: 'tower',
          location: { latDeg: crane.location.latDeg, lonDeg: crane.location.lonDeg + lonShift },
          groundElevationM: 200,
          structureHeightM: 10,
          eyeHeightM: 1.6,
        })
        .expect(201);
      posts.push(created.body.post.id);
    }
    const targets = (await planner.get('/api/v1/targets').expect(200)).body.items;
    const sets = (await planner.get('/api/v1/conditions').expect(200)).body.items;
    const plan = (
      await planner
        .post('/api/v1/plans')
        .send({
          siteId: approved.siteId,
          title: 'Export test plan',
          postIds: posts,
          targetIds: [targets.find((t: { name: string }) => t.name === 'Early smoke column').id],
          conditionSetIds: [sets.find((s: { name: string }) => s.name === 'Refraction spread').id],
          standard: { minSeenPct: 0, priorityMinPosts: 1 },
        })
        .expect(201)
    ).body.plan;
    await planner.post(`/api/v1/plans/${plan.id}/coverage`).send({}).expect(202);
    const s = await planner
      .post(`/api/v1/plans/${plan.id}/submit`)
      .send({ rowVersion: 0, exceptionNote: 'Test plan.' })
      .expect(200);
    await reviewer
      .post(`/api/v1/plans/${plan.id}/reviews`)
      .send({ decision: 'approve', revision: s.body.revision, justification: 'Test plan.' })
      .expect(201);
    const next = (await planner.post(`/api/v1/plans/${plan.id}/versions`).send({}).expect(201)).body.plan;
    return { plan, next };
  })();
  return testPlan;
}

describe('GET /revisions/by-hash/:sha256 (verify a printout)', () => {
  it('names the plan and revision and says whether it is still the approved one', async () => {
    const { plan, next } = await frozenTestPlan();
    const first = (await planner.get(`/api/v1/plans/${plan.id}/revisions/1`).expect(200)).body.revision.contentHash;

    // Approved and current (typed in capitals with spaces, as read off paper).
    const spaced = first.toUpperCase().replace(/(.{8})/g, '$1 ');
    let answer = RevisionByHashSchema.parse(
      (await observer.get(`/api/v1/revisions/by-hash/${encodeURIComponent(spaced)}`).expect(200)).body,
    );
    expect(answer).toMatchObject({
      plan: { id: plan.id, title: 'Export test plan', version: 1, status: 'approved' },
      revision: { number: 1 },
      standing: 'approved-current',
      isCurrentApproved: true,
      verified: true,
    });
    expect(answer.approval!.by.name).toBe('Lin Okonkwo-Hale');

    // The next version is submitted but not decided: the first stays the approved one.
    await planner.post(`/api/v1/plans/${next.id}/coverage`).send({}).expect(202);
    const s = await planner
      .post(`/api/v1/plans/${next.id}/submit`)
      .send({ rowVersion: 0, exceptionNote: 'Test plan.' })
      .expect(200);
    const second = (await planner.get(`/api/v1/plans/${next.id}/revisions/${s.body.revision}`).expect(200)).body.revision
      .contentHash;
    answer = RevisionByHashSchema.parse((await planner.get(`/api/v1/revisions/by-hash/${second}`).expect(200)).body);
    expect(answer).toMatchObject({ standing: 'under-review', isCurrentApproved: false, approval: null });
    expect(answer.currentApproved).toMatchObject({ planId: plan.id, revision: 1, contentHash: first });
    // An observer cannot see a revision that was never approved.
    expect((await observer.get(`/api/v1/revisions/by-hash/${second}`)).status).toBe(404);

    // Once the new version is approved, the old printout is superseded and points to the new one.
    await reviewer
      .post(`/api/v1/plans/${next.id}/reviews`)
      .send({ decision: 'approve', revision: s.body.revision, justification: 'Test plan.' })
      .expect(201);
    answer = RevisionByHashSchema.parse((await observer.get(`/api/v1/revisions/by-hash/${first}`).expect(200)).body);
    expect(answer).toMatchObject({ standing: 'superseded', isCurrentApproved: false, plan: { status: 'superseded' } });
    expect(answer.currentApproved).toMatchObject({ planId: next.id, version: 2, contentHash: second });
    answer = RevisionByHashSchema.parse((await observer.get(`/api/v1/revisions/by-hash/${second}`).expect(200)).body);
    expect(answer).toMatchObject({ standing: 'approved-current', isCurrentApproved: true });
  });

  it('answers 404 for a hash no revision has, and 400 for text that is not a hash', async () => {
    // sha256 of the empty string — no plan revision's content. Source: FIPS 180-4 test vectors (from memory).
    const empty = 'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855';
    const unknown = await planner.get(`/api/v1/revisions/by-hash/${empty}`).expect(404);
    expect(unknown.body.error.code).toBe('unknown_hash');
    const short = await planner.get('/api/v1/revisions/by-hash/abc123').expect(400);
    expect(short.body.error.fields).toHaveProperty('sha256');
    const notHex = await planner.get(`/api/v1/revisions/by-hash/${'z'.repeat(64)}`).expect(400);
    expect(notHex.body.error.fields.sha256).toMatch(/0–9/);
  });

  it('refuses a frozen coverage layer whose bytes no longer match the hash its revision recorded', async () => {
    // The test plan's first version froze its run; one of its layers is changed behind the app's back.
    const { plan } = await frozenTestPlan();
    const coverage = (await planner.get(`/api/v1/plans/${plan.id}/revisions/1`).expect(200)).body.revision.snapshot.coverage;
    const caseKey = coverage.cases[0].key as string;
    await db.query(
      `UPDATE coverage_layers SET encoded = jsonb_set(encoded, '{data}', to_jsonb('AQ' || (encoded->>'data')))
        WHERE run_id = :runId AND case_key = :caseKey AND layer = 'cross-bearing'`,
      { replacements: { runId: coverage.runId, caseKey } },
    );
    const spy = jest.spyOn(console, 'error').mockImplementation(() => undefined);
    try {
      const res = await planner.get(
        `/api/v1/coverage-runs/${coverage.runId}/layers/cross-bearing.tif?caseKey=${encodeURIComponent(caseKey)}`,
      );
      expect(res.status).toBe(500);
      expect(res.body.error.code).toBe('layer_tampered');
      expect(spy).toHaveBeenCalledWith(expect.stringContaining('INTEGRITY:'));
    } finally {
      spy.mockRestore();
    }
    // The untouched layer of the same case still exports.
    await planner
      .get(`/api/v1/coverage-runs/${coverage.runId}/layers/posts-per-cell.asc?caseKey=${encodeURIComponent(caseKey)}`)
      .expect(200);
  });

  it('refuses a revision whose content was changed behind the database’s guards', async () => {
    // The demo's approved revision, with its frozen trigger lifted for a moment by the owner role.
    await db.query('ALTER TABLE plan_revisions DISABLE TRIGGER plan_revisions_frozen');
    try {
      await db.query(
        `UPDATE plan_revisions SET snapshot = jsonb_set(snapshot, '{assumptions,0}', '"changed"') WHERE plan_id = :id AND number = 1`,
        { replacements: { id: approved.id } },
      );
    } finally {
      await db.query('ALTER TABLE plan_revisions ENABLE TRIGGER plan_revisions_frozen');
    }
    const spy = jest.spyOn(console, 'error').mockImplementation(() => undefined);
    try {
      expect((await planner.get(`/api/v1/revisions/by-hash/${contentHash}`)).body.error.code).toBe('revision_tampered');
      expect((await planner.get(`/api/v1/plans/${approved.id}/revisions/1/results.csv`)).body.error.code).toBe(
        'revision_tampered',
      );
      expect(spy).toHaveBeenCalledWith(expect.stringContaining('INTEGRITY:'));
    } finally {
      spy.mockRestore();
    }
  });
});

describe('coast features in the GeoJSON', () => {
  it('has the patrol routes, the shoreline, the shore strips per band × post and the gaps, placed by their chainage', async () => {
    const sites = (await planner.get('/api/v1/sites').expect(200)).body.items as { id: string; name: string }[];
    const coastId = sites.find((s) => s.name === 'Tallow Strand')!.id;
    const site = (await planner.get(`/api/v1/sites/${coastId}`).expect(200)).body.site;
    const posts = (await planner.get(`/api/v1/sites/${coastId}/posts`).expect(200)).body.items as {
      id: string;
      name: string;
      location: { latDeg: number; lonDeg: number };
      route: { latDeg: number; lonDeg: number }[] | null;
    }[];
    const gull = posts.find((p) => p.name === 'Gull Point')!;
    const fenwick = posts.find((p) => p.name === 'Fenwick Head')!;
    const vessel = posts.find((p) => p.name === 'Patrol vessel Kittiwake')!;
    // A straight shoreline from one shore post to the other (the sea side from the site's sea area), two bands.
    const shoreline = [
      [gull.location.lonDeg, gull.location.latDeg],
      [fenwick.location.lonDeg, fenwick.location.latDeg],
    ];
    await planner
      .patch(`/api/v1/sites/${coastId}`)
      .send({
        shoreline,
        bands: [
          { name: 'Surf zone', fromM: 0, toM: 926 },
          { name: 'Inshore', fromM: 926, toM: 5556 },
        ],
        version: site.version,
      })
      .expect(200);
    const targets = (await planner.get('/api/v1/targets').expect(200)).body.items as { id: string; name: string }[];
    const sets = (await planner.get('/api/v1/conditions').expect(200)).body.items as { id: string; name: string }[];
    const plan = (
      await planner
        .post('/api/v1/plans')
        .send({
          siteId: coastId,
          title: 'Coast export test',
          postIds: [gull.id, fenwick.id, vessel.id],
          targetIds: [targets.find((t) => t.name === 'Small open boat')!.id],
          conditionSetIds: [sets.find((s) => s.name === 'Standard day')!.id],
          standard: { minSeenPct: 0, priorityMinPosts: 1 },
        })
        .expect(201)
    ).body.plan;
    await planner.post(`/api/v1/plans/${plan.id}/coverage`).send({}).expect(202);
    await planner.post(`/api/v1/plans/${plan.id}/submit`).send({ rowVersion: 0, exceptionNote: 'Test plan.' }).expect(200);
    const frozen = (await planner.get(`/api/v1/plans/${plan.id}/revisions/1`).expect(200)).body.revision.snapshot as PlanSnapshot;
    const shoreCase = frozen.coverage!.cases[0]!;
    expect(shoreCase.bands.map((b) => b.name)).toEqual(['Surf zone', 'Inshore']);

    const res = await planner.get(`/api/v1/plans/${plan.id}/revisions/1/features.geojson`).expect(200);
    const features = JSON.parse(res.text).features as {
      geometry: { type: string; coordinates: unknown };
      properties: Record<string, unknown>;
    }[];
    const ofKind = (kind: string) => features.filter((f) => f.properties.kind === kind);
    // Source: Karney (2013), inverse problem (geographiclib): the geodesic length on WGS 84.
    const geodesicM = ([lon1, lat1]: number[], [lon2, lat2]: number[]) => Geodesic.WGS84.Inverse(lat1!, lon1!, lat2!, lon2!).s12!;
    // Source: RFC 7946 §3.1.1 — positions are longitude, latitude; 6 decimals ≈ 0.11 m.
    const ROUNDING_M = 0.5;

    // The patrol's route: its waypoints in order, and its length along the geodesics between them.
    const [route] = ofKind('patrol-route');
    expect(route!.geometry.type).toBe('LineString');
    const waypoints = route!.geometry.coordinates as number[][];
    expect(waypoints).toEqual(vessel.route!.map((w) => [+w.lonDeg.toFixed(6), +w.latDeg.toFixed(6)]));
    const routeLength = waypoints.slice(1).reduce((sum, p, i) => sum + geodesicM(waypoints[i]!, p), 0);
    expect(route!.properties).toMatchObject({ postId: vessel.id, waypoints: vessel.route!.length });
    expect(Math.abs((route!.properties.routeLengthM as number) - routeLength)).toBeLessThan(ROUNDING_M);

    // The shoreline and its length.
    const [line] = ofKind('shoreline');
    expect(line!.geometry.type).toBe('LineString');
    const start = (line!.geometry.coordinates as number[][])[0]!;
    expect(Math.abs((line!.properties.lengthM as number) - geodesicM(shoreline[0]!, shoreline[1]!))).toBeLessThan(ROUNDING_M);
    expect((line!.properties.bands as unknown[]).length).toBe(2);

    // Every post's watched stretches of every band: on a straight shore, each stretch starts and ends at its chainage
    // from the shoreline's start.
    const strips = ofKind('shore-strip');
    const expected = shoreCase.bands.flatMap((b) => b.posts.filter((p) => p.watched.some(([f, t]) => t > f)));
    expect(strips.length).toBe(expected.length);
    expect(strips.length).toBeGreaterThan(0);
    for (const strip of strips) {
      const watched = strip.properties.watched as [number, number][];
      const parts = strip.geometry.coordinates as number[][][];
      expect(strip.geometry.type).toBe('MultiLineString');
      expect(parts.length).toBe(watched.filter(([f, t]) => t > f).length);
      parts.forEach((part, i) => {
        const [from, to] = watched.filter(([f, t]) => t > f)[i]!;
        expect(Math.abs(geodesicM(start, part[0]!) - from)).toBeLessThan(ROUNDING_M);
        expect(Math.abs(geodesicM(start, part.at(-1)!) - to)).toBeLessThan(ROUNDING_M);
      });
    }

    // The gaps, each where its chainage says, named by band and with the post that could close it.
    const gaps = ofKind('shore-gap');
    expect(gaps.length).toBe(shoreCase.gaps.length);
    gaps.forEach((gap, i) => {
      const listed = shoreCase.gaps[i]!;
      expect(gap.properties).toMatchObject({
        band: listed.band,
        gapKind: listed.kind,
        closerPostName: listed.closer?.postName ?? null,
      });
      const ends =
        gap.geometry.type === 'Point'
          ? [gap.geometry.coordinates as number[], gap.geometry.coordinates as number[]]
          : [(gap.geometry.coordinates as number[][])[0]!, (gap.geometry.coordinates as number[][]).at(-1)!];
      expect(Math.abs(geodesicM(start, ends[0]!) - listed.fromM)).toBeLessThan(ROUNDING_M);
      expect(Math.abs(geodesicM(start, ends[1]!) - listed.toM)).toBeLessThan(ROUNDING_M);
    });
  });
});
