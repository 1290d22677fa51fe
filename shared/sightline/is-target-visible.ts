import { checkInput } from '@/shared/sightline/check-input';
import { detectionRange, type DetectionInput } from '@/shared/sightline/detection-range';
import type { DetectionLimit } from '@/shared/sightline/types';

/** Result of {@link isTargetVisible}. */
export interface TargetVisibility {
  /** True when no limit is exceeded at the given distance. */
  readonly visible: boolean;
  /** Every limit the distance exceeds, in the order horizon, visibility, angular size. */
  readonly blockedBy: readonly DetectionLimit[];
  /** True when more of the target is required to show than it has (never visible). */
  readonly requiredPartExceedsTarget: boolean;
}

/**
 * Whether a target at a given surface distance can be detected: the
 * distance must not exceed any of the limits of `detectionRange` (geometric
 * range for the required visible part, visibility, angular size). A limit
 * reached exactly still counts as visible.
 *
 * @param input - as for `detectionRange`, plus `distanceM` (metres, ≥ 0)
 * @returns visibility and the limits that block it
 * @throws {SightlineInputError} on invalid input
 *
 * Source: as `detectionRange`.
 *
 * @example
 * isTargetVisible({ observerHeightM: 2, targetHeightM: 30, distanceM: 20_000 }).visible; // true
 */
export function isTargetVisible(input: DetectionInput & { readonly distanceM: number }): TargetVisibility {
  const distance = checkInput('distanceM', input.distanceM, { min: 0 });
  const { limits, reason } = detectionRange(input);
  if (reason === 'required-part-exceeds-target') {
    return { visible: false, blockedBy: [], requiredPartExceedsTarget: true };
  }
  const blockedBy: DetectionLimit[] = [];
  if (limits.horizon.value !== null && distance > limits.horizon.value) blockedBy.push('horizon');
  if (limits.visibilityM !== null && distance > limits.visibilityM) blockedBy.push('visibility');
  if (limits.angularSizeM !== null && distance > limits.angularSizeM) blockedBy.push('angular-size');
  return { visible: blockedBy.length === 0, blockedBy, requiredPartExceedsTarget: false };
}
