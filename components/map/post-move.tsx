import { useEffect, useState } from 'react';
import { View } from 'react-native';
import { compassPoint } from '@/shared/geo/compass-point';
import { geodesicInverse } from '@/shared/geo/geodesic-inverse';
import type { LatLon } from '@/shared/geo/types';
import type { Post } from '@/shared/schemas/site';
import { convertLength } from '@/shared/units/length';
import { ApiRequestError } from '@/components/data/api-client';
import { useMovePost } from '@/components/data/placement';
import { useLengthUnits } from '@/components/data/session';
import { useSite } from '@/components/data/sites';
import { useTerrainElevation } from '@/components/data/terrain';
import { AppText } from '@/components/ui/app-text';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { space } from '@/components/ui/theme';
import { formatLength } from '@/components/check/format';
import { formatPosition } from './map-chrome';

/** A post dropped somewhere new on the map, waiting for the planner's yes. */
export interface PendingMove {
  readonly post: Post;
  readonly to: LatLon;
}

/**
 * Asks before a dragged post is saved at its new place: where from and to,
 * how far, and the ground the site's terrain gives there (or that the recorded
 * ground is kept on a site without terrain). The server checks the version
 * and refuses a post of a submitted or approved plan; the reason stays in the
 * dialog, and Cancel puts the pin back.
 */
export function PostMoveDialog({
  siteId,
  hasTerrain,
  pending,
  onDone,
  onCancel,
}: {
  siteId: string;
  hasTerrain: boolean;
  pending: PendingMove | null;
  onDone: (message: string) => void;
  onCancel: () => void;
}) {
  const lookup = useTerrainElevation(siteId);
  const move = useMovePost(siteId);
  // Heights to a tenth of a metre, in the person's (or the site's) units.
  const units = useLengthUnits(useSite(siteId).data?.defaultUnits);
  const heightText = (m: number) => `${convertLength(m, 'm', units.height).toFixed(1)} ${units.height}`;
  const [ground, setGround] = useState<{ to: LatLon; elevationM: number | null; error: string } | null>(null);
  const { mutate: look, reset: resetLookup } = lookup;
  const { reset: resetMove } = move;

  // Read the ground at the drop point for the question (the server reads it again when it saves).
  useEffect(() => {
    resetMove();
    if (!pending || !hasTerrain) {
      setGround(null);
      return;
    }
    const to = pending.to;
    setGround(null);
    resetLookup();
    look(to, {
      onSuccess: (r) => setGround({ to, elevationM: Math.round(r.elevationM * 10) / 10, error: '' }),
      onError: (e) => setGround({ to, elevationM: null, error: e.message }),
    });
  }, [pending, hasTerrain, look, resetLookup, resetMove]);

  if (!pending) return null;
  const { post, to } = pending;
  const refused = move.error instanceof ApiRequestError && move.error.code === 'post_in_frozen_plan';
  const leg = geodesicInverse(post.location, to);
  const groundKnown = hasTerrain ? (ground?.to === to ? ground : null) : null;
  const groundLine = !hasTerrain
    ? `The site has no terrain, so the recorded ground (${heightText(post.groundElevationM)}) is kept: check it on the post’s page.`
    : !groundKnown
      ? 'Reading the ground from the terrain…'
      : groundKnown.elevationM === null
        ? groundKnown.error
        : `Ground from the terrain there: ${heightText(groundKnown.elevationM)} (recorded now: ${heightText(post.groundElevationM)}). The eye then stands ${heightText(groundKnown.elevationM + post.structureHeightM + post.eyeHeightM)} above sea level.`;

  const confirm = () =>
    move.mutate(
      { postId: post.id, location: to, version: post.version },
      {
        onSuccess: (r) =>
          onDone(
            r.ground.from === 'terrain'
              ? `${r.post.name} moved; ground ${heightText(r.ground.elevationM)} from the terrain (was ${heightText(r.ground.previousM)}).`
              : `${r.post.name} moved; its recorded ground (${heightText(r.ground.elevationM)}) is kept.`,
          ),
      },
    );

  return (
    <ConfirmDialog
      visible
      title={`Move ${post.name} here?`}
      consequence={`${leg.distanceM < 1000 ? formatLength(Math.round(leg.distanceM), units.height) : formatLength(leg.distanceM, units.distance)} ${compassPoint(leg.azimuthDeg)} of where it is now. Plans that use this post will need their coverage computed again.`}
      confirmLabel="Move post"
      busy={move.isPending}
      error={move.error?.message}
      // A post of a submitted or approved plan stays put whatever is tried again; Cancel puts the pin back.
      confirmDisabled={(hasTerrain && groundKnown?.elevationM == null) || refused}
      onConfirm={confirm}
      onCancel={onCancel}
    >
      <View style={{ gap: space.xs }} aria-label="Where the post goes">
        <AppText variant="small">From {formatPosition(post.location, 'dd')}</AppText>
        <AppText variant="small">To {formatPosition(to, 'dd')}</AppText>
        <AppText variant="small" role={groundKnown?.error ? 'alert' : undefined}>
          {groundLine}
        </AppText>
      </View>
    </ConfirmDialog>
  );
}
