import { useState } from 'react';
import { View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Line, Path, Rect, Text as SvgText } from 'react-native-svg';
import type { TerrainProfileResponse } from '@/shared/schemas/terrain';
import { convertLength, type LengthUnit } from '@/shared/units/length';
import { distanceIn } from '@/components/check/format';
import { conditionStyle } from '@/components/check/condition-colors';
import { AppText } from '@/components/ui/app-text';
import { colors, fonts, space } from '@/components/ui/theme';
import { chartScale, profileChart, roundExaggeration, type ChartPoint } from './profile-chart';

const PAD = { left: 46, right: 14, top: 16, bottom: 30 };
const HEIGHT = 230;

const km = (m: number) =>
  m >= 10_000 ? `${(m / 1000).toFixed(1)} km` : m >= 1000 ? `${(m / 1000).toFixed(2)} km` : `${Math.round(m)} m`;

/**
 * The side view of one profile: ground along the line, the eye, the target
 * with its hidden part, and one sight line per condition (colour and dash),
 * each condition's obstruction marked with a cross. Drawn in the true-earth
 * frame (see profile-chart.ts), vertical scale exaggerated and stated.
 */
export function ProfileView({
  profile,
  labels,
  units = { height: 'm', distance: 'km' },
}: {
  profile: TerrainProfileResponse;
  labels: readonly string[];
  /** The person's units: heights on the axis and the hidden part, the line's length (metric by default). */
  units?: { height: LengthUnit; distance: LengthUnit };
}) {
  const heightText = (m: number) => `${Math.round(convertLength(m, 'm', units.height))} ${units.height}`;
  const [width, setWidth] = useState(0);
  const onLayout = (e: LayoutChangeEvent) => setWidth(e.nativeEvent.layout.width);
  const chart = profileChart(profile);
  const box = {
    left: PAD.left,
    top: PAD.top,
    width: Math.max(width - PAD.left - PAD.right, 10),
    height: HEIGHT - PAD.top - PAD.bottom,
  };
  const scale = chartScale(chart, box);
  const path = (pts: readonly ChartPoint[]) =>
    pts.map((p, i) => `${i ? 'L' : 'M'}${scale.sx(p.d).toFixed(1)},${scale.sy(p.y).toFixed(1)}`).join(' ');
  const first = chart.conditions[0];
  const hidden = first ? Math.max(first.hiddenHeightM, 0) : 0;
  const hiddenTop = Math.min(chart.targetGround.y + hidden, chart.yMax);
  const ticks = [chart.yMin, (chart.yMin + chart.yMax) / 2, chart.yMax];
  const exaggeration = roundExaggeration(scale.exaggeration);
  return (
    <View onLayout={onLayout} style={{ gap: space.xs }}>
      {width > 0 ? (
        <Svg
          width={width}
          height={HEIGHT}
          role="img"
          aria-label={`Side view from the eye to the point, ${distanceIn(profile.distanceM, units.distance, km)}, vertical scale ×${exaggeration}`}
        >
          <Rect x={0} y={0} width={width} height={HEIGHT} fill="#EEF2F3" />
          {ticks.map((t) => (
            <G key={t}>
              <Line x1={PAD.left} y1={scale.sy(t)} x2={width - PAD.right} y2={scale.sy(t)} stroke={colors.line} strokeWidth={1} />
              <SvgText
                x={PAD.left - 4}
                y={scale.sy(t) + 4}
                fontSize={10}
                fontFamily={fonts.regular}
                fill={colors.muted}
                textAnchor="end"
              >
                {heightText(t)}
              </SvgText>
            </G>
          ))}
          {chart.ground.map((part, i) => (
            <Path
              key={`ground-${i}`}
              d={`${path(part)} L${scale.sx(part.at(-1)!.d).toFixed(1)},${PAD.top + box.height} L${scale.sx(part[0]!.d).toFixed(1)},${PAD.top + box.height} Z`}
              fill="#D9D3C5"
              stroke={colors.ink}
              strokeWidth={1.5}
            />
          ))}
          {chart.conditions.map((c, i) => {
            const st = conditionStyle(i);
            return (
              <Path
                key={`line-${i}`}
                d={path(c.sightLine)}
                stroke={st.color}
                strokeWidth={2}
                strokeDasharray={st.dash}
                fill="none"
              />
            );
          })}
          {chart.conditions.map((c, i) =>
            c.obstruction ? (
              <G key={`block-${i}`}>
                <Circle
                  cx={scale.sx(c.obstruction.d)}
                  cy={scale.sy(c.obstruction.y)}
                  r={7}
                  fill="#FFFFFF"
                  stroke={conditionStyle(i).color}
                  strokeWidth={2}
                />
                <Path
                  d={`M${scale.sx(c.obstruction.d) - 4},${scale.sy(c.obstruction.y) - 4} l8,8 m0,-8 l-8,8`}
                  stroke={conditionStyle(i).color}
                  strokeWidth={2}
                />
              </G>
            ) : null,
          )}
          {hidden > 0 ? (
            <Line
              x1={scale.sx(chart.targetGround.d) - 3}
              y1={scale.sy(chart.targetGround.y)}
              x2={scale.sx(chart.targetGround.d) - 3}
              y2={scale.sy(hiddenTop)}
              stroke="#7A8A91"
              strokeWidth={8}
              opacity={0.75}
            />
          ) : null}
          {chart.targetGround.y + hidden > chart.yMax ? (
            <SvgText
              x={scale.sx(chart.targetGround.d) - 10}
              y={PAD.top + 10}
              fontSize={11}
              fontFamily={fonts.medium}
              fill={colors.ink}
              textAnchor="end"
            >
              ↑ hidden {heightText(hidden)}
            </SvgText>
          ) : null}
          <Line
            x1={scale.sx(chart.targetGround.d) - 3}
            y1={scale.sy(chart.targetGround.y)}
            x2={scale.sx(chart.targetGround.d) - 3}
            y2={scale.sy(chart.targetTop.y) - (profile.target.heightM > 0 ? 0 : 3)}
            stroke={colors.ink}
            strokeWidth={3}
          />
          <Circle cx={scale.sx(0)} cy={scale.sy(chart.eye.y)} r={5} fill={colors.ember} />
          <SvgText x={scale.sx(0) + 8} y={scale.sy(chart.eye.y) - 6} fontSize={11} fontFamily={fonts.medium} fill={colors.ink}>
            eye
          </SvgText>
          <SvgText
            x={width - PAD.right}
            y={PAD.top - 4}
            fontSize={11}
            fontFamily={fonts.medium}
            fill={colors.ink}
            textAnchor="end"
          >
            point
          </SvgText>
          <SvgText x={PAD.left} y={HEIGHT - 10} fontSize={10} fontFamily={fonts.regular} fill={colors.muted}>
            0
          </SvgText>
          <SvgText
            x={width - PAD.right}
            y={HEIGHT - 10}
            fontSize={10}
            fontFamily={fonts.regular}
            fill={colors.muted}
            textAnchor="end"
          >
            {km(profile.distanceM)}
          </SvgText>
        </Svg>
      ) : (
        <View style={{ height: HEIGHT }} />
      )}
      <AppText variant="small" tone="muted">
        Vertical scale ×{exaggeration.toLocaleString('en')}. Drawn on the true earth: the ground falls away with the earth’s curve
        and each sight line bends with its refraction. A cross marks the ground that blocks a line; grey on the point is its
        hidden height.
      </AppText>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md, rowGap: 2 }}>
        {labels.map((l, i) => (
          <View key={l} style={{ flexDirection: 'row', alignItems: 'center', gap: space.xs }}>
            <Svg width={26} height={10}>
              <Line
                x1={0}
                y1={5}
                x2={26}
                y2={5}
                stroke={conditionStyle(i).color}
                strokeWidth={2.5}
                strokeDasharray={conditionStyle(i).dash}
              />
            </Svg>
            <AppText variant="small">{l}</AppText>
          </View>
        ))}
      </View>
    </View>
  );
}
