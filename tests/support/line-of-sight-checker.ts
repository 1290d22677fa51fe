import type { LookoutPost, SightConditions } from '@/shared/terrain/hidden-height-raster';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';

/** Settings of the brute-force checker. */
export interface LineOfSightCheckerOptions {
  /** Spacing of the uniform samples along each sight line, cells; default 0.1. */
  readonly step?: number;
  /** Check only every `stride`-th column and row (others get NaN); default 1. */
  readonly stride?: number;
}

/**
 * Brute-force reference for the hidden-height raster, written independently
 * of the engine so tests can compare the two.
 *
 * For each target cell it walks the straight sight line (in plan) from the
 * post's cell centre to the target cell's centre and samples the terrain
 * surface by bilinear interpolation of the four surrounding cell-centre
 * heights: at uniform steps of `step` cells and, in addition, exactly at every
 * crossing of a grid line (column or row of cell centres). Every sample is
 * lowered by (1 − k)·d²/(2R) for its own distance d from the post. The hidden
 * height is
 *
 *   max(0, max over samples t ∈ (0, 1) of  E + (z̃(t) − E) / t − z̃(1))
 *
 * with E the eye elevation, z̃ the lowered heights and t the fraction of the
 * way to the target (the straight line from the eye over sample t, extended
 * to the target's distance). Samples touching a nodata cell are skipped (nodata
 * does not block); nodata targets and targets beyond `maxDistance` get NaN.
 *
 * Source: definition of line of sight over a bilinearly interpolated grid
 * surface (common practice, no source); curvature-and-refraction correction
 * (1 − k)·d²/(2R) of trigonometric levelling (standard surveying practice).
 *
 * Cost: O(cells × sight-line length / step) — for grids of a few hundred cells.
 *
 * @param terrain ground heights, metres, row 0 = north
 * @param post the post's cell and eye height above ground, metres
 * @param conditions k (default 0.13), R metres (default 6 371 008.8), maxDistance metres
 * @param options sampling step in cells (default 0.1), stride (default 1)
 * @returns hidden heights, metres, `width * height` values, NaN where not checked
 * @example
 * const reference = checkHiddenHeights(terrain, { col: 50, row: 50, eyeHeight: 12 });
 */
export function checkHiddenHeights(
  terrain: TerrainRaster,
  post: LookoutPost,
  conditions: SightConditions = {},
  options: LineOfSightCheckerOptions = {},
): Float32Array {
  const { width: W, height: H, cellSize, heights } = terrain;
  const k = conditions.refractionCoefficient ?? 0.13;
  const R = conditions.earthRadius ?? 6_371_008.8;
  const maxDistance = conditions.maxDistance ?? Infinity;
  const step = options.step ?? 0.1;
  const stride = options.stride ?? 1;
  const marker = terrain.nodata ?? NaN;
  const isNodata = (v: number): boolean => v !== v || v === marker;
  const at = (c: number, r: number): number => heights[r * W + c] as number;
  const dropPerCell2 = ((1 - k) * cellSize * cellSize) / (2 * R);
  const drop = (dCells: number): number => dropPerCell2 * dCells * dCells;

  /** Bilinear height at grid position (x = column, y = row, both ≥ 0), or NaN when a used node is nodata. */
  const surface = (x: number, y: number): number => {
    // (Plain arithmetic rather than Math.* calls: this runs for every sample.)
    let c = x | 0;
    let r = y | 0;
    if (c > W - 2) c = W > 1 ? W - 2 : 0;
    if (r > H - 2) r = H > 1 ? H - 2 : 0;
    let fx = x - c;
    let fy = y - r;
    if (fx > 1) fx = 1;
    if (fy > 1) fy = 1;
    const c1 = c + 1 < W ? c + 1 : c;
    const r1 = r + 1 < H ? r + 1 : r;
    let z = 0;
    const w00 = (1 - fx) * (1 - fy);
    const w10 = fx * (1 - fy);
    const w01 = (1 - fx) * fy;
    const w11 = fx * fy;
    if (w00 > 0) {
      const v = heights[r * W + c] as number;
      if (v !== v || v === marker) return NaN;
      z += w00 * v;
    }
    if (w10 > 0) {
      const v = heights[r * W + c1] as number;
      if (v !== v || v === marker) return NaN;
      z += w10 * v;
    }
    if (w01 > 0) {
      const v = heights[r1 * W + c] as number;
      if (v !== v || v === marker) return NaN;
      z += w01 * v;
    }
    if (w11 > 0) {
      const v = heights[r1 * W + c1] as number;
      if (v !== v || v === marker) return NaN;
      z += w11 * v;
    }
    return z;
  };

  const x0 = post.col;
  const y0 = post.row;
  const eye = at(x0, y0) + post.eyeHeight;
  const out = new Float32Array(W * H).fill(NaN);
  let ts = new Float64Array(1024);
  for (let r = 0; r < H; r += stride) {
    for (let c = 0; c < W; c += stride) {
      const zt = at(c, r);
      if (isNodata(zt)) continue;
      const dx = c - x0;
      const dy = r - y0;
      const dist = Math.hypot(dx, dy);
      if (dist * cellSize > maxDistance) continue;
      if (dist === 0) {
        out[r * W + c] = 0;
        continue;
      }
      const dist2 = dx * dx + dy * dy;
      const targetLowered = zt - drop(dist);
      // Sample positions t ∈ (0, 1): uniform steps, then the exact crossings of
      // the column and row lines of cell centres.
      const n = Math.ceil(dist / step);
      const crossings = Math.abs(dx) + Math.abs(dy);
      if (ts.length < n + crossings) ts = new Float64Array(2 * (n + crossings));
      let count = 0;
      for (let s = 1; s < n; s++) ts[count++] = s / n;
      for (let gx = Math.min(x0, c) + 1; gx < Math.max(x0, c); gx++) ts[count++] = (gx - x0) / dx;
      for (let gy = Math.min(y0, r) + 1; gy < Math.max(y0, r); gy++) ts[count++] = (gy - y0) / dy;
      let worst = 0;
      for (let q = 0; q < count; q++) {
        const t = ts[q] as number;
        if (!(t > 0 && t < 1)) continue;
        const z = surface(x0 + t * dx, y0 + t * dy);
        if (z !== z) continue;
        const lowered = z - dropPerCell2 * t * t * dist2;
        const need = eye + (lowered - eye) / t - targetLowered;
        if (need > worst) worst = need;
      }
      out[r * W + c] = worst;
    }
  }
  return out;
}
