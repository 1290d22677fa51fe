import type { CoveragePost } from '@/shared/terrain/coverage-post';
import { CROSS_BEARING_CLASS, crossBearingQuality } from '@/shared/terrain/cross-bearing-quality';
import { countPostsPerCell } from '@/shared/terrain/posts-per-cell';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';
import { classesFrom, gridOf, mismatches, seededRandom } from '@/tests/unit/terrain/coverage-fixtures';

const DEG = Math.PI / 180;

describe('crossBearingQuality: geometry at known points', () => {
  // Two posts 40 cells apart on one row; both see everything.
  const grid = gridOf(100, 100);
  const everywhere = classesFrom(grid, () => VISIBILITY_CLASS.seen);
  const posts: CoveragePost[] = [
    { col: 20, row: 60, classes: everywhere },
    { col: 60, row: 60, classes: everywhere },
  ];
  const counts = countPostsPerCell(grid, posts);
  const cross = crossBearingQuality(counts, posts);
  const angleAt = (col: number, row: number) => (cross.bestAngle[row * grid.width + col]! * 180) / Math.PI;
  const classAt = (col: number, row: number) => cross.classes[row * grid.width + col];

  test('a 3-4-5 triangle: bearings cross at acos(0.6) = 53.13°', () => {
    // Source: angle between vectors, cos θ = a·b / (|a||b|) — plane geometry (closed form).
    // Cell (20, 30): 30 cells north of A; from B 40 west and 30 north.
    expect(angleAt(20, 30)).toBeCloseTo((Math.acos(0.6) * 180) / Math.PI, 4);
    expect(classAt(20, 30)).toBe(CROSS_BEARING_CLASS.good);
  });

  test('θ and 180° − θ are equally good: 126.87° folds to 53.13°', () => {
    // Cell (40, 50): vectors (−20, 10) and (20, 10), cos θ = −0.6.
    expect(angleAt(40, 50)).toBeCloseTo((Math.acos(0.6) * 180) / Math.PI, 4);
  });

  test('a right angle on the circle over the baseline (Thales)', () => {
    // Source: Thales' theorem — any point on the circle with diameter AB sees AB at 90°.
    expect(angleAt(40, 40)).toBeCloseTo(90, 4); // centre (40, 60), radius 20
    expect(angleAt(52, 76)).toBeCloseTo(90, 4); // (12, 16) from the centre, also 20 cells
  });

  test('on the baseline and its extension the bearings are parallel: weak', () => {
    expect(angleAt(80, 60)).toBeCloseTo(0, 6);
    expect(angleAt(40, 60)).toBeCloseTo(0, 6);
    expect(classAt(80, 60)).toBe(CROSS_BEARING_CLASS.weak);
    expect(classAt(20, 60)).toBe(CROSS_BEARING_CLASS.weak); // A's own cell: no bearing from A
  });

  test('the band: a 20° crossing is weak; 30° (default limit) and above good; a 60° limit moves the line', () => {
    // A cell where the bearings cross at about 20°: far out on the perpendicular bisector.
    // Half the baseline is 20 cells; tan(10°) = 20/d → d = 113 cells — take 110 rows above (clamped grid).
    const wide = gridOf(100, 200);
    const all = classesFrom(wide, () => VISIBILITY_CLASS.seen);
    const two: CoveragePost[] = [
      { col: 20, row: 180, classes: all },
      { col: 60, row: 180, classes: all },
    ];
    const c = crossBearingQuality(countPostsPerCell(wide, two), two);
    const at = (col: number, row: number) => ({
      angle: (c.bestAngle[row * 100 + col]! * 180) / Math.PI,
      cls: c.classes[row * 100 + col],
    });
    const far = at(40, 180 - 113);
    expect(far.angle).toBeCloseTo((2 * Math.atan(20 / 113) * 180) / Math.PI, 3);
    expect(far.cls).toBe(CROSS_BEARING_CLASS.weak);
    // 2·atan(20/d) = 30° at d = 20/tan(15°) = 74.6 cells: 74 rows up is just above 30°.
    expect(at(40, 180 - 74).cls).toBe(CROSS_BEARING_CLASS.good);
    expect(at(40, 180 - 75).cls).toBe(CROSS_BEARING_CLASS.weak);
    const strict = crossBearingQuality(counts, posts, { minCrossingAngle: 60 * DEG });
    expect(strict.classes[30 * 100 + 20]).toBe(CROSS_BEARING_CLASS.weak); // 53.13° < 60°
    expect(strict.classes[40 * 100 + 40]).toBe(CROSS_BEARING_CLASS.good); // 90°
    expect(strict.minCrossingAngle).toBe(60 * DEG);
  });
});

/** Reference: every pair, bearings with atan2, folded to [0, π/2]. */
function naiveBest(posts: readonly CoveragePost[], seenBy: readonly number[], col: number, row: number): number {
  let best = 0;
  for (let a = 0; a < seenBy.length; a++) {
    for (let b = a + 1; b < seenBy.length; b++) {
      const pa = posts[seenBy[a]!]!;
      const pb = posts[seenBy[b]!]!;
      if ((pa.col === col && pa.row === row) || (pb.col === col && pb.row === row)) continue;
      const ba = Math.atan2(col - pa.col, pa.row - row);
      const bb = Math.atan2(col - pb.col, pb.row - row);
      let d = Math.abs(ba - bb) % Math.PI;
      if (d > Math.PI / 2) d = Math.PI - d;
      if (d > best) best = d;
    }
  }
  return best;
}

