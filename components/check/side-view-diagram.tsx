import { useState } from 'react';
import { View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Line, Path, Rect, Text as SvgText } from 'react-native-svg';
import type { SightlineResult } from '@/shared/schemas/sightline';
import { MEAN_EARTH_RADIUS_M } from '@/shared/sightline/constants';
import type { LengthUnit } from '@/shared/units/length';
import { AppText } from '@/components/ui/app-text';
import { colors, fonts, space } from '@/components/ui/theme';
import type { ConditionLabel } from './check-form-model';
import { conditionStyle } from './condition-colors';
import { formatLength } from './format';

export interface SideViewProps {
  observerHeightM: number;
  targetHeightM?: number;
  distanceM?: number;
  earthRadiusM?: number;
  results: SightlineResult[];
  labels: ConditionLabel[];
  units: { height: LengthUnit; distance: LengthUnit };
}

const PAD = { left: 44, right: 16, top: 20, bottom: 36 };

/**
 * Side view in the true-earth frame: x is distance along the surface, y the
 * height above the observer's tangent plane, so the surface falls away as
 * −x²/2R. Each condition's horizon-grazing sightline is drawn as its height
 * above the surface, (x − d_h)²/2R′, on that falling surface. The vertical
 * scale is exaggerated, and says by how much.
 */
export function SideViewDiagram({
  observerHeightM: h,
  targetHeightM,
  distanceM,
  earthRadiusM = MEAN_EARTH_RADIUS_M,
  results,
  labels,
  units,
}: SideViewProps) {
  const [width, setWidth] = useState(0);
  const height = 260;
  const onLayout = (e: LayoutChangeEvent) => setWidth(e.nativeEvent.layout.width);

  const horizons = results.map((r) => r.horizonDistanceM).filter((d): d is number => d !== null);
  const xMax = Math.max(distanceM ?? 0, ...horizons.map((d) => d * 1.25), 1000) * 1.08;
  const drop = (x: number) => (x * x) / (2 * earthRadiusM);
  const top = Math.max(h, targetHeightM ?? 0) * 1.35 + 1;
  const bottom = -drop(xMax);
  const plotW = Math.max(width - PAD.left - PAD.right, 10);
  const plotH = height - PAD.top - PAD.bottom;
  const sx = (x: number) => PAD.left + (x / xMax) * plotW;
  const sy = (y: number) => PAD.top + ((top - y) / (top - bottom)) * plotH;
  const exaggeration = xMax / plotW / ((top - bottom) / plotH);

  const N = 80;
  const surface = Array.from({ length: N + 1 }, (_, i) => (i / N) * xMax);
  const surfacePath = surface.map((x, i) => `${i ? 'L' : 'M'}${sx(x).toFixed(1)},${sy(-drop(x)).toFixed(1)}`).join(' ');
  const groundFill = `${surfacePath} L${sx(xMax)},${height} L${sx(0)},${height} Z`;

  const rayPath = (r: SightlineResult) => {
    if (r.horizonDistanceM === null || r.effectiveRadiusM === null) return null;
    const dh = r.horizonDistanceM;
    const Re = r.effectiveRadiusM;
    const pts = surface.map((x) => {
      const above = ((x - dh) * (x - dh)) / (2 * Re);
      return `${sx(x).toFixed(1)},${sy(-drop(x) + above).toFixed(1)}`;
    });
    return `M${pts.join(' L')}`;
  };

  const first = results[0];
  const target =
    distanceM !== undefined && targetHeightM !== undefined
      ? { x: distanceM, base: -drop(distanceM), top: -drop(distanceM) + targetHeightM }
      : null;
  const hidden = first && target && first.hiddenHeightM !== null ? Math.min(first.hiddenHeightM, targetHeightM ?? 0) : null;

  return (
    <View onLayout={onLayout} style={{ gap: space.sm }} aria-label="Side view of the sightlines">
      {width > 0 ? (
        <Svg width={width} height={height} role="img" aria-label="Side view: eye, horizon sightlines and target">
          <Rect x={0} y={0} width={width} height={height} fill="#EEF2F3" />
          <Path d={groundFill} fill="#D9D3C5" stroke={colors.ink} strokeWidth={1.5} />
          {results.map((r, i) => {
            const d = rayPath(r);
            const st = conditionStyle(i);
            return d ? (
              <Path key={labels[i]?.key ?? i} d={d} stroke={st.color} strokeWidth={2} strokeDasharray={st.dash} fill="none" />
            ) : null;
          })}
          {target ? (
            <G>
              <Line
                x1={sx(target.x)}
                y1={sy(target.base)}
                x2={sx(target.x)}
                y2={sy(target.top)}
                stroke={colors.ink}
                strokeWidth={6}
              />
              {hidden !== null && hidden > 0 ? (
                <Line
                  x1={sx(target.x)}
                  y1={sy(target.base)}
                  x2={sx(target.x)}
                  y2={sy(target.base + hidden)}
                  stroke="#7A8A91"
                  strokeWidth={10}
                  opacity={0.75}
                />
              ) : null}
              <SvgText
                x={sx(target.x) - 6}
                y={sy(target.top) - 6}
                fontSize={12}
                fontFamily={fonts.medium}
                fill={colors.ink}
                textAnchor="end"
              >
                target
              </SvgText>
            </G>
          ) : null}
          <Line x1={sx(0)} y1={sy(0)} x2={sx(0)} y2={sy(h)} stroke={colors.ink} strokeWidth={3} />
          <Circle cx={sx(0)} cy={sy(h)} r={5} fill={colors.ember} />
          <SvgText x={sx(0) + 8} y={sy(h) - 6} fontSize={12} fontFamily={fonts.medium} fill={colors.ink}>
            eye {formatLength(h, units.height)}
          </SvgText>
          <SvgText x={sx(xMax)} y={height - 10} fontSize={11} fontFamily={fonts.regular} fill={colors.muted} textAnchor="end">
            {formatLength(xMax, units.distance)}
          </SvgText>
          <SvgText x={PAD.left} y={height - 10} fontSize={11} fontFamily={fonts.regular} fill={colors.muted}>
            0
          </SvgText>
        </Svg>
      ) : (
        <View style={{ height }} />
      )}
      <AppText variant="small" tone="muted">
        Vertical scale exaggerated about ×{Math.round(exaggeration).toLocaleString('en')}. Grey on the target: the part hidden
        under the first condition's sightline.
      </AppText>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md }}>
        {labels.map((l, i) => (
          <View key={l.key} style={{ flexDirection: 'row', alignItems: 'center', gap: space.xs }}>
            <Svg width={28} height={10}>
              <Line
                x1={0}
                y1={5}
                x2={28}
                y2={5}
                stroke={conditionStyle(i).color}
                strokeWidth={2.5}
                strokeDasharray={conditionStyle(i).dash}
              />
            </Svg>
            <AppText variant="small">{l.label}</AppText>
            {results[i]?.horizonDistanceM === null ? (
              <AppText variant="small" tone="muted">
                (no horizon)
              </AppText>
            ) : null}
          </View>
        ))}
      </View>
    </View>
  );
}
