import { checkInput } from '@/shared/sightline/check-input';
import { SEA_STATE_WAVE_HEIGHT_M } from '@/shared/sightline/constants';
import { SightlineInputError } from '@/shared/sightline/sightline-error';

/** The sea, given as a Douglas degree or a significant wave height. */
export type SeaInput = { readonly seaState: number } | { readonly significantWaveHeightM: number };

/**
 * Height of the wave crests that screen a low target floating on the sea,
 * metres above the mean surface: half the significant wave height H_s (in a
 * linear sea a crest stands half the crest-to-trough height above the mean
 * level). A target on the water counts only with the part of it that stands
 * above this screen: a head 0.3 m above the water is hidden by crests of
 * 0.625 m (sea state 3, H_s up to 1.25 m). The screen is conservative — a
 * target rises with the swell and shows now and then between crests — and it
 * does not depend on range.
 *
 * A sea-state degree is turned into H_s by the upper edge of its range in
 * WMO code table 3700 (`SEA_STATE_WAVE_HEIGHT_M`).
 *
 * @param sea - `{ seaState }` (whole degree 0–9) or `{ significantWaveHeightM }` (0–30 m)
 * @returns metres, ≥ 0
 * @throws {SightlineInputError} on a degree outside 0–9 or not whole, or a
 *   wave height outside 0–30 m
 *
 * Source: linear (Airy) wave theory, crest amplitude = H/2 (e.g. the US Army
 * Corps of Engineers Coastal Engineering Manual, EM 1110-2-1100, Part II-1)
 * — from memory; significant wave heights of the sea-state degrees: WMO code
 * table 3700.
 *
 * @example
 * waveScreenHeight({ seaState: 3 }); // 0.625
 * waveScreenHeight({ significantWaveHeightM: 2 }); // 1
 */
export function waveScreenHeight(sea: SeaInput): number {
  if ('seaState' in sea) {
    const degree = checkInput('seaState', sea.seaState, { min: 0, max: 9 });
    if (!Number.isInteger(degree)) {
      throw new SightlineInputError('out-of-range', 'seaState', `seaState must be a whole degree 0–9, got ${degree}`);
    }
    return SEA_STATE_WAVE_HEIGHT_M[degree]! / 2;
  }
  return checkInput('significantWaveHeightM', sea.significantWaveHeightM, { min: 0, max: 30 }) / 2;
}

/** The wave screen of a request: from its sea state or significant wave height, else 0. */
export function waveScreenOf(request: { readonly seaState?: number; readonly significantWaveHeightM?: number }): number {
  if (request.significantWaveHeightM !== undefined)
    return waveScreenHeight({ significantWaveHeightM: request.significantWaveHeightM });
  if (request.seaState !== undefined) return waveScreenHeight({ seaState: request.seaState });
  return 0;
}
