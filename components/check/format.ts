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

/** The shortest distance written in a distance unit; anything shorter is written in feet. */
const SHORTEST_IN_UNIT: Partial<Record<LengthUnit, number>> = { nmi: 0.05, mi: 0.1 };

/** Metric distances as the screens have long written them: "850 m", "2.4 km". */
export const metricDistance = (m: number): string => (m >= 1000 ? `${+(m / 1000).toFixed(2)} km` : `${Math.round(m)} m`);

/**
 * A distance (a range, a visibility, a sweep width) for people in the
 * person's distance `unit`: metric (`km` or `m`) as `metric` writes it;
 * nautical or statute miles rounded like {@link formatLength} ("1.5 nmi",
 * "12.3 mi"), short ones in feet (under 0.05 nmi or 0.1 mi: "250 ft"), so a
 * few hundred metres never read "0 nmi".
 *
 * @example
 * distanceIn(2778, 'nmi'); // "1.5 nmi"
 * distanceIn(76.2, 'mi');  // "250 ft"
 */
export function distanceIn(metres: number, unit: LengthUnit, metric: (m: number) => string = metricDistance): string {
  if (unit === 'km' || unit === 'm') return metric(metres);
  const shortest = SHORTEST_IN_UNIT[unit];
  if (shortest !== undefined && Math.abs(convertLength(metres, 'm', unit)) < shortest) return formatLength(metres, 'ft');
  return formatLength(metres, unit);
}

/** The two ways a visibility is reported (meteorological optical range, or the older 2 % meteorological range), as forms offer them. */
export const VISIBILITY_KIND_OPTIONS: { value: 'mor-5pct' | 'meteorological-range-2pct'; label: string }[] = [
  { value: 'mor-5pct', label: 'MOR (5 %)' },
  { value: 'meteorological-range-2pct', label: 'Met. range (2 %)' },
];
