import { locatePostCell } from '@/shared/terrain/locate-post-cell';
import type { GridSpec } from '@/shared/terrain/grid-spec';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { terrainProfile } from '@/shared/terrain/terrain-profile';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';

/** Whether a post sees a fix point, and from what that is known. */
export interface PostSeesFix {
  /** The ground at the point is in view; null when unknown (no terrain under the post or the point). */
  readonly seesGround: boolean | null;
  /**
   * Least height above the ground at the point that shows over the terrain (the hidden height), metres;
   * 0 when the ground is seen, null when unknown.
   */
  readonly minSmokeHeightM: number | null;
  readonly basis: 'coverage-run' | 'profile' | 'no-terrain';
}

/** What {@link postSeesFix} is given; positions in the terrain's grid metres. */
export interface PostSeesFixInput {
  /** The site's terrain, or null when it has none. */
  readonly terrain: TerrainRaster | null;
  /** The post: grid position and eye height above its ground, metres. */
  readonly post: { readonly x: number; readonly y: number; readonly eyeHeightM: number };
  /** The fix point, grid metres. */
  readonly at: { readonly x: number; readonly y: number };
  /** Refraction coefficient k of the line of sight (dimensionless). */
  readonly refractionCoefficient: number;
  /** Earth radius, metres (default the profile's mean radius). */
  readonly earthRadiusM?: number;
  /**
   * The post's class at the point in a finished coverage run on this terrain (`VISIBILITY_CLASS`), or null
   * without one. `seen`, `targetOnly` and `blind` decide whether the ground is seen; `none` (not computed) and
   * `outOfRange` (beyond the case's detection range, so the view was not decided) leave it to the profile.
   */
  readonly runClass: number | null;
}

/**
 * Can a post see the place a fix puts a smoke, and if not, how high must
 * the smoke rise to show? The ground's visibility comes from the site's
 * latest coverage run where it decided this cell, else from the exact
 * terrain profile from the post to the point; the height needed always
 * comes from the profile (the hidden height at the point: the sight line
 * from the eye over the highest obstruction, with the earth's curvature
 * lowered by (1 − k)·d²/(2R)). Without terrain nothing can be said.
 *
 * @param input terrain, post, point, k and the coverage run's class
 * @returns whether the ground is seen, the hidden height (m) and where the answer comes from
 * @example
 * postSeesFix({ terrain, post: { x: 516200, y: 5741300, eyeHeightM: 23.6 }, at: { x: 521000, y: 5736000 },
 *   refractionCoefficient: 0.13, runClass: null });
 * // { seesGround: false, minSmokeHeightM: 41.3, basis: 'profile' }
 */
export function postSeesFix(input: PostSeesFixInput): PostSeesFix {
  const unknown: PostSeesFix = { seesGround: null, minSmokeHeightM: null, basis: 'no-terrain' };
  if (!input.terrain) return unknown;
  let hidden: number | null = null;
  let groundSeen: boolean | null = null;
  try {
    const profile = terrainProfile(input.terrain, {
      observer: { x: input.post.x, y: input.post.y, eyeHeight: input.post.eyeHeightM },
      target: { x: input.at.x, y: input.at.y, height: 0 },
      conditions: [{ refractionCoefficient: input.refractionCoefficient, earthRadius: input.earthRadiusM }],
      maxSamples: 2,
    });
    const c = profile.conditions[0]!;
    if (Number.isFinite(c.hiddenHeight)) {
      hidden = Math.max(0, c.hiddenHeight);
      groundSeen = c.groundSeen;
    }
  } catch (error) {
    // Post or point off the terrain, on nodata, or the same place: the profile cannot tell.
    if (!(error instanceof TerrainInputError)) throw error;
  }
  const decided =
    input.runClass === VISIBILITY_CLASS.seen ||
    input.runClass === VISIBILITY_CLASS.targetOnly ||
    input.runClass === VISIBILITY_CLASS.blind;
  if (decided) {
    const seesGround = input.runClass === VISIBILITY_CLASS.seen;
    // The run's cell and the profile's exact point can disagree at an edge: never claim 0 m for ground the run calls hidden.
    const height = seesGround ? 0 : hidden !== null && hidden > 0 ? hidden : null;
    return { seesGround, minSmokeHeightM: height, basis: 'coverage-run' };
  }
  if (groundSeen === null) return unknown;
  return { seesGround: groundSeen, minSmokeHeightM: groundSeen ? 0 : hidden, basis: 'profile' };
}

/**
 * The class code of a stored per-post layer at a grid point, or null when the
 * point lies outside the layer's grid.
 *
 * @param grid the layer's grid (row 0 = north)
 * @param classes the decoded layer, `width * height` codes
 * @param x grid metres
 * @param y grid metres
 */
export function classAt(grid: GridSpec, classes: Uint8Array, x: number, y: number): number | null {
  try {
    const { col, row } = locatePostCell(grid, x, y);
    return classes[row * grid.width + col] ?? null;
  } catch (error) {
    if (error instanceof TerrainInputError) return null;
    throw error;
  }
}
