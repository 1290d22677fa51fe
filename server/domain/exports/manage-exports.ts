import { createHash } from 'node:crypto';
import type { CoverageLayerName, CoverageSnapshot } from '@/shared/schemas/coverage';
import type { PlanSnapshot } from '@/shared/schemas/plan';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import type { EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';
import { gridProjection } from '@/shared/terrain/grid-projection';
import { COVERAGE_LAYER } from '@/shared/terrain/posts-per-cell';
import { rasterizePolygon } from '@/shared/terrain/rasterize-polygon';
import { gridSpecFromM, type GridSpec } from '@/shared/terrain/grid-spec';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { coverageRepository } from '@/server/data/repositories/coverage-repository';
import { plansRepository } from '@/server/data/repositories/plans-repository';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
import { AppError } from '@/server/domain/app-error';
import type { TerrainCache } from '@/server/domain/ports/terrain-cache';
import type { Actor } from '../actor';
import { flatTerrain, ringOnGrid, seaMaskOf } from '../coverage/compute-coverage';
import type { CoverageRunInputs } from '../coverage/coverage-inputs';
import { coverageLayer } from '../coverage/manage-coverage';
import { getPlan, planRevision } from '../plans/manage-plans';
import { verifiedRevision } from '../plans/verify-revision';
import { blindAreaPolygons } from './blind-area-polygons';
import { exportFileName } from './export-file-name';
import { LAYER_LEGENDS } from '@/shared/terrain/class-layer-legends';
import { layerAsciiGrid, layerGeoTiff } from './layer-files';
import { planFeatureCollection, type BlindAreaOutline } from './plan-features';
import { resultsCsv } from './results-csv';

/** What the export use cases need besides the database. */
export interface ExportDeps {
  /** Terrain heights, for a coast site's land/sea mask (blind areas of targets on the water). */
  terrainCache: TerrainCache;
}

/** A file to send: its name, its bytes or text, and its media type. */
export interface ExportFile<B> {
  fileName: string;
  contentType: string;
  body: B;
}

/** The plan and a verified revision of it, with what its file names need. */
async function frozenRevision(actor: Actor, planId: string, number: number) {
  // planRevision applies the plan's access rules (observers: approved plans only; other
  // organisations: 404) and re-hashes the snapshot (500 revision_tampered on a mismatch).
  const revision = await planRevision(actor, planId, number);
  const plan = await getPlan(actor, planId);
  const snapshot = revision.snapshot!;
  const site = snapshot.inputs.site as { name?: string; timeZone?: string };
  const name = (what: string, extension: string) =>
    exportFileName({
      siteName: site.name ?? plan.siteName,
      planTitle: plan.title,
      planVersion: plan.version,
      revision: revision.number,
      at: revision.submittedAt,
      timeZone: site.timeZone ?? 'UTC',
      what,
      extension,
    });
  return { plan, revision, snapshot, name };
}

/** `GET /plans/:planId/revisions/:n/results.csv`. */
export async function resultsCsvExport(actor: Actor, planId: string, number: number): Promise<ExportFile<string>> {
  const { snapshot, name } = await frozenRevision(actor, planId, number);
  return { fileName: name('results', 'csv'), contentType: 'text/csv; charset=utf-8; header=present', body: resultsCsv(snapshot) };
}

const sha256Of = (encoded: EncodedClassRaster) => createHash('sha256').update(encoded.data).digest('hex');

/** Refuses a stored layer whose bytes no longer hash to what a revision froze. */
function checkLayerHash(
  coverage: CoverageSnapshot,
  planId: string,
  revision: number,
  key: string,
  encoded: EncodedClassRaster,
): void {
  const frozen = coverage.layerHashes[key];
  if (frozen === undefined || frozen === sha256Of(encoded)) return;
  console.error(
    `[kenning] INTEGRITY: layer ${key} of coverage run ${coverage.runId} (frozen by plan ${planId} revision ${revision}) ` +
      `no longer matches its recorded sha256 ${frozen}. It is withheld until an administrator looks into it.`,
  );
  throw new AppError(
    500,
    'layer_tampered',
    'This coverage layer no longer matches the one frozen with the plan revision: it has been changed since. It is withheld; tell your administrator.',
  );
}

const gridOf = (g: CoverageSnapshot['grid']): GridSpec => gridSpecFromM(g, g.epsg === null ? null : { epsg: g.epsg, wkt: null });

/**
 * The listed blind areas of every case of the revision's coverage, outlined
 * from the stored posts-per-cell layer: blind = no post sees the target
 * (`COVERAGE_LAYER.unseen`) inside the site (and, for a target on the water,
 * on the site's sea) — the cells the coverage statistics count — and each
 * listed area is the 8-connected patch that holds its interior point.
 */
async function blindAreaOutlines(
  deps: ExportDeps,
  actor: Actor,
  planId: string,
  revision: number,
  coverage: CoverageSnapshot,
): Promise<BlindAreaOutline[]> {
  const cases = coverage.cases.filter((c) => c.blindAreas.length > 0);
  if (cases.length === 0) return [];
  const run = await coverageRepository.find(actor.organizationId, coverage.runId);
  if (!run) return [];
  const inputs = run.inputs as CoverageRunInputs;
  const grid = gridOf(coverage.grid);
  const crs = run.terrainId ? await terrainCrsOf(actor, run.siteId, run.terrainId) : grid.crs;
  const projection = gridProjection(crs);
  const toRing = (ring: [number, number][]) => ringOnGrid(projection, ring);
  const siteMask = inputs.site.boundary ? rasterizePolygon(grid, [toRing(inputs.site.boundary)]) : null;
  let seaMask: Uint8Array | null | undefined;
  const seaMaskNow = async () => {
    if (seaMask === undefined) {
      const terrain = await terrainOf(deps, actor, run.siteId, run.terrainId, coverage);
      seaMask = seaMaskOf(inputs, terrain, toRing);
    }
    return seaMask;
  };
  const outlines: BlindAreaOutline[] = [];
  // One mask for every case: fresh memory is slow to touch on these machines.
  const mask = new Uint8Array(grid.width * grid.height);
  for (const c of cases) {
    const key = `posts-per-cell:${c.key}`;
    const encoded = await coverageRepository.layer(coverage.runId, c.key, 'posts-per-cell', '');
    if (!encoded) continue;
    checkLayerHash(coverage, planId, revision, key, encoded);
    const codes = decodeClassRaster(encoded);
    const sea = c.detection?.seaOnly ? await seaMaskNow() : null;
    for (let i = 0; i < codes.length; i++) {
      mask[i] =
        codes[i] === COVERAGE_LAYER.unseen && (siteMask === null || siteMask[i] === 1) && (sea === null || sea[i] === 1) ? 1 : 0;
    }
    const yTop = grid.yll + grid.height * grid.cellSize;
    const seeds = c.blindAreas.map((area) => {
      const point = area.interior ?? area.centroid;
      return { col: Math.floor((point.x - grid.xll) / grid.cellSize), row: Math.floor((yTop - point.y) / grid.cellSize) };
    });
    const polygons = blindAreaPolygons(grid, mask, seeds, (x, y) => projection.toLatLon(x, y));
    c.blindAreas.forEach((area, i) => {
      const outline = polygons[i];
      if (!outline) return;
      outlines.push({
        caseKey: c.key,
        rank: i + 1,
        areaM2: area.area,
        interior: area.interior ? { latDeg: area.interior.latDeg, lonDeg: area.interior.lonDeg } : null,
        coordinates: outline.coordinates,
      });
    });
  }
  return outlines;
}

/** The CRS of a stored terrain (its EPSG code, or its WKT when it has no code). */
async function terrainCrsOf(actor: Actor, siteId: string, terrainId: string) {
  const row = await terrainRepository.findInSite(actor.organizationId, siteId, terrainId);
  if (!row) throw AppError.notFound('The terrain of this coverage');
  return { epsg: row.epsg, wkt: row.crsWkt };
}

/** The terrain a run was computed on (the flat datum's grid without terrain). */
async function terrainOf(
  deps: ExportDeps,
  actor: Actor,
  siteId: string,
  terrainId: string | null,
  coverage: CoverageSnapshot,
): Promise<TerrainRaster> {
  if (terrainId === null) return flatTerrain(coverage.grid);
  const row = await terrainRepository.findInSite(actor.organizationId, siteId, terrainId);
  if (!row) throw AppError.notFound('The terrain of this coverage');
  return deps.terrainCache.loadTerrain(row);
}

/** `GET /plans/:planId/revisions/:n/features.geojson`. */
export async function featuresExport(
  deps: ExportDeps,
  actor: Actor,
  planId: string,
  number: number,
): Promise<ExportFile<ReturnType<typeof planFeatureCollection>>> {
  const { plan, revision, snapshot, name } = await frozenRevision(actor, planId, number);
  const blind = snapshot.coverage ? await blindAreaOutlines(deps, actor, planId, revision.number, snapshot.coverage) : [];
  const body = planFeatureCollection(
    snapshot as PlanSnapshot,
    {
      planId,
      planTitle: plan.title,
      planVersion: plan.version,
      revision: revision.number,
      contentHash: revision.contentHash,
      siteName: plan.siteName,
      cautions: snapshot.cautions.map((c) => c.message),
    },
    blind,
  );
  return { fileName: name('features', 'geojson'), contentType: 'application/geo+json', body };
}

/** `GET /coverage-runs/:runId/layers/:layer.tif|.asc`. */
export async function layerFileExport(
  actor: Actor,
  query: { runId: string; layer: CoverageLayerName; caseKey: string; postId?: string; format: 'tif' | 'asc' },
): Promise<ExportFile<Buffer | string> & { legend: string }> {
  const { runId, layer, caseKey, postId, format } = query;
  // The same checks as the map's layer: the run's visibility (observers: approved plans
  // only; 404 across organisations), a finished run, a case and post of the run.
  const encoded = await coverageLayer(actor, runId, layer, caseKey, postId);
  const run = (await coverageRepository.find(actor.organizationId, runId))!;
  const plan = (await plansRepository.find(actor.organizationId, run.planId))!;
  const site = await sitesRepository.findInOrganization(actor.organizationId, run.siteId);
  // The newest revision that froze this run: its layer hashes must still match.
  const frozenBy = (await plansRepository.revisions(run.planId, true))
    .filter((r) => r.snapshot?.coverage?.runId === runId)
    .at(-1);
  if (frozenBy) {
    const verified = verifiedRevision(run.planId, frozenBy);
    const key = [layer, caseKey, layer === 'post-visibility' || layer === 'patrol-fraction' ? postId : '']
      .filter(Boolean)
      .join(':');
    checkLayerHash(verified.snapshot!.coverage!, run.planId, verified.number, key, encoded);
  }
  const c = run.cases.find((x) => x.key === caseKey)!;
  const postName = postId ? c.posts.find((p) => p.postId === postId)?.postName : undefined;
  const what = [layer, c.targetName, c.conditionLabel, postName].filter(Boolean).join(' ');
  const fileName = exportFileName({
    siteName: site?.name ?? plan.siteName,
    planTitle: plan.title,
    planVersion: plan.version,
    revision: frozenBy?.number ?? null,
    at: frozenBy?.submittedAt ?? run.finishedAt ?? run.createdAt,
    timeZone: site?.timeZone ?? 'UTC',
    what,
    extension: format,
  });
  const legend = LAYER_LEGENDS[layer].legend;
  if (format === 'tif') return { fileName, contentType: 'image/tiff', body: layerGeoTiff(encoded, layer), legend };
  return { fileName, contentType: 'text/plain; charset=us-ascii', body: layerAsciiGrid(encoded, layer).asc, legend };
}
