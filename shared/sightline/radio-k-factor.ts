import { checkInput } from '@/shared/sightline/check-input';
import type { Derived } from '@/shared/sightline/types';

/**
 * Radio engineers' effective-earth-radius factor K = R'/R = 1 / (1 − k)
 * (= 1 / (1 + R · dN/dh · 10⁻⁶)): 4/3 for the standard radio atmosphere.
 *
 * @param k - refraction coefficient, dimensionless
 * @returns K; `null` with reason `ducting` when k ≥ 1 (K infinite at k = 1
 *   and negative beyond: the effective surface is flat or concave)
 * @throws {SightlineInputError} on a non-finite k
 *
 * Source: IEC 60050-705 (705-05-41) effective radius of the Earth; ITU-R
 * P.834, k-factor K = 1 / (1 + R · dN/dh · 10⁻⁶).
 *
 * @example
 * radioKFactor(0.25); // { value: 1.3333, reason: null }
 */
export function radioKFactor(k: number): Derived {
  checkInput('k', k);
  if (k >= 1) return { value: null, reason: 'ducting' };
  return { value: 1 / (1 - k), reason: null };
}
