/**
 * Benchmark of the sightline use case and its hottest core function.
 * Measurement only (no assertions); the bench runner calls
 * `benchSightline()` and reports the numbers. Speed is never a test.
 */
import { evaluateSightline } from '@/shared/sightline/evaluate-sightline';
import type { SightlineRequest } from '@/shared/schemas/sightline';
import { hiddenHeight, REFRACTION_PRESET_IDS } from '@/shared/sightline';

/** One measured case. */
export interface BenchResult {
  name: string;
  opsPerSec: number;
}

const WARM_UP_ITERATIONS = 500;
const MIN_DURATION_MS = 400;
const BATCH = 200;

/** Runs `work` in batches until at least `MIN_DURATION_MS` has passed; returns calls per second. */
function measure(work: (i: number) => number): number {
  let sink = 0;
  for (let i = 0; i < WARM_UP_ITERATIONS; i += 1) sink += work(i);
  let iterations = 0;
  const start = performance.now();
  let elapsed = 0;
  while (elapsed < MIN_DURATION_MS) {
    for (let i = 0; i < BATCH; i += 1) sink += work(iterations + i);
    iterations += BATCH;
    elapsed = performance.now() - start;
  }
  if (Number.isNaN(sink)) throw new Error('benchmark produced NaN');
  return (iterations / elapsed) * 1000;
}

const yieldToEventLoop = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

const ONE_CONDITION: SightlineRequest = {
  observerHeightM: 45,
  targetHeightM: 12,
  distanceM: 28_000,
  requiredVisibleM: 2,
  visibilityM: 35_000,
  targetSizeM: 6,
  conditions: [{ preset: 'standard-optical' }],
};

const ALL_PRESETS: SightlineRequest = {
  ...ONE_CONDITION,
  conditions: REFRACTION_PRESET_IDS.map((preset) => ({ preset })),
};

/**
 * Times `evaluateSightline` (per request, and per condition evaluated) and
 * `hiddenHeight`.
 *
 * @returns one entry per case, in calls (or condition evaluations) per second
 */
export async function benchSightline(): Promise<BenchResult[]> {
  const results: BenchResult[] = [];

  const single = measure((i) => evaluateSightline({ ...ONE_CONDITION, distanceM: 20_000 + (i % 100) * 100 }).results.length);
  results.push({ name: 'evaluateSightline, 1 condition (requests/s)', opsPerSec: single });
  await yieldToEventLoop();

  const many = measure((i) => evaluateSightline({ ...ALL_PRESETS, distanceM: 20_000 + (i % 100) * 100 }).results.length);
  results.push({ name: `evaluateSightline, ${ALL_PRESETS.conditions.length} conditions (requests/s)`, opsPerSec: many });
  results.push({ name: 'evaluateSightline core evaluations (conditions/s)', opsPerSec: many * ALL_PRESETS.conditions.length });
  await yieldToEventLoop();

  const hidden = measure((i) => hiddenHeight(30, 10_000 + (i % 1000) * 50, { k: 0.13 }).value ?? 0);
  results.push({ name: 'hiddenHeight (calls/s)', opsPerSec: hidden });

  return results;
}
