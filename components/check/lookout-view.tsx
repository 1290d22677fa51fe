import { useState } from 'react';
import { View, type LayoutChangeEvent } from 'react-native';
import Svg, { Line, Rect, Text as SvgText } from 'react-native-svg';
import type { SightlineResult } from '@/shared/schemas/sightline';
import type { LengthUnit } from '@/shared/units/length';
import { AppText } from '@/components/ui/app-text';
import { colors, fonts, space } from '@/components/ui/theme';
import type { ConditionLabel } from './check-form-model';
import { formatLength } from './format';
import { LINE_Y, lookoutScene, placeLabels, rangeMarks, type LookoutScene, type RangeMark } from './lookout-view-model';

const STRIP_H = 112;
const RANGE_H = 74;

const arcmin = (v: number) => `${v >= 0 ? '+' : '−'}${Math.abs(v) >= 100 ? Math.abs(v).toFixed(0) : Math.abs(v).toFixed(1)}′`;

/**
 * The target as the lookout sees it, one strip per condition: angles from
 * eye level in minutes of arc, the same scale across and up, so the target
 * keeps its true proportions. The horizon sits at the dip below eye level;
 * the part of the target below it is hidden (outlined only). Beside each
 * strip, a range strip puts the target's distance, the horizon, the
 * geographic range and each limit of detection on one scale.
 */
export function LookoutView({
  observerHeightM,
  targetHeightM,
  distanceM,
  targetSizeM,
  results,
  labels,
  units,
}: {
  observerHeightM: number;
  targetHeightM?: number;
  distanceM?: number;
  targetSizeM?: number;
  results: SightlineResult[];
  labels: ConditionLabel[];
  units: { height: LengthUnit; distance: LengthUnit };
}) {
  const [width, setWidth] = useState(0);
  const onLayout = (e: LayoutChangeEvent) => setWidth(e.nativeEvent.layout.width);
  const scenes = results.map((r) => lookoutScene(r, observerHeightM, { heightM: targetHeightM, distanceM, sizeM: targetSizeM }));
  // One angular scale for every strip, so conditions compare at a glance.
  const angles = scenes.flatMap((s) => [0, s.horizonArcmin, s.topArcmin, s.baseArcmin]).filter((a): a is number => a !== null);
  const hi = Math.max(...angles);
  const lo = Math.min(...angles);
  const span = Math.max(hi - lo, 1) * 1.3;
  const pxPerArcmin = (STRIP_H - 16) / span;
  const top = hi + (span - (hi - lo)) / 2;
  const y = (a: number) => 8 + (top - a) * pxPerArcmin;
  const farthest = Math.max(
    1,
    ...results.flatMap((r) => rangeMarks(r, distanceM).map((m) => m.distanceM)).filter((d) => Number.isFinite(d)),
  );
  return (
    <View onLayout={onLayout} style={{ gap: space.md }} aria-label="The target as the lookout sees it">
      <AppText variant="small" tone="muted">
        Angles from eye level in minutes of arc (1′ = 1/60°), the same scale across and up. Outlined: the part of the target the
        earth hides below the horizon.
      </AppText>
      {width > 0
        ? results.map((r, i) => (
            <View key={labels[i]?.key ?? i} style={{ gap: space.xs }}>
              <AppText variant="label">{labels[i]?.label ?? `Condition ${i + 1}`}</AppText>
              <Strip scene={scenes[i]!} width={width} y={y} pxPerArcmin={pxPerArcmin} />
              <RangeStrip marks={rangeMarks(r, distanceM)} width={width} farthest={farthest} unit={units.distance} />
            </View>
          ))
        : null}
    </View>
  );
}

