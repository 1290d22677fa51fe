// Over 300 lines: the ray sampler, its stride choice and its input checks form one documented algorithm.
import { MEAN_EARTH_RADIUS_M, STANDARD_OPTICAL_K } from '@/shared/physics/constants';
import type { GridSpec } from '@/shared/terrain/grid-spec';
import { NEVER_BLOCKS, prepareSweepTerrain, type SweepTerrain } from '@/shared/terrain/sweep-terrain';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';

/** Rays per evaluated cell unless told otherwise (see DEVELOPERS.md for the measured error). */
export const VISIBILITY_INDEX_RAYS = 64;

const TILE = 32; // cells a side of the tiles whose highest ground bounds a ray; common practice, no source

/** Settings of {@link computeVisibilityIndex}. */
export interface VisibilityIndexOptions {
  /** Eye height of the imagined tower above the ground of its cell, metres. */
  readonly heightM: number;
  /** Radius around the tower that is counted, metres. */
  readonly radiusM: number;
  /** Rays cast from each evaluated cell, evenly spaced in bearing; default {@link VISIBILITY_INDEX_RAYS}. */
  readonly rays?: number;
  /** Evaluate every n-th cell in both directions (1 = every cell); default 1. */
  readonly strideCells?: number;
  /** Refraction coefficient k; default 0.13. */
  readonly refractionCoefficient?: number;
  /** Earth radius R, metres; default 6 371 008.8. */
  readonly earthRadius?: number;
  /**
   * The site, one byte per terrain cell (1 = inside, row 0 = north): only seen
   * ground inside it is counted. Null or absent: the whole grid counts.
   */
  readonly mask?: Uint8Array | null;
  /** Rows of the index grid to compute, `[from, to)`; default all (lets workers split the grid). */
  readonly indexRows?: readonly [number, number];
  /** Columns of the index grid to compute, `[from, to)`; default all. */
  readonly indexCols?: readonly [number, number];
}

/**
 * The visibility index on its own (coarser) grid: index cell (c, r) stands for
 * the terrain cell (c·stride + offset, r·stride + offset), offset = ⌊stride/2⌋
 * (clipped to the terrain), and holds the ground area, m², a tower there would
 * see within the radius. The grid's top-left corner is the terrain's.
 */
export interface VisibilityIndexRaster extends GridSpec {
  /** Seen ground inside the site within the radius, m²; NaN where the tower's own cell has no data or was not computed. */
  readonly seenM2: Float32Array;
  readonly strideCells: number;
  readonly rays: number;
  readonly heightM: number;
  readonly radiusM: number;
}

/**
 * Estimates, for every n-th cell of a terrain, how much ground of a site a
 * tower of height `heightM` standing there would see within `radiusM`: the
 * "where would a tower see the most?" layer that suggests candidate sites.
 *
 * Method: from each evaluated cell, `rays` rays at equal bearing steps, each
 * sampled every cell length (bilinear heights, the engine's terrain model,
 * lowered by (1 − k)·d²/(2R) as in `computeHiddenHeightRaster`). A sample is
 * seen when its elevation angle from the eye is at least the largest angle of
 * the samples before it on the ray; each seen sample inside the site counts
 * for its share of the annulus, (2π/rays)·d·Δd. The tower's own cell counts
 * as seen. Cost ∝ evaluated cells × rays × radius/cell, independent of the
 * grid size; the error against exact viewsheds falls as rays grow
 * (`tests/unit/terrain/visibility-index.test.ts`).
 *
 * Sources: radial line-of-sight sampling (the "R3"-style ray viewshed
 * approximation of GIS practice; common practice, no single source);
 * curvature-and-refraction drop of trigonometric levelling (`curvature-drop.ts`).
 *
 * @param terrain ground heights, metres (not modified)
 * @param options tower height and radius in metres, rays, stride, k, R, site mask, rows
 * @param prepared `prepareSweepTerrain(terrain)`, to share between calls
 * @returns the index grid with seen areas in m²
 * @throws TerrainInputError `invalid-option` for bad heights, radius, rays, stride, mask or rows
 * @example
 * const index = computeVisibilityIndex(terrain, { heightM: 20, radiusM: 8000, strideCells: 8 });
 * index.seenM2[0]; // m² a 20 m tower near the north-west corner would see
 */
