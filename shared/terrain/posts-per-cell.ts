import { prepareCoveragePosts, SECTOR_KIND, type CoveragePost } from '@/shared/terrain/coverage-post';
import { insideSector } from '@/shared/terrain/inside-sector';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { GridSpec } from '@/shared/terrain/grid-spec';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';

/**
 * Codes of the coverage layer drawn on the map ({@link PostsPerCellRaster.layer}):
 * how many posts see the target in a cell, with 3 and more together. 0 is
 * "no data", as in `VISIBILITY_CLASS`.
 */
export const COVERAGE_LAYER = {
  /** The terrain has no data here (no post could compute the cell). */
  noData: 0,
  /** No post sees the target here. */
  unseen: 1,
  /** Exactly one post sees it: a bearing but no cross-bearing. */
  onePost: 2,
  /** Two posts see it: a cross-bearing is possible. */
  twoPosts: 3,
  /** Three or more posts see it. */
  threeOrMorePosts: 4,
} as const;

/** One of the {@link COVERAGE_LAYER} codes. */
export type CoverageLayerCode = (typeof COVERAGE_LAYER)[keyof typeof COVERAGE_LAYER];

/** How many posts of a network see the target in each cell (one target height, one condition). */
export interface PostsPerCellRaster extends GridSpec {
  /** Posts that see the target, per cell, saturating at 255; 0 on no-data cells. Row 0 = north. */
  readonly counts: Uint8Array;
  /** 1 where the terrain has no data (see {@link countPostsPerCell}), else 0. */
  readonly noData: Uint8Array;
  /** {@link COVERAGE_LAYER} code per cell, for the map. */
  readonly layer: Uint8Array;
  /**
   * 1 where at least one post has the cell within its range limits and
   * computed (seen, target only or blind for it), else 0: an unseen cell with
   * 0 here is beyond every post's detection range, so range, not the view,
   * decides it.
   */
  readonly reach?: Uint8Array;
  /** Number of posts counted. */
  readonly postCount: number;
}

/**
 * Counts, for every cell, the posts that see the target there: the post's
 * visibility class is seen or target-only (`classifyVisibility` for the
 * target height) and the cell lies inside the post's viewing sector.
 *
 * Sectors: the bearing of a cell is measured in the grid, from the post's
 * cell centre to the cell's centre (the post's own cell is always inside).
 * Sectors are given in true bearings, as people give them; grid north
 * differs from true north by the grid convergence γ at the post (up to about
 * 3° within a UTM zone at mid latitudes), so each sector is turned into grid
 * bearings as β_grid = β_true − γ with the post's `gridConvergence` before
 * the test. Boundaries are inside (to 1e-9 rad).
 *
 * No data: a cell is no-data when some post has class `none` there although
 * the cell is within that post's range limit — the terrain has no height
 * there (beyond a range limit `none` only means "not seen"). Such cells get
 * count 0, layer {@link COVERAGE_LAYER.noData}, and `noData` = 1; statistics
 * count them separately. A no-data cell beyond every post's range cannot be
 * told apart and is counted as unseen.
 *
 * Layer convention: 0 no data, 1 unseen, 2 one post, 3 two posts, 4 three or
 * more posts (see {@link COVERAGE_LAYER}).
 *
 * Complexity O(posts × cells), one pass per post over contiguous rows.
 *
 * Source: counting of overlapping single-post viewsheds ("cumulative" or
 * "multiple" viewshed) — common practice, no source.
 *
 * @param grid the grid of all class rasters (size, cell size in metres, origin)
 * @param posts cells, class rasters, optional sectors (radians, true), grid
 *   convergence (radians) and range limits (metres); none of them modified
 * @returns a new raster of counts, no-data mask and layer codes on `grid`
 * @throws TerrainInputError `post-outside-raster`, `invalid-post`,
 *   `invalid-layer`, `invalid-sector`, `invalid-raster` (with `field`)
 * @example
 * const counts = countPostsPerCell(grid, [
 *   { col: 40, row: 60, classes: classifyVisibility(hiddenA, 30).classes },
 *   { col: 90, row: 20, classes: classifyVisibility(hiddenB, 30).classes, sector: { from: 0, to: Math.PI } },
 * ]);
 * counts.counts[row * grid.width + col]; // 0, 1 or 2 posts see a 30 m smoke there
 */
