import { useQueries } from '@tanstack/react-query';
import { useRouter } from 'expo-router';
import { useMemo } from 'react';
import { View } from 'react-native';
import { Circle, G, Line, Polygon, Polyline } from 'react-native-svg';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import type { CoordinateFormat } from '@/shared/geo/types';
import type { IncidentDetail } from '@/shared/schemas/incident';
import { incidentQuery, useIncidents } from '@/components/data/incidents';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { colors, space } from '@/components/ui/theme';
import type { MapCamera, MapSize } from './map-camera';
import { incidentShapes, type IncidentShape } from './incident-shapes';
import { HaloText } from './map-features';
import { OverlaySvg, overlayPoint } from './overlay-svg';
import type { SiteMapFrame } from './site-map-frame';

/** Bearing lines and error areas: the ember of the app's own marks, the flagged bearing in the danger red. */
const BEARING = colors.ember;
const FLAGGED = colors.danger;

/**
 * The site's open incidents (and one named by address, open or not) with
 * their reports, for the map: loads each incident's page once and keeps it
 * fresh while it is open.
 */
export function useMapIncidents(siteId: string, alsoIncidentId: string | null = null) {
  const list = useIncidents({ siteId, status: 'open' });
  const ids = [...new Set([...(list.data?.items.map((i) => i.id) ?? []), ...(alsoIncidentId ? [alsoIncidentId] : [])])];
  const { details, focusPending } = useQueries({
    queries: ids.map((id) => incidentQuery(id)),
    combine: (results) => ({
      details: results.flatMap((r) => (r.data ? [r.data] : [])),
      focusPending: alsoIncidentId !== null && (results[ids.indexOf(alsoIncidentId)]?.isPending ?? true),
    }),
  });
  return {
    details,
    /** The named incident is still loading (the map waits, to open on its fix). */
    focusPending,
    focusFix: details.find((d) => d.incident.id === alsoIncidentId)?.incident.fix ?? null,
  };
}

/** The incidents' shapes in the map's grid (recomputed when the incidents or the frame change). */
export function useIncidentShapes(frame: SiteMapFrame | null, details: readonly IncidentDetail[]): IncidentShape[] {
  return useMemo(() => {
    if (!frame) return [];
    const postAt = new Map(frame.posts.map((p) => [p.post.id, p.post.location]));
    return incidentShapes((p) => frame.projection.toGrid(p), details, postAt);
  }, [frame, details]);
}

/**
 * Draws the incidents over the coverage layers and the map's features:
 * each bearing as a dashed line from its post, the error area filled, the
 * fix as a ringed cross, for the committed camera.
 */
export function IncidentOverlay({
  shapes,
  camera,
  size,
  margin,
}: {
  shapes: readonly IncidentShape[];
  camera: MapCamera;
  size: MapSize;
  margin: number;
}) {
  if (shapes.length === 0) return null;
  const at = overlayPoint(camera, size, margin);
  const list = (points: readonly { x: number; y: number }[]) =>
    points
      .map((p) => at(p))
      .map((p) => `${p.x.toFixed(1)},${p.y.toFixed(1)}`)
      .join(' ');
  return (
    <OverlaySvg size={size} margin={margin} testID="incident-overlay">
      {shapes.map((shape) => {
        const fix = shape.fix ? at(shape.fix) : null;
        return (
          <G key={shape.incidentId}>
            {shape.errorRing ? (
              <Polygon points={list(shape.errorRing)} fill="rgba(184, 70, 27, 0.28)" stroke={BEARING} strokeWidth={2} />
            ) : null}
            {shape.bearings.map((b) => (
              <Polyline
                key={b.seq}
                points={list(b.points)}
                fill="none"
                stroke={b.flagged ? FLAGGED : BEARING}
                strokeWidth={b.flagged ? 3 : 2.5}
                strokeDasharray={b.flagged ? '4 4' : '10 5'}
              />
            ))}
            {fix ? (
              <G>
                <Circle cx={fix.x} cy={fix.y} r={9} fill="none" stroke={colors.surface} strokeWidth={5} />
                <Circle cx={fix.x} cy={fix.y} r={9} fill="none" stroke={colors.ink} strokeWidth={2.5} />
                <Line x1={fix.x - 14} y1={fix.y} x2={fix.x + 14} y2={fix.y} stroke={colors.ink} strokeWidth={2} />
                <Line x1={fix.x} y1={fix.y - 14} x2={fix.x} y2={fix.y + 14} stroke={colors.ink} strokeWidth={2} />
                <HaloText x={fix.x + 14} y={fix.y - 12} text={shape.title} color={colors.ink} bold />
              </G>
            ) : null}
          </G>
        );
      })}
    </OverlaySvg>
  );
}

/** The side panel's list of the incidents drawn, with their fixes and a way to their pages. */
export function IncidentMapPanel({ details, format }: { details: readonly IncidentDetail[]; format: CoordinateFormat }) {
  const router = useRouter();
  if (details.length === 0) return null;
  return (
    <View style={{ gap: space.sm }} aria-label="Incidents on the map">
      <AppText variant="label">Incidents</AppText>
      {details.map(({ incident }) => (
        <View key={incident.id} style={{ gap: 2 }}>
          <AppText variant="small">
            {incident.title}
            {incident.status === 'closed' ? ' (closed)' : ''}:{' '}
            {incident.fix ? `fix at ${formatCoordinate(incident.fix, format)}` : 'no fix yet'}
          </AppText>
          <View style={{ flexDirection: 'row' }}>
            <Button
              kind="quiet"
              label="Open the incident"
              role="link"
              onPress={() => router.navigate({ pathname: '/incidents/[incidentId]', params: { incidentId: incident.id } })}
            />
          </View>
        </View>
      ))}
      <AppText variant="small" tone="muted">
        Dashed lines are the bearings reported from each post (red: the one that disagrees), the shaded shape the fix’s error
        area. A fix is an estimate only; follow your agency’s procedures.
      </AppText>
    </View>
  );
}