export function computeVisibilityIndex(
  terrain: TerrainRaster,
  options: VisibilityIndexOptions,
  prepared?: SweepTerrain,
): VisibilityIndexRaster {
  const { width: W, height: H, cellSize } = terrain;
  const rays = options.rays ?? VISIBILITY_INDEX_RAYS;
  const stride = options.strideCells ?? 1;
  const k = options.refractionCoefficient ?? STANDARD_OPTICAL_K;
  const R = options.earthRadius ?? MEAN_EARTH_RADIUS_M;
  const mask = options.mask ?? null;
  validate(terrain, options, rays, stride, k, R, mask);
  const sweep = prepared ?? prepareSweepTerrain(terrain);
  const h = sweep.heights;

  const outW = Math.ceil(W / stride);
  const outH = Math.ceil(H / stride);
  const [rowFrom, rowTo] = indexRange(options.indexRows, outH, 'rows');
  const [colFrom, colTo] = indexRange(options.indexCols, outW, 'columns');
  const seenM2 = new Float32Array(outW * outH).fill(NaN);
  const offset = Math.floor(stride / 2);

  // Ray directions in cells (col east, row south) and the samples' distances in cells.
  const steps = Math.floor(options.radiusM / cellSize);
  const dCol = new Float64Array(rays);
  const dRow = new Float64Array(rays);
  for (let r = 0; r < rays; r++) {
    const theta = (2 * Math.PI * r) / rays;
    dCol[r] = Math.sin(theta);
    dRow[r] = -Math.cos(theta);
  }
  const dropPerCell2 = ((1 - k) * cellSize * cellSize) / (2 * R);
  const drop = new Float64Array(steps + 1);
  const reciprocal = new Float64Array(steps + 1);
  const sampleM2 = new Float64Array(steps + 1);
  for (let s = 1; s <= steps; s++) {
    drop[s] = dropPerCell2 * s * s;
    reciprocal[s] = 1 / s;
    sampleM2[s] = ((2 * Math.PI) / rays) * s * cellSize * cellSize;
  }
  const cellM2 = cellSize * cellSize;

  // The rays' geometry is the same from every cell (the cells are whole steps apart), so the
  // sample positions relative to the tower are laid out once: per ray and step, the cell below
  // and left of the sample (whole cells from the tower), the fractions within it, and the
  // nearest cell (for the site mask).
  const S = steps + 1;
  const colOf = new Int32Array(rays * S);
  const rowOf = new Int32Array(rays * S);
  const fracX = new Float64Array(rays * S);
  const fracY = new Float64Array(rays * S);
  const nearest = new Int32Array(rays * S);
  const cornerOf = new Int32Array(rays * S); // rowOf·W + colOf: the corner cell's offset from the tower

  for (let r = 0; r < rays; r++) {
    for (let s = 1; s <= steps; s++) {
      const vx = s * (dCol[r] as number);
      const vy = s * (dRow[r] as number);
      const i = r * S + s;
      colOf[i] = Math.floor(vx);
      rowOf[i] = Math.floor(vy);
      fracX[i] = vx - Math.floor(vx);
      fracY[i] = vy - Math.floor(vy);
      nearest[i] = Math.round(vy) * W + Math.round(vx);
      cornerOf[i] = rowOf[i]! * W + colOf[i]!;
    }
  }

  // The highest ground within reach of a tower: once even it, at a sample's distance, would lie
  // below the horizon of a ray, nothing further along that ray can be seen (the drop only lowers
  // it more), so the ray stops there. Exact: the bound is compared as the slope itself is
  // computed. Kept per tile of TILE² cells, so a tower's is the largest of the tiles its radius reaches.
  const tilesW = Math.ceil(W / TILE);
  const tilesH = Math.ceil(H / TILE);
  const tileTop = new Float64Array(tilesW * tilesH).fill(NaN); // found when first needed (a band needs few)
  const topOfTile = (tc: number, tr: number) => {
    const t = tr * tilesW + tc;
    if (Number.isNaN(tileTop[t]!)) {
      let top = -Infinity;
      for (let row = tr * TILE; row < Math.min(H, (tr + 1) * TILE); row++) {
        for (let col = tc * TILE; col < Math.min(W, (tc + 1) * TILE); col++) if (h[row * W + col]! > top) top = h[row * W + col]!;
      }
      tileTop[t] = top;
    }
    return tileTop[t]!;
  };
  const highestNear = (c0: number, r0: number) => {
    let top = -Infinity;
    const tc1 = Math.min(tilesW - 1, ((c0 + steps + 1) / TILE) | 0);
    const tr1 = Math.min(tilesH - 1, ((r0 + steps + 1) / TILE) | 0);
    for (let tr = Math.max(0, ((r0 - steps - 1) / TILE) | 0); tr <= tr1; tr++) {
      for (let tc = Math.max(0, ((c0 - steps - 1) / TILE) | 0); tc <= tc1; tc++) {
        top = Math.max(top, topOfTile(tc, tr));
      }
    }
    return top;
  };

  for (let orow = rowFrom; orow < rowTo; orow++) {
    const r0 = Math.min(H - 1, orow * stride + offset);
    for (let ocol = colFrom; ocol < colTo; ocol++) {
      const c0 = Math.min(W - 1, ocol * stride + offset);
      const at = r0 * W + c0;
      const ground = h[at] as number;
      if (ground === NEVER_BLOCKS) continue;
      const eye = ground + options.heightM;
      const rise = highestNear(c0, r0) - eye; // the most any sample can stand above the eye, metres
      let seen = mask === null || mask[at] === 1 ? cellM2 : 0;
      for (let r = 0; r < rays; r++) {
        const base = r * S;
        const last = lastInside(colOf, rowOf, base, steps, c0, r0, W, H);
        let horizon = -Infinity; // largest elevation slope so far, metres per cell
        for (let s = 1; s <= last; s++) {
          const i = base + s;
          if (rise * (reciprocal[s] as number) < horizon) break;
          const fx = fracX[i] as number;
          const fy = fracY[i] as number;
          const p = at + (cornerOf[i] as number);
          const z00 = h[p] as number;
          const z01 = h[p + 1] as number;
          const z10 = h[p + W] as number;
          const z11 = h[p + W + 1] as number;
          const top = z00 + fx * (z01 - z00);
          const z = top + fy * (z10 + fx * (z11 - z10) - top);
          if (z < NEVER_BLOCKS / 2) continue; // a nodata corner: neither seen nor blocking
          const slope = (z - (drop[s] as number) - eye) * (reciprocal[s] as number);
          if (slope >= horizon) {
            horizon = slope;
            if (mask === null || mask[at + (nearest[i] as number)] === 1) seen += sampleM2[s] as number;
          }
        }
      }
      seenM2[orow * outW + ocol] = seen;
    }
  }

  return {
    width: outW,
    height: outH,
    cellSize: cellSize * stride,
    xll: terrain.xll,
    yll: terrain.yll + H * cellSize - outH * stride * cellSize,
    crs: terrain.crs,
    seenM2,
    strideCells: stride,
    rays,
    heightM: options.heightM,
    radiusM: options.radiusM,
  };
}

