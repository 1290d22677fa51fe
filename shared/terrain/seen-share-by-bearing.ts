import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';

/** One bearing sector of {@link seenShareByBearing}, true bearings in degrees clockwise from true north. */
export interface BearingSectorShare {
  /** Start of the sector, degrees true (inclusive), 0 ≤ fromDeg < 360. */
  readonly fromDeg: number;
  /** End of the sector, degrees true (exclusive), fromDeg < toDeg ≤ 360. */
  readonly toDeg: number;
  /** Cells of the sector within the detection range (seen, target-only or blind; inside the mask). */
  readonly inRangeCells: number;
  /** Of those, cells where the target shows (seen or target-only). */
  readonly seenCells: number;
  /** seenCells / inRangeCells, 0 … 1; null when no cell of the sector is in range. */
  readonly seenShare: number | null;
}

/** Input of {@link seenShareByBearing}. */
export interface SeenShareByBearingInput {
  /** Columns and rows of the layer (row 0 = north, as every Kenning raster). */
  readonly width: number;
  readonly height: number;
  /** One `VISIBILITY_CLASS` code per cell for this post (a `post-visibility` layer); not modified. */
  readonly classes: Uint8Array;
  /** The post's cell. */
  readonly col: number;
  readonly row: number;
  /**
   * Grid convergence γ at the post, radians (`gridConvergence`): the angle
   * from true north clockwise to grid north. True bearing = grid bearing + γ.
   */
  readonly gridConvergenceRad: number;
  /** Cells that count (1) — the site, or its sea; null counts every cell. Not modified. */
  readonly mask?: Uint8Array | null;
  /** Number of equal sectors round the post; default 36 (10° each). */
  readonly sectorCount?: number;
}

/**
 * Share of the ground within the detection range that one post sees, sector
 * by sector round the post, in true bearings.
 *
 * A cell counts when its class is seen, target-only or blind (`none` —
 * no terrain data — and `outOfRange` are left out) and, with a mask, when it
 * lies inside it; the post's own cell is left out (it has no bearing). The
 * bearing of a cell is taken from the post's cell centre to the cell's
 * centre: grid bearing β_grid = atan2(Δeast, Δnorth), then true bearing
 * β_true = β_grid + γ (γ = grid convergence at the post, the convention of
 * `gridConvergence`), wrapped to [0°, 360°). Sector i spans
 * [i · 360°/n, (i + 1) · 360°/n).
 *
 * Source: grid convergence, true = grid + γ — common practice, no source
 * (the same relation `gridConvergence` documents); bearing sectors — common
 * practice, no source.
 *
 * @param input the post's visibility classes, its cell, γ, mask and sector count
 * @returns `sectorCount` sectors clockwise from true north
 * @throws TerrainInputError `invalid-option` for a bad sector count, a class
 *   or mask array of the wrong length, or a post cell outside the grid
 * @example
 * seenShareByBearing({ width, height, classes, col, row, gridConvergenceRad: 0.0137 });
 * // → [{ fromDeg: 0, toDeg: 10, inRangeCells: 812, seenCells: 130, seenShare: 0.16 }, …]
 */
export function seenShareByBearing(input: SeenShareByBearingInput): BearingSectorShare[] {
  const { width, height, classes, col, row, gridConvergenceRad } = input;
  const mask = input.mask ?? null;
  const n = input.sectorCount ?? 36;
  if (!Number.isInteger(n) || n < 1 || n > 3600) {
    throw new TerrainInputError('invalid-option', `The sector count must be a whole number 1 … 3600, got ${n}.`);
  }
  if (classes.length !== width * height) {
    throw new TerrainInputError('invalid-option', `The layer has ${classes.length} cells, not ${width} × ${height}.`);
  }
  if (mask !== null && mask.length !== width * height) {
    throw new TerrainInputError('invalid-option', `The mask has ${mask.length} cells, not ${width} × ${height}.`);
  }
  if (!(Number.isInteger(col) && Number.isInteger(row) && col >= 0 && col < width && row >= 0 && row < height)) {
    throw new TerrainInputError('invalid-option', `The post's cell (${col}, ${row}) is outside the ${width} × ${height} grid.`);
  }
  if (!Number.isFinite(gridConvergenceRad)) {
    throw new TerrainInputError('invalid-option', `Grid convergence must be a finite angle, got ${gridConvergenceRad}.`);
  }
  const inRange = new Float64Array(n);
  const seen = new Float64Array(n);
  const perSector = (2 * Math.PI) / n;
  for (let r = 0; r < height; r++) {
    const dy = row - r; // cells north of the post
    const base = r * width;
    for (let c = 0; c < width; c++) {
      const i = base + c;
      const v = classes[i]!;
      if (v !== VISIBILITY_CLASS.seen && v !== VISIBILITY_CLASS.targetOnly && v !== VISIBILITY_CLASS.blind) continue;
      if (mask !== null && mask[i] !== 1) continue;
      const dx = c - col;
      if (dx === 0 && dy === 0) continue;
      let bearing = Math.atan2(dx, dy) + gridConvergenceRad;
      bearing = ((bearing % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI);
      const k = Math.min(n - 1, Math.floor(bearing / perSector));
      inRange[k]! += 1;
      if (v !== VISIBILITY_CLASS.blind) seen[k]! += 1;
    }
  }
  const step = 360 / n;
  return Array.from({ length: n }, (_, k) => ({
    fromDeg: k * step,
    toDeg: (k + 1) * step,
    inRangeCells: inRange[k]!,
    seenCells: seen[k]!,
    seenShare: inRange[k]! > 0 ? seen[k]! / inRange[k]! : null,
  }));
}
