// Over 300 lines: drawing a ring by taps: vertices, drag, undo and closing share one gesture state.
import { useMemo, useState } from 'react';
import { View } from 'react-native';
import { Polygon, Polyline } from 'react-native-svg';
import { CoordinateError } from '@/shared/geo/coordinate-error';
import { parseCoordinate } from '@/shared/geo/parse-coordinate';
import type { LatLon } from '@/shared/geo/types';
import { RingSchema, ShorelineSchema, type Post, type PriorityZone, type Site } from '@/shared/schemas/site';
import type { SiteTerrain } from '@/shared/schemas/terrain';
import { HANDLE_REACH_PX } from '@/components/map/map-viewport';
import { siteMapFrame, type SiteMapFrame } from '@/components/map/site-map-frame';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { colors, space } from '@/components/ui/theme';
import { DrawingMap, DrawnPoints, useDrawing, type GridPoint } from './drawing-map';
import type { Ring } from './ring-text-entry';

interface Drawing {
  readonly points: readonly GridPoint[];
  readonly closed: boolean;
}

/** What the drawing map shows besides the outline being drawn. */
export interface RingDrawContext {
  /** The saved site (for its terrain and posts), or null for a new one. */
  readonly site: Site | null;
  readonly posts: readonly Post[];
  readonly terrain: SiteTerrain | null;
  /** The other outlines of the form, drawn for reference. */
  readonly boundary: Ring | null;
  readonly zones: readonly Pick<PriorityZone, 'name' | 'ring'>[];
}

/** Half the side of the first view around a typed start point, metres. */
const START_HALF_SIDE_M = 4000;

const PLACEHOLDER_SITE: Site = {
  id: '00000000-0000-4000-8000-000000000000',
  name: 'New site',
  kind: 'forest-district',
  notes: '',
  boundary: null,
  priorityZones: [],
  defaultUnits: 'metric',
  timeZone: 'UTC',
  seaLevelMaxM: null,
  seaArea: null,
  targetGroundM: null,
  shoreline: null,
  bands: [],
  heightDatum: 'mean-sea-level',
  tide: null,
  version: 0,
  updatedAt: new Date(0).toISOString(),
};

const closedOf = (ring: Ring) => {
  const first = ring[0]!;
  const last = ring[ring.length - 1]!;
  return ring.length > 1 && first[0] === last[0] && first[1] === last[1] ? ring.slice(0, -1) : ring;
};

/**
 * The map frame to draw in, fixed for the whole drawing: the site's terrain (if
 * any) with the other outlines, else a plain grid around the typed start point.
 * The outline being drawn is in view at first. Null until there is somewhere to
 * start.
 */
export function drawingFrame(context: RingDrawContext, ring: Ring | null, start: LatLon | null): SiteMapFrame | null {
  const reference: Site = {
    ...(context.site ?? PLACEHOLDER_SITE),
    boundary: context.boundary,
    priorityZones: context.zones.map((z) => ({ name: z.name, weight: 1, ring: z.ring })),
  };
  const posts = [...context.posts];
  let frame = siteMapFrame(reference, posts, context.terrain);
  if (!frame && start) {
    // A square around the start point only places the view; it is not drawn.
    const dLat = START_HALF_SIDE_M / 111_195;
    const dLon = dLat / Math.max(Math.cos((start.latDeg * Math.PI) / 180), 0.05);
    const square: Ring = [
      [start.lonDeg - dLon, start.latDeg - dLat],
      [start.lonDeg + dLon, start.latDeg - dLat],
      [start.lonDeg + dLon, start.latDeg + dLat],
      [start.lonDeg - dLon, start.latDeg + dLat],
      [start.lonDeg - dLon, start.latDeg - dLat],
    ];
    const placed = siteMapFrame({ ...reference, boundary: square }, posts, context.terrain);
    frame = placed && { ...placed, boundary: null };
  }
  if (frame && ring && ring.length > 0) {
    const pts = ring.map(([lonDeg, latDeg]) => frame!.projection.toGrid({ latDeg, lonDeg }));
    const i = frame.initial;
    const pad = 250;
    frame = {
      ...frame,
      initial: {
        west: Math.min(i.west, ...pts.map((p) => p.x - pad)),
        east: Math.max(i.east, ...pts.map((p) => p.x + pad)),
        south: Math.min(i.south, ...pts.map((p) => p.y - pad)),
        north: Math.max(i.north, ...pts.map((p) => p.y + pad)),
      },
    };
  }
  return frame;
}

/**
 * Drawing an outline on the site's map: tap (or click) to add a corner, drag a
 * corner to move it, undo, and close the ring by tapping its first corner or
 * with the button. Works with a finger: corners are grabbed within a
 * fingertip's reach, and a drag that does not start on a corner pans the map.
 */
