import { Geodesic } from 'geographiclib-geodesic';
import { useMemo } from 'react';
import { Circle, G, Line, Polyline } from 'react-native-svg';
import { convertLength, type LengthUnit } from '@/shared/units/length';
import type { CaseGap } from '@/shared/schemas/coverage';
import { colors } from '@/components/ui/theme';
import type { MapCamera, MapSize } from './map-camera';
import { HaloText } from './map-features';
import { OverlaySvg, overlayPoint } from './overlay-svg';
import type { SiteMapFrame } from './site-map-frame';

type GridPoint = { x: number; y: number };

/** The shoreline in the map's grid with the chainage (geodesic, WGS 84) of each corner. */
export interface FramedShore {
  readonly points: readonly GridPoint[];
  /** Chainage of each corner, metres from the first. */
  readonly chainage: readonly number[];
  readonly lengthM: number;
}

/** A chainage tick: where it is, the unit normal to the shore there (grid), and its label. */
export interface ShoreTick extends GridPoint {
  readonly nx: number;
  readonly ny: number;
  readonly label: string;
}

/**
 * The shoreline placed on the map. Chainage is the geodesic distance along the
 * corners (as the server measures it, Karney's geodesics on WGS 84); between
 * two corners a chainage is placed in proportion along the straight grid
 * segment — within a few centimetres for corners a few kilometres apart.
 */
export function frameShore(frame: SiteMapFrame, shoreline: readonly (readonly [number, number])[] | null | undefined) {
  if (!shoreline || shoreline.length < 2) return null;
  const points = shoreline.map(([lonDeg, latDeg]) => frame.projection.toGrid({ latDeg, lonDeg }));
  const chainage = [0];
  for (let i = 1; i < shoreline.length; i++) {
    const [lon1, lat1] = shoreline[i - 1]!;
    const [lon2, lat2] = shoreline[i]!;
    chainage.push(chainage[i - 1]! + (Geodesic.WGS84.Inverse(lat1, lon1, lat2, lon2).s12 ?? 0));
  }
  return { points, chainage, lengthM: chainage.at(-1)! } satisfies FramedShore;
}

/** The segment index and share along it of a chainage (clamped to the line). */
function locate(shore: FramedShore, m: number): { i: number; t: number } {
  const c = shore.chainage;
  const at = Math.min(Math.max(m, 0), shore.lengthM);
  let i = 0;
  while (i < c.length - 2 && c[i + 1]! < at) i++;
  const span = c[i + 1]! - c[i]!;
  return { i, t: span > 0 ? (at - c[i]!) / span : 0 };
}

/** The grid point at a chainage. */
export function pointAtChainage(shore: FramedShore, m: number): GridPoint {
  const { i, t } = locate(shore, m);
  const a = shore.points[i]!;
  const b = shore.points[i + 1]!;
  return { x: a.x + (b.x - a.x) * t, y: a.y + (b.y - a.y) * t };
}

/** The stretch of shoreline between two chainages, as grid points (its corners included). */
export function stretchOf(shore: FramedShore, fromM: number, toM: number): GridPoint[] {
  const out = [pointAtChainage(shore, fromM)];
  for (let k = 1; k < shore.points.length - 1; k++) {
    if (shore.chainage[k]! > fromM && shore.chainage[k]! < toM) out.push(shore.points[k]!);
  }
  out.push(pointAtChainage(shore, toM));
  return out;
}

/** Tick steps, in the distance unit: 1, 2, 5 × 10ⁿ. */
const NICE = [0.1, 0.2, 0.5, 1, 2, 5, 10, 20, 50, 100];

/**
 * Chainage ticks at a round step of the person's distance unit (km, nmi or
 * mi), chosen so the line carries at most `maxTicks` of them after its start.
 */
export function shoreTicks(shore: FramedShore, unit: LengthUnit, maxTicks = 8): ShoreTick[] {
  const distanceUnit: LengthUnit = unit === 'nmi' || unit === 'mi' ? unit : 'km';
  const unitM = convertLength(1, distanceUnit, 'm');
  const step = NICE.map((s) => s * unitM).find((s) => shore.lengthM / s <= maxTicks) ?? 100 * unitM;
  const ticks: ShoreTick[] = [];
  for (let m = 0; m <= shore.lengthM + 1e-6; m += step) {
    const { i } = locate(shore, m);
    const a = shore.points[i]!;
    const b = shore.points[i + 1]!;
    const len = Math.hypot(b.x - a.x, b.y - a.y) || 1;
    ticks.push({
      ...pointAtChainage(shore, m),
      nx: -(b.y - a.y) / len,
      ny: (b.x - a.x) / len,
      label: `${+(m / unitM).toFixed(1)} ${distanceUnit}`,
    });
  }
  return ticks;
}

