import type { RefractionCondition } from '@/shared/schemas/sightline';
import { refractionFromRefractivityGradient } from '@/shared/sightline/refraction-from-refractivity-gradient';
import { refractionFromTemperatureGradient } from '@/shared/sightline/refraction-from-temperature-gradient';
import { refractionFromTwoTemperatures } from '@/shared/sightline/refraction-from-two-temperatures';
import { refractionPreset } from '@/shared/sightline/refraction-presets';
import { convertTemperature } from '@/shared/units/temperature';

/**
 * The refraction coefficient k of one refraction condition as the API takes
 * it: a given k, a named preset, pressure + temperature + lapse rate, two
 * temperatures at two heights, or a refractivity gradient. Units are
 * converted to SI here, at the edge (°C → K, N-units/km → N-units/m; the lapse
 * rate Γ is −dT/dh).
 *
 * Source: see the functions it delegates to (`refractionPreset`,
 * `refractionFromTemperatureGradient`, `refractionFromTwoTemperatures`,
 * `refractionFromRefractivityGradient`).
 *
 * @param condition one parsed condition (`RefractionConditionSchema`)
 * @param earthRadiusM earth radius, metres (used by the refractivity form)
 * @returns k, dimensionless
 * @example
 * refractionFromCondition({ preset: 'radio-four-thirds' }, 6_371_008.8); // 0.25
 */
export function refractionFromCondition(condition: RefractionCondition, earthRadiusM: number): number {
  if ('k' in condition) return condition.k;
  if ('preset' in condition) return refractionPreset(condition.preset).k;
  if ('refractivityGradientNPerKm' in condition) {
    return refractionFromRefractivityGradient(condition.refractivityGradientNPerKm / 1000, earthRadiusM);
  }
  if ('airTemperatureC' in condition) {
    return refractionFromTwoTemperatures({
      airTemperatureK: convertTemperature(condition.airTemperatureC, 'C'),
      surfaceTemperatureK: convertTemperature(condition.surfaceTemperatureC, 'C'),
      airHeightM: condition.airHeightM,
      surfaceHeightM: condition.surfaceHeightM,
      pressureHpa: condition.pressureHpa,
    });
  }
  // Lapse rate Γ is −dT/dh.
  return refractionFromTemperatureGradient({
    pressureHpa: condition.pressureHpa,
    temperatureK: convertTemperature(condition.temperatureC, 'C'),
    temperatureGradientKPerM: -condition.lapseRateKPerM,
  });
}
