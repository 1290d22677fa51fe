/*
 * Tide in the coverage run. Heights of posts are above the site's datum (mean
 * sea level or chart datum); the water stands `levelM` above that datum. A
 * post on land keeps its height above the datum, so its eye above the water
 * is lower by the tide; a vessel floats, so its eye above the water stays.
 */

/** One water level the run computes with. */
export interface TideLevel {
  /** `low`, `high` or `level` (a single stated level). */
  readonly id: 'low' | 'high' | 'level';
  /** For people, e.g. "low water". */
  readonly label: string;
  /** Metres above the site's height datum. */
  readonly levelM: number;
}

/** The levels a site's tide asks for: none (the datum itself), one, or low and high water. */
export function tideLevelsOf(tide: { levelM: number } | { lowM: number; highM: number } | null | undefined): TideLevel[] {
  if (!tide) return [];
  if ('levelM' in tide) return [{ id: 'level', label: 'tide level', levelM: tide.levelM }];
  return [
    { id: 'low', label: 'low water', levelM: tide.lowM },
    { id: 'high', label: 'high water', levelM: tide.highM },
  ];
}

/**
 * A post's eye height above the water at a tide level: ground elevation
 * (above the datum) + structure and eye, less the water's height above the
 * datum; a floating post (vessel) rides the tide, so its eye stays where it
 * is above the water. Never below 0.
 *
 * Source: heights above a datum less the water's height above it — common practice, no source.
 */
export function eyeAboveWaterM(
  post: { groundElevationM: number; aboveGroundM: number; floats: boolean },
  tideLevelM: number,
): number {
  if (post.floats) return Math.max(0, post.aboveGroundM + Math.max(0, post.groundElevationM));
  return Math.max(0, post.groundElevationM + post.aboveGroundM - tideLevelM);
}
