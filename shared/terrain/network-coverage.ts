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
  /**
   * Visibility classes already made for the target being evaluated, range
   * included (a patrol's view over its cycle, `PatrolSweep`); when given they
   * are used as they are and `hidden` only supplies the grid and condition.
   */
  readonly classes?: Uint8Array;
}

/**
 * One network post as the coverage count takes it: its cell, the visibility
 * `classes` made for the target, its sector and grid convergence, and the range
 * its raster was computed to.
 */
export function coveragePostOf(entry: NetworkPost, classes: Uint8Array): CoveragePost {
  const { post, hidden } = entry;
  return {
    col: post.col,
    row: post.row,
    classes,
    sector: entry.sector ?? null,
    gridConvergence: entry.gridConvergence ?? 0,
    maxDistance: hidden.maxDistance,
  };
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
  /**
   * The target's detection range from every post, metres (visibility,
   * angular size or luminous range, whichever is least); beyond it a post
   * does not count the cell. Default: none (the rasters' own range only).
   */
  readonly rangeLimit?: number | null;
}

/**
 * What decided the cells of the site (1 in the site mask) that no post
 * detects: the view (terrain, horizon or sector: some post is within range
 * but does not see the target) or the range (every post is too far).
 */
export interface LimitShares {
  /** Cells where at least one post detects the target. */
  readonly detectedCells: number;
  /** Cells without terrain data. */
  readonly noDataCells: number;
  /** Undetected cells within some post's range: the view decides. */
  readonly viewCells: number;
  /** Undetected cells beyond every post's range: the range decides. */
  readonly rangeCells: number;
  /** Area of one cell, m². */
  readonly cellArea: number;
}

/** Everything about one network for one condition and one target height. */
export interface NetworkCoverage {
  /** Target height, metres. */
  readonly targetHeight: number;
  readonly postsPerCell: PostsPerCellRaster;
  readonly crossBearings: CrossBearingRaster;
  readonly statistics: CoverageStatistics;
  readonly check: CoverageStandardCheck;
  /** Each post's visibility classes for the target (same order as the posts). */
  readonly postClasses: readonly Uint8Array[];
  /** What decided the undetected part of the site. */
  readonly limits: LimitShares;
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
    const rangeLimit = input.rangeLimit ?? null;
    const classes =
      entry.classes ??
      classifyVisibility(hidden, targetHeight, {
        groundTolerance: input.groundTolerance,
        rangeLimit: rangeLimit === null ? null : { col: post.col, row: post.row, maxDistance: rangeLimit },
      }).classes;
    return coveragePostOf(entry, classes);
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
    postClasses: coveragePosts.map((p) => p.classes),
    limits: limitShares(postsPerCell, input.siteMask),
  };
}

/** Splits the site's cells by what decided them (see {@link LimitShares}); one pass. */
function limitShares(counts: PostsPerCellRaster, siteMask: Uint8Array | null): LimitShares {
  let detectedCells = 0;
  let noDataCells = 0;
  let viewCells = 0;
  let rangeCells = 0;
  const { counts: c, noData } = counts;
  // countPostsPerCell always fills it; a raster rebuilt from a stored layer has none, and then every cell is "in reach".
  const reach = counts.reach ?? new Uint8Array(c.length).fill(1);
  for (let i = 0; i < c.length; i++) {
    if (siteMask !== null && siteMask[i] !== 1) continue;
    if (c[i]! > 0) detectedCells++;
    else if (noData[i] === 1) noDataCells++;
    else if (reach[i] === 1) viewCells++;
    else rangeCells++;
  }
  return { detectedCells, noDataCells, viewCells, rangeCells, cellArea: counts.cellSize * counts.cellSize };
}