function Strip({
  scene,
  width,
  y,
  pxPerArcmin,
}: {
  scene: LookoutScene;
  width: number;
  y: (arcmin: number) => number;
  pxPerArcmin: number;
}) {
  const cx = width / 2;
  const horizonY = scene.horizonArcmin === null ? null : y(scene.horizonArcmin);
  const targetW = scene.widthArcmin === null ? 3 : Math.max(2, scene.widthArcmin * pxPerArcmin);
  const label = (text: string, yy: number, anchor: 'start' | 'end' = 'start', fill: string = colors.ink) => (
    <SvgText
      x={anchor === 'start' ? 6 : width - 6}
      y={yy - 3}
      fontSize={11}
      fontFamily={fonts.medium}
      fill={fill}
      textAnchor={anchor}
    >
      {text}
    </SvgText>
  );
  return (
    <Svg width={width} height={STRIP_H} role="img" aria-label={describe(scene)}>
      <Rect x={0} y={0} width={width} height={STRIP_H} fill="#E9EEF0" />
      {horizonY !== null ? (
        <Rect x={0} y={horizonY} width={width} height={Math.max(0, STRIP_H - horizonY)} fill="#B9C4C2" />
      ) : null}
      <Line x1={0} x2={width} y1={y(0)} y2={y(0)} stroke={colors.muted} strokeDasharray="6 4" strokeWidth={1} />
      {label('eye level 0′', y(0))}
      {horizonY !== null ? label(`horizon ${arcmin(scene.horizonArcmin!)} (dip)`, horizonY + 14, 'start', colors.ink) : null}
      {scene.topArcmin !== null && scene.baseArcmin !== null && scene.lowestSeenArcmin !== null ? (
        <>
          {/* Hidden part: base up to the lowest part seen. */}
          {scene.lowestSeenArcmin > scene.baseArcmin ? (
            <Rect
              x={cx - targetW / 2}
              y={y(scene.lowestSeenArcmin)}
              width={targetW}
              height={Math.max(1, (scene.lowestSeenArcmin - scene.baseArcmin) * pxPerArcmin)}
              fill="none"
              stroke={colors.ember}
              strokeDasharray="3 2"
              strokeWidth={1}
            />
          ) : null}
          {!scene.hidden ? (
            <Rect
              x={cx - targetW / 2}
              y={y(scene.topArcmin)}
              width={targetW}
              height={Math.max(1, (scene.topArcmin - scene.lowestSeenArcmin) * pxPerArcmin)}
              fill={colors.ember}
            />
          ) : null}
          {label(`target top ${arcmin(scene.topArcmin)}`, y(scene.topArcmin) + 4, 'end', colors.emberDeep)}
        </>
      ) : null}
    </Svg>
  );
}

const describe = (s: LookoutScene) =>
  [
    s.horizonArcmin === null ? 'No horizon (duct).' : `Horizon ${arcmin(s.horizonArcmin)} below eye level.`,
    s.topArcmin === null ? '' : `Target top at ${arcmin(s.topArcmin)}${s.hidden ? ', hidden below the horizon.' : '.'}`,
  ].join(' ');

/** The distances of one result on one line, nearest first; the detected stretch drawn solid. */
function RangeStrip({ marks, width, farthest, unit }: { marks: RangeMark[]; width: number; farthest: number; unit: LengthUnit }) {
  const pad = 8;
  const x = (d: number) => pad + (d / (farthest * 1.04)) * (width - 2 * pad);
  const detected = marks.find((m) => m.key === 'detection');
  const texts = marks.map((m) => `${m.label} ${formatLength(m.distanceM, unit)}`);
  const placed = placeLabels(
    marks.map((m, i) => ({ text: texts[i]!, x: x(m.distanceM) })),
    width,
  );
  return (
    <Svg width={width} height={RANGE_H} role="img" aria-label={texts.join(', ')}>
      <Line x1={pad} x2={width - pad} y1={LINE_Y} y2={LINE_Y} stroke={colors.lineStrong} strokeWidth={2} />
      {detected ? (
        <Rect x={pad} y={LINE_Y - 4} width={Math.max(0, x(detected.distanceM) - pad)} height={8} fill={colors.moss} />
      ) : null}
      {marks.map((m, i) => (
        <SvgText
          key={m.key}
          x={placed[i]!.x}
          y={placed[i]!.y}
          fontSize={10.5}
          fontFamily={fonts.medium}
          textAnchor="start"
          fill={m.key === 'target' ? colors.emberDeep : colors.ink}
        >
          {texts[i]}
        </SvgText>
      ))}
      {marks.map((m) => (
        <Line
          key={`tick-${m.key}`}
          x1={x(m.distanceM)}
          x2={x(m.distanceM)}
          y1={LINE_Y - 8}
          y2={LINE_Y + 8}
          stroke={m.key === 'target' ? colors.ember : colors.ink}
          strokeWidth={m.key === 'target' ? 2.5 : 1.5}
        />
      ))}
    </Svg>
  );
}
