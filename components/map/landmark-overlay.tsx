import { useMemo } from 'react';
import { G, Polygon } from 'react-native-svg';
import type { Landmark } from '@/shared/schemas/landmark';
import { useSiteLandmarks } from '@/components/data/landmarks';
import { colors } from '@/components/ui/theme';
import type { MapCamera, MapSize } from './map-camera';
import { HaloText } from './map-features';
import { OverlaySvg, overlayPoint } from './overlay-svg';
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
  const at = overlayPoint(camera, size, margin);
  return (
    <OverlaySvg size={size} margin={margin} testID="landmark-overlay">
      {points.map((m) => {
        const { x, y } = at(m);
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
    </OverlaySvg>
  );
}
