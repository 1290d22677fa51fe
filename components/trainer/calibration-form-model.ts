import type { CalibrationInput, CalibrationMethod } from '@/shared/schemas/calibration';
import { convertLength, type LengthUnit } from '@/shared/units';

/** The calibration form as typed: every number a string (empty = not given), lengths in the person's height unit. */
export interface CalibrationFormValues {
  method: CalibrationMethod;
  eyeHeight: string;
  observedDipArcmin: string;
  accuracyArcmin: string;
  distance: string;
  zenithAngle1Deg: string;
  zenithAngle2Deg: string;
  accuracyArcsec: string;
  markHeight: string;
  observedVisibleFrom: string;
  markVisible: 'read' | 'yes' | 'no';
  accuracy: string;
  pressureHpa: string;
  temperatureC: string;
  lapseRateKPerKm: string;
  notes: string;
  postIds: string[];
}

export const CALIBRATION_DEFAULTS: CalibrationFormValues = {
  method: 'dip',
  eyeHeight: '',
  observedDipArcmin: '',
  accuracyArcmin: '0.5',
  distance: '',
  zenithAngle1Deg: '',
  zenithAngle2Deg: '',
  accuracyArcsec: '5',
  markHeight: '',
  observedVisibleFrom: '',
  markVisible: 'read',
  accuracy: '0',
  pressureHpa: '',
  temperatureC: '',
  lapseRateKPerKm: '',
  notes: '',
  postIds: [],
};

/** Which form field shows a server field path. */
export function calibrationFieldOf(path: string): keyof CalibrationFormValues | undefined {
  const map: Record<string, keyof CalibrationFormValues> = {
    eyeHeightM: 'eyeHeight',
    observedDipArcmin: 'observedDipArcmin',
    accuracyArcmin: 'accuracyArcmin',
    distanceM: 'distance',
    zenithAngle1Deg: 'zenithAngle1Deg',
    zenithAngle2Deg: 'zenithAngle2Deg',
    accuracyArcsec: 'accuracyArcsec',
    markHeightM: 'markHeight',
    observedVisibleFromM: 'observedVisibleFrom',
    markVisible: 'markVisible',
    accuracyM: 'accuracy',
    'weather.pressureHpa': 'pressureHpa',
    'weather.temperatureC': 'temperatureC',
    'weather.lapseRateKPerM': 'lapseRateKPerKm',
    notes: 'notes',
    postId: 'postIds',
  };
  return map[path];
}

/**
 * The request body from the typed form, lengths converted from the person's
 * units to metres (the distance of a line in `distanceUnit`, heights in
 * `heightUnit`), or the fields that are not numbers. Range checks are the
 * shared schema's (the server's answer shows them under the fields).
 */
export function toCalibrationInput(
  v: CalibrationFormValues,
  units: { height: LengthUnit; distance: LengthUnit },
  saveAsConditionSet: boolean,
): { input: CalibrationInput } | { errors: Partial<Record<keyof CalibrationFormValues, string>> } {
  const errors: Partial<Record<keyof CalibrationFormValues, string>> = {};
  const num = (field: keyof CalibrationFormValues, required: boolean): number | undefined => {
    const raw = String(v[field]).trim().replace(',', '.');
    if (raw === '') {
      if (required) errors[field] = 'Required.';
      return undefined;
    }
    const n = Number(raw);
    if (!Number.isFinite(n)) {
      errors[field] = 'Type a number.';
      return undefined;
    }
    return n;
  };
  const height = (field: keyof CalibrationFormValues, required: boolean) => {
    const n = num(field, required);
    return n === undefined ? undefined : convertLength(n, units.height, 'm');
  };
  const distance = (field: keyof CalibrationFormValues) => {
    const n = num(field, true);
    return n === undefined ? undefined : convertLength(n, units.distance, 'm');
  };
  const pressureHpa = num('pressureHpa', false);
  const temperatureC = num('temperatureC', false);
  const lapse = num('lapseRateKPerKm', false);
  const anyWeather = pressureHpa !== undefined || temperatureC !== undefined || lapse !== undefined;
  if (anyWeather) {
    if (pressureHpa === undefined) errors.pressureHpa ??= 'Give the pressure too (or leave the weather out).';
    if (temperatureC === undefined) errors.temperatureC ??= 'Give the temperature too (or leave the weather out).';
    if (lapse === undefined) errors.lapseRateKPerKm ??= 'Give the lapse rate too (or leave the weather out).';
  }
  const common = {
    postId: v.postIds[0],
    notes: v.notes,
    saveAsConditionSet,
    weather:
      anyWeather && pressureHpa !== undefined && temperatureC !== undefined && lapse !== undefined
        ? { pressureHpa, temperatureC, lapseRateKPerM: lapse / 1000 }
        : undefined,
  };
  let input: CalibrationInput | null = null;
  if (v.method === 'dip') {
    const eyeHeightM = height('eyeHeight', true);
    const observedDipArcmin = num('observedDipArcmin', true);
    const accuracyArcmin = num('accuracyArcmin', true);
    if (eyeHeightM !== undefined && observedDipArcmin !== undefined && accuracyArcmin !== undefined) {
      input = { method: 'dip', eyeHeightM, observedDipArcmin, accuracyArcmin, ...common };
    }
  } else if (v.method === 'reciprocal') {
    const distanceM = distance('distance');
    const zenithAngle1Deg = num('zenithAngle1Deg', true);
    const zenithAngle2Deg = num('zenithAngle2Deg', true);
    const accuracyArcsec = num('accuracyArcsec', true);
    if (
      distanceM !== undefined &&
      zenithAngle1Deg !== undefined &&
      zenithAngle2Deg !== undefined &&
      accuracyArcsec !== undefined
    ) {
      input = { method: 'reciprocal', distanceM, zenithAngle1Deg, zenithAngle2Deg, accuracyArcsec, ...common };
    }
  } else {
    const eyeHeightM = height('eyeHeight', true);
    const distanceM = distance('distance');
    const markHeightM = height('markHeight', true);
    const observedVisibleFromM = v.markVisible === 'read' ? height('observedVisibleFrom', true) : undefined;
    const accuracyM = height('accuracy', false) ?? 0;
    if (eyeHeightM !== undefined && distanceM !== undefined && markHeightM !== undefined) {
      if (v.markVisible === 'read' && observedVisibleFromM !== undefined) {
        input = { method: 'mark', eyeHeightM, distanceM, markHeightM, observedVisibleFromM, accuracyM, ...common };
      } else if (v.markVisible !== 'read') {
        input = {
          method: 'mark',
          eyeHeightM,
          distanceM,
          markHeightM,
          markVisible: v.markVisible === 'yes',
          accuracyM,
          ...common,
        };
      }
    }
  }
  if (Object.keys(errors).length > 0 || input === null) return { errors };
  return { input };
}
