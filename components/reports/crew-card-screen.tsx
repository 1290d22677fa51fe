import { Platform, View } from 'react-native';
import { distanceIn, lengthIn } from '@/components/check/format';
import { useCrewCard, crewCardPdfUrl } from '@/components/data/reports';
import { useLengthUnits } from '@/components/data/session';
import { COORDINATE_FORMATS, useCoordinateFormat } from '@/components/map/coordinate-format';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import type { CrewCard } from '@/shared/schemas/crew-card';
import { formatK } from '@/shared/sightline/format-k';
import { DownloadLink } from './download-link';

const LIMITS: Record<string, string> = {
  horizon: 'horizon',
  visibility: 'visibility',
  'angular-size': 'angular size',
  'luminous-range': 'luminous range',
  'sea-state': 'sea state',
};

const metricKm = (m: number) => (m < 1000 ? `${Math.round(m)} m` : `${(m / 1000).toFixed(1)} km`);
const metricM = (m: number) => `${Math.round(m * 10) / 10} m`;
const bearing = (deg: number) => `${Math.round(deg).toString().padStart(3, '0')}°`;

/**
 * A post's crew card on screen, laid out to print on one sheet (the browser's
 * print), with the same card as an A5 PDF. Figures from the latest approved
 * plan that uses the post, else computed now and said so.
 */
export function CrewCardScreen({ siteId, postId }: { siteId: string; postId: string }) {
  const card = useCrewCard(siteId, postId);
  const [format] = useCoordinateFormat();
  if (card.isPending) return <LoadingState label="Loading the crew card…" />;
  if (card.isError) return <ErrorState error={card.error} onRetry={() => void card.refetch()} />;
  return <CardView card={card.data} format={format} />;
}

function CardView({ card, format }: { card: CrewCard; format: (typeof COORDINATE_FORMATS)[number]['id'] }) {
  const { post } = card;
  // The person's units on screen (the PDF is written in metres by the server).
  const units = useLengthUnits();
  const km = (m: number | null) => (m === null ? '—' : distanceIn(m, units.distance, metricKm));
  const metres = (m: number) => lengthIn(m, units.height, metricM);
  const formatName = COORDINATE_FORMATS.find((f) => f.id === format)?.name ?? format;
  let position: string;
  try {
    position = formatCoordinate(post.location, format);
  } catch {
    position = formatCoordinate(post.location, 'ddm');
  }
  const canPrint = Platform.OS === 'web' && typeof window !== 'undefined' && typeof window.print === 'function';
  return (
    <Screen title={`Crew card · ${post.name}`} subtitle={card.site.name}>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
        <DownloadLink href={crewCardPdfUrl(card.site.id, post.id, format)} label="Crew card (PDF, A5)" />
        {canPrint ? <Button kind="quiet" label="Print this page" onPress={() => window.print()} /> : null}
      </View>

      <Card style={{ gap: space.xs }} aria-label="Where and how high">
        <AppText variant="heading">{post.name}</AppText>
        <AppText>
          {position} ({formatName}, WGS 84)
        </AppText>
        <AppText>MGRS {card.mgrs}</AppText>
        <AppText variant="small">
          Ground {metres(post.groundElevationM)} · structure {metres(post.structureHeightM)} · eye {metres(post.eyeHeightM)} above
          the platform · height of eye {metres(post.heightOfEyeM)}
        </AppText>
        <AppText variant="small">
          Sector: {post.sector ? `${bearing(post.sector.fromDeg)} to ${bearing(post.sector.toDeg)} true` : 'all round'}
        </AppText>
      </Card>

      {card.basis.kind === 'approved-plan' ? (
        <AppText variant="small" tone="muted">
          From the approved plan “{card.basis.planTitle}”, version {card.basis.version}, revision {card.basis.revision} · content
          hash {card.basis.contentHash.slice(0, 12)}…
        </AppText>
      ) : (
        <Notice tone="caution" title="No approved plan uses this post">
          <AppText variant="small">
            Computed now with Kenning’s sightline core on smooth earth, for {card.basis.scope}. Not reviewed.
          </AppText>
        </Notice>
      )}

      <Card style={{ gap: space.xs }} aria-label="How far from here">
        <AppText variant="heading">How far from here</AppText>
        {card.rows.map((r, i) => (
          <View key={i} style={{ gap: 2 }}>
            <AppText variant="label">
              {r.targetName} · {r.conditionSetName}, k {formatK(r.k)}
            </AppText>
            <AppText variant="small">
              Horizon {km(r.horizonDistanceM)} · geographic {km(r.geographicRangeM)} · detection {km(r.detectionRangeM)}
              {r.limitedBy ? ` (${LIMITS[r.limitedBy] ?? r.limitedBy})` : ''}
            </AppText>
          </View>
        ))}
      </Card>

      <Card style={{ gap: space.xs }} aria-label="Marks seen from the post">
        <AppText variant="heading">Marks seen from the post</AppText>
        {card.marks.length === 0 ? (
          <AppText variant="small" tone="muted">
            None recorded: photos of landmarks taken with a bearing appear here.
          </AppText>
        ) : (
          card.marks.map((m) => (
            <AppText key={m.attachmentId ?? m.name} variant="small">
              {m.name}: {bearing(m.bearingTrueDeg)} true · magnetic{' '}
              {m.bearingMagneticDeg === null ? 'not available' : bearing(m.bearingMagneticDeg)} · distance{' '}
              {m.distanceM === null ? 'not recorded' : km(m.distanceM)}
            </AppText>
          ))
        )}
        <AppText variant="small" tone="muted">
          {card.declination
            ? `Magnetic declination ${card.declination.deg}° (${card.declination.date}).`
            : 'Magnetic bearings: not available — no magnetic declination is known for this post.'}
        </AppText>
      </Card>

      <Notice tone="caution" title="Read before you rely on this">
        {card.cautions.map((c) => (
          <AppText key={c} variant="small">
            • {c}
          </AppText>
        ))}
      </Notice>
    </Screen>
  );
}
