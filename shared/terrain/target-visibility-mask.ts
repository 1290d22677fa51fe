import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { HiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';

/**
 * Turns hidden heights into a seen/not-seen mask for targets of
 * `targetHeight` metres: 1 where the target's top is seen
 * (hidden ≤ targetHeight + tolerance), 0 where it is not, NaN where the
 * hidden height is NaN (nodata terrain, beyond the range limit).
 *
 * Source: definition of the hidden height — common practice, no source.
 *
 * @param hidden hidden heights, metres (not modified)
 * @param targetHeight target height above ground, metres; default 0 (the ground itself)
 * @param tolerance metres of rounding allowance; default 0.001
 * @returns a new Float32Array, same layout as `hidden.hidden` (row 0 = north)
 * @throws TerrainInputError `invalid-option` for a negative or non-finite target height
 * @example
 * const mask = targetVisibilityMask(hidden, 30); // 1 where a 30 m smoke column is seen
 */
export function targetVisibilityMask(
  hidden: HiddenHeightRaster,
  targetHeight: number = 0,
  tolerance: number = 0.001,
): Float32Array {
  if (!Number.isFinite(targetHeight) || targetHeight < 0) {
    throw new TerrainInputError('invalid-option', `Target height must be ≥ 0 m, got ${targetHeight}.`);
  }
  const values = hidden.hidden;
  const limit = targetHeight + tolerance;
  const mask = new Float32Array(values.length);
  for (let i = 0; i < values.length; i++) {
    const v = values[i] as number;
    mask[i] = v !== v ? NaN : v <= limit ? 1 : 0;
  }
  return mask;
}
