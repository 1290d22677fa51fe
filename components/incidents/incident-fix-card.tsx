import { useRouter } from 'expo-router';
import { View } from 'react-native';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { geodesicInverse } from '@/shared/geo/geodesic-inverse';
import { formatMgrs } from '@/shared/geo/mgrs';
import type { IncidentFix, IncidentReport } from '@/shared/schemas/incident';
import type { Post } from '@/shared/schemas/site';
import { formatLength } from '@/components/check/format';
import { useSiteLandmarks } from '@/components/data/landmarks';
import { useLengthUnits } from '@/components/data/session';
import { COORDINATE_FORMATS, DATUM_LABEL, useCoordinateFormat } from '@/components/map/coordinate-format';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Chip, ChipRow } from '@/components/ui/chip';
import { Notice } from '@/components/ui/states';
import { colors, space } from '@/components/ui/theme';
import { areaText, bearingText, INCIDENT_CAUTIONS } from './incident-words';
import { nearestLandmarkLegs } from './landmark-legs';
import { visibilitySentence } from './visibility-words';

/**
 * The incident's current fix: where, how sure (the error area and its
 * method, the cut angle or residuals), from where (distance and bearing from
 * each post and from the site's nearest landmarks), what looks wrong (warnings, the bearing that disagrees) and
 * whether each post can see the place at all.
 */
