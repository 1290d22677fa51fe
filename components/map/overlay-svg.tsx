import type { ReactNode } from 'react';
import Svg from 'react-native-svg';
import { gridToScreen, type MapCamera, type MapSize } from './map-camera';

/**
 * The SVG a map overlay draws in: the view plus `margin` on every side,
 * placed so that its pixels line up with the features' SVG; it takes no
 * touches and is hidden from screen readers.
 */
export function OverlaySvg({
  size,
  margin,
  testID,
  children,
}: {
  size: MapSize;
  margin: number;
  testID?: string;
  children: ReactNode;
}) {
  return (
    <Svg
      width={size.width + 2 * margin}
      height={size.height + 2 * margin}
      style={{ position: 'absolute', left: -margin, top: -margin }}
      pointerEvents="none"
      aria-hidden
      testID={testID}
    >
      {children}
    </Svg>
  );
}

/** Where a grid point (metres) falls in an overlay's pixels, for the committed camera. */
export function overlayPoint(camera: MapCamera, size: MapSize, margin: number) {
  return (p: { x: number; y: number }) => {
    const s = gridToScreen(camera, size, p.x, p.y);
    return { x: s.x + margin, y: s.y + margin };
  };
}
