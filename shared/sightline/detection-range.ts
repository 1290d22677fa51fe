import { ONE_ARCMINUTE_RAD, VISIBILITY_CONTRAST_THRESHOLD } from '@/shared/sightline/constants';
import { extinctionFromVisibility } from '@/shared/sightline/extinction-from-visibility';
import { firstSightingRange } from '@/shared/sightline/first-sighting-range';
import { resolutionRange } from '@/shared/sightline/resolution-range';
import type { AbsentReason, Derived, DetectionLimit, SphereOptions, VisibilityKind } from '@/shared/sightline/types';
import { visualRange } from '@/shared/sightline/visual-range';

/** Inputs of {@link detectionRange}. All lengths in metres, angles in radians. */
export interface DetectionInput extends SphereOptions {
  /** Height of eye above the surface, ≥ 0. */
  readonly observerHeightM: number;
  /** Height of the target's top above the surface, ≥ 0. */
  readonly targetHeightM: number;
  /** Part of the target that must show above the horizon, ≥ 0 (default 0). */
  readonly requiredVisibleM?: number;
  /** Reported visibility, > 0; omit for no visibility limit. */
  readonly visibilityM?: number;
  /** Kind of `visibilityM` (default `'mor-5pct'`). */
  readonly visibilityKind?: VisibilityKind;
  /**
   * Threshold contrast the detection is judged at, in (0, 1) (default 0.05,
   * the MOR threshold, which WMO and IALA regard as closer to practical
   * sighting than 0.02).
   */
  readonly contrastThreshold?: number;
  /** Critical size of the target for the angular-size limit, > 0; omit for none. */
  readonly targetSizeM?: number;
  /** Resolving angle, radians, in (0, π) (default one minute of arc). */
  readonly resolutionRad?: number;
}

/** Result of {@link detectionRange}. */
export interface DetectionRange {
  /** The least of the limits, metres; `null` with `reason` when none applies or the target can never show. */
  readonly rangeM: number | null;
  /** Which limit sets `rangeM`; `null` with it. */
  readonly limitedBy: DetectionLimit | null;
  /** Why `rangeM` is null (`required-part-exceeds-target`, or `unbounded` when nothing limits the range). */
  readonly reason: AbsentReason | null;
  /** Each limit on its own. */
  readonly limits: {
    /** Geometric range for the required visible part (null under ducting). */
    readonly horizon: Derived;
    /** Visibility limit at `contrastThreshold`, or null when no visibility was given. */
    readonly visibilityM: number | null;
    /** Angular-size limit, or null when no target size was given. */
    readonly angularSizeM: number | null;
  };
}

/**
 * Detection range of a target: the least of
 * (a) the geometric range at which the required part first shows over the
 *     horizon, horizon(h) + horizon(H − p);
 * (b) the visibility limit — the reported visibility converted to the
 *     detection contrast threshold through Koschmieder's law;
 * (c) the angular-size limit, size / (2 tan(θ/2)).
 * Ties go to the earlier in that order. Visibility and angular size are
 * idealised limits (black target, daylight, a steady gaze): real detection
 * by a lookout is shorter and depends on training, search pattern and
 * background.
 *
 * @param input - see {@link DetectionInput}
 * @returns range, the limit that sets it, and each limit on its own
 * @throws {SightlineInputError} on invalid input
 *
 * Source: geographic range (The American Practical Navigator, Bowditch, NGA
 * Pub. 9, Table 12); Koschmieder's law with the thresholds of the AMS
 * Glossary (meteorological range, 0.02) and CIE S 017 / WMO-No. 8 (MOR,
 * 0.05); 1′ acuity of 20/20 vision.
 *
 * @example
 * detectionRange({ observerHeightM: 20, targetHeightM: 5, visibilityM: 8000, targetSizeM: 2 });
 * // → { rangeM: 6875.5, limitedBy: 'angular-size', … }
 */
export function detectionRange(input: DetectionInput): DetectionRange {
  const sphere: SphereOptions = { k: input.k, earthRadiusM: input.earthRadiusM };
  const horizon = firstSightingRange(input.observerHeightM, input.targetHeightM, input.requiredVisibleM ?? 0, sphere);

  const visibilityLimit =
    input.visibilityM === undefined
      ? null
      : visualRange(
          extinctionFromVisibility(input.visibilityM, input.visibilityKind ?? 'mor-5pct'),
          input.contrastThreshold ?? VISIBILITY_CONTRAST_THRESHOLD['mor-5pct'],
        );

  const angularLimit =
    input.targetSizeM === undefined ? null : resolutionRange(input.targetSizeM, input.resolutionRad ?? ONE_ARCMINUTE_RAD);

  const limits = { horizon, visibilityM: visibilityLimit, angularSizeM: angularLimit };
  if (horizon.reason === 'required-part-exceeds-target') {
    return { rangeM: null, limitedBy: null, reason: 'required-part-exceeds-target', limits };
  }

  const candidates: Array<[DetectionLimit, number | null]> = [
    ['horizon', horizon.value],
    ['visibility', visibilityLimit],
    ['angular-size', angularLimit],
  ];
  let best: [DetectionLimit, number] | null = null;
  for (const [limit, value] of candidates) {
    if (value !== null && (best === null || value < best[1])) best = [limit, value];
  }
  if (best === null) return { rangeM: null, limitedBy: null, reason: 'unbounded', limits };
  return { rangeM: best[1], limitedBy: best[0], reason: null, limits };
}
