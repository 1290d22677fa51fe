import { checkInput } from '@/shared/sightline/check-input';
import { hiddenHeight } from '@/shared/sightline/hidden-height';
import type { Derived, SphereOptions } from '@/shared/sightline/types';

/**
 * Visible part of a target of height H at surface distance d: the part
 * above the observer's tangent sightline, max(0, H − hidden).
 *
 * @param observerHeightM - height of eye, metres, ≥ 0
 * @param targetHeightM - height of the target's top above the surface, metres, ≥ 0
 * @param distanceM - surface distance to the target, metres, ≥ 0
 * @param options - `k` (default 0.13), `earthRadiusM` (default 6 371 008.8 m)
 * @returns metres visible (0 when wholly hidden, including past the
 *   effective quarter circle); never null
 * @throws {SightlineInputError} on negative or non-finite input
 *
 * Source: hidden-height reasoning of terrestrial navigation (The American
 * Practical Navigator, Bowditch, NGA Pub. 9, geographic range of an
 * object), with the exact hidden height of `hiddenHeight`.
 *
 * @example
 * visibleHeight(2, 30, 20_000, { k: 0.13 }); // { value: 15.47, reason: null }
 */
export function visibleHeight(
  observerHeightM: number,
  targetHeightM: number,
  distanceM: number,
  options: SphereOptions = {},
): Derived {
  checkInput('targetHeightM', targetHeightM, { min: 0 });
  const hidden = hiddenHeight(observerHeightM, distanceM, options);
  if (hidden.value === null) return { value: 0, reason: null };
  return { value: Math.max(0, targetHeightM - hidden.value), reason: null };
}
