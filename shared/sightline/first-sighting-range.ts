import { checkInput } from '@/shared/sightline/check-input';
import { horizonDistance } from '@/shared/sightline/horizon-distance';
import type { Derived, SphereOptions } from '@/shared/sightline/types';

/**
 * Distance at which a required visible part p of a target of height H first
 * shows above the observer's horizon: horizon(h) + horizon(H − p). With
 * p = 0 this is the geographic range; with p = H, the observer's own horizon
 * distance.
 *
 * @param observerHeightM - height of eye, metres, ≥ 0
 * @param targetHeightM - height of the target's top, metres, ≥ 0
 * @param requiredVisibleM - part that must show, metres, ≥ 0 (default 0)
 * @param options - `k` (default 0.13), `earthRadiusM` (default 6 371 008.8 m)
 * @returns metres (arc distance); `null` with `required-part-exceeds-target`
 *   when p > H, or `ducting` when k ≥ 1
 * @throws {SightlineInputError} on negative or non-finite input
 *
 * Source: geographic range (The American Practical Navigator, Bowditch, NGA
 * Pub. 9, Table 12) applied to the point H − p on the target; on the
 * effective sphere the hidden height at this range is exactly H − p.
 *
 * @example
 * firstSightingRange(10, 40, 10, { k: 0.13 }); // { value: 33 063, reason: null }
 */
export function firstSightingRange(
  observerHeightM: number,
  targetHeightM: number,
  requiredVisibleM = 0,
  options: SphereOptions = {},
): Derived {
  checkInput('targetHeightM', targetHeightM, { min: 0 });
  checkInput('requiredVisibleM', requiredVisibleM, { min: 0 });
  if (requiredVisibleM > targetHeightM) return { value: null, reason: 'required-part-exceeds-target' };
  const fromObserver = horizonDistance(observerHeightM, options);
  const fromPart = horizonDistance(targetHeightM - requiredVisibleM, options);
  if (fromObserver.value === null || fromPart.value === null) return { value: null, reason: 'ducting' };
  return { value: fromObserver.value + fromPart.value, reason: null };
}
