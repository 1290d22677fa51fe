import { View } from 'react-native';
import Svg, { Line, Polyline, Rect, Circle, Text as SvgText } from 'react-native-svg';
import { AppText } from '@/components/ui/app-text';
import { colors, space } from '@/components/ui/theme';
import { sideViewGeometry, sideViewRows } from './trainer-format';
import type { LengthUnit } from '@/shared/units';

const W = 320;
const H = 140;

/** Figures as label–value lines, the label muted on the left and the value on the right. */
export function FigureRows({ rows, label }: { rows: { key: string; label: string; text: string }[]; label?: string }) {
  return (
    <View style={{ gap: 2 }} aria-label={label}>
      {rows.map((r) => (
        <View key={r.key} style={{ flexDirection: 'row', gap: space.sm, justifyContent: 'space-between' }}>
          <AppText variant="small" tone="muted" style={{ flex: 1 }}>
            {r.label}
          </AppText>
          <AppText variant="small">{r.text}</AppText>
        </View>
      ))}
    </View>
  );
}

/** An upright stroke of the drawing (the eye's height, the target, its hidden part) at `x` from `baseY` up to `topY`. */
function Upright({ x, baseY, topY, colour, width }: { x: number; baseY: number; topY: number; colour: string; width: number }) {
  return <Line x1={x} y1={baseY} x2={x} y2={topY} stroke={colour} strokeWidth={width} />;
}

/** The explanation's side view: a schematic drawing (heights exaggerated) and the numbers beside it. */
export function DrillSideView({
  view,
  units,
}: {
  view: Record<string, number | string | boolean | null>;
  units: { height: LengthUnit; distance: LengthUnit };
}) {
  const g = sideViewGeometry(view, W, H);
  const rows = sideViewRows(view, units);
  return (
    <View style={{ gap: space.sm }} aria-label="Side view">
      {g ? (
        <View style={{ width: '100%', maxWidth: 520, aspectRatio: W / H }} role="img" aria-label="Side view, heights exaggerated">
          <Svg width="100%" height="100%" viewBox={`0 0 ${W} ${H}`}>
            <Rect x={0} y={0} width={W} height={H} fill={colors.paper} />
            <Polyline points={g.surface} fill="none" stroke={colors.moss} strokeWidth={2} />
            <Upright x={g.eye.x} baseY={g.eye.baseY} topY={g.eye.y} colour={colors.ink} width={3} />
            <Circle cx={g.eye.x} cy={g.eye.y} r={3.5} fill={colors.ember} />
            <Line
              x1={g.eye.x}
              y1={g.eye.y}
              x2={g.ray.x2}
              y2={g.ray.y2}
              stroke={colors.ember}
              strokeWidth={1}
              strokeDasharray="4 3"
            />
            {g.horizonX !== null ? (
              <SvgText x={g.horizonX} y={H - 4} fontSize={10} fill={colors.muted} textAnchor="middle">
                horizon
              </SvgText>
            ) : null}
            {g.target ? (
              <>
                <Upright x={g.target.x} baseY={g.target.baseY} topY={g.target.topY} colour={colors.ink} width={4} />
                <Upright x={g.target.x} baseY={g.target.baseY} topY={g.target.hiddenTopY} colour={colors.danger} width={4} />
                <SvgText x={g.target.x} y={Math.max(g.target.topY - 4, 9)} fontSize={10} fill={colors.ink} textAnchor="middle">
                  target
                </SvgText>
              </>
            ) : null}
            <SvgText x={g.eye.x + 6} y={Math.max(g.eye.y - 4, 9)} fontSize={10} fill={colors.ink}>
              eye
            </SvgText>
          </Svg>
        </View>
      ) : null}
      <AppText variant="small" tone="muted">
        Heights are exaggerated{g?.target ? '; the red part of the target is hidden by the earth’s curve' : ''}.
      </AppText>
      <FigureRows rows={rows} />
    </View>
  );
}
