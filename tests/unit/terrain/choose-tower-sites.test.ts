import { chooseTowerSites, type SitingOption } from '@/shared/terrain/choose-tower-sites';
import { countPostsPerCell } from '@/shared/terrain/posts-per-cell';
import { CROSS_BEARING_CLASS, crossBearingQuality } from '@/shared/terrain/cross-bearing-quality';
import { bitsetOf, objectiveOf, weightOf, type SitingObjective } from '@/shared/terrain/siting-objective';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';
import { gridOf, seededRandom } from '@/tests/unit/terrain/coverage-fixtures';

const W = 16;
const H = 12;

/** A random disc of seen cells around (col, row), radius r, with holes (a ridge's shadow). */
function disc(random: () => number, col: number, row: number, r: number, holes: number): (i: number) => boolean {
  const shade = new Set<number>();
  for (let h = 0; h < holes; h++) shade.add(Math.floor(random() * W * H));
  return (i) => {
    const c = i % W;
    const rr = Math.floor(i / W);
    return !shade.has(i) && (c - col) ** 2 + (rr - row) ** 2 <= r * r;
  };
}

/** Random options: `locations` places, `heights` each; a taller tower sees a superset (a wider disc). */
function randomCase(seed: number, locations: number, heights: number, minPosts: 1 | 2 = 1) {
  const random = seededRandom(seed);
  const weights = new Float32Array(W * H).map(() => (random() < 0.2 ? 9 : 1));
  const objective: SitingObjective = { cellCount: W * H, width: W, height: H, weights, minPosts };
  const options: SitingOption[] = [];
  for (let l = 0; l < locations; l++) {
    const col = Math.floor(random() * W);
    const row = Math.floor(random() * H);
    const base = 2 + random() * 4;
    const holes = Math.floor(random() * 30);
    const holeSeed = Math.floor(random() * 1e9);
    for (let h = 0; h < heights; h++) {
      const seen = disc(seededRandom(holeSeed), col, row, base + 1.5 * h, holes);
      options.push({ location: l, heightM: 10 * h, cost: 1 + h, col, row, seen: bitsetOf(W * H, seen) });
    }
  }
  return { objective, options };
}

