/** One line of a benchmark's report: a figure, its unit and what it was measured on. */
export interface BenchRow {
  name: string;
  value: number;
  unit: string;
  detail?: string;
}

/** The upper median (the middle value; of an even count, the higher of the two middle ones). */
export function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] as number;
}

/** Median wall-clock time of `runs` calls of `fn`, ms; with `warmUp`, one call first that is not counted. */
export function timed(fn: () => void, runs: number, { warmUp = false }: { warmUp?: boolean } = {}): number {
  if (warmUp) fn();
  const times: number[] = [];
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    fn();
    times.push(performance.now() - t0);
  }
  return median(times);
}
