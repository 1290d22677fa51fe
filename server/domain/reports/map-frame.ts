/**
 * The ground a printed map shows: a round scale (1 : n) chosen so that the
 * wanted extent fits the box on paper, the extent at that scale centred on
 * the wanted one, and the grid lines and scale bar lengths to draw. Grid
 * metres (the terrain's projected CRS); paper in points (1/72 in).
 */

import { boundsOfPoints } from '@/shared/terrain/bounds-of-points';

/** Metres of paper in one point. */
export const METRES_PER_POINT = 0.0254 / 72;

/** Scales a printed map may use (the denominators), smallest first. */
export const PRINT_SCALES = [
  5_000, 10_000, 25_000, 50_000, 100_000, 150_000, 200_000, 250_000, 500_000, 1_000_000, 2_000_000, 5_000_000, 10_000_000,
] as const;

export interface Extent {
  west: number;
  south: number;
  east: number;
  north: number;
}

export interface MapFrame {
  /** Scale denominator: 1 : scale at 100 % print size. */
  scale: number;
  /** Ground shown, grid metres. */
  extent: Extent;
  /** The box on paper, points (top-left origin). */
  box: { x: number; y: number; width: number; height: number };
  /** Grid metres per point. */
  metresPerPoint: number;
}

/** The extent of points, grown by `padShare` of its size on each side (at least `minSizeM` across). */
export function extentOf(points: readonly { x: number; y: number }[], padShare = 0.06, minSizeM = 1000): Extent {
  const bounds = boundsOfPoints(points);
  if (!bounds) throw new Error('extentOf needs at least one point');
  const { west, south, east, north } = bounds;
  const cx = (west + east) / 2;
  const cy = (south + north) / 2;
  const w = Math.max(east - west, minSizeM) * (1 + 2 * padShare);
  const h = Math.max(north - south, minSizeM) * (1 + 2 * padShare);
  return { west: cx - w / 2, east: cx + w / 2, south: cy - h / 2, north: cy + h / 2 };
}

/**
 * The smallest listed scale at which `wanted` fits `box`, and the extent the
 * box then shows (centred on `wanted`).
 *
 * @example
 * fitFrame({ west: 0, south: 0, east: 10_000, north: 10_000 }, { x: 0, y: 0, width: 400, height: 400 }).scale // 100 000
 */
export function fitFrame(wanted: Extent, box: MapFrame['box']): MapFrame {
  const needed = Math.max(
    (wanted.east - wanted.west) / (box.width * METRES_PER_POINT),
    (wanted.north - wanted.south) / (box.height * METRES_PER_POINT),
  );
  const scale = PRINT_SCALES.find((s) => s >= needed) ?? Math.ceil(needed / 1e6) * 1e6;
  const metresPerPoint = scale * METRES_PER_POINT;
  const cx = (wanted.west + wanted.east) / 2;
  const cy = (wanted.south + wanted.north) / 2;
  const halfW = (box.width * metresPerPoint) / 2;
  const halfH = (box.height * metresPerPoint) / 2;
  return { scale, box, metresPerPoint, extent: { west: cx - halfW, east: cx + halfW, south: cy - halfH, north: cy + halfH } };
}

/** Grid metres → the point on paper. */
export function toPaper(frame: MapFrame, x: number, y: number): [number, number] {
  return [
    frame.box.x + (x - frame.extent.west) / frame.metresPerPoint,
    frame.box.y + (frame.extent.north - y) / frame.metresPerPoint,
  ];
}

/** A round step (1, 2 or 5 × 10ⁿ metres) giving about `count` steps over `lengthM`. */
export function roundStep(lengthM: number, count: number): number {
  const raw = lengthM / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const mantissa = raw / power;
  return (mantissa < 1.5 ? 1 : mantissa < 3.5 ? 2 : mantissa < 7.5 ? 5 : 10) * power;
}

/** Grid line values (multiples of `step`) strictly inside [from, to]. */
export function gridValues(from: number, to: number, step: number): number[] {
  const out: number[] = [];
  for (let v = Math.ceil(from / step) * step; v < to; v += step) if (v > from) out.push(v);
  return out;
}
