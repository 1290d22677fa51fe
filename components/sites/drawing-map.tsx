import { useRef, useState, type ReactNode } from 'react';
import { Circle, Line } from 'react-native-svg';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { useCoordinateFormat } from '@/components/map/coordinate-format';
import { gridLines } from '@/components/map/grid-lines';
import type { MapHandles, MapViewportProps } from '@/components/map/map-viewport';
import { OverlaySvg, overlayPoint } from '@/components/map/overlay-svg';
import { PickingMap } from '@/components/map/picking-map';
import type { SiteMapFrame } from '@/components/map/site-map-frame';
import { AppText } from '@/components/ui/app-text';
import { colors } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';

export type GridPoint = { x: number; y: number };

/**
 * A drawing made by taps and drags, with undo: each change (and each finished
 * drag) keeps the drawing before it. `pointsOf` names the points a drag can
 * move and `moved` puts a dragged point back into the drawing.
 */
export function useDrawing<T>(
  initial: () => T,
  pointsOf: (drawing: T) => readonly GridPoint[],
  moved: (drawing: T, index: number, point: GridPoint) => T,
) {
  const [drawing, setDrawing] = useState<T>(initial);
  const [history, setHistory] = useState<T[]>([]);
  const dragStart = useRef<T | null>(null);
  const change = (next: T) => {
    setHistory((h) => [...h, drawing]);
    setDrawing(next);
  };
  const undo = () => {
    const last = history[history.length - 1];
    if (!last) return;
    setHistory((h) => h.slice(0, -1));
    setDrawing(last);
  };
  const handles: MapHandles = {
    points: pointsOf(drawing),
    onDrag: (index, point) => {
      dragStart.current ??= drawing;
      setDrawing((d) => moved(d, index, point));
    },
    onDragEnd: () => {
      const before = dragStart.current;
      dragStart.current = null;
      if (before) setHistory((h) => [...h, before]);
    },
  };
  return { drawing, change, undo, canUndo: history.length > 0, handles };
}

/**
 * The map a drawing is made on (an outline, a shoreline, a patrol route): the
 * frame's map, or a plain grid of round eastings and northings where there is
 * no terrain, with the drawing over it; then what the drawing is now
 * (announced) and where its last point lies.
 */
export function DrawingMap({
  frame,
  phoneHeight,
  label,
  onTap,
  handles,
  status,
  last,
  children,
}: {
  frame: SiteMapFrame;
  /** The map's height on a phone, pixels (520 on a wide screen). */
  phoneHeight: number;
  /** What the map's label says it does (for screen readers). */
  label: string;
  onTap: MapViewportProps['onTap'];
  handles: MapHandles;
  status: string;
  /** The last point and what it is called ("corner", "waypoint"). */
  last: { point: GridPoint | undefined; noun: string };
  /** The drawing, in the overlay's pixels: `at` places a grid point. */
  children: (at: (p: GridPoint) => GridPoint) => ReactNode;
}) {
  const { wide } = useLayout();
  const [format] = useCoordinateFormat();
  return (
    <>
      <PickingMap
        frame={frame}
        height={wide ? 520 : phoneHeight}
        units="metric"
        onTap={onTap}
        handles={handles}
        label={label}
        overlay={({ camera, size, margin }) => {
          const at = overlayPoint(camera, size, margin);
          // Without terrain the ground is a plain grid of round eastings and northings.
          const grid = frame.base ? null : gridLines(camera, size, margin);
          const W = size.width + 2 * margin;
          const H = size.height + 2 * margin;
          return (
            <OverlaySvg size={size} margin={margin}>
              {grid?.eastings.map((e) => {
                const x = at({ x: e, y: 0 }).x;
                return <Line key={`e${e}`} x1={x} y1={0} x2={x} y2={H} stroke="#C9D1CD" strokeWidth={1} />;
              })}
              {grid?.northings.map((n2) => {
                const y = at({ x: 0, y: n2 }).y;
                return <Line key={`n${n2}`} x1={0} y1={y} x2={W} y2={y} stroke="#C9D1CD" strokeWidth={1} />;
              })}
              {children(at)}
            </OverlaySvg>
          );
        }}
      />
      <AppText aria-live="polite">{status}</AppText>
      {last.point ? (
        <AppText variant="small" tone="muted">
          Last {last.noun}: {formatCoordinate(frame.projection.toLatLon(last.point.x, last.point.y), format)} (WGS 84)
        </AppText>
      ) : null}
    </>
  );
}

/**
 * A drawing's points in the overlay's pixels, as rings in `colour` with the
 * first one filled (where the drawing starts); `firstBig` draws the first one
 * larger (a tap there closes the outline).
 */
export function DrawnPoints({
  points,
  colour,
  firstBig = false,
}: {
  points: readonly GridPoint[];
  colour: string;
  firstBig?: boolean;
}) {
  return (
    <>
      {points.map((p, i) => (
        <Circle
          key={i}
          cx={p.x}
          cy={p.y}
          r={i === 0 && firstBig ? 11 : 8}
          fill={i === 0 ? colour : colors.surface}
          stroke={colour}
          strokeWidth={3}
        />
      ))}
    </>
  );
}
