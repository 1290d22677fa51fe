import { memo } from 'react';
import Svg, { Circle, G, Line, Path, Polygon, Polyline, Text as SvgText } from 'react-native-svg';
import { colors, fonts } from '@/components/ui/theme';
import { gridToScreen, type MapCamera, type MapSize } from './map-camera';
import type { FramedPost, FramedRing, SiteMapFrame } from './site-map-frame';

/** A point the person tapped, in grid metres, numbered in tap order. */
export interface MapTarget {
  readonly id: number;
  readonly x: number;
  readonly y: number;
}

/** Map symbols, shared with the legend so both always agree. */
export const SYMBOL = {
  boundary: { stroke: colors.ink, halo: '#FFFFFF', width: 2.5 },
  zone: { stroke: '#7A3E6E', fill: 'rgba(122, 62, 110, 0.10)', dash: '7 4', width: 2 },
  sector: { fill: 'rgba(232, 176, 74, 0.30)', stroke: '#8A6A12' },
  /** A patrol's route (dashed). */
  route: '#1F6F78',
  chosen: colors.ember,
  target: colors.ember,
  outline: { stroke: colors.ink, halo: colors.lantern, width: 2 },
} as const;

/** Sector wedge radius, pixels (a fixed size on screen: it shows a direction, not a range). */
const SECTOR_PX = 56;

/** Existing post: a solid triangle, like a tower seen from the side. */
export function existingPostPath(cx: number, cy: number, r = 8): string {
  return `M${cx},${cy - r} L${cx + r * 0.9},${cy + r * 0.6} L${cx - r * 0.9},${cy + r * 0.6} Z`;
}

/** Proposed post: an open diamond. */
export function proposedPostPath(cx: number, cy: number, r = 8): string {
  return `M${cx},${cy - r} L${cx + r},${cy} L${cx},${cy + r} L${cx - r},${cy} Z`;
}

/** A wedge from true bearing `fromDeg` clockwise to `toDeg`, drawn in grid bearings (β_grid = β_true − γ). */
export function sectorPath(cx: number, cy: number, fromDeg: number, toDeg: number, convergence: number, r = SECTOR_PX): string {
  const gamma = (convergence * 180) / Math.PI;
  const at = (deg: number) => {
    const a = ((deg - gamma) * Math.PI) / 180;
    return [cx + r * Math.sin(a), cy - r * Math.cos(a)] as const;
  };
  const sweep = (((toDeg - fromDeg) % 360) + 360) % 360 || 360;
  if (sweep >= 360) return `M${cx - r},${cy} a${r},${r} 0 1 0 ${2 * r},0 a${r},${r} 0 1 0 ${-2 * r},0 Z`;
  const [x1, y1] = at(fromDeg);
  const [x2, y2] = at(toDeg);
  return `M${cx},${cy} L${x1.toFixed(1)},${y1.toFixed(1)} A${r},${r} 0 ${sweep > 180 ? 1 : 0} 1 ${x2.toFixed(1)},${y2.toFixed(1)} Z`;
}

/**
 * The site's vector layer — boundary, priority zones with their names, posts
 * (shape and label tell existing from proposed) with their viewing sectors,
 * the tapped points and the line from the chosen post to the last one —
 * drawn for the committed camera into an SVG `margin` pixels larger than the
 * view on every side, so a drag shows drawn ground before the redraw.
 */
