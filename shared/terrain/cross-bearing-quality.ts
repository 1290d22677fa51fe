import { checkLayer } from '@/shared/terrain/check-layer';
import { prepareCoveragePosts, type CoveragePost } from '@/shared/terrain/coverage-post';
import { insideSector } from '@/shared/terrain/inside-sector';
import type { PostsPerCellRaster } from '@/shared/terrain/posts-per-cell';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { GridSpec } from '@/shared/terrain/grid-spec';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';

/** Class codes stored in {@link CrossBearingRaster.classes}. */
export const CROSS_BEARING_CLASS = {
  /** No post sees the target here (or the terrain has no data). */
  none: 0,
  /** One post sees it: a bearing, no fix. */
  single: 1,
  /** Two or more posts see it, but every pair's bearings cross too flat (outside the usable band). */
  weak: 2,
  /** At least one pair of bearings crosses within the usable band. */
  good: 3,
} as const;

/** One of the {@link CROSS_BEARING_CLASS} codes. */
export type CrossBearingClass = (typeof CROSS_BEARING_CLASS)[keyof typeof CROSS_BEARING_CLASS];

/** Default least crossing angle of a usable cross-bearing: 30° from parallel (band 30°–150°), radians. */
export const DEFAULT_MIN_CROSSING_ANGLE = Math.PI / 6;

/** Settings of {@link crossBearingQuality}. */
export interface CrossBearingOptions {
  /**
   * Least angle between two bearing lines, radians, for the fix to count as
   * good: bearings crossing at θ with minCrossingAngle ≤ θ ≤ π − minCrossingAngle.
   * Default π/6 (30°); 0 < value ≤ π/2.
   */
  readonly minCrossingAngle?: number;
}

/** Cross-bearing quality per cell for one target height and condition. */
export interface CrossBearingRaster extends GridSpec {
  /** {@link CROSS_BEARING_CLASS} code per cell, row 0 = north. */
  readonly classes: Uint8Array;
  /**
   * Best crossing angle over all pairs of posts that see the cell, radians in
   * [0, π/2] (the angle from parallel: θ and π − θ fold together); NaN where
   * fewer than two posts see the cell.
   */
  readonly bestAngle: Float32Array;
  /** The band limit used, radians. */
  readonly minCrossingAngle: number;
}

/** Above this many posts seeing one cell, pairs are found by sorting instead of trying all of them. */
const PAIRWISE_LIMIT = 16;
const HALF_PI = Math.PI / 2;
const ANGLE_TOLERANCE = 1e-9; // radians; common practice, no source

/**
 * Judges, for every cell, how well a smoke there can be fixed by crossing
 * bearings from the posts that see it. Two bearing lines from different posts
 * meeting at the cell cross at an angle θ; a line has no direction, so θ and
 * 180° − θ are equally good and the quality of a pair is its angle from
 * parallel, q = min(θ, π − θ) ∈ [0, π/2] (90° best). The cell gets the best
 * q over all pairs of posts that see it, and a class:
 * none (0 posts), single (1), weak (2+ but best q below the band), good
 * (best q ≥ `minCrossingAngle`, i.e. θ in [30°, 150°] by default).
 *
 * Bearings are grid bearings from each post's cell centre to the cell's
 * centre. The angle between two lines does not depend on which north they
 * are measured from, so the grid convergence does not enter (only its change
 * between two posts a few kilometres apart, a few thousandths of a degree).
 * The post's own cell has no bearing from that post: a pair with it has
 * q = 0; two posts in one cell give q = 0.
 *
 * Which posts see a cell is decided exactly as {@link countPostsPerCell}
 * does (class seen or target-only, inside the sector), and the counts are
 * taken from it: only cells seen by two or more posts are looked at.
 *
 * Complexity: O(cells) to skip cells seen by fewer than two posts, and for a
 * cell seen by k ≥ 2 of the N posts O(N) to gather the k bearings plus
 * O(k²) pairs when k ≤ 16, or O(k log k) when k > 16 (line directions folded
 * into [0, π), sorted, and for each one the partner nearest 90° away found by
 * a moving pointer). Per-cell work needs no trigonometry on the pairwise path
 * (|sin θ| from the cross product of the two direction vectors).
 *
 * Source for the default band: marine navigation practice — two lines of
 * position crossing near 90° give the smallest error and lines separated by
 * less than 30° give a poor fix (navigation training text, e.g.
 * http://nauticalinformation.blogspot.com/2008/03/navigational-fix.html);
 * the position error of a two-bearing fix grows as 1/sin θ (plain geometry).
 * Fire-lookout practice fixes smokes by intersecting bearings from two or more
 * towers (NWCG course FFM, 6.8 "Intersection",
 * https://www.nwcg.gov/course/ffm/location/68-intersection); no fire-lookout
 * source was found for the 30° limit itself.
 *
 * @param postsPerCell the counts from {@link countPostsPerCell} for the same posts (not modified)
 * @param posts the same posts, in any order (not modified)
 * @param options the usable band, radians; default 30° from parallel
 * @returns a new raster of classes and best angles on the counts' grid
 * @throws TerrainInputError `invalid-option` for a band outside (0, π/2],
 *   `invalid-post` when the posts do not match the counts, and whatever
 *   {@link countPostsPerCell} throws for the posts
 * @example
 * const counts = countPostsPerCell(grid, posts);
 * const cross = crossBearingQuality(counts, posts);
 * cross.classes[i] === CROSS_BEARING_CLASS.good; // a smoke in cell i can be fixed well
 * (cross.bestAngle[i] * 180) / Math.PI; // its best crossing angle, degrees from parallel
 */
