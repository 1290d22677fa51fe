import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { View } from 'react-native';
import type { IncidentDetail } from '@/shared/schemas/incident';
import { useIncident, useUpdateIncident } from '@/components/data/incidents';
import { briefingQuery } from '@/components/data/roster';
import { useSession } from '@/components/data/session';
import { sitePostsQuery } from '@/components/data/sites';
import { when } from '@/components/plans/when';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { Screen } from '@/components/ui/screen';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { IncidentFixCard } from './incident-fix-card';
import { IncidentLog } from './incident-log';
import { bearingText, SIGHTING_LABELS, STATUS_LABELS } from './incident-words';
import { OutboxList } from '@/components/offline/field-status';
import { ReportBearingForm } from './report-bearing-form';

/** The post an observer is on watch at now (to pick first in the report form): null when none, undefined while loading. */
function usePostOnWatch(enabled: boolean): string | null | undefined {
  const briefing = useQuery({ ...briefingQuery(), enabled });
  if (enabled && briefing.isPending) return undefined;
  const now = Date.now();
  const watch = briefing.data?.assignments.find(
    (a) => Date.parse(a.startsAt) <= now && (a.endsAt === null || Date.parse(a.endsAt) > now),
  );
  return watch?.postId ?? null;
}

/**
 * One incident: the fix with its error area and each post's view of it, the
 * bearing form (planners and observers on watch), the reports, the log with
 * its chain check and exports, and closing.
 */
export function IncidentScreen({ incidentId }: { incidentId: string }) {
  const incident = useIncident(incidentId);
  const { wide } = useLayout();
  const { data: user } = useSession();
  const siteId = incident.data?.incident.siteId ?? '';
  const posts = useQuery({ ...sitePostsQuery(siteId), enabled: siteId !== '' });
  const onWatchPost = usePostOnWatch(user?.role === 'observer');
  if (incident.isPending) return <LoadingState label="Loading the incident…" />;
  if (incident.isError) return <ErrorState error={incident.error} onRetry={() => void incident.refetch()} />;
  const { incident: i, reports, entries, chain, fixProblem } = incident.data;
  const writer = user?.role === 'planner' || user?.role === 'admin' || user?.role === 'observer';
  const open = i.status === 'open';
  const sitePosts = posts.data ?? [];

  const fixCard = (
    <IncidentFixCard
      fix={i.fix}
      fixProblem={fixProblem}
      reports={reports}
      posts={sitePosts}
      siteId={i.siteId}
      incidentId={i.id}
    />
  );
  const form =
    writer && open ? (
      user?.role === 'observer' && onWatchPost === undefined ? (
        <LoadingState label="Looking up your watch…" />
      ) : user?.role === 'observer' && !onWatchPost ? (
        <Notice tone="info" title="Reporting">
          <AppText variant="small">Lookouts report bearings while on a watch at one of this site’s posts.</AppText>
        </Notice>
      ) : (
        <>
          <ReportBearingForm incidentId={i.id} posts={sitePosts} preferredPostId={onWatchPost} />
          <OutboxList />
        </>
      )
    ) : null;
  const reportList = <ReportList reports={reports} />;
  const log = <IncidentLog incidentId={i.id} entries={entries} chain={chain} />;

  return (
    <Screen
      title={i.title}
      subtitle={`${i.siteName} · ${STATUS_LABELS[i.status]} · opened ${when(i.openedAt)} by ${i.openedBy.name}${
        i.closedAt ? ` · closed ${when(i.closedAt)}` : ''
      }`}
      actions={writer && user?.role !== 'observer' ? <CloseOrReopen detail={incident.data} /> : null}
    >
      {chain.intact ? null : (
        <Notice tone="danger" title={`This incident’s log is broken at entry ${chain.firstBrokenSeq ?? '?'}`}>
          <AppText variant="small">{chain.message}</AppText>
        </Notice>
      )}
      {wide ? (
        <View style={{ flexDirection: 'row', gap: space.xl, alignItems: 'flex-start' }}>
          <View style={{ flex: 3, gap: space.lg }}>
            {fixCard}
            {reportList}
            {form ? log : null}
          </View>
          {/* Without the form (closed, or a reader) the log takes the right column. */}
          <View style={{ flex: 2, gap: space.lg }}>{form ?? log}</View>
        </View>
      ) : (
        <>
          {fixCard}
          {form}
          {reportList}
          {log}
        </>
      )}
    </Screen>
  );
}

function ReportList({ reports }: { reports: IncidentDetail['reports'] }) {
  if (reports.length === 0) return null;
  return (
    <View style={{ gap: space.sm }} aria-label="Bearings reported">
      <AppText variant="heading">Bearings reported</AppText>
      {[...reports].reverse().map((r) => (
        <View key={r.seq} style={{ gap: 2 }}>
          <AppText variant="label">
            {r.postName}: {bearingText(r.trueBearingDeg)} true ± {r.bearingSigmaDeg}°
          </AppText>
          <AppText variant="small" tone="muted">
            {SIGHTING_LABELS[r.kind]} · seen {when(r.observedAt)} · {r.reportedBy.name}
            {r.bearingReference === 'magnetic'
              ? ` · read ${bearingText(r.bearingDeg)} magnetic, declination ${r.declinationDeg.toFixed(1)}° (${r.declinationSource === 'model' ? 'magnetic model' : 'typed'})`
              : ''}
            {r.verticalAngleDeg !== null ? ` · vertical ${r.verticalAngleDeg}°` : ''}
            {r.note ? ` · ${r.note}` : ''}
          </AppText>
        </View>
      ))}
    </View>
  );
}

/** Closing (or reopening) asks first, with a note for the log. */
function CloseOrReopen({ detail }: { detail: IncidentDetail }) {
  const update = useUpdateIncident(detail.incident.id);
  const [asking, setAsking] = useState(false);
  const [note, setNote] = useState('');
  const closing = detail.incident.status === 'open';
  return (
    <>
      <Button
        kind={closing ? 'danger' : 'secondary'}
        label={closing ? 'Close the incident' : 'Reopen'}
        onPress={() => setAsking(true)}
      />
      <ConfirmDialog
        visible={asking}
        title={closing ? 'Close this incident?' : 'Reopen this incident?'}
        consequence={
          closing
            ? 'No more bearings can be reported to it. The log keeps everything and says who closed it and when.'
            : 'Bearings can be reported to it again. The log says who reopened it and when.'
        }
        confirmLabel={closing ? 'Close' : 'Reopen'}
        tone={closing ? 'danger' : 'primary'}
        busy={update.isPending}
        error={update.error instanceof Error ? update.error.message : undefined}
        onCancel={() => setAsking(false)}
        onConfirm={() =>
          update.mutate(
            { version: detail.incident.version, status: closing ? 'closed' : 'open', note },
            { onSuccess: () => setAsking(false) },
          )
        }
      >
        <TextField
          label="Note for the log (optional)"
          value={note}
          onChangeText={setNote}
          placeholder="e.g. Crew on scene, out."
        />
      </ConfirmDialog>
    </>
  );
}
