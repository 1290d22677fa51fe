import { Geodesic } from 'geographiclib-geodesic';
import { roundCoordinate, type Position } from './geojson-rings';

/** A shoreline ([lon, lat], WGS84) measured along: the chainage of each corner, metres from the first. */
export interface MeasuredLine {
  readonly corners: readonly Position[];
  readonly chainage: readonly number[];
  readonly lengthM: number;
}

/**
 * Chainage along a shoreline as the coverage run measures it: the geodesic
 * length of each leg on WGS 84 (Karney 2013, `geographiclib-geodesic`).
 */
export function measureLine(line: readonly (readonly [number, number])[]): MeasuredLine | null {
  if (line.length < 2) return null;
  const chainage = [0];
  for (let i = 1; i < line.length; i++) {
    const [lon1, lat1] = line[i - 1]!;
    const [lon2, lat2] = line[i]!;
    chainage.push(chainage[i - 1]! + (Geodesic.WGS84.Inverse(lat1, lon1, lat2, lon2).s12 ?? 0));
  }
  return { corners: line.map(([lon, lat]) => [lon, lat] as Position), chainage, lengthM: chainage.at(-1)! };
}

/** The point at a chainage (clamped to the line), on the geodesic of its leg. */
export function positionAt(line: MeasuredLine, m: number): Position {
  const at = Math.min(Math.max(m, 0), line.lengthM);
  let i = 0;
  while (i < line.chainage.length - 2 && line.chainage[i + 1]! < at) i++;
  const [lon1, lat1] = line.corners[i]!;
  const [lon2, lat2] = line.corners[i + 1]!;
  const { azi1 } = Geodesic.WGS84.Inverse(lat1, lon1, lat2, lon2);
  const p = Geodesic.WGS84.Direct(lat1, lon1, azi1 ?? 0, at - line.chainage[i]!);
  return [roundCoordinate(p.lon2 ?? lon1), roundCoordinate(p.lat2 ?? lat1)];
}

/**
 * The shoreline between two chainages as an RFC 7946 LineString's positions
 * (the corners inside the stretch kept), or null for a stretch of no length.
 */
export function stretchPositions(line: MeasuredLine, fromM: number, toM: number): Position[] | null {
  if (!(toM > fromM)) return null;
  const out: Position[] = [positionAt(line, fromM)];
  for (let k = 1; k < line.corners.length - 1; k++) {
    const c = line.chainage[k]!;
    if (c > fromM && c < toM) out.push([roundCoordinate(line.corners[k]![0]), roundCoordinate(line.corners[k]![1])]);
  }
  out.push(positionAt(line, toM));
  // Two ends rounded onto the same point make no line.
  return out.some((p) => p[0] !== out[0]![0] || p[1] !== out[0]![1]) ? out : null;
}
