import { useMemo, useState } from 'react';
import { View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Path, Rect, Text as SvgText } from 'react-native-svg';
import type { EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import { gridProjection } from '@/shared/terrain/grid-projection';
import { AppText } from '@/components/ui/app-text';
import { colors, fonts, space } from '@/components/ui/theme';
import { addedColour, KEPT_COLOUR, STEP_COLOURS } from './siting-format';

/** Longest side of the drawn picture, blocks of cells. */
const MAX_BLOCKS = 150;

export interface MapMarker {
  latDeg: number;
  lonDeg: number;
  label: string;
  /** 0 = a kept post, n = the n-th chosen tower. */
  step: number;
}

/**
 * What each chosen tower adds, drawn on the run's grid (north up): the ground
 * the kept posts already see, then each tower's new ground in its own colour,
 * with the kept posts (squares) and the chosen towers (numbered circles).
 * The grid is drawn in blocks of cells (the code at each block's centre) so
 * the picture stays light on a phone.
 */
export function AddedAreaMap({ layer, markers }: { layer: EncodedClassRaster; markers: MapMarker[] }) {
  const [width, setWidth] = useState(0);
  const onLayout = (e: LayoutChangeEvent) => setWidth(e.nativeEvent.layout.width);
  const block = Math.max(1, Math.ceil(Math.max(layer.width, layer.height) / MAX_BLOCKS));
  const cols = Math.ceil(layer.width / block);
  const rows = Math.ceil(layer.height / block);
  const paths = useMemo(() => {
    const values = decodeClassRaster(layer);
    const byColour = new Map<string, string[]>();
    for (let r = 0; r < rows; r++) {
      const row = Math.min(layer.height - 1, r * block + (block >> 1));
      let start = 0;
      let current: string | null = null;
      const flush = (end: number) => {
        if (current === null) return;
        const d = byColour.get(current) ?? [];
        d.push(`M${start} ${r}h${end - start}v1h${start - end}z`);
        byColour.set(current, d);
      };
      for (let c = 0; c <= cols; c++) {
        const colour: string | null =
          c === cols ? null : addedColour(values[row * layer.width + Math.min(layer.width - 1, c * block + (block >> 1))]!);
        if (colour !== current) {
          flush(c);
          current = colour;
          start = c;
        }
      }
    }
    return [...byColour.entries()].map(([fill, d]) => ({ fill, d: d.join('') }));
  }, [layer, block, cols, rows]);
  const projection = useMemo(() => {
    try {
      return gridProjection({ epsg: layer.epsg ?? 0, wkt: null });
    } catch {
      return null; // a grid without a known CRS: the ground is drawn, the posts are not
    }
  }, [layer.epsg]);
  const scale = width > 0 ? Math.min(width / cols, 460 / rows) : 0;
  const heightPx = rows * scale;
  const toPx = (m: MapMarker) => {
    const { x, y } = projection!.toGrid({ latDeg: m.latDeg, lonDeg: m.lonDeg });
    const top = layer.yll + layer.height * layer.cellSize;
    return { px: ((x - layer.xll) / layer.cellSize / block) * scale, py: ((top - y) / layer.cellSize / block) * scale };
  };
  return (
    <View style={{ gap: space.sm }}>
      <View onLayout={onLayout} testID="siting-added-map" accessibilityLabel="Map of the ground each chosen tower adds">
        {scale > 0 ? (
          <Svg width={cols * scale} height={heightPx}>
            <Rect x={0} y={0} width={cols * scale} height={heightPx} fill={colors.surface} />
            <G scale={scale}>
              {paths.map((p) => (
                <Path key={p.fill} d={p.d} fill={p.fill} />
              ))}
            </G>
            {(projection ? markers : []).map((m) => {
              const { px, py } = toPx(m);
              return m.step === 0 ? (
                <Rect
                  key={`k${m.label}`}
                  x={px - 5}
                  y={py - 5}
                  width={10}
                  height={10}
                  fill={colors.ink}
                  stroke={colors.surface}
                  strokeWidth={1.5}
                />
              ) : (
                <G key={`s${m.step}`}>
                  <Circle
                    cx={px}
                    cy={py}
                    r={10}
                    fill={STEP_COLOURS[(m.step - 1) % STEP_COLOURS.length]}
                    stroke={colors.surface}
                    strokeWidth={2}
                  />
                  <SvgText x={px} y={py + 4} fontSize={11} fontFamily={fonts.bold} fill={colors.surface} textAnchor="middle">
                    {String(m.step)}
                  </SvgText>
                </G>
              );
            })}
          </Svg>
        ) : null}
      </View>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md }}>
        <Legend colour={KEPT_COLOUR} label="Seen by the kept posts" />
        {markers
          .filter((m) => m.step > 0)
          .map((m) => (
            <Legend
              key={m.step}
              colour={STEP_COLOURS[(m.step - 1) % STEP_COLOURS.length]!}
              label={`Added by ${m.step}. ${m.label}`}
            />
          ))}
      </View>
    </View>
  );
}

function Legend({ colour, label }: { colour: string; label: string }) {
  return (
    <View style={{ flexDirection: 'row', alignItems: 'center', gap: space.xs }}>
      <View style={{ width: 14, height: 14, borderRadius: 3, backgroundColor: colour }} />
      <AppText variant="small">{label}</AppText>
    </View>
  );
}
