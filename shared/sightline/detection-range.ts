import { ONE_ARCMINUTE_RAD } from '@/shared/physics/constants';
import {
  BACKGROUND_LIGHTING_FACTOR,
  NIGHT_THRESHOLD_ILLUMINANCE_LUX,
  VISIBILITY_CONTRAST_THRESHOLD,
  type BackgroundLighting,
} from '@/shared/sightline/constants';
import { checkInput } from '@/shared/sightline/check-input';
import { convertVisibility } from '@/shared/sightline/convert-visibility';
import { extinctionFromVisibility } from '@/shared/sightline/extinction-from-visibility';
import { firstSightingRange } from '@/shared/sightline/first-sighting-range';
import { luminousRange } from '@/shared/sightline/luminous-range';
import { resolutionRange } from '@/shared/sightline/resolution-range';
import type {
  AbsentReason,
  Derived,
  DetectionLimit,
  NoDetectionReason,
  Period,
  SphereOptions,
  VisibilityKind,
} from '@/shared/sightline/types';
import { visualRange } from '@/shared/sightline/visual-range';

/** Inputs of {@link detectionRange}. All lengths in metres, angles in radians. */
export interface DetectionInput extends SphereOptions {
  /** Height of eye above the surface, ≥ 0. */
  readonly observerHeightM: number;
  /** Height of the target's top above the surface, ≥ 0. */
  readonly targetHeightM: number;
  /** Part of the target that must show above the horizon, ≥ 0 (default 0). */
  readonly requiredVisibleM?: number;
  /** Reported visibility, > 0; omit for no visibility limit (by night: the nominal 10 nmi). */
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
  /** Day (default) or night. */
  readonly period?: Period;
  /** Luminous intensity of the target's light towards the lookout, candela, ≥ 0; at night only a light is seen. */
  readonly lightIntensityCd?: number;
  /** Lights behind the target at night (default `none`): raises the threshold illuminance. */
  readonly backgroundLighting?: BackgroundLighting;
  /** Height of the wave crests that screen a target on the water, metres, ≥ 0 (default 0; see `waveScreenHeight`). */
  readonly waveScreenM?: number;
}

/** Result of {@link detectionRange}. */
export interface DetectionRange {
  /** The least of the limits, metres; `null` with `reason` when none applies or the target can never show. */
  readonly rangeM: number | null;
  /** Which limit sets `rangeM`; `null` with it. */
  readonly limitedBy: DetectionLimit | null;
  /** Why `rangeM` is null (`required-part-exceeds-target`, `unbounded`) or 0 (`screened-by-waves`, `unlit-at-night`). */
  readonly reason: AbsentReason | NoDetectionReason | null;
  /**
   * The least of the limits other than the horizon — what a terrain
   * viewshed, which does the geometry itself, must add: metres and the limit,
   * or `rangeM: null` when nothing but the geometry bounds the range.
   */
  readonly rangeLimit: { readonly rangeM: number | null; readonly limitedBy: Exclude<DetectionLimit, 'horizon'> | null };
  /** Each limit on its own. */
  readonly limits: {
    /** Geometric range for the required visible part (null under ducting). */
    readonly horizon: Derived;
    /** Visibility limit at `contrastThreshold` (by day), or null when no visibility was given or at night. */
    readonly visibilityM: number | null;
    /** Angular-size limit (by day), or null when no target size was given or at night. */
    readonly angularSizeM: number | null;
    /** Luminous range of the light (at night), or null by day. */
    readonly luminousRangeM: number | null;
    /** Wave-crest screen used, metres (0 without a sea). */
    readonly waveScreenM: number;
  };
}

type RangeLimit = Exclude<DetectionLimit, 'horizon'>;

const least = <L extends string>(candidates: ReadonlyArray<readonly [L, number | null]>): [L, number] | null => {
  let best: [L, number] | null = null;
  for (const [limit, value] of candidates) {
    if (value !== null && (best === null || value < best[1])) best = [limit, value];
  }
  return best;
};

