import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';

/** A candidate place picked from the terrain. */
export interface TerrainCandidate {
  readonly col: number;
  readonly row: number;
  /** Ground elevation of the cell, metres. */
  readonly elevationM: number;
  /** Higher than all eight neighbours (else a ridge cell: higher than both neighbours along some line). */
  readonly summit: boolean;
}

export interface PickTerrainCandidatesOptions {
  /** Least distance between two candidates, metres. */
  readonly spacingM: number;
  /** Most candidates returned. */
  readonly maxCandidates: number;
  /** 1 where a candidate may stand (the site, near an access line), 0 elsewhere; null = anywhere. Not modified. */
  readonly allowed: Uint8Array | null;
}

// The four lines through a cell: E–W, N–S and the two diagonals (column, row steps); LINES[l ^ 1] is l's perpendicular.
const LINES = [
  [1, 0],
  [0, 1],
  [1, 1],
  [1, -1],
] as const;

/**
 * Candidate places for a lookout tower from the ground's shape: summits (a
 * cell higher than its eight neighbours) and ridge cells (higher than both
 * neighbours along at least one of the four lines through it by more than
 * the ground falls along the perpendicular line — a crest crossed by that
 * line, not the flank of a rounded hill), inside `allowed`; then thinned to `spacingM`:
 * taken highest first (summits before ridge cells of the same height, then
 * row-major order), each kept only when at least `spacingM` from every one
 * kept before, up to `maxCandidates`. High ground with open crests sees
 * farthest, which is why lookouts stand there; the optimiser then judges
 * them by what they actually see.
 *
 * Source: summit and ridge detection by comparing a cell with its
 * neighbours (Peucker & Douglas 1975, "Detection of surface-specific points
 * by local parallel processing of discrete terrain elevation data", Computer
 * Graphics and Image Processing 4 — from memory); thinning by a least
 * distance, common practice, no source. Cells on the grid's edge and cells
 * without data are never picked. Deterministic.
 *
 * @param terrain heights in metres, row 0 = north (not modified)
 * @param options spacing (m), most candidates, allowed cells
 * @returns candidates, highest first
 * @throws TerrainInputError `invalid-option` for a spacing ≤ 0 or a count < 1, `invalid-layer` for a mask of the wrong size
 * @example
 * pickTerrainCandidates(terrain, { spacingM: 1500, maxCandidates: 20, allowed: siteMask });
 */
export function pickTerrainCandidates(terrain: TerrainRaster, options: PickTerrainCandidatesOptions): TerrainCandidate[] {
  const { width: W, height: H, heights, cellSize } = terrain;
  if (!(options.spacingM > 0)) throw new TerrainInputError('invalid-option', 'The spacing must be above 0 m.', 'spacingM');
  if (!Number.isInteger(options.maxCandidates) || options.maxCandidates < 1) {
    throw new TerrainInputError('invalid-option', 'Ask for at least one candidate.', 'maxCandidates');
  }
  if (options.allowed !== null && options.allowed.length !== W * H) {
    throw new TerrainInputError('invalid-layer', 'The allowed mask must have one value per cell.', 'allowed');
  }
  const found: TerrainCandidate[] = [];
  for (let row = 1; row < H - 1; row++) {
    for (let col = 1; col < W - 1; col++) {
      const i = row * W + col;
      if (options.allowed !== null && options.allowed[i] !== 1) continue;
      const z = heights[i]!;
      if (!Number.isFinite(z)) continue;
      let crests = 0;
      let summit = true;
      for (let l = 0; l < LINES.length; l++) {
        const [dc, dr] = LINES[l]!;
        const a = heights[i + dr * W + dc]!;
        const b = heights[i - dr * W - dc]!;
        if (!(z > a) || !(z > b)) summit = false;
        // A crest across this line that is sharper than the ground falls along the crest itself
        // (the perpendicular line): a ridge, not the flank of a rounded hill.
        const [pc, pr] = LINES[l ^ 1]!;
        const along = Math.abs(heights[i + pr * W + pc]! - heights[i - pr * W - pc]!) / 2;
        const crest = Math.min(z - a, z - b);
        if (crest > 0 && crest >= along) crests++;
      }
      if (crests > 0) found.push({ col, row, elevationM: z, summit });
    }
  }
  found.sort((a, b) => b.elevationM - a.elevationM || Number(b.summit) - Number(a.summit) || a.row - b.row || a.col - b.col);
  const minCells2 = (options.spacingM / cellSize) ** 2;
  const kept: TerrainCandidate[] = [];
  for (const c of found) {
    if (kept.length >= options.maxCandidates) break;
    if (kept.every((k) => (k.col - c.col) ** 2 + (k.row - c.row) ** 2 >= minCells2)) kept.push(c);
  }
  return kept;
}
