import { checkInput } from '@/shared/sightline/check-input';
import { NAUTICAL_MILE_M } from '@/shared/physics/constants';
import { NIGHT_THRESHOLD_ILLUMINANCE_LUX } from '@/shared/sightline/constants';

/** Inputs of {@link luminousRange}. */
export interface LuminousRangeInput {
  /** Luminous intensity of the light towards the observer, candela, > 0. */
  readonly intensityCd: number;
  /**
   * Meteorological optical range (5 % contrast), metres, > 0; omit for the
   * nominal range (10 nautical miles of visibility, T = 0.74 per nmi).
   */
  readonly visibilityMorM?: number;
  /** Threshold illuminance at the eye, lux, > 0 (default 2 × 10⁻⁷, dark background). */
  readonly thresholdLux?: number;
}

/**
 * Luminous range of a point light: the distance d at which the illuminance
 * it gives at the eye falls to the threshold E_t, from Allard's law
 *
 *   E = I · T^(d / d₀) / d²,   T = 0.05^(d₀ / V)
 *
 * (T the transmissivity over d₀, V the meteorological optical range). The
 * left side falls monotonically with d, so the root is unique; it is found
 * by bisection on ln d to 1 mm. The result ignores the earth's curvature:
 * take the lesser of this and the geographic range.
 *
 * @param input - intensity (cd), visibility (MOR, m; default 10 nmi), threshold (lx; default 2 × 10⁻⁷)
 * @returns metres
 * @throws {SightlineInputError} on non-finite or non-positive input
 *
 * Source: Allard's law, CIE S 017:2020 term 17-31-025 (also IEC 60050-845);
 * nominal range: 0.2 µlx threshold and T = 0.74 per nautical mile for 10 nmi
 * of visibility (IALA Recommendation E-200-2, as quoted in the IES
 * definition "nominal range of a light signal").
 *
 * @example
 * luminousRange({ intensityCd: 1400 }); // ≈ 18 530 m (10 nmi, the nominal range)
 */
export function luminousRange(input: LuminousRangeInput): number {
  const intensity = checkInput('intensityCd', input.intensityCd, { min: 0, minExclusive: true });
  const visibility = checkInput('visibilityMorM', input.visibilityMorM ?? 10 * NAUTICAL_MILE_M, { min: 0, minExclusive: true });
  const threshold = checkInput('thresholdLux', input.thresholdLux ?? NIGHT_THRESHOLD_ILLUMINANCE_LUX, {
    min: 0,
    minExclusive: true,
  });
  // ln E(d) − ln E_t = ln I − ln E_t + (d/V)·ln 0.05 − 2 ln d, falling in d.
  const lnRatio = Math.log(intensity) - Math.log(threshold);
  const f = (d: number) => lnRatio + (d / visibility) * Math.log(0.05) - 2 * Math.log(d);
  let lo = 1e-6;
  let hi = 1;
  while (f(hi) > 0) hi *= 2;
  if (f(lo) <= 0) return 0;
  // Bisection in ln d: 200 halvings reach far below a millimetre at any scale used here.
  for (let i = 0; i < 200 && hi - lo > 1e-3; i++) {
    const mid = Math.sqrt(lo * hi);
    if (f(mid) > 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
