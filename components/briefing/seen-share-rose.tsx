import Svg, { Circle, G, Line, Path, Text as SvgText } from 'react-native-svg';
import type { BriefingTerrainCase } from '@/shared/schemas/assignment';
import { colors, fonts } from '@/components/ui/theme';

const DEG = Math.PI / 180;

/** A point `r` from the centre at a true bearing, on a north-up drawing (y grows downward). */
function at(cx: number, cy: number, r: number, bearingDeg: number) {
  return { x: cx + r * Math.sin(bearingDeg * DEG), y: cy - r * Math.cos(bearingDeg * DEG) };
}

/** An annular wedge between two bearings and two radii. */
function wedge(cx: number, cy: number, r0: number, r1: number, fromDeg: number, toDeg: number) {
  const a = at(cx, cy, r0, fromDeg);
  const b = at(cx, cy, r1, fromDeg);
  const c = at(cx, cy, r1, toDeg);
  const d = at(cx, cy, r0, toDeg);
  const large = toDeg - fromDeg > 180 ? 1 : 0;
  return `M${a.x} ${a.y}L${b.x} ${b.y}A${r1} ${r1} 0 ${large} 1 ${c.x} ${c.y}L${d.x} ${d.y}A${r0} ${r0} 0 ${large} 0 ${a.x} ${a.y}Z`;
}

/**
 * The seen share of the ground in range round the post, one petal per
 * bearing sector (true north up): a petal's length is the share seen, blind
 * sectors (below the threshold) are drawn in ember, sectors without ground in
 * range as a thin grey rim. The dashed ring marks the threshold.
 */
export function SeenShareRose({
  view,
  blindBelowPct,
  size = 220,
  watch,
}: {
  view: BriefingTerrainCase;
  blindBelowPct: number;
  size?: number;
  /** The post's watch sector, degrees true, when it has one. */
  watch?: { fromDeg: number; toDeg: number } | null;
}) {
  const c = size / 2;
  const r0 = size * 0.08;
  const r1 = size * 0.36;
  const reach = (pct: number) => r0 + ((r1 - r0) * pct) / 100;
  const blindList = view.blindSectors.map((b) => `${b.fromDeg}°–${b.toDeg}°`).join(', ');
  return (
    <Svg
      width={size}
      height={size}
      viewBox={`0 0 ${size} ${size}`}
      role="img"
      aria-label={`Seen share by bearing, true north up. ${blindList ? `Blind: ${blindList}.` : 'No blind sector.'}`}
    >
      <Circle cx={c} cy={c} r={r1} fill={colors.surface} stroke={colors.line} />
      {watch ? (
        <Path
          d={wedge(c, c, r1, r1 + 6, watch.fromDeg, watch.toDeg + (watch.toDeg < watch.fromDeg ? 360 : 0))}
          fill={colors.lantern}
        />
      ) : null}
      <G>
        {view.sectors.map((s) =>
          s.seenPct === null ? (
            <Path key={s.fromDeg} d={wedge(c, c, r1 - 2, r1, s.fromDeg, s.toDeg)} fill={colors.lineStrong} />
          ) : (
            <Path
              key={s.fromDeg}
              d={wedge(c, c, r0, Math.max(reach(s.seenPct), r0 + 1), s.fromDeg + 0.6, s.toDeg - 0.6)}
              fill={s.seenPct < blindBelowPct ? colors.ember : colors.moss}
            />
          ),
        )}
      </G>
      <Circle cx={c} cy={c} r={reach(blindBelowPct)} fill="none" stroke={colors.ink} strokeDasharray="3 3" strokeWidth={1} />
      {[0, 90, 180, 270].map((b) => {
        const p = at(c, c, r1, b);
        const q = at(c, c, r1 + 10, b);
        const t = at(c, c, r1 + 19, b);
        return (
          <G key={b}>
            <Line x1={p.x} y1={p.y} x2={q.x} y2={q.y} stroke={colors.ink} strokeWidth={1.5} />
            <SvgText x={t.x} y={t.y + 4} fontSize={12} fontFamily={fonts.semibold} fill={colors.ink} textAnchor="middle">
              {['N', 'E', 'S', 'W'][b / 90]}
            </SvgText>
          </G>
        );
      })}
      <Circle cx={c} cy={c} r={3} fill={colors.ink} />
    </Svg>
  );
}
