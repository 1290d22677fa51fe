import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';
import { AppText } from '@/components/ui/app-text';
import { Screen } from '@/components/ui/screen';
import { Notice } from '@/components/ui/states';
import { RunMapScreen } from './run-map-screen';
import { SiteMapScreen } from './site-map-screen';

const Params = z.object({
  siteId: z.uuid(),
  postId: z.uuid().optional(),
  /** A coverage run whose layers to draw, and the case (target × condition) to start with. */
  runId: z.uuid().optional(),
  caseKey: z.string().min(1).optional(),
  /** A point to centre on and start the profile to (e.g. a blind area), degrees. */
  lat: z.coerce.number().min(-90).max(90).optional(),
  lon: z.coerce.number().min(-180).max(180).optional(),
  /** `1`: the point is inside a blind area of the case; outline it. */
  blind: z.literal('1').optional(),
  /** An incident whose fix to open on. */
  incidentId: z.uuid().optional(),
});

/** `/sites/:siteId/map`: the site's map, or a coverage run's layers on it, from the address's parameters. */
export function SiteMapRouteContent() {
  const parsed = Params.safeParse(useLocalSearchParams());
  if (!parsed.success) {
    return (
      <Screen title="Map">
        <Notice tone="danger">
          <AppText>This address does not name a site (or names a post or a coverage run wrongly).</AppText>
        </Notice>
      </Screen>
    );
  }
  const { siteId, postId, runId, caseKey, lat, lon, blind, incidentId } = parsed.data;
  const at = lat !== undefined && lon !== undefined ? { latDeg: lat, lonDeg: lon } : null;
  return runId ? (
    <RunMapScreen
      siteId={siteId}
      runId={runId}
      caseKey={caseKey ?? null}
      focusPostId={postId ?? null}
      focusAt={at}
      outlineBlindArea={blind === '1'}
    />
  ) : (
    <SiteMapScreen siteId={siteId} focusPostId={postId ?? null} focusAt={at} focusIncidentId={incidentId ?? null} />
  );
}
