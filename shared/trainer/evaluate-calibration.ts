import type { CalibrationFigures, CalibrationMeasurement, CalibrationWarning } from '@/shared/schemas/calibration';
import type { LapseRateConditionSchema } from '@/shared/schemas/sightline';
import type { z } from 'zod';
import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';
import { classifyRefraction } from '@/shared/sightline/classify-refraction';
import { effectiveRadius } from '@/shared/sightline/effective-radius';
import { formatK } from '@/shared/sightline/format-k';
import { refractionFromCondition } from '@/shared/sightline/refraction-from-condition';
import { refractionWarnings } from '@/shared/sightline/refraction-warnings';
import { SIGHTLINE_CAUTIONS } from '@/shared/sightline/evaluate-sightline';
import { convertAngle } from '@/shared/units/angle';
import { kFromDip } from '@/shared/trainer/k-from-dip';
import { kFromHiddenHeight, K_SEARCH_MIN } from '@/shared/trainer/k-from-hidden-height';
import { kFromReciprocalZenith } from '@/shared/trainer/k-from-reciprocal-zenith';

type Weather = z.infer<typeof LapseRateConditionSchema>;

const ARCSEC_RAD = Math.PI / (180 * 3600);
const fmt = (value: number, digits = 4) => String(Number(value.toPrecision(digits)));

interface Solved {
  k: number | null;
  kMin: number | null;
  kMax: number | null;
  resultKind: CalibrationFigures['resultKind'];
  working: string;
  warnings: CalibrationWarning[];
}

function solveDip(m: Extract<CalibrationMeasurement, { method: 'dip' }>, r: number): Solved {
  const dip = convertAngle(m.observedDipArcmin, 'arcmin', 'rad');
  const acc = convertAngle(m.accuracyArcmin, 'arcmin', 'rad');
  const k = kFromDip(m.eyeHeightM, dip, r);
  // k falls as the dip grows: the larger dip gives the lower end.
  const kMin = kFromDip(m.eyeHeightM, dip + acc, r);
  const kMax = kFromDip(m.eyeHeightM, dip - acc, r);
  const working =
    `k = 1 − R·(1 − cos δ)/(h·cos δ) with R = ${fmt(r / 1000, 7)} km, h = ${fmt(m.eyeHeightM)} m, δ = ${fmt(m.observedDipArcmin)}′ ± ${fmt(m.accuracyArcmin)}′` +
    (k === null
      ? ': a dip of 0′ or less has no k below 1 (the horizon is at or above the horizontal).'
      : ` → k = ${formatK(k)}.`);
  const warnings: CalibrationWarning[] = [];
  if (k === null) {
    return { k: null, kMin: kMin ?? 1, kMax: null, resultKind: 'lower-bound', working, warnings };
  }
  return { k, kMin: kMin ?? 1, kMax, resultKind: 'estimate', working, warnings };
}

function solveReciprocal(m: Extract<CalibrationMeasurement, { method: 'reciprocal' }>, r: number): Solved {
  const z1 = convertAngle(m.zenithAngle1Deg, 'deg', 'rad');
  const z2 = convertAngle(m.zenithAngle2Deg, 'deg', 'rad');
  const k = kFromReciprocalZenith(m.distanceM, z1, z2, r);
  // Each angle off by up to ±a moves the sum by up to ±2a: |Δk| = R·2a/S (worst case).
  const dk = (r * 2 * m.accuracyArcsec * ARCSEC_RAD) / m.distanceM;
  const excessArcsec = (z1 + z2 - Math.PI) / ARCSEC_RAD;
  const working =
    `k = 1 − R·(z₁ + z₂ − 180°)/S with R = ${fmt(r / 1000, 7)} km, S = ${fmt(m.distanceM, 6)} m, ` +
    `z₁ + z₂ − 180° = ${fmt(excessArcsec)}″ → k = ${formatK(k)}; each angle ± ${fmt(m.accuracyArcsec)}″ moves k by up to ± ${fmt(dk, 3)}.`;
  const warnings: CalibrationWarning[] = [];
  if (dk > 0.2) {
    warnings.push({
      code: 'line-too-short',
      message: `On a ${fmt(m.distanceM / 1000, 3)} km line the angles' accuracy leaves k uncertain by ± ${fmt(dk, 2)}: use a longer line or a finer instrument.`,
    });
  }
  return { k, kMin: k - dk, kMax: k + dk, resultKind: 'estimate', working, warnings };
}

