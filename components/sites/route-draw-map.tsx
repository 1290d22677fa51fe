import { useMemo } from 'react';
import { View } from 'react-native';
import { Polyline, Text as SvgText } from 'react-native-svg';
import type { LatLon } from '@/shared/geo/types';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { space } from '@/components/ui/theme';
import { DrawingMap, DrawnPoints, useDrawing, type GridPoint } from './drawing-map';
import { drawingFrame, type RingDrawContext } from './ring-draw-map';

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
  const {
    drawing: points,
    change,
    undo,
    canUndo,
    handles,
  } = useDrawing<GridPoint[]>(
    () => (frame && route ? route.map((p) => frame.projection.toGrid(p)) : []),
    (ps) => ps,
    (ps, index, point) => ps.map((p, i) => (i === index ? point : p)),
  );

  if (!frame) {
    return (
      <View style={{ gap: space.sm }}>
        <AppText tone="muted">Give the post a location first (or type the waypoints): the map opens around it.</AppText>
        <Button kind="quiet" label="Close" onPress={onCancel} style={{ alignSelf: 'flex-start' }} />
      </View>
    );
  }
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

  return (
    <View style={{ gap: space.sm }}>
      <DrawingMap
        frame={frame}
        phoneHeight={400}
        onTap={(point) => change([...points, point])}
        handles={handles}
        label="Route map: tap to add a waypoint, drag a waypoint to move it"
        status={status}
        last={{ point: points[n - 1], noun: 'waypoint' }}
      >
        {(at) => {
          const pts = points.map(at);
          return (
            <>
              {n > 1 ? (
                <Polyline
                  points={pts.map((p) => `${p.x.toFixed(1)},${p.y.toFixed(1)}`).join(' ')}
                  fill="none"
                  stroke={ROUTE_COLOUR}
                  strokeWidth={3}
                  strokeDasharray="10 6"
                />
              ) : null}
              <DrawnPoints points={pts} colour={ROUTE_COLOUR} />
              {pts.map((p, i) =>
                closed && i === n - 1 ? null : (
                  <SvgText key={`t${i}`} x={p.x + 11} y={p.y - 9} fontSize={13} fontWeight="700" fill={ROUTE_COLOUR}>
                    {String(i + 1)}
                  </SvgText>
                ),
              )}
            </>
          );
        }}
      </DrawingMap>
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button kind="secondary" label="Undo" onPress={undo} disabled={!canUndo} />
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
