import type {
  RefractionCondition,
  SightlineCaution,
  SightlineRequest,
  SightlineResponse,
  SightlineResult,
  SightlineWarning,
} from '@/shared/schemas/sightline';
import {
  classifyRefraction,
  detectionRange,
  effectiveRadius,
  geographicRange,
  hiddenHeight,
  horizonDip,
  horizonDistance,
  MEAN_EARTH_RADIUS_M,
  tangentLength,
  visibleHeight,
  type SphereOptions,
} from '@/shared/sightline';
import { refractionWarnings } from '@/shared/sightline/refraction-warnings';
import { refractionFromCondition } from '@/shared/sightline/refraction-from-condition';
import { waveScreenOf } from '@/shared/sightline/wave-screen';
import { convertAngle } from '@/shared/units/angle';

/** Standing cautions returned with every evaluation. */
export const SIGHTLINE_CAUTIONS: readonly SightlineCaution[] = Object.freeze([
  {
    code: 'estimates-only',
    message:
      'These figures are estimates from a smooth-sphere model with uniform refraction; terrain, obstacles, waves and the height of the surface itself are not included.',
  },
  {
    code: 'refraction-varies',
    message:
      'Refraction near the horizon varies widely and quickly with the air close to the surface: mirages, looming, sinking and ducting can move a horizon or a target far from these values.',
  },
  {
    code: 'visibility-not-detection',
    message:
      'A target within geometric and meteorological range is not necessarily detected: contrast, lighting, background, motion, optics and the observer’s fatigue and training decide that.',
  },
  {
    code: 'follow-procedures',
    message: 'Use these figures to support, not replace, your agency’s procedures, local regulations and licensed practice.',
  },
] satisfies SightlineCaution[]);

function evaluateCondition(request: SightlineRequest, condition: RefractionCondition): SightlineResult {
  const earthRadiusM = request.earthRadiusM ?? MEAN_EARTH_RADIUS_M;
  const k = refractionFromCondition(condition, earthRadiusM);
  const sphere: SphereOptions = { k, earthRadiusM };
  const regime = classifyRefraction(k);
  const warnings: SightlineWarning[] = [];
  const h = request.observerHeightM;
  const target = request.targetHeightM;
  const distance = request.distanceM;

  warnings.push(...refractionWarnings(k));

  const dip = horizonDip(h, sphere);

  let hidden: number | null = null;
  let visible: number | null = null;
  if (distance === undefined) {
    warnings.push({ code: 'distance-not-given', message: 'No distance given, so hidden and visible height are not computed.' });
  } else {
    const hiddenResult = hiddenHeight(h, distance, sphere);
    hidden = hiddenResult.value;
    if (hiddenResult.reason === 'beyond-effective-quarter') {
      warnings.push({
        code: 'beyond-effective-quarter',
        message:
          'The target stands more than a quarter of the effective circumference past the horizon: no height reaches the sightline, so the hidden height does not exist and the visible height is 0.',
      });
    }
    if (target !== undefined) visible = visibleHeight(h, target, distance, sphere).value;
  }

  let geographic: number | null = null;
  let detection: number | null = null;
  let limitedBy: SightlineResult['limitedBy'] = null;
  let limits = { visibilityLimitM: null, angularSizeLimitM: null, luminousRangeM: null, waveScreenM: 0 } as Pick<
    SightlineResult,
    'visibilityLimitM' | 'angularSizeLimitM' | 'luminousRangeM' | 'waveScreenM'
  >;
  if (target === undefined) {
    warnings.push({
      code: 'target-height-not-given',
      message: `No target height given, so ${distance === undefined ? '' : 'visible height, '}geographic range and detection range are not computed.`,
    });
  } else {
    geographic = geographicRange(h, target, sphere).value;
    const result = detectionRange({
      observerHeightM: h,
      targetHeightM: target,
      requiredVisibleM: request.requiredVisibleM ?? 0,
      visibilityM: request.visibilityM,
      visibilityKind: request.visibilityKind,
      targetSizeM: request.targetSizeM,
      resolutionRad: convertAngle(request.resolutionArcmin ?? 1, 'arcmin', 'rad'),
      period: request.period ?? 'day',
      lightIntensityCd: request.lightIntensityCd,
      backgroundLighting: request.backgroundLighting,
      waveScreenM: waveScreenOf(request),
      ...sphere,
    });
    detection = result.rangeM;
    limitedBy = result.limitedBy;
    limits = {
      visibilityLimitM: result.limits.visibilityM,
      angularSizeLimitM: result.limits.angularSizeM,
      luminousRangeM: result.limits.luminousRangeM,
      waveScreenM: result.limits.waveScreenM,
    };
    if (result.reason === 'screened-by-waves') {
      warnings.push({
        code: 'screened-by-waves',
        message:
          `Wave crests about ${Number(result.limits.waveScreenM.toPrecision(3))} m above the mean surface hide the part of the target that must show, ` +
          'so it is not counted as detectable in this sea (it may show now and then between crests).',
      });
    } else if (result.reason === 'unlit-at-night') {
      warnings.push({
        code: 'unlit-at-night',
        message: 'At night a target without a light is not detected by eye in this model: give the light’s intensity (cd).',
      });
    }
    if (result.reason === 'required-part-exceeds-target') {
      warnings.push({
        code: 'required-part-exceeds-target',
        message: 'The required visible part is taller than the target, so the target can never show enough of itself.',
      });
    } else if (result.reason === 'unbounded') {
      warnings.push({
        code: 'detection-unbounded',
        message: 'Under ducting, and with no visibility or target size given, nothing bounds the detection range.',
      });
    }
  }

  return {
    k,
    regime,
    effectiveRadiusM: effectiveRadius(sphere).value,
    horizonDistanceM: horizonDistance(h, sphere).value,
    tangentLengthM: tangentLength(h, sphere).value,
    dipDeg: dip.value === null ? null : convertAngle(dip.value, 'rad', 'deg'),
    hiddenHeightM: hidden,
    visibleHeightM: visible,
    geographicRangeM: geographic,
    detectionRangeM: detection,
    limitedBy,
    ...limits,
    warnings,
  };
}

/**
 * The sightline use case: for each refraction condition of an (already
 * validated) request, the effective radius, horizon distance (arc), tangent
 * length, dip (degrees, positive below the horizontal), hidden and visible
 * height at the given distance, geographic range and detection range with
 * the limit that sets it. A quantity that does not exist under a condition,
 * or was not asked for, is `null` with a warning saying why; every number
 * returned is finite. The standing cautions are always included.
 *
 * Pure: no I/O, no clock, the request is not modified.
 *
 * @param request - a request parsed by `SightlineRequestSchema` (metres,
 *   °C, hPa, K/m lapse rate Γ = −dT/dh, N-units/km, arcminutes)
 * @returns one result per condition, in request order, plus the cautions
 * @throws {SightlineInputError} only if the request was not validated (e.g.
 *   a negative height)
 *
 * Source: the formulas of `@/shared/sightline`, each documented there.
 *
 * @example
 * evaluateSightline({ observerHeightM: 12, targetHeightM: 30, distanceM: 25_000, conditions: [{ preset: 'standard-optical' }] });
 * // → { results: [{ k: 0.13, horizonDistanceM: 13 257, hiddenHeightM: 9.42, … }], cautions: [...] }
 */
export function evaluateSightline(request: SightlineRequest): SightlineResponse {
  return {
    results: request.conditions.map((condition) => evaluateCondition(request, condition)),
    cautions: SIGHTLINE_CAUTIONS.map((caution) => ({ ...caution })),
  };
}