export const MapFeatures = memo(function MapFeatures({
  frame,
  camera,
  size,
  margin,
  chosenPostId,
  targets,
  outline = null,
}: {
  frame: SiteMapFrame;
  camera: MapCamera;
  size: MapSize;
  margin: number;
  chosenPostId: string | null;
  targets: readonly MapTarget[];
  /** Edges to outline (a blind area), `x1, y1, x2, y2` each, grid metres. */
  outline?: Float64Array | null;
}) {
  const at = (x: number, y: number) => {
    const p = gridToScreen(camera, size, x, y);
    return { x: p.x + margin, y: p.y + margin };
  };
  const points = (ring: FramedRing) =>
    ring.points
      .map((p) => {
        const s = at(p.x, p.y);
        return `${s.x.toFixed(1)},${s.y.toFixed(1)}`;
      })
      .join(' ');
  const centroid = (ring: FramedRing) => {
    const n = Math.max(ring.points.length - 1, 1); // rings are closed: the last corner repeats the first
    const pts = ring.points.slice(0, n);
    return at(pts.reduce((s, p) => s + p.x, 0) / pts.length, pts.reduce((s, p) => s + p.y, 0) / pts.length);
  };
  const chosen = frame.posts.find((p) => p.post.id === chosenPostId) ?? null;
  const last = targets.at(-1) ?? null;
  const W = size.width + 2 * margin;
  const H = size.height + 2 * margin;

  return (
    <Svg width={W} height={H} style={{ position: 'absolute', left: -margin, top: -margin }} pointerEvents="none" aria-hidden>
      {frame.zones.map((z) => (
        <Polygon
          key={`zone-${z.name}`}
          points={points(z)}
          fill={SYMBOL.zone.fill}
          stroke={SYMBOL.zone.stroke}
          strokeWidth={SYMBOL.zone.width}
          strokeDasharray={SYMBOL.zone.dash}
        />
      ))}
      {frame.boundary ? (
        <G>
          <Polygon
            points={points(frame.boundary)}
            fill="none"
            stroke={SYMBOL.boundary.halo}
            strokeWidth={SYMBOL.boundary.width + 3}
            opacity={0.8}
          />
          <Polygon
            points={points(frame.boundary)}
            fill="none"
            stroke={SYMBOL.boundary.stroke}
            strokeWidth={SYMBOL.boundary.width}
          />
        </G>
      ) : null}
      {frame.zones.map((z) => {
        const c = centroid(z);
        return (
          <HaloText
            key={`zone-label-${z.name}`}
            x={c.x}
            y={c.y}
            text={z.name}
            color={SYMBOL.zone.stroke}
            anchor="middle"
            italic
          />
        );
      })}
      {frame.posts.map((p) => {
        if (!p.post.sector) return null;
        const s = at(p.x, p.y);
        return (
          <Path
            key={`sector-${p.post.id}`}
            d={sectorPath(s.x, s.y, p.post.sector.fromDeg, p.post.sector.toDeg, p.convergence)}
            fill={SYMBOL.sector.fill}
            stroke={SYMBOL.sector.stroke}
            strokeWidth={1}
          />
        );
      })}
      {frame.posts.map((p) => {
        // A patrol's route: a dashed line through its waypoints.
        if (!p.post.route || p.post.route.length < 2) return null;
        const line = p.post.route
          .map((w) => {
            const g = frame.projection.toGrid(w);
            const s = at(g.x, g.y);
            return `${s.x.toFixed(1)},${s.y.toFixed(1)}`;
          })
          .join(' ');
        return (
          <G key={`route-${p.post.id}`}>
            <Polyline points={line} fill="none" stroke="#FFFFFF" strokeWidth={5} opacity={0.8} />
            <Polyline points={line} fill="none" stroke={SYMBOL.route} strokeWidth={2.5} strokeDasharray="9 5" />
          </G>
        );
      })}
      {outline && outline.length > 0 ? <AreaOutline d={outlinePath(outline, at)} /> : null}
      {chosen && last ? <SightLineMark from={at(chosen.x, chosen.y)} to={at(last.x, last.y)} /> : null}
      {targets.map((t) => {
        const s = at(t.x, t.y);
        const latest = t.id === last?.id;
        return (
          <G key={`target-${t.id}`} opacity={latest ? 1 : 0.6}>
            <Circle cx={s.x} cy={s.y} r={latest ? 9 : 6} fill="none" stroke="#FFFFFF" strokeWidth={4} />
            <Circle cx={s.x} cy={s.y} r={latest ? 9 : 6} fill="none" stroke={SYMBOL.target} strokeWidth={2} />
            <Line x1={s.x - 13} y1={s.y} x2={s.x + 13} y2={s.y} stroke={SYMBOL.target} strokeWidth={1.5} />
            <Line x1={s.x} y1={s.y - 13} x2={s.x} y2={s.y + 13} stroke={SYMBOL.target} strokeWidth={1.5} />
            <HaloText x={s.x + 12} y={s.y - 10} text={`P${t.id}`} color={SYMBOL.target} />
          </G>
        );
      })}
      {frame.posts.map((p) => (
        <PostSymbol key={p.post.id} post={p} at={at(p.x, p.y)} chosen={p.post.id === chosenPostId} />
      ))}
    </Svg>
  );
});

