import { checkSameGrid } from '@/shared/terrain/check-same-grid';
import type { GridSpec } from '@/shared/terrain/grid-spec';
import type { HiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { classifyVisibility, VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';

/** A target the patrol's views are judged for. */
export interface PatrolTarget {
  /** Height above ground that must be in view, metres (≥ 0). */
  readonly countsFromM: number;
  /** Detection range from the craft, metres; null = the views' own reach. */
  readonly rangeM: number | null;
}

/** What a patrol watches of one target over its cycle. */
export interface PatrolSweepResult {
  /**
   * Per cell, the best visibility class over the cycle (seen, else target
   * only, else blind, else beyond range, else not computed): the patrol's
   * view as one post's, for the network's counts.
   */
  readonly classes: Uint8Array;
  /** Per cell, seconds of the cycle the target there is detected (in view and within range). */
  readonly timeInViewS: Float32Array;
}

// Best class first: seen 1, target only 2, blind 3, out of range 4, then none 0 (as 5).
const rank = (c: number) => (c === VISIBILITY_CLASS.none ? 5 : c);

/**
 * Sweeps a patrol's views along its track: add each sample's hidden-height
 * raster (computed from the craft's position, with its weight in seconds of
 * the cycle) and read, per target, the time each cell is in view and the
 * patrol's best class per cell ("watched at least once" = seen or target
 * only). Each sample's raster is classified for each target with the target's
 * range measured from that sample, so the range moves with the craft.
 * The sweep keeps only its own sums: one Float32 and one byte per cell and
 * target, whatever the number of samples.
 *
 * Source: time in view as the sum of the sampled stays (midpoint rule;
 * `samplePatrol`) — common practice, no source. Visibility classes: see
 * `classifyVisibility`.
 *
 * @example
 * const sweep = new PatrolSweep(terrain, [{ countsFromM: 0.5, rangeM: 7000 }]);
 * for (const s of samples) sweep.add(rasterFrom(s), s.weightS);
 * sweep.result(0).timeInViewS[i] / cycleS; // the fraction of the cycle cell i is watched
 */
export class PatrolSweep {
  private readonly classes: Uint8Array[];
  private readonly time: Float32Array[];
  private added = 0;

  constructor(
    private readonly grid: GridSpec,
    private readonly targets: readonly PatrolTarget[],
  ) {
    const cells = grid.width * grid.height;
    this.classes = targets.map(() => new Uint8Array(cells).fill(5));
    this.time = targets.map(() => new Float32Array(cells));
  }

  /** Adds one sample: its raster (on the sweep's grid) and the seconds of the cycle it stands for. */
  add(raster: HiddenHeightRaster, weightS: number): void {
    checkSameGrid(this.grid, raster, 'raster');
    if (!(weightS >= 0)) throw new TerrainInputError('invalid-option', `A sample's weight must be ≥ 0 s, got ${weightS}.`);
    this.targets.forEach((target, t) => {
      const classes = classifyVisibility(raster, target.countsFromM, {
        rangeLimit: target.rangeM === null ? null : { col: raster.post.col, row: raster.post.row, maxDistance: target.rangeM },
      }).classes;
      const best = this.classes[t]!;
      const time = this.time[t]!;
      for (let i = 0; i < classes.length; i++) {
        const c = classes[i]!;
        const r = rank(c);
        if (r < best[i]!) best[i] = r;
        if (c === VISIBILITY_CLASS.seen || c === VISIBILITY_CLASS.targetOnly) time[i] = time[i]! + weightS;
      }
    });
    this.added++;
  }

  /** Number of samples added. */
  get samples(): number {
    return this.added;
  }

  /** The sweep of target `t` (new arrays; the sweep may go on). */
  result(t: number): PatrolSweepResult {
    const best = this.classes[t];
    if (!best) throw new TerrainInputError('invalid-option', `No target ${t}.`);
    const classes = new Uint8Array(best.length);
    for (let i = 0; i < best.length; i++) classes[i] = best[i] === 5 ? VISIBILITY_CLASS.none : best[i]!;
    return { classes, timeInViewS: Float32Array.from(this.time[t]!) };
  }
}

/** Layer codes of a patrol's fraction-of-cycle raster (`patrol-fraction`). */
export const PATROL_FRACTION_CODE = {
  /** Not computed (no terrain data) or outside the area judged. */
  none: 0,
  /** Never in view during the cycle. */
  never: 1,
  /** In view p % of the cycle (p = 1 … 100, rounded up so any stay shows): code 1 + p. */
  firstPct: 2,
} as const;

/**
 * A patrol's fraction-of-cycle layer as byte codes ({@link PATROL_FRACTION_CODE}):
 * 0 not computed or outside `mask`, 1 never in view, 1 + ⌈100·t/cycle⌉ (2 … 101) in view.
 *
 * @param sweep - a result of {@link PatrolSweep} (not modified)
 * @param cycleS - the cycle, seconds (> 0)
 * @param mask - 1 where the cell is judged; null = everywhere
 */
export function patrolFractionCodes(sweep: PatrolSweepResult, cycleS: number, mask: Uint8Array | null): Uint8Array {
  if (!(cycleS > 0)) throw new TerrainInputError('invalid-option', `The cycle must be more than 0 s, got ${cycleS}.`);
  const out = new Uint8Array(sweep.classes.length);
  for (let i = 0; i < out.length; i++) {
    if ((mask !== null && mask[i] !== 1) || sweep.classes[i] === VISIBILITY_CLASS.none) continue;
    const t = sweep.timeInViewS[i]!;
    out[i] = t > 0 ? 1 + Math.min(100, Math.max(1, Math.ceil((100 * t) / cycleS - 1e-6))) : PATROL_FRACTION_CODE.never;
  }
  return out;
}