export function IncidentFixCard({
  fix,
  fixProblem,
  reports,
  posts,
  siteId,
  incidentId,
}: {
  fix: IncidentFix | null;
  fixProblem: string | null;
  reports: readonly IncidentReport[];
  posts: readonly Post[];
  siteId: string;
  incidentId: string;
}) {
  const router = useRouter();
  const [format, setFormat] = useCoordinateFormat();
  const { distance, height } = useLengthUnits();
  const landmarks = useSiteLandmarks(siteId);
  if (!fix) {
    return (
      <Card style={{ gap: space.sm }} aria-label="Fix">
        <AppText variant="heading">Fix</AppText>
        <AppText tone="muted">{fixProblem ?? 'No fix yet.'}</AppText>
      </Card>
    );
  }
  const bySeq = new Map(reports.map((r) => [r.seq, r]));
  const postById = new Map(posts.map((p) => [p.id, p]));
  return (
    <Card style={{ gap: space.md }} accent="ember" aria-label="Fix">
      <View style={{ gap: 2 }}>
        <AppText variant="heading">Fix</AppText>
        <AppText variant="figure" selectable aria-label="Fix position">
          {formatCoordinate(fix, format)}
        </AppText>
        <AppText variant="small" selectable>
          MGRS {formatMgrs(fix)} · {DATUM_LABEL}
        </AppText>
      </View>
      <ChipRow label="Coordinates">
        {COORDINATE_FORMATS.map((f) => (
          <Chip key={f.id} label={f.label} on={format === f.id} onPress={() => setFormat(f.id)} />
        ))}
      </ChipRow>
      <View style={{ gap: 2 }}>
        <AppText>
          Error area {areaText(fix.errorAreaM2)}
          {fix.cutAngleDeg !== undefined ? ` · cut angle ${fix.cutAngleDeg.toFixed(0)}°` : ''}
          {fix.errorEllipse
            ? ` · ellipse ${formatLength(fix.errorEllipse.semiMajorM, distance)} × ${formatLength(fix.errorEllipse.semiMinorM, distance)} (1σ)`
            : ''}
        </AppText>
        <AppText variant="small" tone="muted">
          {fix.method === 'two-bearing-intersection'
            ? 'Two bearings crossed'
            : fix.method === 'vertical-angle'
              ? 'One bearing and its vertical angle'
              : `Least squares over ${fix.fromReports.length} bearings`}
          . {fix.errorAreaMethod}
        </AppText>
      </View>
      {fix.range ? (
        <View style={{ gap: 2 }} aria-label="Range from the vertical angle">
          <AppText variant="label">
            {fix.range.basis === 'terrain' ? 'Where the sight line meets the terrain' : 'No terrain: smooth-earth estimate'}
          </AppText>
          <AppText selectable>
            Range {formatLength(fix.range.distanceM, distance)} · between {formatLength(fix.range.minM, distance)} and{' '}
            {fix.range.maxM === null ? 'open-ended (no ground)' : formatLength(fix.range.maxM, distance)} for the angle ±{' '}
            {fix.range.verticalAngleSigmaDeg}°
          </AppText>
          <AppText variant="small" tone="muted">
            {fix.range.angleFromHorizontalDeg.toFixed(2)}° from the horizontal
            {fix.range.verticalAngleReference === 'horizon' ? ' (the sea-horizon reading plus the dip)' : ''} · refraction k{' '}
            {fix.range.refractionK} · eye {formatLength(fix.range.eyeAltitudeM, height)}{' '}
            {fix.range.basis === 'terrain' ? 'above the datum' : 'above the ground'}. Estimates only: refraction near the horizon
            varies widely.
          </AppText>
        </View>
      ) : null}
      {fix.warnings.length > 0 ? (
        <Notice tone="caution" title="Warnings">
          {fix.warnings.map((w) => (
            <AppText key={w} variant="small">
              {w}
            </AppText>
          ))}
        </Notice>
      ) : null}
      <View style={{ gap: space.sm }} role="list" aria-label="From each post">
        {fix.lines.map((line) => {
          const report = bySeq.get(line.seq);
          const post = postById.get(line.postId);
          const toFix = post ? geodesicInverse(post.location, fix) : null;
          return (
            <View
              key={line.seq}
              role="listitem"
              style={{
                gap: 2,
                paddingLeft: space.sm,
                borderLeftWidth: 3,
                borderLeftColor: line.flagged ? colors.danger : colors.line,
              }}
            >
              <AppText variant="label">
                {line.postName}
                {line.flagged ? ' — disagrees with the others' : ''}
              </AppText>
              <AppText variant="small">
                {formatLength(line.distanceM, distance)} at {toFix ? bearingText(toFix.azimuthDeg) : '—'} true
                {report ? ` · reported ${bearingText(report.trueBearingDeg)} ± ${report.bearingSigmaDeg}°` : ''}
                {fix.method === 'least-squares'
                  ? ` · residual ${line.residualDeg >= 0 ? '+' : ''}${line.residualDeg.toFixed(2)}°`
                  : ''}
              </AppText>
              {line.flagged ? (
                <AppText variant="small" tone="danger">
                  This bearing is more than three standard deviations off the others: check it, or take it again.
                </AppText>
              ) : null}
            </View>
          );
        })}
      </View>
      {landmarks.data && landmarks.data.length > 0 ? (
        <View style={{ gap: 2 }} role="list" aria-label="From the landmarks">
          <AppText variant="label">From the landmarks</AppText>
          {nearestLandmarkLegs(landmarks.data, fix).map((leg) => (
            <AppText key={leg.id} variant="small" role="listitem">
              {formatLength(leg.distanceM, distance)} at {bearingText(leg.bearingDeg)} true from {leg.name}
            </AppText>
          ))}
        </View>
      ) : null}
      {fix.visibility && fix.visibility.length > 0 ? (
        <View style={{ gap: space.xs }} aria-label="Can each post see the place?">
          <AppText variant="label">Can each post see the place?</AppText>
          {fix.visibility.map((v) => (
            <AppText key={v.postId} variant="small" tone={v.seesGround ? 'ink' : 'ember'}>
              {visibilitySentence(v, height)}
            </AppText>
          ))}
        </View>
      ) : null}
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
        <Button
          kind="secondary"
          label="Show on the map"
          role="link"
          onPress={() => router.navigate({ pathname: '/sites/[siteId]/map', params: { siteId, incidentId } })}
        />
      </View>
      <View style={{ gap: 2 }}>
        {INCIDENT_CAUTIONS.map((c) => (
          <AppText key={c} variant="small" tone="muted">
            {c}
          </AppText>
        ))}
      </View>
    </Card>
  );
}