/** An SVG path of separate edges, in screen pixels. */
function outlinePath(segments: Float64Array, at: (x: number, y: number) => { x: number; y: number }): string {
  const parts: string[] = [];
  for (let i = 0; i + 3 < segments.length; i += 4) {
    const a = at(segments[i] as number, segments[i + 1] as number);
    const b = at(segments[i + 2] as number, segments[i + 3] as number);
    parts.push(`M${a.x.toFixed(1)} ${a.y.toFixed(1)}L${b.x.toFixed(1)} ${b.y.toFixed(1)}`);
  }
  return parts.join('');
}

/** A blind area's edge: dark over a light halo, so it reads on hillshade and on any layer. */
function AreaOutline({ d }: { d: string }) {
  return (
    <G>
      <Path d={d} stroke={SYMBOL.outline.halo} strokeWidth={SYMBOL.outline.width + 3} fill="none" strokeLinecap="square" />
      <Path d={d} stroke={SYMBOL.outline.stroke} strokeWidth={SYMBOL.outline.width} fill="none" strokeLinecap="square" />
    </G>
  );
}

function SightLineMark({ from, to }: { from: { x: number; y: number }; to: { x: number; y: number } }) {
  return (
    <G>
      <Line x1={from.x} y1={from.y} x2={to.x} y2={to.y} stroke="#FFFFFF" strokeWidth={4} opacity={0.8} />
      <Line x1={from.x} y1={from.y} x2={to.x} y2={to.y} stroke={SYMBOL.chosen} strokeWidth={2} strokeDasharray="8 5" />
    </G>
  );
}

/** A post: triangle (existing) or open diamond (proposed), its name, and "proposed" spelled out. */
export function PostSymbol({ post, at, chosen }: { post: FramedPost; at: { x: number; y: number }; chosen: boolean }) {
  const proposed = post.post.status === 'proposed';
  return (
    <G>
      {chosen ? (
        <Circle cx={at.x} cy={at.y} r={14} fill="rgba(184, 70, 27, 0.16)" stroke={SYMBOL.chosen} strokeWidth={2} />
      ) : null}
      {proposed ? (
        <G>
          <Path
            d={proposedPostPath(at.x, at.y, 8)}
            fill="#FFFFFF"
            stroke={colors.ink}
            strokeWidth={2.5}
            aria-label={`${post.post.name} symbol`}
          />
        </G>
      ) : (
        <Path
          d={existingPostPath(at.x, at.y, 9)}
          fill={colors.ink}
          stroke="#FFFFFF"
          strokeWidth={1.5}
          aria-label={`${post.post.name} symbol`}
        />
      )}
      <HaloText x={at.x + 14} y={at.y + 4} text={post.post.name} color={colors.ink} bold />
      {proposed ? <HaloText x={at.x + 14} y={at.y + 18} text="proposed" color={colors.muted} italic /> : null}
    </G>
  );
}

/** Text with a white halo so it reads over any shade of the hillshade. */
export function HaloText({
  x,
  y,
  text,
  color,
  anchor = 'start',
  bold,
  italic,
}: {
  x: number;
  y: number;
  text: string;
  color: string;
  anchor?: 'start' | 'middle' | 'end';
  bold?: boolean;
  italic?: boolean;
}) {
  // The same text twice: first as a thick white outline, then in its colour over it.
  const placed = {
    x,
    y,
    fontSize: 13,
    fontFamily: bold ? fonts.semibold : fonts.medium,
    fontStyle: italic ? 'italic' : 'normal',
    textAnchor: anchor,
  } as const;
  return (
    <G>
      <SvgText {...placed} stroke="#FFFFFF" strokeWidth={3.5} strokeLinejoin="round" fill="#FFFFFF">
        {text}
      </SvgText>
      <SvgText {...placed} fill={color}>
        {text}
      </SvgText>
    </G>
  );
}
