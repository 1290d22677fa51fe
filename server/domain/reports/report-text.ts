import { DateTime } from 'luxon';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { formatMgrs } from '@/shared/geo/mgrs';
import type { CoordinateFormat, LatLon } from '@/shared/geo/types';
import { formatK } from '@/shared/sightline/format-k';
import { REFRACTION_PRESETS } from '@/shared/sightline/refraction-presets';

/**
 * Words and numbers as the printed reports write them. Distances in metres
 * inside; kilometres with one decimal on paper (metres below 1 km).
 */

/** The standing cautions every printout carries, in this order. */
export const PRINT_CAUTIONS = [
  'Estimates only: these figures support planning; they are not measurements.',
  'Refraction near the horizon varies widely (mirages, looming, ducting): a range can be much shorter or longer on the day.',
  'Visibility is not detection: a target within range can still be missed.',
  'Defer to the agency’s procedures, local regulations and licensed practice.',
] as const;

/** Characters the embedded font lacks, written another way. */
const REPLACEMENTS: [RegExp, string][] = [
  [/→/g, 'to'],
  [/γ/g, 'gamma'],
  [/λ/g, 'lambda'],
  [/φ/g, 'phi'],
  [/[✓✔]/g, 'yes'],
  [/[✗✘]/g, 'no'],
];

/** Text safe for the report font. */
export function printable(text: string): string {
  let out = text;
  for (const [pattern, to] of REPLACEMENTS) out = out.replace(pattern, to);
  return out;
}

/** "12.3 km", "850 m", or "—" for no range. */
export function formatDistance(metres: number | null | undefined): string {
  if (metres === null || metres === undefined || !Number.isFinite(metres)) return '—';
  if (Math.abs(metres) < 1000) return `${Math.round(metres)} m`;
  return `${(metres / 1000).toFixed(1)} km`;
}

/** "12.5 m". */
export const formatHeight = (metres: number) => `${(Math.round(metres * 10) / 10).toLocaleString('en-GB')} m`;

/** "42.7 %", or "—". */
export function formatPct(pct: number | null | undefined): string {
  if (pct === null || pct === undefined || !Number.isFinite(pct)) return '—';
  return `${(Math.round(pct * 10) / 10).toFixed(1)} %`;
}

/** "3.41 km²" (m² below 0.01 km²). */
export function formatArea(m2: number): string {
  if (m2 < 10_000) return `${Math.round(m2).toLocaleString('en-GB')} m²`;
  return `${(m2 / 1e6).toFixed(2)} km²`;
}

/** "3 Dec 2026 14:05 CET" in the site's time zone (UTC when the zone is unknown). */
export function formatTimeIn(iso: string | Date, timeZone: string): string {
  const at = typeof iso === 'string' ? DateTime.fromISO(iso) : DateTime.fromJSDate(iso);
  const zoned = at.setZone(timeZone);
  return (zoned.isValid ? zoned : at.toUTC()).toFormat('d LLL yyyy HH:mm ZZZZ');
}

/** "2026-12-03" in the site's time zone, for file names. */
export function isoDateIn(at: Date, timeZone: string): string {
  const zoned = DateTime.fromJSDate(at).setZone(timeZone);
  return (zoned.isValid ? zoned : DateTime.fromJSDate(at).toUTC()).toISODate()!;
}

/** A position in the person's format; MGRS falls back to DDM outside its area. */
export function formatPosition(point: LatLon, format: CoordinateFormat): string {
  try {
    return formatCoordinate(point, format);
  } catch {
    return formatCoordinate(point, 'ddm');
  }
}

/** The MGRS reference of a position, or a note where MGRS does not reach (polar areas). */
export function mgrsOf(point: LatLon): string {
  try {
    return formatMgrs(point);
  } catch {
    return 'not available (outside the MGRS UTM area)';
  }
}

/** Names the coordinate format on paper. */
export const COORDINATE_FORMAT_NAMES: Record<CoordinateFormat, string> = {
  dd: 'decimal degrees',
  ddm: 'degrees and decimal minutes',
  dms: 'degrees, minutes and seconds',
  utm: 'UTM',
  mgrs: 'MGRS',
};

/** How a condition's k was reached, in words, from the condition as the library stored it. */
export function conditionDerivation(condition: Record<string, unknown>, k: number | null): string {
  const kText = k === null ? '' : `k = ${formatK(k)}`;
  if (typeof condition.preset === 'string') {
    const preset = REFRACTION_PRESETS.find((p) => p.id === condition.preset);
    if (preset) return `${preset.label}: k = ${formatK(preset.k)}, ${preset.definition} (${preset.source})`;
    return `preset ${condition.preset}${kText ? `: ${kText}` : ''}`;
  }
  if (typeof condition.k === 'number') return `k = ${formatK(condition.k)}, stated`;
  if (typeof condition.refractivityGradientNPerKm === 'number') {
    return `${kText} from a refractivity gradient dN/dh = ${condition.refractivityGradientNPerKm} N/km`;
  }
  if (typeof condition.airTemperatureC === 'number') {
    return (
      `${kText} from two temperatures: air ${String(condition.airTemperatureC)} °C at ${String(condition.airHeightM)} m, ` +
      `surface ${String(condition.surfaceTemperatureC)} °C at ${String(condition.surfaceHeightM)} m` +
      (typeof condition.pressureHpa === 'number' ? `, ${condition.pressureHpa} hPa` : '')
    );
  }
  if (typeof condition.lapseRateKPerM === 'number') {
    return `${kText} from P = ${String(condition.pressureHpa)} hPa, T = ${String(condition.temperatureC)} °C, dT/dh = ${condition.lapseRateKPerM} K/m`;
  }
  return kText || 'not stated';
}

/** Words for a detection limit. */
export const LIMIT_WORDS: Record<string, string> = {
  horizon: 'horizon',
  visibility: 'visibility',
  'angular-size': 'angular size',
  'luminous-range': 'luminous range',
  'sea-state': 'sea state',
  view: 'terrain view',
};

/** A file-name part: letters, digits and hyphens only. */
export function slug(text: string): string {
  return (
    text
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .replace(/[^A-Za-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .toLowerCase()
      .slice(0, 60) || 'untitled'
  );
}