function solveMark(m: Extract<CalibrationMeasurement, { method: 'mark' }>, r: number): Solved {
  const solve = (hidden: number) => kFromHiddenHeight(m.eyeHeightM, m.distanceM, hidden, r);
  const base =
    `hidden height of a ${fmt(m.markHeightM)} m mark at ${fmt(m.distanceM / 1000, 4)} km from an eye at ${fmt(m.eyeHeightM)} m ` +
    `(hidden = R′/cos((d − d_h)/R′) − R′, R′ = R/(1 − k), solved for k)`;
  const warnings: CalibrationWarning[] = [];
  const atFloor = (k: number | null) => k !== null && k <= K_SEARCH_MIN + 1e-6;

  if (m.observedVisibleFromM !== undefined && m.observedVisibleFromM > 0) {
    const x = m.observedVisibleFromM;
    const k = solve(x);
    const kMin = solve(x + m.accuracyM);
    const kMax = x - m.accuracyM > 0 ? solve(x - m.accuracyM) : null;
    if (k === null) {
      warnings.push({
        code: 'unexplained-sighting',
        message: `Even a k of ${K_SEARCH_MIN} hides less than ${fmt(x)} m of the mark: check the distance and heights (something else, such as terrain or waves, hid the base).`,
      });
      return { k: null, kMin: null, kMax: null, resultKind: 'none', working: `${base}: no k explains it.`, warnings };
    }
    if (m.accuracyM === 0) {
      warnings.push({ code: 'no-accuracy', message: 'No accuracy was given for the visible-from height, so kMin = kMax = k.' });
    }
    return {
      k,
      kMin: kMin ?? K_SEARCH_MIN,
      kMax,
      resultKind: 'estimate',
      working: `${base}, hidden ${fmt(x)} m ± ${fmt(m.accuracyM)} m → k = ${formatK(k)}.`,
      warnings,
    };
  }

  if (m.observedVisibleFromM === 0 || m.markVisible === true) {
    // Base visible: at most the reading's accuracy hidden; top visible: less than the whole mark hidden.
    const hiddenAtMost = m.observedVisibleFromM === 0 ? m.accuracyM : m.markHeightM;
    const kMin = solve(hiddenAtMost);
    const what = m.observedVisibleFromM === 0 ? 'its base was visible' : 'its top was visible';
    if (kMin === null || atFloor(kMin)) {
      warnings.push({
        code: 'no-information',
        message: `The mark shows at any plausible k from this height and distance, so seeing it tells nothing about refraction: use a farther or lower mark.`,
      });
      return { k: null, kMin: null, kMax: null, resultKind: 'none', working: `${base}: ${what} at any k.`, warnings };
    }
    warnings.push({
      code: 'bound-only',
      message: `Only that ${what} is known, so k is at least ${formatK(kMin)}; read how high the visible part starts for a value.`,
    });
    return {
      k: null,
      kMin,
      kMax: null,
      resultKind: 'lower-bound',
      working: `${base}: ${what}, so at most ${fmt(hiddenAtMost)} m was hidden → k ≥ ${formatK(kMin)}.`,
      warnings,
    };
  }

  // Not visible: more than the whole mark hidden.
  const kMax = solve(m.markHeightM);
  if (kMax === null) {
    warnings.push({
      code: 'unexplained-sighting',
      message: `At any plausible k the mark's top should show from this height and distance: something else hid it (visibility, terrain, an obstacle), so no bound on k follows.`,
    });
    return { k: null, kMin: null, kMax: null, resultKind: 'none', working: `${base}: the top should show at any k.`, warnings };
  }
  warnings.push({
    code: 'bound-only',
    message: `Only that the mark was not visible is known, so k is below ${formatK(kMax)} (if visibility, not refraction, hid it, even this bound does not hold).`,
  });
  return {
    k: null,
    kMin: null,
    kMax,
    resultKind: 'upper-bound',
    working: `${base}: not visible, so more than ${fmt(m.markHeightM)} m was hidden → k < ${formatK(kMax)}.`,
    warnings,
  };
}

