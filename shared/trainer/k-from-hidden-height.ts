import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';
import { checkInput } from '@/shared/sightline/check-input';
import { hiddenHeight } from '@/shared/sightline/hidden-height';

/** Lowest k searched: a sub-refraction far beyond anything observed near the ground. */
export const K_SEARCH_MIN = -10;

/**
 * The refraction coefficient at which a mark at surface distance `d` is
 * hidden up to `hiddenM` metres from an eye at `h`: solves the exact
 * hidden-height relation of `hiddenHeight` for k.
 *
 * The hidden height falls as k rises (a flatter effective earth hides less)
 * and reaches 0 where the horizon distance equals d; there is no closed form
 * for k on the exact sphere, so k is found by bisection on [−10, 1) to
 * 10⁻¹² (the hidden height is continuous and non-increasing in k; a point
 * past the effective quarter circle counts as infinitely hidden).
 *
 * - `hiddenM` > 0: the one k with hiddenHeight(h, d, k) = hiddenM.
 * - `hiddenM` = 0: the *least* k at which nothing is hidden (the horizon
 *   just reaches the mark); every larger k hides nothing either, so it is a
 *   lower bound.
 *
 * @param eyeHeightM - height of eye above the surface, metres, ≥ 0
 * @param distanceM - surface distance to the mark, metres, > 0
 * @param hiddenM - hidden part of the mark, metres, ≥ 0
 * @param earthRadiusM - radius of the Earth model, metres (default 6 371 008.8)
 * @returns k; `null` when even k = −10 hides less than `hiddenM` (no
 *   plausible refraction explains the sighting: check the inputs)
 * @throws {SightlineInputError} on negative or non-finite input
 *
 * Source: the hidden-height relation of `hiddenHeight` (the exact form of
 * the levelling correction (1 − k)d²/2R on the effective sphere); the
 * inversion by bisection is numerical, no published formula.
 *
 * @example
 * kFromHiddenHeight(10, 30_000, hiddenHeight(10, 30_000, { k: 0.2 }).value!); // 0.2
 */
export function kFromHiddenHeight(
  eyeHeightM: number,
  distanceM: number,
  hiddenM: number,
  earthRadiusM: number = MEAN_EARTH_RADIUS_M,
): number | null {
  checkInput('eyeHeightM', eyeHeightM, { min: 0 });
  checkInput('distanceM', distanceM, { min: 0, minExclusive: true });
  checkInput('hiddenM', hiddenM, { min: 0 });
  const hidden = (k: number) => hiddenHeight(eyeHeightM, distanceM, { k, earthRadiusM }).value ?? Number.POSITIVE_INFINITY;
  let low = K_SEARCH_MIN;
  // The hidden height at k just below 1 is 0; at low it is at its greatest.
  if (hidden(low) < hiddenM) return null;
  let high = 1;
  // Invariant: hidden(low) ≥ hiddenM, and hidden(high) < hiddenM or (hiddenM = 0 and high = 1).
  for (let i = 0; i < 200 && high - low > 1e-12; i += 1) {
    const mid = (low + high) / 2;
    if (hiddenM === 0 ? hidden(mid) > 0 : hidden(mid) >= hiddenM) low = mid;
    else high = mid;
  }
  return (low + high) / 2;
}
