import { findWatchGaps } from '@/shared/roster/find-watch-gaps';

// common practice, no source: the uncovered part of a window is the window minus the union of the watches.
describe('findWatchGaps', () => {
  const window = { start: 0, end: 100 };

  it('returns the whole window when nobody is on watch', () => {
    expect(findWatchGaps([], window)).toEqual([window]);
  });

  it('merges overlapping and touching watches and finds the holes between them', () => {
    const gaps = findWatchGaps(
      [
        { start: 10, end: 30 },
        { start: 25, end: 40 },
        { start: 40, end: 50 },
        { start: 70, end: 80 },
      ],
      window,
    );
    expect(gaps).toEqual([
      { start: 0, end: 10 },
      { start: 50, end: 70 },
      { start: 80, end: 100 },
    ]);
  });

  it('treats an open-ended watch as lasting past the window, and clips watches to it', () => {
    expect(
      findWatchGaps(
        [
          { start: -50, end: 20 },
          { start: 60, end: null },
        ],
        window,
      ),
    ).toEqual([{ start: 20, end: 60 }]);
  });

  it('drops hand-overs shorter than the least gap', () => {
    expect(
      findWatchGaps(
        [
          { start: 0, end: 49 },
          { start: 50, end: 100 },
        ],
        window,
        5,
      ),
    ).toEqual([]);
    expect(
      findWatchGaps(
        [
          { start: 0, end: 40 },
          { start: 50, end: 100 },
        ],
        window,
        5,
      ),
    ).toEqual([{ start: 40, end: 50 }]);
  });

  it('agrees with a minute-by-minute count on random rosters', () => {
    let seed = 7;
    const rand = () => (seed = (seed * 48271) % 2147483647) / 2147483647;
    for (let trial = 0; trial < 50; trial++) {
      const watches = Array.from({ length: 1 + Math.floor(rand() * 6) }, () => {
        const start = Math.floor(rand() * 120) - 10;
        return { start, end: rand() < 0.1 ? null : start + 1 + Math.floor(rand() * 40) };
      });
      const gaps = findWatchGaps(watches, window);
      for (let t = 0; t < 100; t++) {
        const covered = watches.some((w) => w.start <= t && (w.end === null || t < w.end));
        const inGap = gaps.some((g) => g.start <= t && t < g.end);
        expect(inGap).toBe(!covered);
      }
    }
  });

  it('refuses an empty window and does not modify its input', () => {
    expect(() => findWatchGaps([], { start: 5, end: 5 })).toThrow(RangeError);
    const watches = [{ start: 30, end: 10 + 40 }];
    const copy = structuredClone(watches);
    findWatchGaps(watches, window);
    expect(watches).toEqual(copy);
  });
});
