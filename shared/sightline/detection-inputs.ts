import type { ConditionSet, Target } from '@/shared/schemas/library';
import type { SightlineRequest } from '@/shared/schemas/sightline';
import { detectionRange, type DetectionRange } from '@/shared/sightline/detection-range';
import { waveScreenOf } from '@/shared/sightline/wave-screen';
import { convertAngle } from '@/shared/units/angle';

/**
 * The detection fields of a sightline request for a library target under a
 * condition set: height and required part, size, period and light, the
 * set's visibility (with its kind), sea (for targets on the water only) and
 * background lighting, and the lookout's resolving angle. One mapping, so
 * the plan results, the coverage runs and the quick check read a target
 * and a condition set the same way.
 *
 * @param target - a library target (lengths in metres, intensity in cd)
 * @param set - a library condition set (visibility in metres)
 * @param resolutionArcmin - the lookout's resolving angle in object space, arcminutes (default 1)
 * @returns the request fields (no observer height, no conditions)
 *
 * Source: none — a mapping of Kenning's own fields.
 *
 * @example
 * detectionInputsOf(personInWater, breezyDay); // { targetHeightM: 0.3, targetSizeM: 0.3, seaState: 3, … }
 */
export function detectionInputsOf(
  target: Pick<Target, 'heightM' | 'requiredVisibleM' | 'widthM' | 'period' | 'lightIntensityCd' | 'onWater'>,
  set: Pick<ConditionSet, 'visibilityM' | 'visibilityKind' | 'seaState' | 'significantWaveHeightM' | 'backgroundLighting'>,
  resolutionArcmin = 1,
): Omit<SightlineRequest, 'observerHeightM' | 'conditions'> {
  return {
    targetHeightM: target.heightM,
    requiredVisibleM: target.requiredVisibleM,
    targetSizeM: target.widthM,
    resolutionArcmin,
    period: target.period,
    ...(target.lightIntensityCd !== null && { lightIntensityCd: target.lightIntensityCd }),
    ...(set.visibilityM !== null && { visibilityM: set.visibilityM, visibilityKind: set.visibilityKind }),
    ...(target.onWater && set.significantWaveHeightM !== null && { significantWaveHeightM: set.significantWaveHeightM }),
    ...(target.onWater && set.significantWaveHeightM === null && set.seaState !== null && { seaState: set.seaState }),
    ...(set.backgroundLighting !== 'none' && { backgroundLighting: set.backgroundLighting }),
  };
}

/**
 * The limits on detecting a library target under a condition set that do
 * not depend on where the lookout stands — visibility, angular size,
 * luminous range, wave screen — as `detectionRange` gives them (its
 * `rangeLimit`, `limits` and `reason`): what a terrain viewshed, which does
 * the geometry itself, must add.
 *
 * @param target - a library target
 * @param set - a library condition set
 * @param resolutionArcmin - the lookout's resolving angle in object space, arcminutes (default 1)
 * @returns `detectionRange`'s result for an eye at the surface (its horizon figures are not meant to be read)
 *
 * Source: see `detectionRange`.
 *
 * @example
 * rangeLimitsOf(personInWater, standardDay).rangeLimit; // { rangeM: 1031, limitedBy: 'angular-size' }
 */
export function rangeLimitsOf(
  target: Parameters<typeof detectionInputsOf>[0],
  set: Parameters<typeof detectionInputsOf>[1],
  resolutionArcmin = 1,
): DetectionRange {
  const request = detectionInputsOf(target, set, resolutionArcmin);
  return detectionRange({
    observerHeightM: 0,
    targetHeightM: request.targetHeightM ?? 0,
    requiredVisibleM: request.requiredVisibleM,
    visibilityM: request.visibilityM,
    visibilityKind: request.visibilityKind,
    targetSizeM: request.targetSizeM,
    resolutionRad: convertAngle(resolutionArcmin, 'arcmin', 'rad'),
    period: request.period,
    lightIntensityCd: request.lightIntensityCd,
    backgroundLighting: request.backgroundLighting,
    waveScreenM: waveScreenOf(request),
  });
}
