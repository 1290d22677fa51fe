import { DateTime } from 'luxon';
import { findWatchGaps } from '@/shared/roster/find-watch-gaps';

/*
 * Coverage hour by hour from the roster. A post counts in an hour when it is
 * on watch for the whole hour (hand-overs under five minutes do not break
 * it, as on the roster). A post's contribution to a band is then simply its
 * watched stations or nothing; a patrol post will fit the same way (on
 * station in that hour or not).
 */

/** Hand-overs shorter than this do not take a post off watch. */
export const HANDOVER_MS = 5 * 60_000;

/** One hour of the site's local day. */
export interface WatchHour {
  /** Milliseconds since the epoch. */
  readonly start: number;
  readonly end: number;
  /** Local date and hour, e.g. "2026-12-03 08:00" (a repeated hour on the autumn change keeps its own offset). */
  readonly local: string;
  /** Local hour of the day, 0–23. */
  readonly hour: number;
}

/**
 * The hours of `days` local days from `date` (YYYY-MM-DD) in the site's time
 * zone: 24 a day, 23 or 25 on the days the clocks change.
 *
 * @throws RangeError for a date or time zone luxon cannot read, or days outside 1–14
 */
export function hoursOfDays(date: string, days: number, timeZone: string): WatchHour[] {
  if (!(days >= 1 && days <= 14)) throw new RangeError('From 1 to 14 days.');
  const start = DateTime.fromISO(date, { zone: timeZone }).startOf('day');
  if (!start.isValid) throw new RangeError(`Not a date in ${timeZone}: ${date}.`);
  const end = start.plus({ days }).toMillis();
  const hours: WatchHour[] = [];
  for (let t = start.toMillis(); t < end; t += 3600_000) {
    const local = DateTime.fromMillis(t, { zone: timeZone });
    hours.push({ start: t, end: t + 3600_000, local: local.toFormat('yyyy-MM-dd HH:mm'), hour: local.hour });
  }
  return hours;
}

/** A watch on the roster: a post from `start` to `end` (null = until further notice), ms since the epoch. */
export interface PostWatch {
  readonly postId: string;
  readonly start: number;
  readonly end: number | null;
}

/**
 * Which posts are on watch in each hour: hour → post (in `postIds` order) → true
 * when its watches cover the whole hour, hand-overs under five minutes allowed.
 */
export function onWatchByHour(
  watches: readonly PostWatch[],
  postIds: readonly string[],
  hours: readonly WatchHour[],
): boolean[][] {
  const byPost = new Map<string, PostWatch[]>();
  for (const w of watches) byPost.set(w.postId, [...(byPost.get(w.postId) ?? []), w]);
  return hours.map((h) =>
    postIds.map((id) => findWatchGaps(byPost.get(id) ?? [], { start: h.start, end: h.end }, HANDOVER_MS).length === 0),
  );
}

/** One hour of the series. */
export interface HourlyPoint {
  readonly startsAt: string;
  readonly local: string;
  readonly hour: number;
  /** Posts on watch for the whole hour. */
  readonly postIds: string[];
  /** Per band (the case's order): share of the shore watched by ≥ 1 and ≥ 2 posts on watch, %. */
  readonly bands: { name: string; watched1Pct: number; watched2Pct: number }[];
}

/** An hour in which some band has no shore watched at all. */
export interface UnwatchedHour {
  readonly startsAt: string;
  readonly local: string;
  readonly bands: string[];
}

/**
 * The watched share of each band hour by hour.
 *
 * @param bandShares for each band, a function of the posts on watch (`on[p]`) giving the ≥ 1 and ≥ 2 shares, %
 */
export function hourlySeries(
  hours: readonly WatchHour[],
  on: readonly boolean[][],
  postIds: readonly string[],
  bands: readonly { name: string; shares: (on: readonly boolean[]) => { watched1Pct: number; watched2Pct: number } }[],
): { hourly: HourlyPoint[]; unwatchedHours: UnwatchedHour[] } {
  const hourly = hours.map((h, i) => {
    const onNow = on[i]!;
    return {
      startsAt: new Date(h.start).toISOString(),
      local: h.local,
      hour: h.hour,
      postIds: postIds.filter((_, p) => onNow[p]),
      bands: bands.map((b) => ({ name: b.name, ...b.shares(onNow) })),
    };
  });
  const unwatchedHours = hourly
    .map((h) => ({ startsAt: h.startsAt, local: h.local, bands: h.bands.filter((b) => b.watched1Pct === 0).map((b) => b.name) }))
    .filter((h) => h.bands.length > 0);
  return { hourly, unwatchedHours };
}

/**
 * Stretches nobody covers after a change that were covered before it: each
 * gap of `after` less the gaps of `before` (hand-overs under five minutes
 * dropped). Empty when the change opened no gap.
 *
 * Source: interval difference — common practice, no source.
 */
export function openedGaps(
  before: readonly { start: number; end: number }[],
  after: readonly { start: number; end: number }[],
): { start: number; end: number }[] {
  return after.flatMap((g) => findWatchGaps(before, g, HANDOVER_MS));
}
