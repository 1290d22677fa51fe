import { checkInput } from '@/shared/sightline/check-input';
import { STANDARD_PRESSURE_HPA } from '@/shared/physics/constants';
import { refractionFromTemperatureGradient } from '@/shared/sightline/refraction-from-temperature-gradient';
import { SightlineInputError } from '@/shared/sightline/sightline-error';

/** Inputs of {@link refractionFromTwoTemperatures}. */
export interface TwoTemperaturesInput {
  /** Air temperature at the upper measuring height, K, > 0. */
  readonly airTemperatureK: number;
  /** Temperature at the lower height (e.g. the surface or sea), K, > 0. */
  readonly surfaceTemperatureK: number;
  /** Height of the air-temperature reading above the surface datum, metres. */
  readonly airHeightM: number;
  /** Height of the lower reading, metres (0 for the surface itself). */
  readonly surfaceHeightM: number;
  /** Air pressure, hPa (default 1013.25). */
  readonly pressureHpa?: number;
}

/**
 * Refraction coefficient from two temperature readings at two heights: the
 * gradient dT/dh = (T_air − T_surface) / (h_air − h_surface) between them,
 * their mean temperature, and the surveying relation of
 * `refractionFromTemperatureGradient`. A warm sea under cold air gives a
 * negative gradient steeper than −0.0343 K/m and so k < 0 (sub-refraction);
 * cold water under warm air gives an inversion and large k.
 *
 * The gradient is taken as uniform between (and beyond) the two heights — a
 * strong simplification near the surface, where it is usually far from
 * linear.
 *
 * @param input - temperatures (K), heights (m), optional pressure (hPa)
 * @returns k, dimensionless
 * @throws {SightlineInputError} on non-finite input, non-positive
 *   temperatures, or equal heights
 *
 * Source: finite-difference gradient plus the surveying relation
 * k ≈ 503 · P/T² · (0.0343 + dT/dh) (see `refractionFromTemperatureGradient`).
 *
 * @example
 * refractionFromTwoTemperatures({ airTemperatureK: 283.15, surfaceTemperatureK: 288.15, airHeightM: 10, surfaceHeightM: 0 });
 * // dT/dh = −0.5 K/m → k ≈ −2.91
 */
export function refractionFromTwoTemperatures(input: TwoTemperaturesInput): number {
  const airT = checkInput('airTemperatureK', input.airTemperatureK, { min: 0, minExclusive: true });
  const surfaceT = checkInput('surfaceTemperatureK', input.surfaceTemperatureK, { min: 0, minExclusive: true });
  const airH = checkInput('airHeightM', input.airHeightM);
  const surfaceH = checkInput('surfaceHeightM', input.surfaceHeightM);
  const span = airH - surfaceH;
  if (span === 0) {
    throw new SightlineInputError('out-of-range', 'airHeightM', 'airHeightM and surfaceHeightM must differ to give a gradient');
  }
  return refractionFromTemperatureGradient({
    pressureHpa: input.pressureHpa ?? STANDARD_PRESSURE_HPA,
    temperatureK: (airT + surfaceT) / 2,
    temperatureGradientKPerM: (airT - surfaceT) / span,
  });
}
