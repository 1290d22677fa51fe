import { useMemo } from 'react';
import Svg, { G, Polygon } from 'react-native-svg';
import type { Landmark } from '@/shared/schemas/landmark';
import { useSiteLandmarks } from '@/components/data/landmarks';
import { colors } from '@/components/ui/theme';
import { gridToScreen, type MapCamera, type MapSize } from './map-camera';
import { HaloText } from './map-features';
import type { SiteMapFrame } from './site-map-frame';

/** A landmark as the map draws it, in grid metres. */
export interface LandmarkPoint {
  readonly id: string;
  readonly name: string;
  readonly x: number;
  readonly y: number;
}

/** The site's landmarks in the map's grid. */
export function useLandmarkPoints(frame: SiteMapFrame | null, siteId: string): LandmarkPoint[] {
  const landmarks = useSiteLandmarks(siteId);
  return useMemo(() => {
    if (!frame || !landmarks.data) return [];
    return landmarks.data.map((m: Landmark) => ({ id: m.id, name: m.name, ...frame.projection.toGrid(m) }));
  }, [frame, landmarks.data]);
}

/** Each landmark as a small upright triangle with its name, over the map's layers. */
export function LandmarkOverlay({
  points,
  camera,
  size,
  margin,
}: {
  points: readonly LandmarkPoint[];
  camera: MapCamera;
  size: MapSize;
  margin: number;
}) {
  if (points.length === 0) return null;
  return (
    <Svg
      width={size.width + 2 * margin}
      height={size.height + 2 * margin}
      style={{ position: 'absolute', left: -margin, top: -margin }}
      pointerEvents="none"
      aria-hidden
      testID="landmark-overlay"
    >
      {points.map((m) => {
        const s = gridToScreen(camera, size, m.x, m.y);
        const x = s.x + margin;
        const y = s.y + margin;
        return (
          <G key={m.id}>
            <Polygon
              points={`${x},${y - 8} ${x - 7},${y + 5} ${x + 7},${y + 5}`}
              fill={colors.surface}
              stroke={colors.ink}
              strokeWidth={2}
            />
            <HaloText x={x + 10} y={y + 4} text={m.name} color={colors.ink} />
          </G>
        );
      })}
    </Svg>
  );
}
