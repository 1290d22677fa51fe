import { compassPoint } from '@/shared/geo/compass-point';
import { MEBIBYTE } from '@/shared/schemas/attachment';

/** A bearing as lookouts read it out: three digits and the compass point, e.g. `045° NE`. */
export function formatBearing(bearingDeg: number): string {
  const rounded = Math.round(bearingDeg);
  return `${String(rounded).padStart(3, '0')}° ${compassPoint(bearingDeg)}`;
}

/** File sizes in the units the limits are stated in (1 MB = 1 048 576 bytes). */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} bytes`;
  if (bytes < MEBIBYTE) return `${(bytes / 1024).toFixed(0)} kB`;
  return `${(bytes / MEBIBYTE).toFixed(1)} MB`;
}

/** Reads a bearing typed by a person: empty is null (no bearing); a comma may stand for the decimal point; NaN when not a number. */
export function bearingFromText(text: string): number | null {
  const t = text.trim().replace(',', '.').replace(/°$/, '');
  return t === '' ? null : Number(t);
}
