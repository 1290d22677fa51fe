import type { CoverageLayerName } from '@/shared/schemas/coverage';
import { CROSS_BEARING_CLASS } from '@/shared/terrain/cross-bearing-quality';
import { COVERAGE_LAYER } from '@/shared/terrain/posts-per-cell';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';
import { PATROL_FRACTION_CODE } from '@/shared/terrain/patrol-sweep';

/**
 * What the cell values of each exported layer mean, and which value is
 * nodata. Values are the stored class codes unchanged (so a GIS reading the
 * file and Kenning's map agree cell for cell); nodata is the code that means
 * "no terrain data", or 255 (never stored) where no code means that.
 */
export const LAYER_LEGENDS: Record<CoverageLayerName, { nodata: number; legend: string }> = {
  'posts-per-cell': {
    nodata: COVERAGE_LAYER.noData,
    legend: `posts seeing the target: ${COVERAGE_LAYER.noData} no terrain data, ${COVERAGE_LAYER.unseen} none (blind), ${COVERAGE_LAYER.onePost} one, ${COVERAGE_LAYER.twoPosts} two, ${COVERAGE_LAYER.threeOrMorePosts} three or more`,
  },
  'cross-bearing': {
    nodata: 255,
    legend: `cross-bearing quality: ${CROSS_BEARING_CLASS.none} no post sees it, ${CROSS_BEARING_CLASS.single} one bearing, ${CROSS_BEARING_CLASS.weak} bearings cross too flat, ${CROSS_BEARING_CLASS.good} good cross-bearing`,
  },
  'post-visibility': {
    nodata: VISIBILITY_CLASS.none,
    legend: `one post's view: ${VISIBILITY_CLASS.none} not computed (no terrain data), ${VISIBILITY_CLASS.seen} ground seen, ${VISIBILITY_CLASS.targetOnly} only the target shows, ${VISIBILITY_CLASS.blind} blind, ${VISIBILITY_CLASS.outOfRange} beyond the detection range`,
  },
  'patrol-fraction': {
    nodata: PATROL_FRACTION_CODE.none,
    legend: `one patrol's share of its cycle in view: ${PATROL_FRACTION_CODE.none} not computed or outside the judged area, ${PATROL_FRACTION_CODE.never} never in view, 2–101 in view 1–100 % of the cycle (code − 1, rounded up)`,
  },
};
