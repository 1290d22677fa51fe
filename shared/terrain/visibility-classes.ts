import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { HiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import type { GridSpec } from '@/shared/terrain/grid-spec';

/** Class codes stored in {@link VisibilityClassRaster.classes}. */
export const VISIBILITY_CLASS = {
  /** Not computed: nodata terrain or beyond the range limit. */
  none: 0,
  /** Seen area: the ground itself is seen. */
  seen: 1,
  /** Only a target of the given height shows (e.g. the top of a smoke column). */
  targetOnly: 2,
  /** Blind: not even the top of the target is seen. */
  blind: 3,
  /**
   * Beyond the target's detection range from this post (visibility, angular
   * size, luminous range), whether or not it would be in view.
   */
  outOfRange: 4,
} as const;

/** One of the {@link VISIBILITY_CLASS} codes. */
export type VisibilityClass = (typeof VISIBILITY_CLASS)[keyof typeof VISIBILITY_CLASS];

/** Visibility classes for one post and one target height, same grid as the hidden heights. */
export interface VisibilityClassRaster extends GridSpec {
  /** One {@link VISIBILITY_CLASS} code per cell, row 0 = north. */
  readonly classes: Uint8Array;
  /** Target height the classes were made for, metres above ground. */
  readonly targetHeight: number;
}

/** Settings of {@link classifyVisibility}. */
export interface ClassifyOptions {
  /**
   * Hidden heights up to this many metres still count as "ground seen", to
   * absorb floating-point rounding; default 0.001 m (1 mm).
   */
  readonly groundTolerance?: number;
  /**
   * The target's detection range from the post, beyond which cells are
   * {@link VISIBILITY_CLASS.outOfRange}: the post's cell and the range in
   * metres, measured from cell centre to cell centre in the grid; default none.
   */
  readonly rangeLimit?: { readonly col: number; readonly row: number; readonly maxDistance: number } | null;
}

/**
 * Sorts the cells of a hidden-height raster into seen (ground visible),
 * target-only (only a target of `targetHeight` metres shows — a smoke column
 * of 30–100 m, a mast) and blind, from the rule
 *
 *   seen        if hidden ≤ tolerance
 *   target-only if tolerance < hidden ≤ targetHeight + tolerance
 *   blind       otherwise; `none` where hidden is NaN.
 *
 * With a `rangeLimit`, cells farther than it from the post (centre to centre)
 * are `outOfRange` instead, whatever their hidden height: the target is too
 * far to be detected there. A range of 0 m puts every cell out of range.
 *
 * Source: definition of the hidden height (the height a target must reach to
 * be seen) — common practice, no source.
 *
 * @param hidden hidden heights, metres (not modified)
 * @param targetHeight target height above ground, metres (≥ 0)
 * @param options ground tolerance, metres; default 0.001
 * @returns a new class raster on the same grid
 * @throws TerrainInputError `invalid-option` for a negative or non-finite target height
 * @example
 * const classes = classifyVisibility(hidden, 50);
 * classes.classes[i] === VISIBILITY_CLASS.targetOnly; // a 50 m smoke column shows, the ground does not
 */
export function classifyVisibility(
  hidden: HiddenHeightRaster,
  targetHeight: number,
  options: ClassifyOptions = {},
): VisibilityClassRaster {
  const tolerance = options.groundTolerance ?? 0.001;
  if (!Number.isFinite(targetHeight) || targetHeight < 0) {
    throw new TerrainInputError('invalid-option', `Target height must be ≥ 0 m, got ${targetHeight}.`);
  }
  if (!Number.isFinite(tolerance) || tolerance < 0) {
    throw new TerrainInputError('invalid-option', `Ground tolerance must be ≥ 0 m, got ${tolerance}.`);
  }
  const values = hidden.hidden;
  const classes = new Uint8Array(values.length);
  const targetLimit = targetHeight + tolerance;
  const limit = options.rangeLimit ?? null;
  if (limit !== null && !(limit.maxDistance >= 0)) {
    throw new TerrainInputError('invalid-option', `The range limit must be ≥ 0 m, got ${limit.maxDistance}.`);
  }
  const W = hidden.width;
  const range2 = limit === null ? Infinity : (limit.maxDistance / hidden.cellSize) ** 2;
  for (let row = 0; row < hidden.height; row++) {
    // Columns within the range on this row: [c0, c1], by the circle's chord (cells outside it are out of range).
    let c0 = 0;
    let c1 = W - 1;
    if (limit !== null && limit.maxDistance <= 0) {
      // A range of zero (an unlit target at night, one screened by waves) reaches no cell, not even the post's own.
      c0 = W;
      c1 = -1;
    } else if (limit !== null) {
      const dy = row - limit.row;
      const span2 = range2 - dy * dy;
      if (span2 < 0) {
        c0 = W;
        c1 = -1;
      } else {
        const span = Math.sqrt(span2);
        c0 = Math.max(0, Math.ceil(limit.col - span));
        c1 = Math.min(W - 1, Math.floor(limit.col + span));
      }
    }
    const base = row * W;
    if (c0 > c1) {
      classes.fill(VISIBILITY_CLASS.outOfRange, base, base + W);
      continue;
    }
    if (c0 > 0) classes.fill(VISIBILITY_CLASS.outOfRange, base, base + c0);
    if (c1 < W - 1) classes.fill(VISIBILITY_CLASS.outOfRange, base + c1 + 1, base + W);
    // seen (1) + 1 above the ground tolerance + 1 above the target's top: 1 seen, 2 target
    // only, 3 blind (tolerance ≤ targetLimit); NaN → none (0). Counted rather than branched
    // on, since neighbouring cells often differ.
    for (let i = base + c0, end = base + c1; i <= end; i++) {
      const v = values[i] as number;
      classes[i] = v === v ? VISIBILITY_CLASS.seen + +(v > tolerance) + +(v > targetLimit) : VISIBILITY_CLASS.none;
    }
  }
  return {
    width: hidden.width,
    height: hidden.height,
    cellSize: hidden.cellSize,
    xll: hidden.xll,
    yll: hidden.yll,
    crs: hidden.crs,
    classes,
    targetHeight,
  };
}
