import { useEffect, useMemo, useRef, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { findWatchGaps } from '@/shared/roster/find-watch-gaps';
import { HANDOVER_MS, openedGaps } from '@/shared/roster/hourly-watch';
import type { Roster } from '@/shared/schemas/assignment';
import { useDeleteAssignment, useSiteRoster } from '@/components/data/roster';
import { useQualifications } from '@/components/data/trainer';
import { useSession } from '@/components/data/session';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { qualificationSummary } from '@/components/trainer/trainer-format';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { colors, radius, space } from '@/components/ui/theme';
import { showWatchTime, weekFrom } from './watch-time';
import { WatchForm } from './watch-form';

const HOUR = 3_600_000;

/** Where an instant falls across the window, 0…100 %. */
const at = (iso: string, from: number, to: number) => Math.min(100, Math.max(0, ((Date.parse(iso) - from) / (to - from)) * 100));

/**
 * Who is on which post over a week, in the site's time zone: a bar per post
 * with its watches and, in the danger colour, the stretches nobody covers.
 * Planners put people on posts and take them off here.
 */
export function SiteRoster({ siteId, timeZone }: { siteId: string; timeZone: string }) {
  const [week, setWeek] = useState(0);
  const window = useMemo(() => weekFrom(timeZone, week * 7), [timeZone, week]);
  const roster = useSiteRoster(siteId, window.from, window.to);
  const remove = useDeleteAssignment();
  const [takingOff, setTakingOff] = useState<{ id: string; who: string; post: string; until: string } | null>(null);
  const { data: user } = useSession();
  const planner = user?.role === 'planner';
  const qualifications = useQualifications();
  const opened = useOpenedGaps(roster.data);

  return (
    <Card style={{ gap: space.md }} aria-label="Watch roster">
      <View
        style={{ flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center', flexWrap: 'wrap', gap: space.sm }}
      >
        <View style={{ gap: 2 }}>
          <AppText variant="heading">Watch roster</AppText>
          <AppText variant="small" tone="muted">
            {window.days[0]} – {window.days[6]} · times in {timeZone}
          </AppText>
        </View>
        <View style={{ flexDirection: 'row', gap: space.xs }}>
          <Button kind="secondary" label="Earlier" onPress={() => setWeek((w) => w - 1)} />
          <Button kind="secondary" label="Later" onPress={() => setWeek((w) => w + 1)} />
        </View>
      </View>
      {roster.isPending ? (
        <LoadingState label="Loading the roster…" />
      ) : roster.isError ? (
        <ErrorState error={roster.error} onRetry={() => void roster.refetch()} />
      ) : roster.data.posts.length === 0 ? (
        <AppText tone="muted">This site has no posts to put anyone on yet.</AppText>
      ) : (
        <>
          {opened.length ? (
            <Notice tone="danger" title="That change left nobody on watch">
              {opened.slice(0, 6).map((g) => (
                <AppText key={g.start}>
                  No post is staffed {showWatchTime(new Date(g.start).toISOString(), timeZone)} →{' '}
                  {showWatchTime(new Date(g.end).toISOString(), timeZone)}: the shore (or ground) is unwatched then.
                </AppText>
              ))}
            </Notice>
          ) : null}
          <GapSummary roster={roster.data} timeZone={timeZone} />
          <View style={styles.days}>
            {window.days.map((d) => (
              <AppText key={d} variant="small" tone="muted" style={{ flex: 1 }}>
                {d}
              </AppText>
            ))}
          </View>
          {roster.data.posts.map((p) => {
            const from = Date.parse(roster.data.from);
            const to = Date.parse(roster.data.to);
            return (
              <View key={p.postId} style={{ gap: space.xs }} aria-label={`${p.postName} watches`}>
                <AppText variant="label">{p.postName}</AppText>
                <View style={styles.bar}>
                  {p.gaps.map((g) => (
                    <View
                      key={g.from}
                      style={[
                        styles.gap,
                        { left: `${at(g.from, from, to)}%`, width: `${at(g.to, from, to) - at(g.from, from, to)}%` },
                      ]}
                    />
                  ))}
                  {p.assignments.map((a) => {
                    const left = at(a.startsAt, from, to);
                    const right = a.endsAt ? at(a.endsAt, from, to) : 100;
                    return (
                      <View key={a.id} style={[styles.watch, { left: `${left}%`, width: `${right - left}%` }]}>
                        <AppText variant="small" numberOfLines={1} style={{ color: colors.surface, paddingHorizontal: 4 }}>
                          {a.person.name}
                        </AppText>
                      </View>
                    );
                  })}
                </View>
                {p.assignments.map((a) => (
                  <View key={a.id} style={styles.line}>
                    <View style={{ flex: 1 }}>
                      <AppText variant="small">
                        {a.person.name}: {showWatchTime(a.startsAt, timeZone)} →{' '}
                        {a.endsAt ? showWatchTime(a.endsAt, timeZone) : 'until further notice'}
                        {a.note ? ` · ${a.note}` : ''}
                      </AppText>
                      <QualificationLine summary={qualificationSummary(qualifications.data ?? [], a.person.id)} />
                    </View>
                    {planner ? (
                      <Button
                        kind="quiet"
                        label="Take off"
                        aria-label={`Take ${a.person.name} off ${p.postName}`}
                        busy={remove.isPending && remove.variables === a.id}
                        onPress={() =>
                          setTakingOff({
                            id: a.id,
                            who: a.person.name,
                            post: p.postName,
                            until: a.endsAt ? `until ${showWatchTime(a.endsAt, timeZone)}` : 'until further notice',
                          })
                        }
                      />
                    ) : null}
                  </View>
                ))}
              </View>
            );
          })}
          {remove.isError ? (
            <Notice tone="danger">
              <AppText>{remove.error.message}</AppText>
            </Notice>
          ) : null}
        </>
      )}
      {takingOff ? (
        <ConfirmDialog
          visible
          title={`Take ${takingOff.who} off ${takingOff.post}?`}
          consequence={
            `The watch (${takingOff.until}) is removed from the roster, and the hours it covered show as uncovered ` +
            'unless someone else is on the post.'
          }
          confirmLabel="Take off the watch"
          tone="danger"
          busy={remove.isPending}
          error={remove.isError ? remove.error.message : undefined}
          onConfirm={() => remove.mutate(takingOff.id, { onSuccess: () => setTakingOff(null) })}
          onCancel={() => {
            remove.reset();
            setTakingOff(null);
          }}
        />
      ) : null}
      {planner && roster.data ? <WatchForm posts={roster.data.posts} timeZone={timeZone} /> : null}
    </Card>
  );
}

/** One line per post that is not watched for the whole window, with how long it is left alone. */
/** Stretches of the window in which no post of the site is staffed (hand-overs under five minutes ignored). */
export function siteUncovered(roster: Roster): { start: number; end: number }[] {
  const intervals = roster.posts.flatMap((p) =>
    p.assignments.map((a) => ({ start: Date.parse(a.startsAt), end: a.endsAt ? Date.parse(a.endsAt) : null })),
  );
  return findWatchGaps(intervals, { start: Date.parse(roster.from), end: Date.parse(roster.to) }, HANDOVER_MS);
}

/** What the last change to the roster (same window) left with nobody on watch that was watched before. */
function useOpenedGaps(roster: Roster | undefined) {
  const previous = useRef<Roster | null>(null);
  const [opened, setOpened] = useState<{ start: number; end: number }[]>([]);
  useEffect(() => {
    if (!roster) return;
    const before = previous.current;
    previous.current = roster;
    if (!before || before.from !== roster.from || before.to !== roster.to) {
      setOpened([]);
      return;
    }
    setOpened(openedGaps(siteUncovered(before), siteUncovered(roster)));
  }, [roster]);
  return opened;
}

function GapSummary({ roster, timeZone }: { roster: Roster; timeZone: string }) {
  const open = roster.posts.filter((p) => p.gaps.length > 0);
  if (open.length === 0) {
    return (
      <Notice tone="info" title="No gaps">
        <AppText variant="small">Every post has someone on watch for the whole week.</AppText>
      </Notice>
    );
  }
  return (
    <Notice tone="danger" title={`${open.length} post${open.length === 1 ? '' : 's'} with nobody on watch part of the week`}>
      {open.map((p) => {
        const hours = p.gaps.reduce((sum, g) => sum + (Date.parse(g.to) - Date.parse(g.from)) / HOUR, 0);
        const first = p.gaps[0]!;
        return (
          <AppText key={p.postId} variant="small">
            {p.postName}: {Math.round(hours)} h uncovered, first from {showWatchTime(first.from, timeZone)}
          </AppText>
        );
      })}
    </Notice>
  );
}

const styles = StyleSheet.create({
  days: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.line, paddingBottom: 2 },
  bar: { height: 26, backgroundColor: colors.paper, borderRadius: radius.sm, overflow: 'hidden', position: 'relative' },
  gap: {
    position: 'absolute',
    top: 0,
    bottom: 0,
    backgroundColor: colors.dangerSoft,
    borderTopWidth: 3,
    borderTopColor: colors.danger,
  },
  watch: {
    position: 'absolute',
    top: 3,
    bottom: 3,
    backgroundColor: colors.moss,
    borderRadius: radius.sm,
    justifyContent: 'center',
  },
  line: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
});

/** A person's training standing beside their watch (nothing when no course is assigned to them). */
function QualificationLine({ summary }: { summary: ReturnType<typeof qualificationSummary> }) {
  if (!summary) return null;
  return (
    <AppText variant="small" tone={summary.ok ? 'moss' : 'ember'}>
      {summary.ok ? '✓ ' : '! '}
      {summary.text}
    </AppText>
  );
}
