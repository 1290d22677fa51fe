import type { ViewingSector } from '@/shared/terrain/coverage-post';
import { computeHiddenHeightRaster, type LookoutPost, type SightConditions } from '@/shared/terrain/hidden-height-raster';
import { evaluateNetworkCoverage, type NetworkCoverage, type NetworkCoverageInput } from '@/shared/terrain/network-coverage';
import { prepareSweepTerrain } from '@/shared/terrain/sweep-terrain';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';

/** A post of {@link computeNetworkCoverage}: cell, eye height (m) and optional sector. */
export interface NetworkPostSetup extends LookoutPost {
  /** Viewing sector in true bearings, radians; null or absent = all round. */
  readonly sector?: ViewingSector | null;
  /** Grid convergence at the post, radians; default 0. */
  readonly gridConvergence?: number;
}

/** Site, zones, standard and thresholds of {@link computeNetworkCoverage}, as {@link evaluateNetworkCoverage} takes them. */
export type NetworkCoverageSetup = Pick<
  NetworkCoverageInput,
  'siteMask' | 'zones' | 'standard' | 'minCrossingAngle' | 'blindAreaMinArea' | 'maxBlindAreas'
>;

/** One condition × one target height of {@link computeNetworkCoverage}. */
export interface NetworkCoverageCase {
  /** Index into the given conditions. */
  readonly conditionIndex: number;
  readonly conditions: SightConditions;
  /** Target height, metres. */
  readonly targetHeight: number;
  readonly coverage: NetworkCoverage;
}

/**
 * Computes a network's coverage on one thread for every condition × target
 * height: the hidden-height raster of each post once per condition
 * (`computeHiddenHeightRaster`, the terrain prepared once), then
 * `evaluateNetworkCoverage` for each target height. Meant for tests, the
 * command line and small grids; the server computes the rasters in worker
 * threads and calls `evaluateNetworkCoverage` itself.
 *
 * Source: see the functions it calls.
 *
 * @param terrain ground heights, metres (not modified)
 * @param posts cells, eye heights (m), optional sectors (radians, true) and grid convergence
 * @param conditions one entry per condition: k, R metres, maxDistance metres (at least one)
 * @param targetHeights target heights above ground, metres (at least one)
 * @param setup site and zone masks, standard and thresholds
 * @returns one case per condition × target height, conditions outermost
 * @throws TerrainInputError `invalid-condition` or `invalid-option` for empty
 *   lists, and whatever the functions it calls throw
 * @example
 * const cases = computeNetworkCoverage(terrain, towers, [{ refractionCoefficient: 0.13 }], [0, 30], {
 *   siteMask, standard: { minSeenPct: 70, priorityMinPosts: 2 },
 * });
 * cases[1]?.coverage.statistics.site.seenBy2.pct; // % of the site where a 30 m smoke is seen from two towers
 */
export function computeNetworkCoverage(
  terrain: TerrainRaster,
  posts: readonly NetworkPostSetup[],
  conditions: readonly SightConditions[],
  targetHeights: readonly number[],
  setup: NetworkCoverageSetup,
): NetworkCoverageCase[] {
  if (conditions.length === 0)
    throw new TerrainInputError('invalid-condition', 'At least one condition is needed.', 'conditions');
  if (targetHeights.length === 0)
    throw new TerrainInputError('invalid-option', 'At least one target height is needed.', 'targetHeights');
  const sweep = prepareSweepTerrain(terrain);
  const cases: NetworkCoverageCase[] = [];
  conditions.forEach((condition, conditionIndex) => {
    const networkPosts = posts.map((post) => ({
      post: { col: post.col, row: post.row, eyeHeight: post.eyeHeight },
      hidden: computeHiddenHeightRaster(terrain, post, condition, sweep),
      sector: post.sector ?? null,
      gridConvergence: post.gridConvergence ?? 0,
    }));
    for (const targetHeight of targetHeights) {
      const coverage = evaluateNetworkCoverage({ ...setup, posts: networkPosts, targetHeight });
      cases.push({ conditionIndex, conditions: condition, targetHeight, coverage });
    }
  });
  return cases;
}
