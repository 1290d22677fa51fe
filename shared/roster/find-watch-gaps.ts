/** A stretch of time in milliseconds since the epoch; `end` null = open-ended. */
export interface Interval {
  readonly start: number;
  readonly end: number | null;
}

/** A stretch of the window that nobody covers, milliseconds since the epoch. */
export interface Gap {
  readonly start: number;
  readonly end: number;
}

/**
 * The parts of a watch window that no assignment covers: the window minus
 * the union of the intervals. Intervals may overlap, touch, run past the
 * window or be open-ended. Gaps shorter than `minGapMs` (default 0) are
 * dropped, so a hand-over of a minute does not show as a gap.
 *
 * Source: interval union by sorting on start — common practice, no source.
 *
 * @param intervals covered stretches (not modified)
 * @param window the stretch to check, start < end
 * @param minGapMs shortest gap worth reporting, milliseconds
 * @returns the uncovered stretches in time order
 * @throws RangeError when the window is empty or reversed
 * @example
 * findWatchGaps([{ start: 0, end: 10 }, { start: 15, end: null }], { start: 0, end: 20 });
 * // [{ start: 10, end: 15 }]
 */
export function findWatchGaps(intervals: readonly Interval[], window: Gap, minGapMs = 0): Gap[] {
  if (!(window.end > window.start)) throw new RangeError('The watch window must end after it starts.');
  const sorted = intervals
    .map((i) => ({ start: i.start, end: i.end ?? Infinity }))
    .filter((i) => i.end > window.start && i.start < window.end && i.end > i.start)
    .sort((a, b) => a.start - b.start);
  const gaps: Gap[] = [];
  let cursor = window.start;
  for (const i of sorted) {
    if (i.start > cursor) gaps.push({ start: cursor, end: Math.min(i.start, window.end) });
    cursor = Math.max(cursor, i.end);
    if (cursor >= window.end) break;
  }
  if (cursor < window.end) gaps.push({ start: cursor, end: window.end });
  return gaps.filter((g) => g.end - g.start > minGapMs);
}
