import type { BearingSectorShare } from '@/shared/terrain/seen-share-by-bearing';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';

/** A run of neighbouring sectors where a post sees little, degrees true. */
export interface BlindBearingRange {
  /** Start, degrees true, 0 ≤ fromDeg < 360. */
  readonly fromDeg: number;
  /** End, degrees true, 0 < toDeg ≤ 360; smaller than fromDeg when the range crosses north. */
  readonly toDeg: number;
  /** Share of the range's in-range cells the post sees, 0 … 1. */
  readonly seenShare: number;
  /** Cells of the range within the detection range. */
  readonly inRangeCells: number;
}

/**
 * Merges the sectors of `seenShareByBearing` where the post sees less than
 * `threshold` of the ground in range into contiguous bearing ranges, joining
 * across north (350°–10° is one range). A sector with no cell in range is
 * neither seen nor blind: it ends a range. When every sector is blind the
 * answer is one range 0°–360°.
 *
 * Source: none needed (bookkeeping); the threshold is the caller's choice.
 *
 * @param sectors equal sectors clockwise from 0° true, as `seenShareByBearing` returns them (not modified)
 * @param threshold share below which a sector is blind, 0 … 1; default 0.25
 * @returns blind ranges, ordered by start bearing
 * @throws TerrainInputError `invalid-option` for a threshold outside 0 … 1
 * @example
 * blindBearingRanges(seenShareByBearing(input), 0.25);
 * // → [{ fromDeg: 150, toDeg: 210, seenShare: 0.04, inRangeCells: 5120 }]
 */
export function blindBearingRanges(sectors: readonly BearingSectorShare[], threshold = 0.25): BlindBearingRange[] {
  if (!(threshold >= 0 && threshold <= 1)) {
    throw new TerrainInputError('invalid-option', `The threshold must be a share 0 … 1, got ${threshold}.`);
  }
  const n = sectors.length;
  const blind = sectors.map((s) => s.seenShare !== null && s.seenShare < threshold);
  if (n === 0 || !blind.includes(true)) return [];
  const all = blind.every(Boolean);
  // Start at a sector that begins a run (its predecessor not blind), so runs across north stay whole.
  const start = all ? 0 : blind.findIndex((b, i) => b && !blind[(i - 1 + n) % n]);
  const ranges: BlindBearingRange[] = [];
  let run: { from: number; to: number; seen: number; cells: number } | null = null;
  for (let j = 0; j < n; j++) {
    const i = (start + j) % n;
    const s = sectors[i]!;
    if (blind[i]) {
      if (run === null) run = { from: s.fromDeg, to: s.toDeg, seen: 0, cells: 0 };
      run.to = s.toDeg;
      run.seen += s.seenCells;
      run.cells += s.inRangeCells;
    } else if (run !== null) {
      ranges.push(close(run));
      run = null;
    }
  }
  if (run !== null) ranges.push(close(run));
  if (all) return [{ ...ranges[0]!, fromDeg: 0, toDeg: 360 }];
  return ranges.sort((a, b) => a.fromDeg - b.fromDeg);
}

function close(run: { from: number; to: number; seen: number; cells: number }): BlindBearingRange {
  return { fromDeg: run.from, toDeg: run.to, seenShare: run.seen / run.cells, inRangeCells: run.cells };
}