describe('chooseTowerSites', () => {
  it('greedy equals the enumerated optimum for one new post', () => {
    // Source: Nemhauser, Wolsey & Fisher 1978, Math. Programming 14 — greedy's first step is the best
    // single element, so for N = 1 it is the optimum (the bound is 1 − (1 − 1/N)^N = 1 at N = 1).
    for (let seed = 1; seed <= 40; seed++) {
      const { objective, options } = randomCase(seed, 4, 3);
      const exact = chooseTowerSites({ objective, kept: [], options, count: 1, method: 'exact' });
      const greedy = chooseTowerSites({ objective, kept: [], options, count: 1, method: 'greedy', swap: false });
      expect(exact.method).toBe('exact');
      expect(greedy.total).toBeCloseTo(exact.total, 6);
    }
  });

  it('greedy reaches at least (1 − 1/e) of the optimum on small random cases', () => {
    // Source: Nemhauser, Wolsey & Fisher 1978, "An analysis of approximations for maximizing submodular
    // set functions — I", Theorem 4.2 (bound 1 − (1 − 1/N)^N ≥ 1 − 1/e for monotone submodular functions).
    const bound = 1 - 1 / Math.E;
    let worst = Infinity;
    for (let seed = 100; seed < 160; seed++) {
      for (const count of [2, 3]) {
        const { objective, options } = randomCase(seed, 6, 2);
        const kept = seed % 3 === 0 ? [options[0]!] : [];
        const exact = chooseTowerSites({ objective, kept, options, count, method: 'exact' });
        const greedy = chooseTowerSites({ objective, kept, options, count, method: 'greedy', swap: false });
        const ratio = (greedy.total - exact.keptTotal) / (exact.total - exact.keptTotal);
        worst = Math.min(worst, ratio);
        expect(greedy.total).toBeLessThanOrEqual(exact.total + 1e-9);
        expect(greedy.total - exact.keptTotal).toBeGreaterThanOrEqual(bound * (exact.total - exact.keptTotal) - 1e-9);
      }
    }
    expect(worst).toBeGreaterThanOrEqual(bound);
  });

  it('lazy greedy picks the same as greedy that recomputes every gain', () => {
    // Source: Minoux 1978, "Accelerated greedy algorithms for maximizing submodular set functions":
    // with a submodular objective a stale gain is an upper bound, so lazy evaluation changes nothing.
    for (let seed = 300; seed < 320; seed++) {
      const { objective, options } = randomCase(seed, 20, 3);
      const lazy = chooseTowerSites({ objective, kept: [], options, count: 5, method: 'greedy', swap: false });
      // The ≥ 2 code path recomputes every gain; with minPosts 1 weights, emulate it by a manual greedy.
      const chosen: number[] = [];
      for (let round = 0; round < 5; round++) {
        let best = -1;
        let bestGain = -1;
        const base = objectiveOf(
          objective,
          chosen.map((i) => options[i]!),
        );
        options.forEach((o, i) => {
          if (chosen.some((c) => options[c]!.location === o.location)) return;
          const gain = objectiveOf(objective, [...chosen.map((c) => options[c]!), o]) - base;
          if (gain > bestGain || (gain === bestGain && o.heightM > options[best]!.heightM)) {
            best = i;
            bestGain = gain;
          }
        });
        if (bestGain <= 0) break;
        chosen.push(best);
      }
      expect(lazy.steps.map((s) => s.option)).toEqual(chosen);
      expect(lazy.evaluations).toBeLessThan(20 * 3 * 5);
    }
  });

  it('the swap pass never lowers the objective and mends the textbook trap', () => {
    // Source: the classic greedy trap of maximum coverage (a large set overlapping two disjoint
    // halves; e.g. Vazirani, "Approximation Algorithms", 2001, ch. 2 — from memory).
    const n = 8;
    const objective: SitingObjective = { cellCount: n, width: n, height: 1, weights: new Float32Array(n).fill(1), minPosts: 1 };
    const set = (cells: number[]) => bitsetOf(n, (i) => cells.includes(i));
    const options: SitingOption[] = [
      { location: 0, heightM: 0, cost: 0, col: 0, row: 0, seen: set([0, 1, 2, 3]) },
      { location: 1, heightM: 0, cost: 0, col: 7, row: 0, seen: set([4, 5, 6, 7]) },
      { location: 2, heightM: 0, cost: 0, col: 3, row: 0, seen: set([1, 2, 3, 4, 5]) },
    ];
    const plain = chooseTowerSites({ objective, kept: [], options, count: 2, method: 'greedy', swap: false });
    const swapped = chooseTowerSites({ objective, kept: [], options, count: 2, method: 'greedy' });
    expect(plain.total).toBe(7);
    expect(swapped.total).toBe(8);
    expect(swapped.swaps).toBeGreaterThan(0);

    for (let seed = 500; seed < 540; seed++) {
      for (const minPosts of [1, 2] as const) {
        const { objective: o, options: opts } = randomCase(seed, 10, 2, minPosts);
        const a = chooseTowerSites({ objective: o, kept: [], options: opts, count: 3, method: 'greedy', swap: false });
        const b = chooseTowerSites({ objective: o, kept: [], options: opts, count: 3, method: 'greedy' });
        expect(b.total).toBeGreaterThanOrEqual(a.total - 1e-9);
      }
    }
  });

  it('the swap pass picks what trying every swap in full picks', () => {
    // Source: the swap pass as documented on chooseTowerSites (each position in turn, the option that
    // raises the objective most, the first of equal ones in the order of what each adds alone; ≤ 5
    // passes); the reference below recomputes every candidate set's objective from scratch, so the
    // fast path (shared weights through a word index) must give the same sets and totals.
    const fullSwap = (
      objective: SitingObjective,
      options: SitingOption[],
      kept: SitingOption[],
      start: number[],
      budget: number | null,
    ) => {
      const totalOf = (set: number[]) => objectiveOf(objective, [...kept, ...set.map((i) => options[i]!)]);
      const alone = options.map((_, i) => totalOf([i]) - totalOf([]));
      const order = options.map((_, i) => i).sort((a, b) => alone[b]! - alone[a]! || a - b);
      const set = [...start];
      let current = totalOf(set);
      for (let pass = 0; pass < 5; pass++) {
        let improved = false;
        for (let k = 0; k < set.length; k++) {
          const others = set.filter((_, j) => j !== k);
          let best = -1;
          let bestTotal = current;
          for (const i of order) {
            if (set.includes(i) || others.some((j) => options[j]!.location === options[i]!.location)) continue;
            if (budget !== null && [...others, i].reduce((sum, j) => sum + options[j]!.cost, 0) > budget + 1e-9) continue;
            const total = totalOf([...others, i]);
            if (total > bestTotal) {
              best = i;
              bestTotal = total;
            }
          }
          if (best !== -1) {
            set[k] = best;
            current = bestTotal;
            improved = true;
          }
        }
        if (!improved) break;
      }
      return { set, total: current };
    };
    let swapsSeen = 0;
    for (let seed = 900; seed < 960; seed++) {
      const { objective, options } = randomCase(seed, 14, 3);
      const kept = seed % 3 === 0 ? [options[0]!] : [];
      const budget = seed % 4 === 0 ? 9 : null;
      const input = { objective, kept, options, count: 4, method: 'greedy' as const, budget };
      const plain = chooseTowerSites({ ...input, swap: false });
      const swapped = chooseTowerSites(input);
      const reference = fullSwap(
        objective,
        options,
        kept,
        plain.steps.map((s) => s.option),
        budget,
      );
      expect(new Set(swapped.steps.map((s) => s.option))).toEqual(new Set(reference.set));
      expect(swapped.total).toBe(reference.total);
      swapsSeen += swapped.swaps;
    }
    // The cases must exercise swaps, or the comparison proves little.
    expect(swapsSeen).toBeGreaterThan(5);
  });

  it('chooses at most one height per location and keeps to the budget', () => {
    // common practice, no source: one tower per site; the budget is a hard limit.
    for (let seed = 700; seed < 720; seed++) {
      const { objective, options } = randomCase(seed, 5, 4);
      for (const method of ['exact', 'greedy'] as const) {
        const choice = chooseTowerSites({ objective, kept: [], options, count: 3, method, budget: 6 });
        const locations = choice.steps.map((s) => options[s.option]!.location);
        expect(new Set(locations).size).toBe(locations.length);
        expect(choice.steps.reduce((sum, s) => sum + options[s.option]!.cost, 0)).toBeLessThanOrEqual(6);
      }
    }
  });

  it('counts good cross-bearings exactly as crossBearingQuality does', () => {
    // Source: crossBearingQuality's definition (best pair's angle from parallel ≥ 30°), the figure
    // coverage runs report; the siting objective must give the same cells.
    const random = seededRandom(42);
    const grid = gridOf(W, H);
    const posts = [0, 1, 2, 3].map(() => {
      const col = Math.floor(random() * W);
      const row = Math.floor(random() * H);
      const see = disc(random, col, row, 4 + random() * 6, 20);
      const classes = new Uint8Array(W * H).map((_, i) => (see(i) ? VISIBILITY_CLASS.seen : VISIBILITY_CLASS.blind));
      return { col, row, classes };
    });
    const counts = countPostsPerCell(grid, posts);
    const cross = crossBearingQuality(counts, posts);
    const expected = cross.classes.reduce((n, c) => n + (c === CROSS_BEARING_CLASS.good ? 1 : 0), 0);
    const objective: SitingObjective = {
      cellCount: W * H,
      width: W,
      height: H,
      weights: new Float32Array(W * H).fill(1),
      minPosts: 2,
    };
    const views = posts.map((p) => ({
      col: p.col,
      row: p.row,
      seen: bitsetOf(W * H, (i) => p.classes[i] === VISIBILITY_CLASS.seen),
    }));
    expect(expected).toBeGreaterThan(0);
    expect(objectiveOf(objective, views)).toBe(expected);
    // The order the posts are added in does not change the total.
    expect(objectiveOf(objective, [...views].reverse())).toBe(expected);
  });

  it('counts two-post cells against the band limit at its extremes as the definition does', () => {
    // Source: crossBearingQuality's definition (the crossing angle q = min(θ, π − θ) of two bearing lines
    // lies in [0, π/2]): a limit of 0 counts every cell two posts see (but their own cells), a limit above
    // π/2 none, and 30° counts exactly the cells whose q ≥ 30°, tested here cell by cell with the arcsine.
    const random = seededRandom(4242);
    const views = [0, 1, 2].map(() => {
      const col = Math.floor(random() * W);
      const row = Math.floor(random() * H);
      return { col, row, seen: bitsetOf(W * H, disc(random, col, row, 5 + random() * 5, 10)) };
    });
    const has = (bits: Uint32Array, i: number) => ((bits[i >>> 5]! >>> (i & 31)) & 1) === 1;
    const count = (limit: number) => {
      let n = 0;
      for (let i = 0; i < W * H; i++) {
        const col = i % W;
        const row = (i - col) / W;
        const seers = views.filter((v) => has(v.seen, i) && (v.col !== col || v.row !== row));
        let good = false;
        for (let a = 0; a < seers.length && !good; a++) {
          for (let b = a + 1; b < seers.length && !good; b++) {
            const t1 = Math.atan2(col - seers[a]!.col, seers[a]!.row - row);
            const t2 = Math.atan2(col - seers[b]!.col, seers[b]!.row - row);
            let d = Math.abs(t1 - t2) % Math.PI;
            d = Math.min(d, Math.PI - d);
            good = d >= limit - 1e-9;
          }
        }
        if (good) n++;
      }
      return n;
    };
    const weights = new Float32Array(W * H).fill(1);
    const objective = (minCrossingAngle: number): SitingObjective => ({
      cellCount: W * H,
      width: W,
      height: H,
      weights,
      minPosts: 2,
      minCrossingAngle,
    });
    expect(count(Math.PI / 6)).toBeGreaterThan(0);
    for (const limit of [0, Math.PI / 6, Math.PI / 3, Math.PI / 2 + 0.1]) {
      expect(objectiveOf(objective(limit), views)).toBe(count(limit));
    }
    expect(objectiveOf(objective(Math.PI / 2 + 0.1), views)).toBe(0);
  });

  it('counts weights word by word exactly as cell by cell', () => {
    // Source: the definition of a weighted count (sum of the weights of the set cells); the popcount
    // path for words of one weight must give the same sum (common practice, no source).
    const random = seededRandom(77);
    const n = 32 * 40 + 13;
    const weights = new Float32Array(n).map((_, i) => (i >= 320 && i < 700 ? 9 : i % 97 === 0 ? 3 : 1));
    const bits = bitsetOf(n, () => random() < 0.4);
    const minus = bitsetOf(n, () => random() < 0.3);
    let expected = 0;
    for (let i = 0; i < n; i++) {
      const on = (bits[i >>> 5]! >>> (i & 31)) & 1 && !((minus[i >>> 5]! >>> (i & 31)) & 1);
      if (on) expected += weights[i]!;
    }
    expect(weightOf(bits, weights, minus)).toBe(expected);
  });

  it('refuses a count below one', () => {
    const { objective, options } = randomCase(1, 2, 1);
    expect(() => chooseTowerSites({ objective, kept: [], options, count: 0 })).toThrow(/at least one/);
  });

  it('does not modify its input', () => {
    const { objective, options } = randomCase(9, 6, 2);
    const before = options.map((o) => Array.from(o.seen));
    chooseTowerSites({ objective, kept: [], options, count: 3, method: 'greedy' });
    expect(options.map((o) => Array.from(o.seen))).toEqual(before);
  });
});