/**
 * The smallest stride that keeps the work of {@link computeVisibilityIndex}
 * (evaluated cells × rays × samples per ray) within `sampleBudget`.
 *
 * @param grid the terrain grid
 * @param radiusM radius, metres
 * @param rays rays per cell
 * @param sampleBudget most samples; default 1.2 × 10⁹ (≈ 25 s on one core here, so ≈ 13 s on two)
 * @returns stride in cells, ≥ 1
 * @example
 * visibilityIndexStride({ width: 2000, height: 2000, cellSize: 25, xll: 0, yll: 0, crs: null }, 8000, 64); // 5
 */
export function visibilityIndexStride(grid: GridSpec, radiusM: number, rays: number, sampleBudget = 1.2e9): number {
  const perCell = rays * Math.max(1, Math.floor(radiusM / grid.cellSize));
  for (let stride = 1; ; stride++) {
    const cells = Math.ceil(grid.width / stride) * Math.ceil(grid.height / stride);
    if (cells * perCell <= sampleBudget || stride >= Math.max(grid.width, grid.height)) return stride;
  }
}

/**
 * The last step of a ray (samples `base + 1 … base + steps` of the tables)
 * whose bilinear patch lies wholly on the grid: 0 ≤ col, col + 1 ≤ W − 1 and
 * the same for rows. The patch indexes only move away from the tower as the
 * step grows, so the first step that leaves the grid ends the ray.
 */
function lastInside(
  colOf: Int32Array,
  rowOf: Int32Array,
  base: number,
  steps: number,
  c0: number,
  r0: number,
  W: number,
  H: number,
): number {
  let lo = 0; // known inside (step 0 is the tower)
  let hi = steps + 1; // known outside or past the end
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    const c = c0 + (colOf[base + mid] as number);
    const r = r0 + (rowOf[base + mid] as number);
    if (c >= 0 && c <= W - 2 && r >= 0 && r <= H - 2) lo = mid;
    else hi = mid;
  }
  return lo;
}

function indexRange(range: readonly [number, number] | undefined, size: number, what: string): readonly [number, number] {
  const [from, to] = range ?? [0, size];
  if (!(Number.isInteger(from) && Number.isInteger(to) && 0 <= from && from <= to && to <= size)) {
    throw new TerrainInputError('invalid-option', `Index ${what} must lie within [0, ${size}], got [${from}, ${to}).`);
  }
  return [from, to];
}

function validate(
  terrain: TerrainRaster,
  options: VisibilityIndexOptions,
  rays: number,
  stride: number,
  k: number,
  R: number,
  mask: Uint8Array | null,
): void {
  const bad = (message: string) => new TerrainInputError('invalid-option', message);
  if (terrain.heights.length !== terrain.width * terrain.height) {
    throw new TerrainInputError('invalid-raster', 'Heights length does not match width × height.');
  }
  if (terrain.width < 2 || terrain.height < 2) throw bad('The terrain must be at least 2 × 2 cells.');
  if (!Number.isFinite(options.heightM) || options.heightM < 0) throw bad(`Tower height must be ≥ 0 m, got ${options.heightM}.`);
  if (!(options.radiusM > 0) || !Number.isFinite(options.radiusM)) throw bad(`Radius must be > 0 m, got ${options.radiusM}.`);
  if (!Number.isInteger(rays) || rays < 4) throw bad(`Rays must be an integer ≥ 4, got ${rays}.`);
  if (!Number.isInteger(stride) || stride < 1) throw bad(`Stride must be an integer ≥ 1, got ${stride}.`);
  if (!Number.isFinite(k) || k >= 1) throw bad(`Refraction coefficient must be finite and < 1, got ${k}.`);
  if (!(R > 0) || !Number.isFinite(R)) throw bad(`Earth radius must be > 0 m, got ${R}.`);
  if (mask !== null && mask.length !== terrain.width * terrain.height)
    throw bad('The site mask must have one byte per terrain cell.');
}
