import { checkInput } from '@/shared/sightline/check-input';

/** Inputs of {@link refractionFromTemperatureGradient}. */
export interface TemperatureGradientInput {
  /** Air pressure along the sightline, hPa, in (0, 1200]. */
  readonly pressureHpa: number;
  /** Air temperature along the sightline, K, > 0. */
  readonly temperatureK: number;
  /**
   * Vertical temperature gradient dT/dh, K/m: negative when the air cools
   * with height (standard atmosphere −0.0065), positive in an inversion.
   * Note: this is the gradient, i.e. minus the meteorological lapse rate.
   */
  readonly temperatureGradientKPerM: number;
}

/**
 * Refraction coefficient of a near-horizontal optical sightline from the air
 * pressure, temperature and vertical temperature gradient:
 * k ≈ 503 · P / T² · (0.0343 + dT/dh)   (P in hPa, T in K, dT/dh in K/m).
 *
 * Derivation: visible-light refractivity of dry air N ≈ 79 · P/T; with the
 * hydrostatic equation dP/dh = −g P / (R_air T) the gradient is
 * dN/dh = −79 · P/T² · (g/R_air + dT/dh), g/R_air ≈ 0.0342 K/m (the
 * "autoconvective" gradient at which air density is constant with height),
 * and k = −R · dn/dh = 6.371 × 10⁶ m · 79 × 10⁻⁶ · P/T² · (…) ≈ 503 · P/T² · (…).
 *
 * @param input - pressure (hPa), temperature (K), gradient dT/dh (K/m)
 * @returns k, dimensionless (negative for strongly cooling air near hot
 *   ground, above 1 in strong inversions)
 * @throws {SightlineInputError} on non-finite input, pressure outside
 *   (0, 1200] hPa, or temperature ≤ 0 K
 *
 * Source: the standard geodetic-refraction relation between k and the
 * temperature gradient, as given in surveying literature (stated from
 * memory and re-derived above).
 *
 * @example
 * // standard atmosphere at sea level
 * refractionFromTemperatureGradient({ pressureHpa: 1013.25, temperatureK: 288.15, temperatureGradientKPerM: -0.0065 }); // ≈ 0.170
 */
export function refractionFromTemperatureGradient(input: TemperatureGradientInput): number {
  const pressure = checkInput('pressureHpa', input.pressureHpa, { min: 0, max: 1200, minExclusive: true });
  const temperature = checkInput('temperatureK', input.temperatureK, { min: 0, minExclusive: true });
  const gradient = checkInput('temperatureGradientKPerM', input.temperatureGradientKPerM);
  return ((503 * pressure) / (temperature * temperature)) * (0.0343 + gradient);
}
