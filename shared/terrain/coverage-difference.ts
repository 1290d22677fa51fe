import { checkLayer } from '@/shared/terrain/check-layer';
import { checkSameGrid } from '@/shared/terrain/check-same-grid';
import type { PostsPerCellRaster } from '@/shared/terrain/posts-per-cell';
import type { GridSpec } from '@/shared/terrain/grid-spec';

/** Change codes stored in {@link CoverageDifference.changes}. */
export const COVERAGE_CHANGE = {
  /** No terrain data in either raster (or outside the mask). */
  noData: 0,
  /** Same number of posts (including unseen in both). */
  unchanged: 1,
  /** Unseen before, seen by at least one post after. */
  gained: 2,
  /** Seen before, unseen after. */
  lost: 3,
  /** Seen before and after, by more posts after. */
  morePosts: 4,
  /** Seen before and after, by fewer posts after. */
  fewerPosts: 5,
} as const;

/** One of the {@link COVERAGE_CHANGE} codes. */
export type CoverageChange = (typeof COVERAGE_CHANGE)[keyof typeof COVERAGE_CHANGE];

/** Cells and m² of one kind of change. */
export interface ChangeMeasure {
  readonly cells: number;
  /** m². */
  readonly area: number;
}

/** Per-cell change between two coverage rasters, with totals. */
export interface CoverageDifference extends GridSpec {
  /** {@link COVERAGE_CHANGE} code per cell, row 0 = north. */
  readonly changes: Uint8Array;
  readonly statistics: {
    /** Cells compared (in the mask, with data in both). */
    readonly compared: ChangeMeasure;
    /** Area per change code. */
    readonly byChange: {
      readonly unchanged: ChangeMeasure;
      readonly gained: ChangeMeasure;
      readonly lost: ChangeMeasure;
      readonly morePosts: ChangeMeasure;
      readonly fewerPosts: ChangeMeasure;
    };
    /** Cells going from 0 posts to ≥ 1, and back. */
    readonly gainedSeenBy1: ChangeMeasure;
    readonly lostSeenBy1: ChangeMeasure;
    /** Cells going from < 2 posts to ≥ 2, and back. */
    readonly gainedSeenBy2: ChangeMeasure;
    readonly lostSeenBy2: ChangeMeasure;
    /** Net change of the area seen by ≥ 1 and ≥ 2 posts, m² (gained − lost). */
    readonly netSeenBy1Area: number;
    readonly netSeenBy2Area: number;
  };
}

/**
 * Compares two posts-per-cell rasters of the same grid — two plans, or one
 * plan before and after a change (a tower raised by 10 m, a post moved) — for
 * the same target height and condition. Each cell gets a change code:
 * gained (0 → ≥ 1 posts), lost (≥ 1 → 0), more posts, fewer posts,
 * unchanged (0 → 0 included), or no data (no data in either, or outside the
 * mask). Totals: m² per code, and m² gained and lost seen by ≥ 1 and by ≥ 2
 * posts, with the net change.
 *
 * Source: per-cell change classification of two rasters — common practice,
 * no source.
 *
 * @param before counts and no-data mask, the reference (not modified)
 * @param after counts and no-data mask on the same grid (not modified)
 * @param mask 1 where to compare (e.g. the site), or null for the whole grid (not modified)
 * @returns a new raster of change codes with totals (areas in m²)
 * @throws TerrainInputError `grid-mismatch`, `invalid-layer` (with `field`)
 * @example
 * const diff = compareCoverage(countsBefore, countsAfter, siteMask);
 * diff.statistics.netSeenBy1Area / 1e6; // km² more seen by at least one post after raising the tower
 */
export function compareCoverage(
  before: PostsPerCellRaster,
  after: PostsPerCellRaster,
  mask: Uint8Array | null = null,
): CoverageDifference {
  checkLayer(before, before.counts, 'Uint8Array', 'before.counts');
  checkLayer(before, before.noData, 'Uint8Array', 'before.noData');
  checkSameGrid(before, after, 'after');
  checkLayer(before, after.counts, 'Uint8Array', 'after.counts');
  checkLayer(before, after.noData, 'Uint8Array', 'after.noData');
  if (mask !== null) checkLayer(before, mask, 'Uint8Array', 'mask');

  const n = before.counts.length;
  const changes = new Uint8Array(n);
  const tally = new Float64Array(6);
  let gained1 = 0;
  let lost1 = 0;
  let gained2 = 0;
  let lost2 = 0;
  for (let i = 0; i < n; i++) {
    if ((mask !== null && mask[i] === 0) || before.noData[i] === 1 || after.noData[i] === 1) continue;
    const a = before.counts[i] as number;
    const b = after.counts[i] as number;
    let code: number;
    if (a === b) code = COVERAGE_CHANGE.unchanged;
    else if (a === 0) code = COVERAGE_CHANGE.gained;
    else if (b === 0) code = COVERAGE_CHANGE.lost;
    else code = b > a ? COVERAGE_CHANGE.morePosts : COVERAGE_CHANGE.fewerPosts;
    changes[i] = code;
    tally[code]!++;
    if (a === 0 && b > 0) gained1++;
    else if (a > 0 && b === 0) lost1++;
    if (a < 2 && b >= 2) gained2++;
    else if (a >= 2 && b < 2) lost2++;
  }
  const cellArea = before.cellSize * before.cellSize;
  const measure = (cells: number): ChangeMeasure => ({ cells, area: cells * cellArea });
  const compared = tally.reduce((sum, v) => sum + v, 0);
  return {
    width: before.width,
    height: before.height,
    cellSize: before.cellSize,
    xll: before.xll,
    yll: before.yll,
    crs: before.crs,
    changes,
    statistics: {
      compared: measure(compared),
      byChange: {
        unchanged: measure(tally[COVERAGE_CHANGE.unchanged] as number),
        gained: measure(tally[COVERAGE_CHANGE.gained] as number),
        lost: measure(tally[COVERAGE_CHANGE.lost] as number),
        morePosts: measure(tally[COVERAGE_CHANGE.morePosts] as number),
        fewerPosts: measure(tally[COVERAGE_CHANGE.fewerPosts] as number),
      },
      gainedSeenBy1: measure(gained1),
      lostSeenBy1: measure(lost1),
      gainedSeenBy2: measure(gained2),
      lostSeenBy2: measure(lost2),
      netSeenBy1Area: (gained1 - lost1) * cellArea,
      netSeenBy2Area: (gained2 - lost2) * cellArea,
    },
  };
}
