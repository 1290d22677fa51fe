/**
 * Benchmark of the siting choice alone (the viewsheds are the engine's
 * benchmark): 100 candidates × 3 heights on a 2000² grid, one condition,
 * choosing 10 towers with lazy greedy, then the swap pass. Views are discs
 * with a random shadow pattern (a taller tower a wider disc). Measurement
 * only; speed is never a test.
 */
import { loadavg } from 'node:os';
import { chooseTowerSites, type SitingOption } from '@/shared/terrain/choose-tower-sites';
import { bitsetWords, type SitingObjective } from '@/shared/terrain/siting-objective';

export interface SitingBenchRow {
  name: string;
  value: number;
  unit: string;
  detail?: string;
}

function seeded(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export async function benchSiting(): Promise<SitingBenchRow[]> {
  const W = 2000;
  const H = 2000;
  const N = W * H;
  const random = seeded(2026);
  // A priority zone (weight 9) in one quarter, 1 elsewhere.
  const weights = new Float32Array(N).map((_, i) => (i % W < W / 2 && i < N / 2 ? 9 : 1));
  const objective: SitingObjective = { cellCount: N, width: W, height: H, weights, minPosts: 1 };
  const options: SitingOption[] = [];
  const built = performance.now();
  for (let l = 0; l < 100; l++) {
    const col = Math.floor(random() * W);
    const row = Math.floor(random() * H);
    const shade = Math.floor(random() * 16);
    for (let h = 0; h < 3; h++) {
      const r = 150 + 120 * h + random() * 80;
      const seen = new Uint32Array(bitsetWords(N));
      for (let y = Math.max(0, Math.floor(row - r)); y < Math.min(H, Math.ceil(row + r)); y++) {
        const span = Math.sqrt(Math.max(0, r * r - (y - row) ** 2));
        for (let x = Math.max(0, Math.floor(col - span)); x < Math.min(W, Math.ceil(col + span)); x++) {
          // Shadows: a stripe pattern per place, as ridges hide ground in bands.
          if (((x + y + shade) >> 5) % 5 === 0) continue;
          const i = y * W + x;
          seen[i >>> 5]! |= 1 << (i & 31);
        }
      }
      options.push({ location: l, heightM: 10 * h, cost: 1 + h, col, row, seen });
    }
  }
  const buildS = (performance.now() - built) / 1000;
  const rows: SitingBenchRow[] = [];
  // Each run gets fresh copies of the bitsets, so the words each post sees are found again (cold, as in a
  // siting run, where the choice is made once); CPU time beside wall time, as the machine is shared.
  const time = (label: string, run: (fresh: SitingOption[]) => ReturnType<typeof chooseTowerSites>) => {
    const walls: number[] = [];
    const cpus: number[] = [];
    let evaluations = 0;
    for (let k = 0; k < 5; k++) {
      const fresh = options.map((o) => ({ ...o, seen: o.seen.slice() }));
      const cpu = process.cpuUsage();
      const t = performance.now();
      evaluations = run(fresh).evaluations;
      walls.push((performance.now() - t) / 1000);
      const used = process.cpuUsage(cpu);
      cpus.push((used.user + used.system) / 1e6);
    }
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[2]!;
    rows.push({
      name: label,
      value: median(walls),
      unit: 's',
      detail: `median of 5 cold, CPU ${median(cpus).toFixed(3)} s, load ${loadavg()[0]!.toFixed(1)}, ${evaluations} gains computed`,
    });
  };
  time('greedy choice of 10 (lazy), 300 options, 2000²', (fresh) =>
    chooseTowerSites({ objective, kept: [], options: fresh, count: 10, method: 'greedy', swap: false }),
  );
  time('greedy choice of 10, two posts with good cross-bearings', (fresh) =>
    chooseTowerSites({
      objective: { ...objective, minPosts: 2 },
      kept: [],
      options: fresh,
      count: 10,
      method: 'greedy',
      swap: false,
    }),
  );
  time('greedy (one post) + swap pass, same options', (fresh) =>
    chooseTowerSites({ objective, kept: [], options: fresh, count: 10, method: 'greedy' }),
  );
  const mem = process.memoryUsage();
  rows.push({ name: 'option bitsets built (setup, not the choice)', value: buildS, unit: 's' });
  rows.push({
    name: 'heap used after the runs',
    value: mem.heapUsed / 2 ** 20,
    unit: 'MB',
    detail: `rss ${Math.round(mem.rss / 2 ** 20)} MB`,
  });
  return rows;
}
