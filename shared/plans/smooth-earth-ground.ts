/** Where the ground that targets stand on comes from, for smooth-earth figures. */
export type GroundBasis = 'sea-level' | 'stated' | 'post-ground';

/** The ground under the targets of one post's smooth-earth figures. */
export interface SmoothEarthGround {
  /** Height of that ground above sea level, metres. */
  readonly groundM: number;
  readonly basis: GroundBasis;
}

/** Words for each basis, for the figures' labels. */
export const GROUND_BASIS_WORDS: Readonly<Record<GroundBasis, string>> = {
  'sea-level': 'targets at sea level',
  stated: 'targets on the site’s stated ground height',
  'post-ground': 'targets on the post’s own ground',
};

/**
 * The datum of a post's smooth-earth figures: the ground its targets stand
 * on. A site may state it (`targetGroundM`); otherwise a coast's targets are
 * at sea level and an inland site's stand on the post's own ground — a tower
 * on a 580 m ridge looks over ground near 580 m, not over the sea 580 m below
 * it, so its height of eye is counted from there. Terrain coverage runs use
 * the terrain itself and do not need this.
 *
 * Source: height of eye is measured above the surface the horizon lies on —
 * common practice, no source.
 *
 * @example
 * smoothEarthGround({ kind: 'forest-district', targetGroundM: null }, { groundElevationM: 578 });
 * // { groundM: 578, basis: 'post-ground' }
 */
export function smoothEarthGround(
  site: { readonly kind: string; readonly targetGroundM: number | null },
  post: { readonly groundElevationM: number },
): SmoothEarthGround {
  if (site.targetGroundM !== null) return { groundM: site.targetGroundM, basis: 'stated' };
  if (site.kind === 'coast-stretch') return { groundM: 0, basis: 'sea-level' };
  return { groundM: post.groundElevationM, basis: 'post-ground' };
}
