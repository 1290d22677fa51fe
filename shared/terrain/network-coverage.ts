import {
  checkCoverageStandard,
  type CoverageStandard,
  type CoverageStandardCheck,
} from '@/shared/terrain/check-coverage-standard';
import { checkSameGrid } from '@/shared/terrain/check-same-grid';
import type { CoveragePost, ViewingSector } from '@/shared/terrain/coverage-post';
import { computeCoverageStatistics, type CoverageStatistics, type CoverageZone } from '@/shared/terrain/coverage-statistics';
import { crossBearingQuality, type CrossBearingRaster } from '@/shared/terrain/cross-bearing-quality';
import type { HiddenHeightRaster, LookoutPost } from '@/shared/terrain/hidden-height-raster';
import { countPostsPerCell, type PostsPerCellRaster } from '@/shared/terrain/posts-per-cell';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { classifyVisibility } from '@/shared/terrain/visibility-classes';

/** One post of the network with its hidden-height raster (already computed). */
export interface NetworkPost {
  /** The post (cell, eye height in metres); must be the one `hidden` was computed for. */
  readonly post: LookoutPost;
  /** Its hidden heights, metres, for the condition being evaluated. */
  readonly hidden: HiddenHeightRaster;
  /** Viewing sector in true bearings, radians; null or absent = all round. */
  readonly sector?: ViewingSector | null;
  /** Grid convergence at the post, radians (true north → grid north, clockwise); default 0. */
  readonly gridConvergence?: number;
}

/** What to evaluate: one condition (the rasters') × one target height. */
export interface NetworkCoverageInput {
  /** The posts, all computed on one terrain under one condition. */
  readonly posts: readonly NetworkPost[];
  /** Target height above ground, metres (0 = the ground itself, 30–100 m a smoke column). */
  readonly targetHeight: number;
  /** 1 inside the site, 0 outside; null = the whole grid. */
  readonly siteMask: Uint8Array | null;
  /** Priority zones (their masks on the same grid); default none. */
  readonly zones?: readonly CoverageZone[];
  /** The plan's standard. */
  readonly standard: CoverageStandard;
  /** Least crossing angle of a good cross-bearing, radians; default π/6 (30°). */
  readonly minCrossingAngle?: number;
  /** Blind areas smaller than this are not listed, m²; default 10 000. */
  readonly blindAreaMinArea?: number;
  /** At most this many blind areas are listed; default 100. */
  readonly maxBlindAreas?: number;
  /** Hidden heights up to this count as ground seen, metres; default 0.001. */
  readonly groundTolerance?: number;
}

/** Everything about one network for one condition and one target height. */
export interface NetworkCoverage {
  /** Target height, metres. */
  readonly targetHeight: number;
  readonly postsPerCell: PostsPerCellRaster;
  readonly crossBearings: CrossBearingRaster;
  readonly statistics: CoverageStatistics;
  readonly check: CoverageStandardCheck;
}

/**
 * Evaluates a network of posts for one condition and one target height from
 * hidden-height rasters already computed (by the worker pool): classifies
 * each post's raster for the target height (`classifyVisibility`), counts the
 * posts that see each cell within their sectors (`countPostsPerCell`), judges
 * the cross-bearings (`crossBearingQuality`), sums up the site and zones and
 * finds the blind areas (`computeCoverageStatistics`) and checks the plan's
 * standard (`checkCoverageStandard`). See those functions for conventions:
 * rasters row-major with row 0 = north, metres and radians, areas in m².
 *
 * The posts must share one grid and one condition (refraction coefficient
 * and earth radius); each raster's range limit is used to tell no-data cells
 * from cells out of range.
 *
 * Source: see the functions it calls.
 *
 * @param input posts with rasters, target height (m), site and zone masks,
 *   standard and thresholds (not modified)
 * @returns new rasters, statistics and the verdict
 * @throws TerrainInputError `invalid-post` (no posts, or a raster computed for
 *   another post), `grid-mismatch`, `invalid-condition` (mixed conditions),
 *   and whatever the functions it calls throw
 * @example
 * const result = evaluateNetworkCoverage({
 *   posts: towers.map((t, i) => ({ post: t.post, hidden: hiddenRasters[i], sector: t.sector })),
 *   targetHeight: 30,
 *   siteMask,
 *   zones: [{ name: 'Old-growth stand', weight: 9, mask: zoneMask }],
 *   standard: { minSeenPct: 70, priorityMinPosts: 2 },
 * });
 * result.check.passed;
 */
export function evaluateNetworkCoverage(input: NetworkCoverageInput): NetworkCoverage {
  const { posts, targetHeight } = input;
  if (!Array.isArray(posts) || posts.length === 0) {
    throw new TerrainInputError('invalid-post', 'At least one post is needed.', 'posts');
  }
  const first = posts[0]!.hidden;
  const coveragePosts: CoveragePost[] = posts.map((entry, p) => {
    const { post, hidden } = entry;
    checkSameGrid(first, hidden, `posts.${p}.hidden`);
    if (hidden.post.col !== post.col || hidden.post.row !== post.row || hidden.post.eyeHeight !== post.eyeHeight) {
      throw new TerrainInputError(
        'invalid-post',
        `Post ${p}: its hidden-height raster was computed for another post ` +
          `(col ${hidden.post.col}, row ${hidden.post.row}, eye ${hidden.post.eyeHeight} m).`,
        `posts.${p}.hidden`,
      );
    }
    if (hidden.refractionCoefficient !== first.refractionCoefficient || hidden.earthRadius !== first.earthRadius) {
      throw new TerrainInputError(
        'invalid-condition',
        `Post ${p}: its raster was computed under another condition (k ${hidden.refractionCoefficient}, ` +
          `R ${hidden.earthRadius} m; the first post's: k ${first.refractionCoefficient}, R ${first.earthRadius} m).`,
        `posts.${p}.hidden`,
      );
    }
    const classes = classifyVisibility(hidden, targetHeight, { groundTolerance: input.groundTolerance }).classes;
    return {
      col: post.col,
      row: post.row,
      classes,
      sector: entry.sector ?? null,
      gridConvergence: entry.gridConvergence ?? 0,
      maxDistance: hidden.maxDistance,
    };
  });
  const postsPerCell = countPostsPerCell(first, coveragePosts);
  const crossBearings = crossBearingQuality(postsPerCell, coveragePosts, { minCrossingAngle: input.minCrossingAngle });
  const statistics = computeCoverageStatistics(postsPerCell, crossBearings, input.siteMask, input.zones ?? [], {
    blindAreaMinArea: input.blindAreaMinArea,
    maxBlindAreas: input.maxBlindAreas,
  });
  return {
    targetHeight,
    postsPerCell,
    crossBearings,
    statistics,
    check: checkCoverageStandard(statistics, input.standard),
  };
}