/** Map symbols of the shore, shared with the run map's key. */
export const SHORE_SYMBOL = {
  line: '#1F4E5F',
  gap: colors.danger,
} as const;

/**
 * The site's shoreline with its chainage ticks, and a case's gaps along it
 * (unwatched stretches as thick red runs, seams as rings), over the map.
 */
export function ShoreOverlay({
  frame,
  shoreline,
  gaps = [],
  unit,
  camera,
  size,
  margin,
}: {
  frame: SiteMapFrame;
  shoreline: readonly (readonly [number, number])[] | null | undefined;
  gaps?: readonly CaseGap[];
  unit: LengthUnit;
  camera: MapCamera;
  size: MapSize;
  margin: number;
}) {
  const shore = useMemo(() => frameShore(frame, shoreline), [frame, shoreline]);
  const ticks = useMemo(() => (shore ? shoreTicks(shore, unit) : []), [shore, unit]);
  if (!shore) return null;
  const at = overlayPoint(camera, size, margin);
  const line = (pts: readonly GridPoint[]) =>
    pts
      .map((p) => {
        const s = at(p);
        return `${s.x.toFixed(1)},${s.y.toFixed(1)}`;
      })
      .join(' ');
  const labelPlaces = gapLabelPlaces(
    gaps.map((g) => at(pointAtChainage(shore, (g.fromM + g.toM) / 2))),
    size.width + margin,
  );
  return (
    <OverlaySvg size={size} margin={margin} testID="shore-overlay">
      <Polyline points={line(shore.points)} fill="none" stroke="#FFFFFF" strokeWidth={6} opacity={0.85} />
      <Polyline points={line(shore.points)} fill="none" stroke={SHORE_SYMBOL.line} strokeWidth={3} />
      {gaps.map((g, k) => {
        const mid = at(pointAtChainage(shore, (g.fromM + g.toM) / 2));
        const label = `${g.band}: ${g.kind === 'seam' ? 'seam' : 'gap'}`;
        const place = labelPlaces[k]!;
        return g.kind === 'seam' || g.toM - g.fromM <= 0 ? (
          <G key={`gap-${k}`}>
            <Circle cx={mid.x} cy={mid.y} r={7} fill="none" stroke="#FFFFFF" strokeWidth={4} />
            <Circle cx={mid.x} cy={mid.y} r={7} fill="none" stroke={SHORE_SYMBOL.gap} strokeWidth={2} />
            <HaloText x={place.x} y={place.y} text={label} color={SHORE_SYMBOL.gap} anchor={place.anchor} />
          </G>
        ) : (
          <G key={`gap-${k}`}>
            <Polyline points={line(stretchOf(shore, g.fromM, g.toM))} fill="none" stroke="#FFFFFF" strokeWidth={10} />
            <Polyline points={line(stretchOf(shore, g.fromM, g.toM))} fill="none" stroke={SHORE_SYMBOL.gap} strokeWidth={6} />
            <HaloText x={place.x} y={place.y} text={label} color={SHORE_SYMBOL.gap} anchor={place.anchor} />
          </G>
        );
      })}
      {ticks.map((t, k) => {
        const s = at(t);
        // Screen y runs down: the grid normal's north component flips.
        const dx = t.nx * 7;
        const dy = -t.ny * 7;
        return (
          <G key={`tick-${k}`}>
            <Line x1={s.x - dx} y1={s.y - dy} x2={s.x + dx} y2={s.y + dy} stroke={SHORE_SYMBOL.line} strokeWidth={2} />
            <HaloText x={s.x + dx * 1.6} y={s.y + dy * 1.6 + 4} text={t.label} color={SHORE_SYMBOL.line} anchor="middle" />
          </G>
        );
      })}
    </OverlaySvg>
  );
}

/** Gap labels under the shore, stacked where two gaps (two bands at one place) would print over each other. */
export function gapLabelPlaces(
  mids: readonly { x: number; y: number }[],
  rightEdge: number,
): { x: number; y: number; anchor: 'start' | 'end' }[] {
  const placed: { x: number; y: number; anchor: 'start' | 'end' }[] = [];
  for (const m of mids) {
    // Near the view's right edge the label runs leftwards, so it is not cut off.
    const anchor = m.x > rightEdge - 110 ? ('end' as const) : ('start' as const);
    const x = anchor === 'end' ? m.x - 8 : m.x + 8;
    let y = m.y + 20;
    while (placed.some((p) => Math.abs(p.x - x) < 110 && Math.abs(p.y - y) < 15)) y += 15;
    placed.push({ x, y, anchor });
  }
  return placed;
}