export function RingDrawMap({
  label,
  ring,
  context,
  onDone,
  onCancel,
  line = false,
}: {
  label: string;
  ring: Ring | null;
  context: RingDrawContext;
  onDone: (ring: Ring) => void;
  onCancel: () => void;
  /** An open line (a shoreline) instead of a closed ring: at least two corners, never closed. */
  line?: boolean;
}) {
  const [startText, setStartText] = useState('');
  const [startError, setStartError] = useState('');
  const [start, setStart] = useState<LatLon | null>(null);
  // The frame is fixed once drawing can begin, so the grid does not move under the corners.
  const frame = useMemo(() => drawingFrame(context, ring, start), [start]); // eslint-disable-line react-hooks/exhaustive-deps

  if (!frame) {
    const show = () => {
      try {
        const p = parseCoordinate(startText);
        setStart({ latDeg: p.latDeg, lonDeg: p.lonDeg });
        setStartError('');
      } catch (e) {
        setStartError(e instanceof CoordinateError ? e.message : 'Not a coordinate.');
      }
    };
    return (
      <View style={{ gap: space.sm }}>
        <AppText tone="muted">
          This site has nothing on a map yet. Give a point inside it and the map opens there on a plain grid (upload terrain later
          to see the ground).
        </AppText>
        <TextField
          label="A point inside the site"
          value={startText}
          onChangeText={setStartText}
          onSubmitEditing={show}
          autoCapitalize="characters"
          error={startError || undefined}
          hint="WGS 84, latitude first: decimal degrees (61.05, 14.1), degrees-minutes, DMS, UTM or MGRS."
        />
        <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
          <Button kind="secondary" label="Show the map there" onPress={show} />
          <Button kind="quiet" label="Cancel" onPress={onCancel} />
        </View>
      </View>
    );
  }
  return <Drawer label={label} frame={frame} ring={ring} onDone={onDone} onCancel={onCancel} line={line} />;
}

function Drawer({
  label,
  frame,
  ring,
  onDone,
  onCancel,
  line,
}: {
  label: string;
  frame: SiteMapFrame;
  ring: Ring | null;
  onDone: (ring: Ring) => void;
  onCancel: () => void;
  line: boolean;
}) {
  const {
    drawing,
    change: changeDrawing,
    undo: undoDrawing,
    canUndo,
    handles,
  } = useDrawing<Drawing>(
    () =>
      line && ring && ring.length >= 2
        ? { points: ring.map(([lonDeg, latDeg]) => frame.projection.toGrid({ latDeg, lonDeg })), closed: false }
        : ring && ring.length >= 3
          ? { points: closedOf(ring).map(([lonDeg, latDeg]) => frame.projection.toGrid({ latDeg, lonDeg })), closed: true }
          : { points: [], closed: false },
    (d) => d.points,
    (d, index, point) => ({ ...d, points: d.points.map((p, i) => (i === index ? point : p)) }),
  );
  const [problem, setProblem] = useState('');

  const change = (next: Drawing) => {
    changeDrawing(next);
    setProblem('');
  };
  const n = drawing.points.length;

  const onTap = (point: GridPoint, at: { metresPerPx: number }) => {
    if (drawing.closed) return;
    const first = drawing.points[0];
    if (!line && first && n >= 3 && Math.hypot(first.x - point.x, first.y - point.y) <= HANDLE_REACH_PX * at.metresPerPx) {
      change({ ...drawing, closed: true });
      return;
    }
    change({ points: [...drawing.points, point], closed: false });
  };

  const undo = () => {
    undoDrawing();
    setProblem('');
  };

  const use = () => {
    const lonLat: Ring = drawing.points.map((p) => {
      const q = frame.projection.toLatLon(p.x, p.y);
      return [Number(q.lonDeg.toFixed(7)), Number(q.latDeg.toFixed(7))];
    });
    const checked = (line ? ShorelineSchema : RingSchema).safeParse(lonLat);
    if (!checked.success) {
      setProblem(checked.error.issues[0]?.message ?? 'This outline cannot be used.');
      return;
    }
    onDone(checked.data);
  };

  const status = line
    ? n === 0
      ? 'Tap the map where the shoreline starts (chainage 0), then along the shore. Drag the map to move it; pinch, scroll or use +/− to zoom.'
      : `${n} corner${n === 1 ? '' : 's'}. Tap to go on along the shore; drag a corner to move it.`
    : drawing.closed
      ? `${n} corners, closed. Drag a corner to move it, or use the outline.`
      : n === 0
        ? 'Tap the map to place the first corner. Drag the map to move it; pinch, scroll or use +/− to zoom.'
        : n < 3
          ? `${n} corner${n === 1 ? '' : 's'}. Tap to add more (at least three).`
          : `${n} corners. Tap the first corner (or Close the ring) to finish.`;

  return (
    <View style={{ gap: space.sm }}>
      <DrawingMap
        frame={frame}
        phoneHeight={420}
        onTap={onTap}
        handles={handles}
        label={`Drawing map for ${label.toLowerCase()}: tap to add a corner, drag a corner to move it`}
        status={status}
        last={{ point: drawing.points[n - 1], noun: 'corner' }}
      >
        {(at) => {
          const pts = drawing.points.map(at);
          const list = pts.map((p) => `${p.x.toFixed(1)},${p.y.toFixed(1)}`).join(' ');
          return (
            <>
              {drawing.closed ? (
                <Polygon points={list} fill="rgba(196, 84, 36, 0.15)" stroke={colors.ember} strokeWidth={3} />
              ) : n > 1 ? (
                <Polyline points={list} fill="none" stroke={colors.ember} strokeWidth={3} />
              ) : null}
              <DrawnPoints points={pts} colour={colors.ember} firstBig={!line && !drawing.closed && n >= 3} />
            </>
          );
        }}
      </DrawingMap>
      {problem ? (
        <AppText tone="danger" role="alert">
          {problem}
        </AppText>
      ) : null}
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button kind="secondary" label="Undo" onPress={undo} disabled={!canUndo} />
        {line ? null : (
          <Button
            kind="secondary"
            label="Close the ring"
            onPress={() => change({ ...drawing, closed: true })}
            disabled={drawing.closed || n < 3}
          />
        )}
        <Button kind="quiet" label="Start over" onPress={() => change({ points: [], closed: false })} disabled={n === 0} />
      </View>
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button label={line ? 'Use this line' : 'Use this outline'} onPress={use} disabled={n < (line ? 2 : 3)} />
        <Button kind="quiet" label="Cancel" onPress={onCancel} />
      </View>
    </View>
  );
}
