import { SECTOR_KIND, type PreparedCoveragePost } from '@/shared/terrain/coverage-post';

/** Allowance on the sector test, radians, so a cell on a boundary ray counts as inside. */
const SECTOR_TOLERANCE = 1e-9; // common practice, no source

/**
 * Whether the direction from a post's cell centre to a cell centre `dx`
 * cells east and `dy` cells north lies inside the post's viewing sector,
 * boundaries included (to 1e-9 rad); the post's own cell (0, 0) always does.
 * Uses the sector's grid unit vectors f (start) and t (end): d is clockwise
 * of f when f × d ≤ 0, and t is clockwise of d when d × t ≤ 0; a sector wider
 * than 180° is everything outside its narrower complement. No trigonometry.
 *
 * Source: sign of the 2-D cross product as the side of a direction
 * (common practice, no source).
 *
 * @param post a post from `prepareCoveragePosts` (not modified)
 * @param dx cells east of the post
 * @param dy cells north of the post
 * @returns true inside the sector (always for an all-round post)
 * @example
 * // A post watching 0°–90° (grid): north-east is inside, north-west is not.
 * insideSector(post, 3, 3); // true
 * insideSector(post, -3, 3); // false
 */
export function insideSector(post: PreparedCoveragePost, dx: number, dy: number): boolean {
  const kind = post.kind;
  if (kind === SECTOR_KIND.allRound || (dx === 0 && dy === 0)) return true;
  const tolerance = SECTOR_TOLERANCE * ((dx < 0 ? -dx : dx) + (dy < 0 ? -dy : dy));
  const a = post.fx * dy - post.fy * dx;
  const b = dx * post.ty - dy * post.tx;
  if (kind === SECTOR_KIND.narrow) return a <= tolerance && b <= tolerance;
  return a <= tolerance || b <= tolerance;
}
