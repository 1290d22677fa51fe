import { View } from 'react-native';
import Svg, { Circle, Line, Path, Polygon, Rect } from 'react-native-svg';
import { AppText } from '@/components/ui/app-text';
import { colors, space } from '@/components/ui/theme';
import type { ClassPalette } from './class-palettes';
import { existingPostPath, proposedPostPath, sectorPath, SYMBOL } from './map-features';
import { SHORE_SYMBOL } from './shore-overlay';

const SWATCH = 22;
/** The hillshade's grey on flat ground (1 + 254·sin 45° ≈ 181), under the legend's colour swatches. */
const GROUND_GREY = '#B5B5B5';

function Row({ symbol, label, meaning }: { symbol: React.ReactNode; label: string; meaning?: string }) {
  return (
    <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'flex-start' }}>
      <View style={{ width: SWATCH + 6, alignItems: 'center', paddingTop: 1 }}>{symbol}</View>
      <View style={{ flex: 1 }}>
        <AppText variant="label">{label}</AppText>
        {meaning ? (
          <AppText variant="small" tone="muted">
            {meaning}
          </AppText>
        ) : null}
      </View>
    </View>
  );
}

/** The classes of a coverage layer: a swatch as the map shows it (over hillshade grey), the name and the meaning of each. */
export function ClassLegend({ palette, title }: { palette: ClassPalette; title?: string }) {
  return (
    <View style={{ gap: space.sm }} role="list" aria-label={`Legend: ${title ?? palette.title}`}>
      <AppText variant="label" tone="muted">
        {title ?? palette.title}
      </AppText>
      {palette.classes.map((c) => (
        <View key={c.code} role="listitem">
          <Row
            symbol={
              <Svg width={SWATCH} height={SWATCH}>
                <Rect x={1} y={1} width={SWATCH - 2} height={SWATCH - 2} fill={GROUND_GREY} />
                {c.color ? (
                  <Rect x={1} y={1} width={SWATCH - 2} height={SWATCH - 2} fill={c.color} opacity={palette.opacity} />
                ) : (
                  <Rect
                    x={1}
                    y={1}
                    width={SWATCH - 2}
                    height={SWATCH - 2}
                    fill="none"
                    stroke={colors.muted}
                    strokeDasharray="3 2"
                  />
                )}
              </Svg>
            }
            label={c.color ? c.label : `${c.label} (not tinted)`}
            meaning={c.meaning}
          />
        </View>
      ))}
    </View>
  );
}

/** The map's own symbols: what the base layer is, boundary, zones, posts, sectors, tapped points and the sight line. */
export function MapLegend({
  hasTerrain,
  showSectors,
  palette,
  shore = null,
}: {
  hasTerrain: boolean;
  showSectors: boolean;
  palette: ClassPalette | null;
  /** The site has a shoreline; `gaps`: a case's gaps are drawn on it. */
  shore?: { gaps: boolean } | null;
}) {
  const s = SWATCH;
  return (
    <View style={{ gap: space.md }}>
      <View style={{ gap: space.sm }} role="list" aria-label="Legend: map symbols">
        <AppText variant="label" tone="muted">
          Map symbols
        </AppText>
        <Row
          symbol={
            <Svg width={s} height={s}>
              <Rect x={0} y={0} width={s} height={s} fill={hasTerrain ? '#9A9A9A' : '#E4E9E6'} />
              {hasTerrain ? <Path d={`M0,${s} L${s * 0.5},${s * 0.25} L${s},${s} Z`} fill="#D8D8D8" /> : null}
            </Svg>
          }
          label={hasTerrain ? 'Hillshade of the terrain' : 'No terrain: plain background'}
          meaning={
            hasTerrain ? 'Lit from the north-west; grid north up.' : 'Upload a terrain on the site page for relief and profiles.'
          }
        />
        <Row
          symbol={
            <Svg width={s} height={s}>
              <Rect x={3} y={5} width={s - 6} height={s - 10} fill="none" stroke={SYMBOL.boundary.halo} strokeWidth={5} />
              <Rect x={3} y={5} width={s - 6} height={s - 10} fill="none" stroke={SYMBOL.boundary.stroke} strokeWidth={2} />
            </Svg>
          }
          label="Site boundary"
        />
        <Row
          symbol={
            <Svg width={s} height={s}>
              <Polygon
                points={`3,5 ${s - 3},5 ${s - 3},${s - 5} 3,${s - 5}`}
                fill={SYMBOL.zone.fill}
                stroke={SYMBOL.zone.stroke}
                strokeWidth={2}
                strokeDasharray="5 3"
              />
            </Svg>
          }
          label="Priority zone (named)"
        />
        <Row
          symbol={
            <Svg width={s} height={s}>
              <Path d={existingPostPath(s / 2, s / 2 + 1, 9)} fill={colors.ink} />
            </Svg>
          }
          label="Existing post (triangle)"
        />
        <Row
          symbol={
            <Svg width={s} height={s}>
              <Path d={proposedPostPath(s / 2, s / 2, 8)} fill="#FFFFFF" stroke={colors.ink} strokeWidth={2.5} />
            </Svg>
          }
          label="Proposed post (open diamond, labelled “proposed”)"
        />
        {showSectors ? (
          <Row
            symbol={
              <Svg width={s} height={s}>
                <Path d={sectorPath(3, s - 3, 20, 70, 0, s - 4)} fill={SYMBOL.sector.fill} stroke={SYMBOL.sector.stroke} />
              </Svg>
            }
            label="Viewing sector"
            meaning="Posts without a wedge watch all round."
          />
        ) : null}
        <Row
          symbol={
            <Svg width={s} height={s}>
              <Circle cx={s / 2} cy={s / 2} r={6} fill="none" stroke={SYMBOL.target} strokeWidth={2} />
              <Line x1={s / 2 - 10} y1={s / 2} x2={s / 2 + 10} y2={s / 2} stroke={SYMBOL.target} strokeWidth={1.5} />
              <Line x1={s / 2} y1={s / 2 - 10} x2={s / 2} y2={s / 2 + 10} stroke={SYMBOL.target} strokeWidth={1.5} />
            </Svg>
          }
          label="Tapped point (P1, P2, …)"
        />
        <Row
          symbol={
            <Svg width={s} height={s}>
              <Line x1={2} y1={s - 4} x2={s - 2} y2={4} stroke={SYMBOL.chosen} strokeWidth={2} strokeDasharray="5 3" />
            </Svg>
          }
          label="Line of the profile, from the chosen post"
        />
        {shore ? (
          <Row
            symbol={
              <Svg width={s} height={s}>
                <Line x1={2} y1={s / 2} x2={s - 2} y2={s / 2} stroke={SHORE_SYMBOL.line} strokeWidth={3} />
                <Line x1={s / 2} y1={s / 2 - 6} x2={s / 2} y2={s / 2 + 6} stroke={SHORE_SYMBOL.line} strokeWidth={2} />
              </Svg>
            }
            label="Shoreline, ticks at round chainages"
            meaning="Chainage: distance along the shore from its start."
          />
        ) : null}
        {shore?.gaps ? (
          <Row
            symbol={
              <Svg width={s} height={s}>
                <Line x1={2} y1={s / 2} x2={s - 2} y2={s / 2} stroke={SHORE_SYMBOL.gap} strokeWidth={6} />
              </Svg>
            }
            label="Gap along the shore (band named; a ring where two strips only just meet)"
            meaning="Nobody watches that band there in this case. Watched is in view, not detected; estimates only."
          />
        ) : null}
      </View>
      {palette ? <ClassLegend palette={palette} /> : null}
    </View>
  );
}
