import { convertLength, type LengthUnit } from '@/shared/units/length';

const digits = (v: number) => (Math.abs(v) >= 100 ? 0 : Math.abs(v) >= 10 ? 1 : 2);

/** A length in metres shown in `unit`, or an em dash for a quantity that does not exist. */
export function formatLength(metres: number | null, unit: LengthUnit): string {
  if (metres === null) return '—';
  const v = convertLength(metres, 'm', unit);
  return `${v.toLocaleString('en', { maximumFractionDigits: digits(v), minimumFractionDigits: 0 })} ${unit}`;
}

export function formatAngle(deg: number | null): string {
  if (deg === null) return '—';
  const arcmin = deg * 60;
  return Math.abs(arcmin) < 60 ? `${arcmin.toFixed(2)}′` : `${deg.toFixed(3)}°`;
}

export const LIMIT_LABELS = {
  horizon: 'horizon',
  visibility: 'visibility',
  'angular-size': 'angular size',
  'luminous-range': 'luminous range',
  'sea-state': 'sea state',
} as const;

/** What each limit means, in a sentence, for a person reading a result. */
export const LIMIT_EXPLANATIONS = {
  horizon: 'The earth (the horizon) hides the target beyond this range.',
  visibility: 'The haze of the air (the visibility) hides the target beyond this range.',
  'angular-size': 'Beyond this range the target is too small for the eye to make out at the resolving angle.',
  'luminous-range': 'At night the light is too faint beyond this range (Allard’s law, night threshold).',
  'sea-state': 'Wave crests hide the part of the target that must show.',
} as const;

export const REGIME_LABELS = {
  'sub-refraction': 'sub-refraction',
  standard: 'standard',
  'super-refraction': 'super-refraction',
  ducting: 'ducting',
} as const;

/**
 * A stored length for a read-out in the person's `unit`: in metres as the
 * screen has always written it (`metric`, e.g. one decimal), in other units
 * rounded like {@link formatLength} ("1,793 ft", never "1793.3071 ft").
 */
export function lengthIn(metres: number, unit: LengthUnit, metric: (m: number) => string = (m) => `${m} m`): string {
  return unit === 'm' ? metric(metres) : formatLength(metres, unit);
}