describe('crossBearingQuality against all pairs (brute force)', () => {
  test.each([
    { n: 5, seed: 1 },
    { n: 12, seed: 2 },
    { n: 30, seed: 3 },
  ])('$n posts with random visibility and sectors', ({ n, seed }) => {
    const random = seededRandom(seed);
    const grid = gridOf(70, 60);
    const posts: CoveragePost[] = Array.from({ length: n }, (_, p) => {
      const share = 0.4 + 0.5 * random();
      const classes = classesFrom(grid, () => {
        const u = random();
        return u < share ? (u < share / 2 ? VISIBILITY_CLASS.seen : VISIBILITY_CLASS.targetOnly) : VISIBILITY_CLASS.blind;
      });
      const from = random() * 2 * Math.PI;
      return {
        col: Math.floor(random() * grid.width),
        row: Math.floor(random() * grid.height),
        classes,
        sector: p % 3 === 0 ? { from, to: from + (0.5 + random() * 5) } : null,
      };
    });
    const counts = countPostsPerCell(grid, posts);
    const cross = crossBearingQuality(counts, posts);
    const perPost = posts.map((p) => countPostsPerCell(grid, [p]).counts);
    let sortedPath = 0;
    let worst = 0;
    let classMismatch = 0;
    for (let row = 0; row < grid.height; row++) {
      for (let col = 0; col < grid.width; col++) {
        const i = row * grid.width + col;
        const seenBy = perPost.flatMap((c, p) => (c[i] === 1 ? [p] : []));
        const k = seenBy.length;
        if (k > 16) sortedPath++;
        const expectedClass = k === 0 ? CROSS_BEARING_CLASS.none : k === 1 ? CROSS_BEARING_CLASS.single : undefined;
        if (expectedClass !== undefined) {
          if (cross.classes[i] !== expectedClass || !Number.isNaN(cross.bestAngle[i])) classMismatch++;
          continue;
        }
        const best = naiveBest(posts, seenBy, col, row);
        worst = Math.max(worst, Math.abs(best - cross.bestAngle[i]!));
        const cls = best >= 30 * DEG ? CROSS_BEARING_CLASS.good : CROSS_BEARING_CLASS.weak;
        if (Math.abs(best - 30 * DEG) > 1e-6 && cross.classes[i] !== cls) classMismatch++;
      }
    }
    expect(classMismatch).toBe(0);
    expect(worst).toBeLessThan(1e-6); // radians; Float32 storage rounds to ~1e-7
    if (n === 30) expect(sortedPath).toBeGreaterThan(100); // the O(k log k) path was exercised
  });
});

describe('crossBearingQuality: inputs', () => {
  const grid = gridOf(8, 6);
  const everywhere = classesFrom(grid, () => VISIBILITY_CLASS.seen);
  const half = classesFrom(grid, (col) => (col < 4 ? VISIBILITY_CLASS.seen : VISIBILITY_CLASS.blind));
  const posts: CoveragePost[] = [
    { col: 0, row: 0, classes: everywhere },
    { col: 7, row: 5, classes: half },
  ];
  const counts = countPostsPerCell(grid, posts);

  test('classes follow the counts: none, single, and weak/good only where two or more see', () => {
    const cross = crossBearingQuality(counts, posts);
    for (let i = 0; i < counts.counts.length; i++) {
      const c = counts.counts[i]!;
      const cls = cross.classes[i]!;
      if (c === 0) expect(cls).toBe(CROSS_BEARING_CLASS.none);
      else if (c === 1) expect(cls).toBe(CROSS_BEARING_CLASS.single);
      else expect([CROSS_BEARING_CLASS.weak, CROSS_BEARING_CLASS.good]).toContain(cls);
    }
  });

  test('does not mutate its inputs', () => {
    const before = { counts: Uint8Array.from(counts.counts), a: Uint8Array.from(everywhere), b: Uint8Array.from(half) };
    crossBearingQuality(counts, posts);
    expect(mismatches(counts.counts, before.counts) + mismatches(everywhere, before.a) + mismatches(half, before.b)).toBe(0);
  });

  test('refuses posts that do not match the counts, and bad bands', () => {
    expect(() => crossBearingQuality(counts, [posts[0]!])).toThrow(
      expect.objectContaining({ code: 'invalid-post', field: 'posts' }),
    );
    // Checked where the counts say two or more: here the second post no longer sees anything.
    const blind = classesFrom(grid, () => VISIBILITY_CLASS.blind);
    expect(() => crossBearingQuality(counts, [posts[0]!, { ...posts[1]!, classes: blind }])).toThrow(
      expect.objectContaining({ code: 'invalid-post' }),
    );
    for (const bad of [0, -0.1, 2, NaN]) {
      expect(() => crossBearingQuality(counts, posts, { minCrossingAngle: bad })).toThrow(
        expect.objectContaining({ code: 'invalid-option', field: 'minCrossingAngle' }),
      );
    }
    expect(() => crossBearingQuality({ ...counts, counts: new Uint8Array(3) }, posts)).toThrow(
      expect.objectContaining({ code: 'invalid-layer' }),
    );
  });
});