/**
 * Detection range of a target: the least of the limits that apply.
 *
 * By day:
 * (a) the geometric range at which the required part first shows over the
 *     horizon, horizon(h) + horizon(H − p);
 * (b) the visibility limit — the reported visibility converted to the
 *     detection contrast threshold through Koschmieder's law (a visibility
 *     given at 2 % is first turned into the 5 % MOR);
 * (c) the angular-size limit, size / (2 tan(θ/2)).
 *
 * At night only a light is seen: (a) and
 * (d) the light's luminous range from Allard's law with the night threshold
 *     (× the background-lighting factor), through the visibility as MOR
 *     (the nominal 10 nmi when none is given). A target without a light has
 *     range 0 (`unlit-at-night`).
 *
 * On the water, (e) the wave screen: when the crests (`waveScreenM`) stand as
 * high as the part that must show (or as the whole target when no part is
 * required), the range is 0, `limitedBy: 'sea-state'`.
 *
 * Ties go to the earlier in that order. Visibility, angular size and
 * luminous range are idealised limits (a steady gaze, a known direction):
 * real detection by a lookout is shorter and depends on training, search
 * pattern and background.
 *
 * @param input - see {@link DetectionInput}
 * @returns range, the limit that sets it, the non-geometric limit, and each limit on its own
 * @throws {SightlineInputError} on invalid input
 *
 * Source: geographic range (The American Practical Navigator, Bowditch, NGA
 * Pub. 9, Table 12); Koschmieder's law with the thresholds of the AMS
 * Glossary (meteorological range, 0.02) and CIE S 017 / WMO-No. 8 (MOR,
 * 0.05); 1′ acuity of 20/20 vision; Allard's law (CIE S 017 17-31-025) with
 * the IALA night threshold; wave screen: see `waveScreenHeight`.
 *
 * @example
 * detectionRange({ observerHeightM: 20, targetHeightM: 5, visibilityM: 8000, targetSizeM: 2 });
 * // → { rangeM: 6875.5, limitedBy: 'angular-size', … }
 */
export function detectionRange(input: DetectionInput): DetectionRange {
  const sphere: SphereOptions = { k: input.k, earthRadiusM: input.earthRadiusM };
  const required = input.requiredVisibleM ?? 0;
  const horizon = firstSightingRange(input.observerHeightM, input.targetHeightM, required, sphere);
  const night = input.period === 'night';
  const waveScreenM = checkInput('waveScreenM', input.waveScreenM ?? 0, { min: 0 });

  const visibilityLimit =
    night || input.visibilityM === undefined
      ? null
      : visualRange(
          extinctionFromVisibility(input.visibilityM, input.visibilityKind ?? 'mor-5pct'),
          input.contrastThreshold ?? VISIBILITY_CONTRAST_THRESHOLD['mor-5pct'],
        );
  const angularLimit =
    night || input.targetSizeM === undefined
      ? null
      : resolutionRange(input.targetSizeM, input.resolutionRad ?? ONE_ARCMINUTE_RAD);
  const intensity = checkInput('lightIntensityCd', input.lightIntensityCd ?? 0, { min: 0 });
  const luminousLimit = !night
    ? null
    : intensity === 0
      ? 0
      : luminousRange({
          intensityCd: intensity,
          ...(input.visibilityM !== undefined && {
            visibilityMorM: convertVisibility(input.visibilityM, input.visibilityKind ?? 'mor-5pct', 'mor-5pct'),
          }),
          thresholdLux: NIGHT_THRESHOLD_ILLUMINANCE_LUX * BACKGROUND_LIGHTING_FACTOR[input.backgroundLighting ?? 'none'],
        });

  const limits = {
    horizon,
    visibilityM: visibilityLimit,
    angularSizeM: angularLimit,
    luminousRangeM: luminousLimit,
    waveScreenM,
  };
  if (horizon.reason === 'required-part-exceeds-target') {
    return { rangeM: null, limitedBy: null, reason: 'required-part-exceeds-target', rangeLimit: none, limits };
  }
  // Whatever shows of a target on the water stands above the crests.
  const shownAboveWaves = input.targetHeightM - waveScreenM;
  if (waveScreenM > 0 && (shownAboveWaves <= 0 || shownAboveWaves < required)) {
    return {
      rangeM: 0,
      limitedBy: 'sea-state',
      reason: 'screened-by-waves',
      rangeLimit: { rangeM: 0, limitedBy: 'sea-state' },
      limits,
    };
  }

  const other = least<RangeLimit>([
    ['visibility', visibilityLimit],
    ['angular-size', angularLimit],
    ['luminous-range', luminousLimit],
  ]);
  const rangeLimit = other === null ? none : { rangeM: other[1], limitedBy: other[0] };
  const best = least<DetectionLimit>([['horizon', horizon.value], ...(other ? [other] : [])]);
  if (best === null) return { rangeM: null, limitedBy: null, reason: 'unbounded', rangeLimit, limits };
  const reason = night && intensity === 0 ? 'unlit-at-night' : null;
  return { rangeM: best[1], limitedBy: best[0], reason, rangeLimit, limits };
}

const none = { rangeM: null, limitedBy: null } as const;
