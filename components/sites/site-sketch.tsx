import { useState } from 'react';
import { View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Path, Polygon, Text as SvgText } from 'react-native-svg';
import type { Post, Site } from '@/shared/schemas/site';
import { useLengthUnits } from '@/components/data/session';
import { scaleBar } from '@/components/map/scale-bar';
import { AppText } from '@/components/ui/app-text';
import { colors, fonts, space } from '@/components/ui/theme';

/**
 * A map-like sketch of the site: boundary, priority zones and posts, in a local
 * equirectangular projection (east scaled by cos latitude), north up. Viewing
 * sectors are drawn as wedges. Until terrain lands there is no base map.
 */
export function SiteSketch({ site, posts }: { site: Site; posts: Post[] }) {
  const [width, setWidth] = useState(0);
  const { system } = useLengthUnits(site.defaultUnits);
  const onLayout = (e: LayoutChangeEvent) => setWidth(e.nativeEvent.layout.width);
  const pts: [number, number][] = [
    ...(site.boundary ?? []),
    ...site.priorityZones.flatMap((z) => z.ring),
    ...posts.map((p) => [p.location.lonDeg, p.location.latDeg] as [number, number]),
  ];
  const height = Math.min(Math.max(width * 0.7, 220), 420);
  if (pts.length === 0) {
    return (
      <AppText tone="muted" onLayout={onLayout}>
        No boundary or posts yet.
      </AppText>
    );
  }
  const lat0 = pts.reduce((s, p) => s + p[1], 0) / pts.length;
  const kx = Math.cos((lat0 * Math.PI) / 180);
  const xs = pts.map((p) => p[0] * kx);
  const ys = pts.map((p) => p[1]);
  const [minX, maxX, minY, maxY] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
  const span = Math.max(maxX - minX, maxY - minY, 1e-4);
  const pad = 28;
  const scale = Math.min((width - 2 * pad) / span, (height - 2 * pad) / span);
  const sx = (lon: number) => pad + (lon * kx - minX) * scale + (width - 2 * pad - (maxX - minX) * scale) / 2;
  const sy = (lat: number) => height - pad - (lat - minY) * scale - (height - 2 * pad - (maxY - minY) * scale) / 2;
  const poly = (ring: [number, number][]) => ring.map(([lon, lat]) => `${sx(lon).toFixed(1)},${sy(lat).toFixed(1)}`).join(' ');
  // Kilometres per degree of latitude: 2πR/360 with R = 6 371 km (common practice, no source).
  const kmPerPx = 111.195 / scale;
  const barKm = [1, 2, 5, 10, 20, 50].find((k) => k / kmPerPx > 60) ?? 50;
  // Metric keeps the sketch's own kilometre bar; feet, miles and nautical miles come from the map's scale bar.
  // Before the first layout (width 0) nothing is drawn, and there is no scale to show.
  const bar =
    scale <= 0
      ? null
      : system === 'metric'
        ? { px: barKm / kmPerPx, label: `${barKm} km` }
        : scaleBar(kmPerPx * 1000, Math.max(width / 3, 60), system);

  const wedge = (p: Post) => {
    if (!p.sector) return null;
    const cx = sx(p.location.lonDeg);
    const cy = sy(p.location.latDeg);
    const r = 36;
    const at = (deg: number) => [cx + r * Math.sin((deg * Math.PI) / 180), cy - r * Math.cos((deg * Math.PI) / 180)] as const;
    const sweep = (p.sector.toDeg - p.sector.fromDeg + 360) % 360;
    const [x1, y1] = at(p.sector.fromDeg);
    const [x2, y2] = at(p.sector.toDeg);
    return `M${cx},${cy} L${x1},${y1} A${r},${r} 0 ${sweep > 180 ? 1 : 0} 1 ${x2},${y2} Z`;
  };

  return (
    <View onLayout={onLayout} style={{ gap: space.xs }}>
      {bar ? (
        <Svg width={width} height={height} role="img" aria-label={`Sketch of ${site.name}`}>
          <Path d={`M0,0 H${width} V${height} H0 Z`} fill="#EEF2F3" />
          {site.boundary ? <Polygon points={poly(site.boundary)} fill="#E1ECE4" stroke={colors.moss} strokeWidth={2} /> : null}
          {site.priorityZones.map((z) => (
            <G key={z.name}>
              <Polygon points={poly(z.ring)} fill="#F6E3D8" stroke={colors.ember} strokeWidth={1.5} strokeDasharray="6 3" />
            </G>
          ))}
          {posts.map((p) => {
            const w = wedge(p);
            return w ? <Path key={`${p.id}-w`} d={w} fill={colors.lantern} opacity={0.35} /> : null;
          })}
          {posts.map((p) => (
            <G key={p.id}>
              <Circle
                cx={sx(p.location.lonDeg)}
                cy={sy(p.location.latDeg)}
                r={6}
                fill={p.status === 'proposed' ? colors.surface : colors.ink}
                stroke={colors.ink}
                strokeWidth={2}
              />
              <SvgText
                x={sx(p.location.lonDeg) + 9}
                y={sy(p.location.latDeg) + 4}
                fontSize={12}
                fontFamily={fonts.medium}
                fill={colors.ink}
              >
                {p.name}
              </SvgText>
            </G>
          ))}
          <Path d={`M${width - 22},34 L${width - 16},18 L${width - 10},34 L${width - 16},30 Z`} fill={colors.ink} />
          <SvgText x={width - 16} y={46} fontSize={11} fontFamily={fonts.semibold} fill={colors.ink} textAnchor="middle">
            N
          </SvgText>
          <Path d={`M${pad},${height - 12} h${bar.px}`} stroke={colors.ink} strokeWidth={3} />
          <SvgText x={pad} y={height - 18} fontSize={11} fontFamily={fonts.regular} fill={colors.ink}>
            {bar.label}
          </SvgText>
        </Svg>
      ) : (
        <View style={{ height: 220 }} />
      )}
      <AppText variant="small" tone="muted">
        Sketch, north up. Filled dots: existing posts; open dots: proposed. Dashed: priority zones. Wedges: viewing sectors.
      </AppText>
    </View>
  );
}
