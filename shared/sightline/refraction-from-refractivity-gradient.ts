import { checkInput } from '@/shared/sightline/check-input';
import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';

/**
 * Refraction coefficient from a vertical gradient of refractivity
 * N = (n − 1) × 10⁶: k = −R · dN/dh · 10⁻⁶ (dN/dh in N-units per metre).
 * The radio standard −40 N/km gives k ≈ 0.25 (4/3 earth); −157 N/km gives
 * k ≈ 1, the onset of ducting.
 *
 * @param refractivityGradientNPerM - dN/dh, N-units per metre (divide a
 *   per-kilometre figure by 1000 at the edge)
 * @param earthRadiusM - R, metres (default 6 371 008.8)
 * @returns k, dimensionless
 * @throws {SightlineInputError} on non-finite input or a non-positive radius
 *
 * Source: Recommendation ITU-R P.834 (effects of tropospheric refraction)
 * and ITU-R P.453 (refractivity and its gradients): effective radius factor
 * K = 1 / (1 + R · dN/dh · 10⁻⁶), i.e. k = 1 − 1/K = −R · dN/dh · 10⁻⁶.
 *
 * @example
 * refractionFromRefractivityGradient(-0.040);  // ≈ 0.255
 * refractionFromRefractivityGradient(-0.157);  // ≈ 1.0
 */
export function refractionFromRefractivityGradient(
  refractivityGradientNPerM: number,
  earthRadiusM: number = MEAN_EARTH_RADIUS_M,
): number {
  checkInput('refractivityGradientNPerM', refractivityGradientNPerM);
  checkInput('earthRadiusM', earthRadiusM, { min: 0, minExclusive: true });
  return -earthRadiusM * refractivityGradientNPerM * 1e-6;
}