/**
 * k of the day from one field measurement: the solved k with the range the
 * instrument's stated accuracy allows (or only a bound), the effective
 * radius, the refraction regime's warnings (ducting, strong inversion,
 * sub-refraction), and, given the weather readings, k from pressure,
 * temperature and lapse rate beside it.
 *
 * - `dip`: exact inversion of the dip on the effective sphere (`kFromDip`);
 *   kMin/kMax from dip ± accuracy.
 * - `reciprocal`: k = 1 − R(z₁ + z₂ − π)/S (`kFromReciprocalZenith`);
 *   kMin/kMax from each angle ± accuracy, worst case (both errors adding).
 * - `mark`: the hidden-height relation solved for k (`kFromHiddenHeight`);
 *   visible-from height ± accuracy gives the range; "top visible" gives a
 *   lower bound, "not visible" an upper bound.
 *
 * Pure: no I/O, no clock; inputs are not modified.
 *
 * @param measurement - the method's fields (angles in the units their names give, metres)
 * @param weather - optional pressure (hPa), temperature (°C), lapse rate (K/m)
 * @param earthRadiusM - radius of the Earth model (default 6 371 008.8 m)
 * @returns the figures (`CalibrationFiguresSchema`)
 *
 * Source: see `kFromDip`, `kFromReciprocalZenith`, `kFromHiddenHeight` and
 * `refractionFromTemperatureGradient`.
 *
 * @example
 * evaluateCalibration({ method: 'dip', eyeHeightM: 25, observedDipArcmin: 8.8, accuracyArcmin: 0.2 }).k; // ≈ 0.17
 */
export function evaluateCalibration(
  measurement: CalibrationMeasurement,
  weather?: Weather | null,
  earthRadiusM: number = MEAN_EARTH_RADIUS_M,
): CalibrationFigures {
  const solved =
    measurement.method === 'dip'
      ? solveDip(measurement, earthRadiusM)
      : measurement.method === 'reciprocal'
        ? solveReciprocal(measurement, earthRadiusM)
        : solveMark(measurement, earthRadiusM);
  const { k, kMin, kMax, resultKind } = solved;
  const warnings: CalibrationWarning[] = [];

  // The regime's own warnings: of k, else of the bound where the bound alone implies it.
  if (k !== null) warnings.push(...refractionWarnings(k));
  else if (resultKind === 'lower-bound' && kMin !== null && kMin >= 0.5) warnings.push(...refractionWarnings(kMin));
  else if (resultKind === 'upper-bound' && kMax !== null && kMax < 0) warnings.push(...refractionWarnings(kMax));
  if (resultKind === 'estimate' && k !== null && k < 1 && (kMax === null || kMax >= 1)) {
    warnings.push({
      code: 'range-reaches-ducting',
      message: `Within the instrument's accuracy k could reach 1 or more (a duct): treat horizons and ranges today as unreliable.`,
    });
  }
  warnings.push(...solved.warnings);

  const kFromWeather = weather ? refractionFromCondition(weather, earthRadiusM) : null;
  const differenceFromWeather = k !== null && kFromWeather !== null ? k - kFromWeather : null;
  if (kFromWeather !== null && ((kMin !== null && kFromWeather < kMin) || (kMax !== null && kFromWeather > kMax))) {
    warnings.push({
      code: 'weather-disagrees',
      message:
        `k from the weather readings (${formatK(kFromWeather)}) lies outside what the sighting allows: the readings describe the air where they were taken, ` +
        'the sighting the air along the line of sight, which near the surface often differs.',
    });
  }

  const regimeOf = k ?? (resultKind === 'lower-bound' ? kMin : resultKind === 'upper-bound' ? kMax : null);
  return {
    k,
    kMin,
    kMax,
    resultKind,
    regime: regimeOf === null ? null : classifyRefraction(regimeOf),
    effectiveRadiusM: k === null ? null : effectiveRadius({ k, earthRadiusM }).value,
    kFromWeather,
    differenceFromWeather,
    working: solved.working,
    warnings,
  };
}

/**
 * The standing cautions shown with every calibration: the same four as every
 * sightline answer (estimates only, refraction varies, visibility is not
 * detection, follow procedures) and one of its own — a k of the day holds for
 * that line, that height band and that hour.
 */
export const CALIBRATION_CAUTIONS = Object.freeze([
  ...SIGHTLINE_CAUTIONS,
  {
    code: 'k-of-the-day',
    message:
      'A k solved from one sighting holds for that line of sight, at those heights, at that time; refraction near the surface changes within minutes and from one bearing to the next.',
  },
]);
