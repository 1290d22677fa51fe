import { checkInput } from '@/shared/sightline/check-input';
import { ONE_ARCMINUTE_RAD } from '@/shared/physics/constants';

/**
 * Angular-size limit: the greatest range at which a target of size s still
 * subtends the eye's resolving angle θ, d = s / (2 tan(θ/2)) (≈ s/θ). With
 * the default 1′ (normal 20/20 acuity) a 1 m object is resolvable to about
 * 3.4 km. Lookout detection of a small object against clutter needs several
 * times that angle: pass a larger `resolutionRad` to model it.
 *
 * @param targetSizeM - the target's critical size (e.g. its width), metres, > 0
 * @param resolutionRad - resolving angle θ, radians, in (0, π); default one
 *   minute of arc
 * @returns metres
 * @throws {SightlineInputError} on non-finite or out-of-range input
 *
 * Source: visual acuity: 20/20 (6/6) vision resolves detail of one minute of
 * arc (Snellen convention; IES definition of visual acuity).
 *
 * @example
 * resolutionRange(1); // ≈ 3437.7 m
 */
export function resolutionRange(targetSizeM: number, resolutionRad: number = ONE_ARCMINUTE_RAD): number {
  checkInput('targetSizeM', targetSizeM, { min: 0, minExclusive: true });
  checkInput('resolutionRad', resolutionRad, { min: 0, max: Math.PI, minExclusive: true, maxExclusive: true });
  return targetSizeM / (2 * Math.tan(resolutionRad / 2));
}
