import { useMemo, useRef, useState } from 'react';
import { View } from 'react-native';
import Svg, { Circle, Line, Polyline, Text as SvgText } from 'react-native-svg';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import type { LatLon } from '@/shared/geo/types';
import { useCoordinateFormat } from '@/components/map/coordinate-format';
import { gridLines } from '@/components/map/grid-lines';
import { gridToScreen } from '@/components/map/map-camera';
import { MapViewport, type MapHandles } from '@/components/map/map-viewport';
import { createReadoutStore } from '@/components/map/readout-store';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { colors, radius, space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { drawingFrame, type RingDrawContext } from './ring-draw-map';

type GridPoint = { x: number; y: number };

/** The route's line on the map: a deep teal, apart from the outlines' ember. */
const ROUTE_COLOUR = '#1F6F78';

/**
 * Drawing a patrol route on the site's map: tap (or click) to add the next
 * waypoint, drag a waypoint to move it, undo, and "Back to the start" to end
 * the route where it began (a loop, or out and back). The frame is the
 * site's map (terrain, outlines, posts), or a plain grid around the post.
 */
export function RouteDrawMap({
  route,
  context,
  near,
  onDone,
  onCancel,
}: {
  route: LatLon[] | null;
  context: RingDrawContext;
  /** Where to open the map when the site has nothing on it (the post's location). */
  near: LatLon | null;
  onDone: (route: LatLon[]) => void;
  onCancel: () => void;
}) {
  const frame = useMemo(
    () =>
      drawingFrame(context, route && route.length > 0 ? route.map((p) => [p.lonDeg, p.latDeg] as [number, number]) : null, near),
    [], // eslint-disable-line react-hooks/exhaustive-deps -- fixed for the whole drawing, so the grid does not move under the waypoints
  );
  const { wide } = useLayout();
  const [readout] = useState(createReadoutStore);
  const [format, setFormat] = useCoordinateFormat();
  const [points, setPoints] = useState<GridPoint[]>(() => (frame && route ? route.map((p) => frame.projection.toGrid(p)) : []));
  const [history, setHistory] = useState<GridPoint[][]>([]);
  const dragStart = useRef<GridPoint[] | null>(null);

  if (!frame) {
    return (
      <View style={{ gap: space.sm }}>
        <AppText tone="muted">Give the post a location first (or type the waypoints): the map opens around it.</AppText>
        <Button kind="quiet" label="Close" onPress={onCancel} style={{ alignSelf: 'flex-start' }} />
      </View>
    );
  }
  const change = (next: GridPoint[]) => {
    setHistory((h) => [...h, points]);
    setPoints(next);
  };
  const handles: MapHandles = {
    points,
    onDrag: (index, point) => {
      dragStart.current ??= points;
      setPoints((ps) => ps.map((p, i) => (i === index ? point : p)));
    },
    onDragEnd: () => {
      const before = dragStart.current;
      dragStart.current = null;
      if (before) setHistory((h) => [...h, before]);
    },
  };
  const n = points.length;
  const closed = n > 2 && points[0]!.x === points[n - 1]!.x && points[0]!.y === points[n - 1]!.y;
  const use = () =>
    onDone(
      points.map((p) => {
        const q = frame.projection.toLatLon(p.x, p.y);
        return { latDeg: Number(q.latDeg.toFixed(7)), lonDeg: Number(q.lonDeg.toFixed(7)) };
      }),
    );
  const status =
    n === 0
      ? 'Tap the map where the patrol starts. Drag the map to move it; pinch, scroll or use +/− to zoom.'
      : n === 1
        ? 'Tap the next waypoint.'
        : `${n} waypoints, ${n - 1} leg${n === 2 ? '' : 's'}${closed ? ', back at the start' : ''}. Tap to add more, drag one to move it.`;
  const last = points[n - 1];

  return (
    <View style={{ gap: space.sm }}>
      <View
        style={{
          height: wide ? 520 : 400,
          borderRadius: radius.md,
          overflow: 'hidden',
          borderWidth: 1,
          borderColor: colors.line,
        }}
      >
        <MapViewport
          frame={frame}
          units="metric"
          chosenPostId={null}
          targets={[]}
          shown={null}
          focus={null}
          readout={readout}
          format={format}
          onFormat={setFormat}
          onTap={(point) => change([...points, point])}
          handles={handles}
          label="Route map: tap to add a waypoint, drag a waypoint to move it"
          overlay={({ camera, size, margin }) => {
            const at = (p: GridPoint) => {
              const s = gridToScreen(camera, size, p.x, p.y);
              return { x: s.x + margin, y: s.y + margin };
            };
            const pts = points.map(at);
            const grid = frame.base ? null : gridLines(camera, size, margin);
            const W = size.width + 2 * margin;
            const H = size.height + 2 * margin;
            return (
              <Svg
                width={W}
                height={H}
                style={{ position: 'absolute', left: -margin, top: -margin }}
                pointerEvents="none"
                aria-hidden
              >
                {grid?.eastings.map((e) => {
                  const x = at({ x: e, y: 0 }).x;
                  return <Line key={`e${e}`} x1={x} y1={0} x2={x} y2={H} stroke="#C9D1CD" strokeWidth={1} />;
                })}
                {grid?.northings.map((n2) => {
                  const y = at({ x: 0, y: n2 }).y;
                  return <Line key={`n${n2}`} x1={0} y1={y} x2={W} y2={y} stroke="#C9D1CD" strokeWidth={1} />;
                })}
                {n > 1 ? (
                  <Polyline
                    points={pts.map((p) => `${p.x.toFixed(1)},${p.y.toFixed(1)}`).join(' ')}
                    fill="none"
                    stroke={ROUTE_COLOUR}
                    strokeWidth={3}
                    strokeDasharray="10 6"
                  />
                ) : null}
                {pts.map((p, i) => (
                  <Circle
                    key={i}
                    cx={p.x}
                    cy={p.y}
                    r={8}
                    fill={i === 0 ? ROUTE_COLOUR : colors.surface}
                    stroke={ROUTE_COLOUR}
                    strokeWidth={3}
                  />
                ))}
                {pts.map((p, i) =>
                  closed && i === n - 1 ? null : (
                    <SvgText key={`t${i}`} x={p.x + 11} y={p.y - 9} fontSize={13} fontWeight="700" fill={ROUTE_COLOUR}>
                      {String(i + 1)}
                    </SvgText>
                  ),
                )}
              </Svg>
            );
          }}
        />
      </View>
      <AppText aria-live="polite">{status}</AppText>
      {last ? (
        <AppText variant="small" tone="muted">
          Last waypoint: {formatCoordinate(frame.projection.toLatLon(last.x, last.y), format)} (WGS 84)
        </AppText>
      ) : null}
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button
          kind="secondary"
          label="Undo"
          onPress={() => {
            const prev = history[history.length - 1];
            if (!prev) return;
            setHistory((h) => h.slice(0, -1));
            setPoints(prev);
          }}
          disabled={history.length === 0}
        />
        <Button
          kind="secondary"
          label="Back to the start"
          onPress={() => change([...points, points[0]!])}
          disabled={n < 2 || closed}
        />
        <Button kind="quiet" label="Start over" onPress={() => change([])} disabled={n === 0} />
      </View>
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button label="Use this route" onPress={use} disabled={n < 2} />
        <Button kind="quiet" label="Cancel" onPress={onCancel} />
      </View>
    </View>
  );
}