export function countPostsPerCell(grid: GridSpec, posts: readonly CoveragePost[]): PostsPerCellRaster {
  const prepared = prepareCoveragePosts(grid, posts);
  if (prepared.length > 65_535) throw new TerrainInputError('invalid-post', 'At most 65 535 posts can be counted.', 'posts');
  const { width: W, height: H } = grid;
  // Up to 65 535 posts without overflow; clamped to 255 below.
  const tally = new Uint16Array(W * H);
  const noData = new Uint8Array(W * H);
  const reach = new Uint8Array(W * H);
  const SEEN = VISIBILITY_CLASS.seen;
  const TARGET_ONLY = VISIBILITY_CLASS.targetOnly;
  const BLIND = VISIBILITY_CLASS.blind;
  const NONE = VISIBILITY_CLASS.none;

  for (const post of prepared) {
    const classes = post.classes;
    const limited = Number.isFinite(post.range2);
    const allRound = post.kind === SECTOR_KIND.allRound;
    for (let row = 0; row < H; row++) {
      const dy = post.row - row;
      const base = row * W;
      // Columns within the range limit on this row (all of them when unlimited).
      let c0 = 0;
      let c1 = W - 1;
      if (limited) {
        const span2 = post.range2 - dy * dy;
        if (span2 < 0) {
          c1 = -1;
        } else {
          const span = Math.floor(Math.sqrt(span2));
          c0 = Math.max(0, post.col - span - 1);
          c1 = Math.min(W - 1, post.col + span + 1);
        }
      }
      if (allRound) {
        // The same tally without a branch on the class, which flips often between
        // neighbouring cells: seen and target only are 1 and 2, blind is 3, so
        // (c − 1) as unsigned is ≤ 1 where the post sees and ≤ 2 where the cell is
        // in its view; no data (0) is rare and keeps its branch.
        for (let col = 0; col < W; col++) {
          const i = base + col;
          const c = classes[i] as number;
          const u = (c - SEEN) >>> 0;
          tally[i] = (tally[i] as number) + +(u <= TARGET_ONLY - SEEN);
          reach[i] = (reach[i] as number) | +(u <= BLIND - SEEN);
          if (c === NONE && col >= c0 && col <= c1) {
            const dx = col - post.col;
            if (dx * dx + dy * dy <= post.range2) noData[i] = 1;
          }
        }
        continue;
      }
      for (let col = 0; col < W; col++) {
        const i = base + col;
        const c = classes[i];
        if (c === SEEN || c === TARGET_ONLY) {
          reach[i] = 1;
          if (allRound || insideSector(post, col - post.col, dy)) tally[i]!++;
        } else if (c === BLIND) {
          reach[i] = 1;
        } else if (c === NONE && col >= c0 && col <= c1) {
          const dx = col - post.col;
          if (dx * dx + dy * dy <= post.range2) noData[i] = 1;
        }
      }
    }
  }

  const counts = new Uint8Array(W * H);
  const layer = new Uint8Array(W * H);
  for (let i = 0; i < layer.length; i++) {
    if (noData[i] === 1) {
      layer[i] = COVERAGE_LAYER.noData;
    } else {
      const t = tally[i] as number;
      const c = t > 255 ? 255 : t;
      counts[i] = c;
      layer[i] = c >= 3 ? COVERAGE_LAYER.threeOrMorePosts : c + 1;
    }
  }
  return {
    width: W,
    height: H,
    cellSize: grid.cellSize,
    xll: grid.xll,
    yll: grid.yll,
    crs: grid.crs,
    counts,
    noData,
    layer,
    reach,
    postCount: prepared.length,
  };
}
