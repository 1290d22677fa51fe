import { memo, useMemo } from 'react';
import Svg, { Rect } from 'react-native-svg';
import type { ClassRasterOverlayProps } from './class-raster-overlay-props';
import { classRasterBounds, classRuns } from './class-raster-pixels';
import { gridRectToScreen } from './map-camera';

/**
 * Native (no canvas): the drawn classes as one SVG rectangle per run of equal
 * cells along a row, in a view box of one unit per cell (row 0 at the top)
 * stretched over the raster's grid rectangle. The web build uses a canvas
 * image instead (class-raster-overlay.web.tsx).
 */
export const ClassRasterOverlay = memo(function ClassRasterOverlay({
  raster,
  values,
  palette,
  camera,
  size,
}: ClassRasterOverlayProps) {
  const runs = useMemo(() => classRuns(values, raster, palette), [values, raster, palette]);
  const fill = useMemo(() => new Map(palette.classes.map((c) => [c.code, c.color])), [palette]);
  const rect = gridRectToScreen(camera, size, classRasterBounds(raster));
  return (
    <Svg
      width={rect.width}
      height={rect.height}
      viewBox={`0 0 ${raster.width} ${raster.height}`}
      preserveAspectRatio="none"
      style={{ position: 'absolute', left: rect.left, top: rect.top }}
      pointerEvents="none"
      opacity={palette.opacity}
    >
      {runs.map((r) => (
        <Rect
          key={`${r.row}-${r.col}`}
          x={r.col}
          y={r.row}
          width={r.length}
          height={1}
          fill={fill.get(r.code) ?? 'transparent'}
        />
      ))}
    </Svg>
  );
});
