import { classifyVisibility, type VisibilityClassRaster } from '@/shared/terrain/visibility-classes';
import {
  computeHiddenHeightRaster,
  type HiddenHeightRaster,
  type LookoutPost,
  type SightConditions,
} from '@/shared/terrain/hidden-height-raster';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';

/** Result of one condition in {@link computeMultiConditionViewsheds}. */
export interface ConditionViewshed {
  /** The conditions as given. */
  readonly conditions: SightConditions;
  /** Hidden heights, metres. */
  readonly hidden: HiddenHeightRaster;
  /** Seen / target-only / blind for the requested target height. */
  readonly classes: VisibilityClassRaster;
}

/**
 * Computes the viewshed of one post under several atmospheric conditions
 * (e.g. k = 0.13 standard, k = 0 no refraction, k = −0.1 sub-refraction on a
 * hot afternoon), one after the other, and classifies each for the same
 * target height. Use the worker pool (`server/workers/viewshed-pool.ts`) to
 * run many posts and conditions in parallel.
 *
 * Source: see {@link computeHiddenHeightRaster} and {@link classifyVisibility}.
 *
 * @param terrain ground heights, metres (not modified)
 * @param post the post's cell and eye height, metres
 * @param conditions one entry per condition: k, R metres, maxDistance metres (at least one)
 * @param targetHeight target height above ground for the classes, metres; default 0
 * @returns one result per condition, in the given order
 * @throws TerrainInputError `invalid-condition` for an empty list, and whatever the core throws
 * @example
 * const [standard, dry] = computeMultiConditionViewsheds(terrain, post, [
 *   { refractionCoefficient: 0.13 },
 *   { refractionCoefficient: 0 },
 * ], 50);
 */
export function computeMultiConditionViewsheds(
  terrain: TerrainRaster,
  post: LookoutPost,
  conditions: readonly SightConditions[],
  targetHeight: number = 0,
): ConditionViewshed[] {
  if (conditions.length === 0) {
    throw new TerrainInputError('invalid-condition', 'At least one condition is needed.');
  }
  return conditions.map((condition) => {
    const hidden = computeHiddenHeightRaster(terrain, post, condition);
    return { conditions: condition, hidden, classes: classifyVisibility(hidden, targetHeight) };
  });
}
