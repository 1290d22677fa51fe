import { hoursOfDays, hourlySeries, onWatchByHour, openedGaps } from '@/shared/roster/hourly-watch';

const H = 3600_000;

describe('hour by hour from the roster', () => {
  it('a local day has 24 hours, 23 on the spring change and 25 on the autumn change', () => {
    // Source: Directive 2000/84/EC — summer time in the EU begins on the last Sunday of March and ends on the
    // last Sunday of October at 01:00 UTC.
    expect(hoursOfDays('2026-07-01', 1, 'Europe/Berlin')).toHaveLength(24);
    expect(hoursOfDays('2026-03-29', 1, 'Europe/Berlin')).toHaveLength(23);
    expect(hoursOfDays('2026-10-25', 1, 'Europe/Berlin')).toHaveLength(25);
    expect(hoursOfDays('2026-07-01', 7, 'Europe/Berlin')).toHaveLength(168);
    const [first] = hoursOfDays('2026-07-01', 1, 'Europe/Berlin');
    expect(first).toMatchObject({ local: '2026-07-01 00:00', hour: 0 });
    expect(new Date(first!.start).toISOString()).toBe('2026-06-30T22:00:00.000Z'); // CEST is UTC+2
  });

  it('follows a roster with one unstaffed hour', () => {
    // common practice, no source: a post counts in an hour when on watch the whole hour.
    const hours = hoursOfDays('2026-07-01', 1, 'UTC');
    const day = hours[0]!.start;
    // Post A on watch 08:00–13:00 and 14:00–20:00; post B 08:00–20:00 but off 13:00–14:00 as well.
    const watches = [
      { postId: 'A', start: day + 8 * H, end: day + 13 * H },
      { postId: 'A', start: day + 14 * H, end: day + 20 * H },
      { postId: 'B', start: day + 8 * H, end: day + 13 * H },
      { postId: 'B', start: day + 14 * H + 2 * 60_000, end: day + 20 * H }, // a 2-minute hand-over: still on watch
    ];
    const on = onWatchByHour(watches, ['A', 'B'], hours);
    // A band where A alone watches 60 % and B alone 30 % of the shore, together 80 %.
    const shares = (o: readonly boolean[]) => ({
      watched1Pct: o[0] && o[1] ? 80 : o[0] ? 60 : o[1] ? 30 : 0,
      watched2Pct: o[0] && o[1] ? 10 : 0,
    });
    const { hourly, unwatchedHours } = hourlySeries(hours, on, ['A', 'B'], [{ name: 'inshore', shares }]);
    expect(hourly).toHaveLength(24);
    expect(hourly[8]).toMatchObject({
      local: '2026-07-01 08:00',
      postIds: ['A', 'B'],
      bands: [{ name: 'inshore', watched1Pct: 80 }],
    });
    expect(hourly[13]).toMatchObject({ postIds: [], bands: [{ watched1Pct: 0, watched2Pct: 0 }] });
    expect(hourly[14]!.postIds).toEqual(['A', 'B']);
    expect(hourly[19]!.postIds).toEqual(['A', 'B']);
    expect(hourly[20]!.postIds).toEqual([]);
    // Unwatched between 08:00 and 20:00: only 13:00.
    const inDay = unwatchedHours.filter((h) => h.local >= '2026-07-01 08:00' && h.local < '2026-07-01 20:00');
    expect(inDay).toEqual([{ startsAt: '2026-07-01T13:00:00.000Z', local: '2026-07-01 13:00', bands: ['inshore'] }]);
    expect(unwatchedHours).toHaveLength(24 - 11);
  });

  it('an open-ended watch covers every later hour; a watch ending mid-hour does not cover that hour', () => {
    const hours = hoursOfDays('2026-07-01', 1, 'UTC');
    const day = hours[0]!.start;
    const on = onWatchByHour(
      [
        { postId: 'A', start: day + 6 * H, end: null },
        { postId: 'B', start: day, end: day + 10.5 * H },
      ],
      ['A', 'B'],
      hours,
    );
    expect(on[5]).toEqual([false, true]);
    expect(on[23]).toEqual([true, false]);
    expect(on[10]).toEqual([true, false]);
    expect(on[9]).toEqual([true, true]);
  });
});

describe('a change that opens a gap', () => {
  it('names what is newly uncovered, and nothing when the gaps only shrink', () => {
    // common practice, no source: interval difference.
    const before = [{ start: 0, end: 8 * H }];
    expect(
      openedGaps(before, [
        { start: 0, end: 8 * H },
        { start: 13 * H, end: 14 * H },
      ]),
    ).toEqual([{ start: 13 * H, end: 14 * H }]);
    expect(openedGaps(before, [{ start: 0, end: 9 * H }])).toEqual([{ start: 8 * H, end: 9 * H }]);
    expect(openedGaps(before, [{ start: 0, end: 7 * H }])).toEqual([]);
    expect(openedGaps(before, [{ start: 8 * H, end: 8 * H + 2 * 60_000 }])).toEqual([]);
  });
});
