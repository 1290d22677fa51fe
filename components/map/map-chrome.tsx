import { Pressable, StyleSheet, View } from 'react-native';
import Svg, { Line, Path, Text as SvgText } from 'react-native-svg';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import type { CoordinateFormat, LatLon } from '@/shared/geo/types';
import { AppText } from '@/components/ui/app-text';
import { colors, fonts, radius, space, TOUCH } from '@/components/ui/theme';
import { COORDINATE_FORMATS, DATUM_LABEL } from './coordinate-format';
import { useReadout, type ReadoutStore } from './readout-store';
import { scaleBar, type ScaleUnits } from './scale-bar';

/** Degrees of grid convergence below which the arrow's offset is not worth a word. */
const CONVERGENCE_NOTE_DEG = 0.05;

/**
 * North arrow pointing to true north on the grid-north-up map: turned γ
 * anticlockwise (γ = grid convergence, true → grid north clockwise).
 */
export function NorthArrow({ convergence }: { convergence: number }) {
  const deg = (convergence * 180) / Math.PI;
  const note =
    Math.abs(deg) >= CONVERGENCE_NOTE_DEG
      ? `True north, ${Math.abs(deg).toFixed(1)}° ${deg > 0 ? 'west' : 'east'} of the map’s grid north`
      : 'True north (the map’s grid north)';
  return (
    <View style={styles.arrow} role="img" aria-label={note}>
      <Svg width={36} height={46}>
        <Path
          d="M18,4 L26,30 L18,25 L10,30 Z"
          fill={colors.ink}
          stroke="#FFFFFF"
          strokeWidth={1.5}
          transform={`rotate(${(-deg).toFixed(3)} 18 20)`}
        />
        <SvgText x={18} y={43} fontSize={12} fontFamily={fonts.bold} fill={colors.ink} textAnchor="middle">
          N
        </SvgText>
      </Svg>
    </View>
  );
}

/** A round-length scale bar for the committed zoom. */
export function ScaleBarView({ metresPerPx, units }: { metresPerPx: number; units: ScaleUnits }) {
  const bar = scaleBar(metresPerPx, 120, units);
  return (
    <View style={styles.scale} role="img" aria-label={`Scale bar: ${bar.label}`}>
      <AppText variant="small" style={{ fontSize: 12, lineHeight: 14 }}>
        {bar.label}
      </AppText>
      <Svg width={bar.px + 4} height={10}>
        <Line x1={2} y1={8} x2={bar.px + 2} y2={8} stroke={colors.ink} strokeWidth={3} />
        <Line x1={2} y1={1} x2={2} y2={9} stroke={colors.ink} strokeWidth={2} />
        <Line x1={bar.px + 2} y1={1} x2={bar.px + 2} y2={9} stroke={colors.ink} strokeWidth={2} />
      </Svg>
    </View>
  );
}

/** Zoom in, zoom out and back to the whole site, as buttons (keyboard and one-handed use). */
export function ZoomButtons({ onZoom, onFit }: { onZoom: (factor: number) => void; onFit: () => void }) {
  return (
    <View style={styles.zoom}>
      <MapButton label="+" name="Zoom in" onPress={() => onZoom(2)} />
      <MapButton label="−" name="Zoom out" onPress={() => onZoom(0.5)} />
      <MapButton label="⤢" name="Show the whole site" onPress={onFit} />
    </View>
  );
}

function MapButton({ label, name, onPress }: { label: string; name: string; onPress: () => void }) {
  return (
    <Pressable
      role="button"
      aria-label={name}
      onPress={onPress}
      style={({ pressed }) => [styles.button, pressed && { backgroundColor: colors.paper }]}
    >
      <AppText variant="heading" style={{ fontSize: 22, lineHeight: 26 }}>
        {label}
      </AppText>
    </Pressable>
  );
}

/** Writes a position in the chosen format; UTM outside its area falls back to DD. */
export function formatPosition(point: LatLon, format: CoordinateFormat): string {
  try {
    return formatCoordinate(point, format);
  } catch {
    return formatCoordinate(point, 'dd');
  }
}

/** The coordinate read-out (pointer on the web, the last tap on touch) with the format switch. */
export function ReadoutBar({
  store,
  format,
  onFormat,
}: {
  store: ReadoutStore;
  format: CoordinateFormat;
  onFormat: (format: CoordinateFormat) => void;
}) {
  const readout = useReadout(store);
  return (
    <View style={styles.readout}>
      <View style={{ flexShrink: 1, minWidth: 0 }} aria-live="polite" aria-label="Coordinate read-out">
        <View style={{ flexDirection: 'row', gap: space.xs }}>
          <AppText variant="small" tone="muted" style={{ fontSize: 12, lineHeight: 15 }}>
            {readout ? (readout.kind === 'tap' ? 'Tapped point' : 'Pointer') : 'Tap or point at the map'}
          </AppText>
          <AppText variant="small" tone="muted" style={{ fontSize: 12, lineHeight: 15 }} aria-label={`Datum ${DATUM_LABEL}`}>
            · {DATUM_LABEL}
          </AppText>
        </View>
        <AppText variant="label" style={{ fontVariant: ['tabular-nums'] }} numberOfLines={1}>
          {readout ? formatPosition(readout.point, format) : '—'}
        </AppText>
        {readout?.layerClass ? (
          <AppText variant="small" numberOfLines={1}>
            {readout.layerClass}
          </AppText>
        ) : null}
      </View>
      <View style={styles.formats} role="radiogroup" aria-label="Coordinate format">
        {COORDINATE_FORMATS.map((f) => {
          const on = f.id === format;
          return (
            <Pressable
              key={f.id}
              role="radio"
              aria-checked={on}
              aria-label={f.name}
              onPress={() => onFormat(f.id)}
              style={[styles.format, on && { backgroundColor: colors.ink }]}
            >
              <AppText variant="label" style={{ fontSize: 12, color: on ? colors.surface : colors.ink }}>
                {f.label}
              </AppText>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const panel = {
  backgroundColor: 'rgba(255, 255, 255, 0.93)',
  borderRadius: radius.md,
  borderWidth: 1,
  borderColor: colors.line,
} as const;

const styles = StyleSheet.create({
  arrow: { ...panel, position: 'absolute', top: space.sm, right: space.sm, padding: 2 },
  scale: { ...panel, paddingHorizontal: space.sm, paddingVertical: 4, alignSelf: 'flex-start' },
  zoom: { position: 'absolute', right: space.sm, top: 72, gap: space.xs },
  button: {
    ...panel,
    width: TOUCH,
    height: TOUCH,
    alignItems: 'center',
    justifyContent: 'center',
  },
  readout: {
    ...panel,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    paddingHorizontal: space.sm,
    paddingVertical: 6,
    flexWrap: 'wrap',
    justifyContent: 'space-between',
  },
  formats: { flexDirection: 'row', borderRadius: radius.sm, borderWidth: 1, borderColor: colors.lineStrong, overflow: 'hidden' },
  format: { minWidth: 40, minHeight: 32, paddingHorizontal: 6, alignItems: 'center', justifyContent: 'center' },
});
