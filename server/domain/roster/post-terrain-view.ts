import type { BriefingTerrainView } from '@/shared/schemas/assignment';
import type { CoverageSnapshot } from '@/shared/schemas/coverage';
import type { PlanResultRow } from '@/shared/schemas/plan';
import type { Post } from '@/shared/schemas/site';
import { blindBearingRanges } from '@/shared/terrain/blind-bearing-ranges';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import { gridConvergence } from '@/shared/terrain/grid-convergence';
import { gridProjection } from '@/shared/terrain/grid-projection';
import { locatePostCell } from '@/shared/terrain/locate-post-cell';
import { rasterizePolygon } from '@/shared/terrain/rasterize-polygon';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { seenShareByBearing } from '@/shared/terrain/seen-share-by-bearing';
import { gridSpecFromM, type TerrainCrs } from '@/shared/terrain/grid-spec';
import { coverageRepository } from '@/server/data/repositories/coverage-repository';
import { ringOnGrid } from '../coverage/compute-coverage';

/** Width of a bearing sector in the briefing, degrees. */
export const BRIEFING_SECTOR_DEG = 10;
/** Sectors seen below this share are blind in the briefing, percent. */
export const BRIEFING_BLIND_BELOW_PCT = 25;

const round = (v: number, digits: number) => Math.round(v * 10 ** digits) / 10 ** digits;
const pct = (share: number | null) => (share === null ? null : round(100 * share, 1));

/**
 * What one post sees over the site's terrain, from a plan's frozen coverage
 * run: per target × condition its seen share, the seen share of the ground in
 * range by 10° sector of true bearing (from its stored visibility layer), the
 * sectors it sees less than a quarter of, and the plan's detection range.
 * Null when the run was on the flat datum or holds no layer for the post.
 */
export async function postTerrainView(args: {
  coverage: CoverageSnapshot;
  crs: TerrainCrs;
  post: Post;
  /** The site's boundary as the revision froze it (`[lon, lat]` ring), or null. */
  boundary: [number, number][] | null;
  results: PlanResultRow[];
}): Promise<BriefingTerrainView | null> {
  const { coverage, crs, post, boundary, results } = args;
  if (coverage.datum !== 'terrain' || coverage.terrainId === null) return null;
  const grid = gridSpecFromM(coverage.grid, crs);
  const projection = gridProjection(crs);
  const { x, y } = projection.toGrid(post.location);
  let cell;
  try {
    cell = locatePostCell(grid, x, y);
  } catch (error) {
    // A post the run placed on the grid always is; refuse quietly if the frozen data says otherwise.
    if (error instanceof TerrainInputError) return null;
    throw error;
  }
  const gamma = gridConvergence(projection, post.location);
  const siteMask = boundary ? rasterizePolygon(grid, [ringOnGrid(projection, boundary)]) : null;
  const cases: BriefingTerrainView['cases'] = [];
  for (const c of coverage.cases) {
    const mine = c.posts.find((p) => p.postId === post.id);
    if (!mine) continue;
    const encoded = await coverageRepository.layer(coverage.runId, c.key, 'post-visibility', post.id);
    if (!encoded) continue;
    const seaOnly = c.detection?.seaOnly ?? false;
    const sectors = seenShareByBearing({
      width: grid.width,
      height: grid.height,
      classes: decodeClassRaster(encoded),
      col: cell.col,
      row: cell.row,
      gridConvergenceRad: gamma,
      mask: seaOnly ? null : siteMask,
      sectorCount: 360 / BRIEFING_SECTOR_DEG,
    });
    const row = results.find(
      (r) => r.targetId === c.targetId && r.conditionSetId === c.conditionSetId && r.conditionIndex === c.conditionIndex,
    );
    cases.push({
      caseKey: c.key,
      targetId: c.targetId,
      targetName: c.targetName,
      conditionSetId: c.conditionSetId,
      conditionSetName: c.conditionSetName,
      conditionIndex: c.conditionIndex,
      conditionLabel: c.conditionLabel,
      seenPct: mine.seenPct,
      sectors: sectors.map((s) => ({ fromDeg: s.fromDeg, toDeg: s.toDeg, seenPct: pct(s.seenShare) })),
      blindSectors: blindBearingRanges(sectors, BRIEFING_BLIND_BELOW_PCT / 100).map((b) => ({
        fromDeg: b.fromDeg,
        toDeg: b.toDeg,
        seenPct: pct(b.seenShare)!,
      })),
      detectionRangeM: row ? row.result.detectionRangeM : null,
      limitedBy: row ? row.result.limitedBy : null,
      seaOnly,
    });
  }
  if (cases.length === 0) return null;
  return {
    runId: coverage.runId,
    terrainId: coverage.terrainId,
    sectorDeg: BRIEFING_SECTOR_DEG,
    blindBelowPct: BRIEFING_BLIND_BELOW_PCT,
    gridConvergenceDeg: round((gamma * 180) / Math.PI, 3),
    cases,
  };
}