export function crossBearingQuality(
  postsPerCell: PostsPerCellRaster,
  posts: readonly CoveragePost[],
  options: CrossBearingOptions = {},
): CrossBearingRaster {
  const minAngle = options.minCrossingAngle ?? DEFAULT_MIN_CROSSING_ANGLE;
  if (!Number.isFinite(minAngle) || minAngle <= 0 || minAngle > HALF_PI) {
    throw new TerrainInputError(
      'invalid-option',
      `The least crossing angle must be above 0 and at most 90° (π/2 rad), got ${minAngle} rad.`,
      'minCrossingAngle',
    );
  }
  checkLayer(postsPerCell, postsPerCell.counts, 'Uint8Array', 'postsPerCell.counts');
  const prepared = prepareCoveragePosts(postsPerCell, posts);
  if (prepared.length !== postsPerCell.postCount) {
    throw new TerrainInputError(
      'invalid-post',
      `The counts were made for ${postsPerCell.postCount} posts but ${prepared.length} were given.`,
      'posts',
    );
  }
  const { width: W, height: H } = postsPerCell;
  const counts = postsPerCell.counts;
  const N = prepared.length;
  const classes = new Uint8Array(W * H);
  const bestAngle = new Float32Array(W * H).fill(NaN);
  const ex = new Float64Array(N);
  const ey = new Float64Array(N);
  const len2 = new Float64Array(N);
  const folded = new Float64Array(N);
  const goodFrom = minAngle - ANGLE_TOLERANCE;

  for (let row = 0; row < H; row++) {
    const base = row * W;
    for (let col = 0; col < W; col++) {
      const i = base + col;
      const c = counts[i] as number;
      if (c < 2) {
        classes[i] = c === 0 ? CROSS_BEARING_CLASS.none : CROSS_BEARING_CLASS.single;
        continue;
      }
      let k = 0;
      for (let p = 0; p < N; p++) {
        const post = prepared[p]!;
        const v = post.classes[i];
        if (v !== VISIBILITY_CLASS.seen && v !== VISIBILITY_CLASS.targetOnly) continue;
        const dx = col - post.col;
        const dy = post.row - row;
        if (insideSector(post, dx, dy)) {
          ex[k] = dx;
          ey[k] = dy;
          len2[k] = dx * dx + dy * dy;
          k++;
        }
      }
      if (k !== c && c < 255) {
        throw new TerrainInputError(
          'invalid-post',
          `The posts do not match the counts: ${k} posts see cell (col ${col}, row ${row}) but the counts say ${c}.`,
          'posts',
        );
      }
      const q = k <= PAIRWISE_LIMIT ? bestPairwise(ex, ey, len2, k) : bestBySorting(ex, ey, k, folded);
      bestAngle[i] = q;
      classes[i] = q >= goodFrom ? CROSS_BEARING_CLASS.good : CROSS_BEARING_CLASS.weak;
    }
  }
  return {
    width: W,
    height: H,
    cellSize: postsPerCell.cellSize,
    xll: postsPerCell.xll,
    yll: postsPerCell.yll,
    crs: postsPerCell.crs,
    classes,
    bestAngle,
    minCrossingAngle: minAngle,
  };
}

/** Best angle from parallel over all pairs, radians: the largest |sin θ| = |a × b| / (|a||b|). */
function bestPairwise(ex: Float64Array, ey: Float64Array, len2: Float64Array, k: number): number {
  let best = 0; // sin² of the best angle
  for (let a = 0; a < k - 1; a++) {
    const ax = ex[a] as number;
    const ay = ey[a] as number;
    const la = len2[a] as number;
    if (la === 0) continue;
    for (let b = a + 1; b < k; b++) {
      const lb = len2[b] as number;
      if (lb === 0) continue;
      const cross = ax * (ey[b] as number) - ay * (ex[b] as number);
      const s = (cross * cross) / (la * lb);
      if (s > best) best = s;
    }
  }
  return Math.asin(Math.sqrt(best > 1 ? 1 : best));
}

/**
 * Best angle from parallel, radians, in O(k log k): line directions folded
 * into [0, π) and sorted; for each direction the best partner is the one
 * nearest to it + π/2 on the circle of circumference π, found by a pointer
 * that only moves forward.
 */
function bestBySorting(ex: Float64Array, ey: Float64Array, k: number, scratch: Float64Array): number {
  let m = 0;
  for (let j = 0; j < k; j++) {
    const dx = ex[j] as number;
    const dy = ey[j] as number;
    if (dx === 0 && dy === 0) continue;
    let a = Math.atan2(dx, dy); // bearing, (−π, π]
    if (a < 0) a += Math.PI;
    if (a >= Math.PI) a -= Math.PI;
    scratch[m++] = a;
  }
  if (m < 2) return 0;
  const a = scratch.subarray(0, m).sort();
  const at = (j: number): number => (j < m ? (a[j] as number) : (a[j - m] as number) + Math.PI);
  let best = 0;
  let j = 1;
  for (let i = 0; i < m; i++) {
    const ai = a[i] as number;
    const target = ai + HALF_PI;
    if (j < i + 1) j = i + 1;
    while (j < i + m && at(j) < target) j++;
    if (j < i + m) {
      const d = at(j) - ai;
      const q = d < Math.PI - d ? d : Math.PI - d;
      if (q > best) best = q;
    }
    if (j - 1 >= i + 1) {
      const d = at(j - 1) - ai;
      const q = d < Math.PI - d ? d : Math.PI - d;
      if (q > best) best = q;
    }
  }
  return best;
}
