import { checkInput } from '@/shared/sightline/check-input';
import { horizonDistance } from '@/shared/sightline/horizon-distance';
import type { Derived, SphereOptions } from '@/shared/sightline/types';

/**
 * Geographic range: the greatest surface distance at which the top of a
 * target can just be seen over the curve, horizon(observer) + horizon(target
 * top). Symmetric in the two heights.
 *
 * @param observerHeightM - height of eye, metres, ≥ 0
 * @param targetHeightM - height of the target's top, metres, ≥ 0
 * @param options - `k` (default 0.13), `earthRadiusM` (default 6 371 008.8 m)
 * @returns metres (arc distance); `null` with reason `ducting` when k ≥ 1
 *   (no geometric limit)
 * @throws {SightlineInputError} on negative or non-finite input
 *
 * Source: The American Practical Navigator (Bowditch, NGA Pub. 9),
 * "geographic range" of a light or object: the sum of the distances of the
 * horizon from the observer's eye and from the object (Table 12).
 *
 * @example
 * geographicRange(10, 40, { k: 0.13 }); // { value: 36 306, reason: null }
 */
export function geographicRange(observerHeightM: number, targetHeightM: number, options: SphereOptions = {}): Derived {
  checkInput('targetHeightM', targetHeightM, { min: 0 });
  const fromObserver = horizonDistance(observerHeightM, options);
  const fromTarget = horizonDistance(targetHeightM, options);
  if (fromObserver.value === null || fromTarget.value === null) return { value: null, reason: 'ducting' };
  return { value: fromObserver.value + fromTarget.value, reason: null };
}
