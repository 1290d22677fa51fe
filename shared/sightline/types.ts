/**
 * Shared types of the sightline core.
 *
 * The model: a sphere of radius R (metres) and refraction folded into an
 * effective radius R' = R / (1 − k), k the refraction coefficient (the ratio
 * of the Earth's radius to the radius of the light path). Sightlines are then
 * straight lines over the effective sphere.
 */

/**
 * Why a quantity has no value:
 * - `ducting`: k ≥ 1, the effective surface is flat or concave, so there is
 *   no geometric horizon (R' infinite or negative).
 * - `beyond-effective-quarter`: the target stands more than a quarter of the
 *   effective circumference past the tangent point; no height would reach the
 *   sightline, so a hidden height does not exist.
 * - `required-part-exceeds-target`: more of the target is asked to show than
 *   the target has.
 * - `unbounded`: no limit applies (e.g. ducting and neither a visibility nor a
 *   target size is given).
 */
export type AbsentReason = 'ducting' | 'beyond-effective-quarter' | 'required-part-exceeds-target' | 'unbounded';

/**
 * Why a detection range is 0 although the geometry would allow more:
 * - `screened-by-waves`: the wave crests stand as high as the part of the
 *   target that must show;
 * - `unlit-at-night`: at night a target without a light is not detected by eye.
 */
export type NoDetectionReason = 'screened-by-waves' | 'unlit-at-night';

/**
 * A quantity that may not exist under the given conditions. Never NaN and
 * never ±Infinity: either a finite `value` with `reason: null`, or
 * `value: null` with the reason.
 */
export type Derived = { readonly value: number; readonly reason: null } | { readonly value: null; readonly reason: AbsentReason };

/** The sphere and the refraction: all optional, with documented defaults. */
export interface SphereOptions {
  /** Refraction coefficient k, dimensionless. Default 0.13 (standard optical). */
  readonly k?: number;
  /** Radius of the Earth model R, metres. Default 6 371 008.8 (IUGG mean). */
  readonly earthRadiusM?: number;
}

/** Refraction regimes by k (see `classifyRefraction`). */
export type RefractionRegime = 'sub-refraction' | 'standard' | 'super-refraction' | 'ducting';

/** Which limit sets a detection range. */
export type DetectionLimit = 'horizon' | 'visibility' | 'angular-size' | 'luminous-range' | 'sea-state';

/** Day or night: by day a target is seen by its contrast and size, at night only by its light. */
export type Period = 'day' | 'night';

/** The two kinds of reported visibility Kenning accepts. */
export type VisibilityKind = 'meteorological-range-2pct' | 'mor-5pct';
