import { useState } from 'react';
import { View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, Line, Polyline, Text as SvgText } from 'react-native-svg';
import { formatArea, formatPct } from '@/components/plans/coverage-format';
import { colors, fonts } from '@/components/ui/theme';
import type { CurvePoint } from './siting-format';

const PAD = { left: 56, right: 16, top: 16, bottom: 40 };

/**
 * The coverage curve: area seen (km², left axis) against the number of new
 * towers (0 = the kept posts alone), one dot per step, the share of the site
 * beside each dot. Shows how quickly each further tower adds less.
 */
export function CoverageCurveChart({ points, siteAreaM2 }: { points: CurvePoint[]; siteAreaM2: number | null }) {
  const [width, setWidth] = useState(0);
  const onLayout = (e: LayoutChangeEvent) => setWidth(e.nativeEvent.layout.width);
  const height = 220;
  const last = points.at(-1);
  const top = Math.max(siteAreaM2 ?? 0, last?.seenM2 ?? 0, 1);
  const plotW = Math.max(width - PAD.left - PAD.right, 10);
  const plotH = height - PAD.top - PAD.bottom;
  const n = Math.max(points.length - 1, 1);
  const x = (towers: number) => PAD.left + (towers / n) * plotW;
  const y = (m2: number) => PAD.top + plotH - (m2 / top) * plotH;
  const ticks = [0, 0.25, 0.5, 0.75, 1].map((f) => f * top);
  return (
    <View
      onLayout={onLayout}
      testID="siting-curve"
      accessibilityLabel="Coverage curve: area seen against the number of new towers"
    >
      {width > 0 && points.length > 0 ? (
        <Svg width={width} height={height}>
          {ticks.map((t) => (
            <Line key={`g${t}`} x1={PAD.left} x2={PAD.left + plotW} y1={y(t)} y2={y(t)} stroke={colors.line} strokeWidth={1} />
          ))}
          {ticks.map((t) => (
            <SvgText
              key={`l${t}`}
              x={PAD.left - 6}
              y={y(t) + 4}
              fontSize={11}
              fontFamily={fonts.regular}
              fill={colors.muted}
              textAnchor="end"
            >
              {formatArea(t).replace(' km²', '')}
            </SvgText>
          ))}
          <SvgText x={4} y={PAD.top - 4} fontSize={11} fontFamily={fonts.medium} fill={colors.muted}>
            km²
          </SvgText>
          {points.map((p) => (
            <SvgText
              key={`x${p.towers}`}
              x={x(p.towers)}
              y={height - PAD.bottom + 16}
              fontSize={11}
              fontFamily={fonts.regular}
              fill={colors.muted}
              textAnchor="middle"
            >
              {String(p.towers)}
            </SvgText>
          ))}
          <SvgText
            x={PAD.left + plotW / 2}
            y={height - 6}
            fontSize={12}
            fontFamily={fonts.medium}
            fill={colors.ink}
            textAnchor="middle"
          >
            New towers
          </SvgText>
          <Polyline
            points={points.map((p) => `${x(p.towers)},${y(p.seenM2)}`).join(' ')}
            fill="none"
            stroke={colors.moss}
            strokeWidth={2.5}
          />
          {points.map((p) => (
            <Circle
              key={`c${p.towers}`}
              cx={x(p.towers)}
              cy={y(p.seenM2)}
              r={4.5}
              fill={p.towers === 0 ? colors.lineStrong : colors.ember}
            />
          ))}
          {points.map((p) => (
            <SvgText
              key={`p${p.towers}`}
              x={x(p.towers) + (p.towers === points.length - 1 ? -6 : 6)}
              y={y(p.seenM2) - 8}
              fontSize={11}
              fontFamily={fonts.semibold}
              fill={colors.ink}
              textAnchor={p.towers === points.length - 1 ? 'end' : 'start'}
            >
              {formatPct(p.seenPct)}
            </SvgText>
          ))}
        </Svg>
      ) : null}
    </View>
  );
}
