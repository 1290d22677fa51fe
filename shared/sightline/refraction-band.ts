import { checkInput } from '@/shared/sightline/check-input';
import { SightlineInputError } from '@/shared/sightline/sightline-error';

/** Range of k to sweep in {@link refractionBand}. */
export interface RefractionSweep {
  /** Lowest k (default 0). */
  readonly kMin?: number;
  /** Highest k, ≥ kMin (default 0.3). */
  readonly kMax?: number;
  /** Step, > 0 (default 0.05). At most 10 001 values are swept. */
  readonly step?: number;
}

/** One point of the sweep; `value` is null where the quantity does not exist at that k. */
export interface RefractionBandPoint {
  readonly k: number;
  readonly value: number | null;
}

/** Result of {@link refractionBand}. */
export interface RefractionBand {
  /** Every k swept, in increasing order, with the quantity's value. */
  readonly series: readonly RefractionBandPoint[];
  /** Least and greatest finite value over the sweep, with the k where each occurs; null when no k gave a value. */
  readonly min: RefractionBandPoint | null;
  readonly max: RefractionBandPoint | null;
}

/**
 * Uncertainty band of any sightline quantity over a range of refraction
 * coefficients: evaluates `quantity(k)` at kMin, kMin + step, …, kMax (kMax
 * always included) and reports the series with its extremes. Use it to show
 * how much a horizon, hidden height or detection range moves when k is not
 * known (typical daytime optical values lie between 0 and 0.3).
 *
 * Non-finite results are treated as missing (null), so the band never holds
 * NaN or Infinity.
 *
 * @param quantity - pure function of k returning a number or null
 * @param sweep - `kMin` (0), `kMax` (0.3), `step` (0.05)
 * @returns the series and its min/max
 * @throws {SightlineInputError} on non-finite bounds, kMax < kMin, step ≤ 0,
 *   or more than 10 001 points
 *
 * Source: sensitivity sweep (no published formula; the range 0…0.3 reflects
 * the spread of daytime optical k reported in geodetic-refraction practice).
 *
 * @example
 * refractionBand((k) => horizonDistance(10, { k }).value);
 * // min at k = 0 (11 288 m), max at k = 0.3 (13 492 m)
 */
export function refractionBand(quantity: (k: number) => number | null, sweep: RefractionSweep = {}): RefractionBand {
  const kMin = checkInput('kMin', sweep.kMin ?? 0);
  const kMax = checkInput('kMax', sweep.kMax ?? 0.3, { min: kMin });
  const step = checkInput('step', sweep.step ?? 0.05, { min: 0, minExclusive: true });
  const intervals = Math.ceil((kMax - kMin) / step - 1e-9);
  if (intervals > 10_000) {
    throw new SightlineInputError(
      'out-of-range',
      'step',
      `the sweep would have ${intervals + 1} points; at most 10 001 are allowed`,
    );
  }

  const series: RefractionBandPoint[] = [];
  let min: RefractionBandPoint | null = null;
  let max: RefractionBandPoint | null = null;
  for (let i = 0; i <= intervals; i += 1) {
    const raw = i === intervals ? kMax : kMin + i * step;
    const k = Math.round(raw * 1e12) / 1e12;
    const result = quantity(k);
    const value = result !== null && Number.isFinite(result) ? result : null;
    const point: RefractionBandPoint = { k, value };
    series.push(point);
    if (value !== null) {
      if (min === null || min.value === null || value < min.value) min = point;
      if (max === null || max.value === null || value > max.value) max = point;
    }
  }
  return { series, min, max };
}
