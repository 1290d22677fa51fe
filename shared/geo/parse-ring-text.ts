import { CoordinateError } from '@/shared/geo/coordinate-error';
import { parseCoordinate } from '@/shared/geo/parse-coordinate';

/** A ring typed as text could not be read: which line and why (1-based line numbers). */
export class RingTextError extends Error {
  override name = 'RingTextError';
  constructor(
    readonly line: number | null,
    message: string,
  ) {
    super(message);
  }
}

/**
 * Reads a polygon's corners typed or pasted one per line (or separated by
 * `;`), each in any format `parseCoordinate` takes (DD, DDM, DMS, UTM — and
 * MGRS where supported), latitude first unless hemisphere letters say
 * otherwise. Empty lines are skipped; the ring need not repeat its first
 * corner.
 *
 * @param text - the corners as typed
 * @returns `[longitude, latitude]` pairs in degrees (GeoJSON order), as typed (not closed)
 * @throws {RingTextError} naming the line that cannot be read, or when fewer than 3 corners are given
 *
 * @example
 * parseRingText('61.00, 14.00\n61.00, 14.20\n61.10, 14.20'); // [[14, 61], [14.2, 61], [14.2, 61.1]]
 */
export function parseRingText(text: string): [number, number][] {
  const lines = text.split(/\r?\n|;/);
  const ring: [number, number][] = [];
  lines.forEach((raw, index) => {
    const line = raw.trim();
    if (line === '') return;
    try {
      const p = parseCoordinate(line);
      ring.push([p.lonDeg, p.latDeg]);
    } catch (e) {
      const why = e instanceof CoordinateError ? e.message : 'Not a coordinate.';
      throw new RingTextError(index + 1, `Line ${index + 1} (“${line}”): ${why}`);
    }
  });
  if (ring.length < 3) {
    throw new RingTextError(
      null,
      `An outline needs at least three corners; ${ring.length === 0 ? 'none were' : `only ${ring.length} ${ring.length === 1 ? 'was' : 'were'}`} given.`,
    );
  }
  return ring;
}
