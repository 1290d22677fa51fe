import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { gridSpecOf, type GridSpec } from '@/shared/terrain/grid-spec';

/** Light and scaling of {@link computeHillshade}. */
export interface HillshadeOptions {
  /** Direction the light comes from, degrees clockwise from grid north; default 315 (north-west). */
  readonly azimuthDeg?: number;
  /** Height of the light above the horizon, degrees (0 … 90); default 45. */
  readonly altitudeDeg?: number;
  /** Vertical exaggeration; default 1. */
  readonly zFactor?: number;
  /** Horizontal units per vertical unit; default 1 (metres over metres). */
  readonly scale?: number;
}

/** A shaded-relief raster on the grid of the terrain it was computed from. */
export interface HillshadeRaster extends GridSpec {
  /**
   * Brightness per cell, row 0 = north: 1 (full shadow) … 255 (facing the
   * light), 0 where the terrain has no data.
   */
  readonly shade: Uint8Array;
}

/**
 * Shaded relief of a terrain, with Horn's gradient and the same formulation,
 * defaults and rounding as `gdaldem hillshade` (GDAL):
 *
 *   x = ((z0 + 2·z3 + z6) − (z2 + 2·z5 + z8)) / ewres,
 *   y = ((z6 + 2·z7 + z8) − (z0 + 2·z1 + z2)) / nsres   (nsres = −cellSize, north up),
 *   s = zFactor / (8 · scale),
 *   shade = 1 + max(0, 254 · (sin alt − s·cos alt·(y·cos az − x·sin az)) / √(1 + s²(x² + y²))),
 *
 * rounded to the nearest integer, over the 3 × 3 window
 *
 *   z0 z1 z2
 *   z3 z4 z5     (z4 the cell; row above = north)
 *   z6 z7 z8
 *
 * Edges and holes, as `gdaldem hillshade -compute_edges` does: a window
 * reaching past the grid's edge takes the missing values by linear
 * extrapolation, 2·(edge cell) − (the next cell inwards) — except that on the
 * first and last rows the missing column beyond a corner repeats the corner's
 * own column; a neighbour without data takes the centre cell's value; a cell
 * without data gets 0. A grid only one cell wide or high is shaded as flat in
 * that direction.
 *
 * Source: Horn, B. K. P. (1981), "Hill shading and the reflectance map",
 * Proc. IEEE 69(1); GDAL `gdaldem` documentation (hillshade: -az 315, -alt 45,
 * -z 1, -s 1, -compute_edges) and its implementation in apps/gdaldem_lib.cpp
 * (GDALHillshadeAlg, the edge windows of GDALGeneric3x3Processing).
 *
 * Cost: one pass over the grid, O(cells); no allocation besides the result.
 *
 * @param terrain ground heights, metres, row 0 = north (not modified)
 * @param options azimuth (default 315°), altitude (default 45°), z factor
 *   (default 1), scale (default 1)
 * @returns a new raster of shade values, same grid as the terrain
 * @throws TerrainInputError `invalid-option` for out-of-range options
 * @example
 * const relief = computeHillshade(terrain);
 * relief.shade[0]; // brightness of the north-west cell, 1 … 255
 */
export function computeHillshade(terrain: TerrainRaster, options: HillshadeOptions = {}): HillshadeRaster {
  const azimuth = options.azimuthDeg ?? 315;
  const altitude = options.altitudeDeg ?? 45;
  const zFactor = options.zFactor ?? 1;
  const scale = options.scale ?? 1;
  if (!Number.isFinite(azimuth)) throw new TerrainInputError('invalid-option', `Azimuth must be finite, got ${azimuth}.`);
  if (!(altitude >= 0 && altitude <= 90)) {
    throw new TerrainInputError('invalid-option', `Altitude must be 0 … 90°, got ${altitude}.`);
  }
  if (!(zFactor > 0) || !Number.isFinite(zFactor)) {
    throw new TerrainInputError('invalid-option', `Z factor must be a positive number, got ${zFactor}.`);
  }
  if (!(scale > 0) || !Number.isFinite(scale)) {
    throw new TerrainInputError('invalid-option', `Scale must be a positive number, got ${scale}.`);
  }
  const { width: W, height: H, cellSize, heights } = terrain;
  if (heights.length !== W * H) throw new TerrainInputError('invalid-raster', 'Heights length does not match width × height.');

  const rad = Math.PI / 180;
  const s = zFactor / (8 * scale);
  const invEw = 1 / cellSize;
  const invNs = -1 / cellSize;
  const sinAlt254 = 254 * Math.sin(altitude * rad);
  const cosAz254 = 254 * Math.cos(azimuth * rad) * Math.cos(altitude * rad) * s;
  const sinAz254 = 254 * Math.sin(azimuth * rad) * Math.cos(altitude * rad) * s;
  const s2 = s * s;
  const marker = terrain.nodata;
  const isNodata = (v: number): boolean => v !== v || v === marker;

  const shade = new Uint8Array(W * H);
  const win = new Float64Array(9);
  const shadeOf = (w: Float64Array): number => {
    const z0 = w[0] as number;
    const z1 = w[1] as number;
    const z2 = w[2] as number;
    const z3 = w[3] as number;
    const z5 = w[5] as number;
    const z6 = w[6] as number;
    const z7 = w[7] as number;
    const z8 = w[8] as number;
    const x = (z0 + z3 + z3 + z6 - (z2 + z5 + z5 + z8)) * invEw;
    const y = (z6 + z7 + z7 + z8 - (z0 + z1 + z1 + z2)) * invNs;
    const value = (sinAlt254 - (y * cosAz254 - x * sinAz254)) / Math.sqrt(1 + s2 * (x * x + y * y));
    return value <= 0 ? 1 : Math.round(1 + value);
  };
  const at = (c: number, r: number): number => heights[r * W + c] as number;
  /** 2a − b, or nodata (NaN) when either is nodata. */
  const extrapolate = (a: number, b: number): number => (isNodata(a) || isNodata(b) ? NaN : 2 * a - b);

  /** Edge cells: GDAL's -compute_edges windows, then nodata neighbours → centre. */
  const edgeCell = (c: number, r: number): number => {
    const centre = at(c, r);
    if (isNodata(centre)) return 0;
    const cl = c > 0 ? c - 1 : c;
    const cr = c < W - 1 ? c + 1 : c;
    const colMin = r === 0 || r === H - 1 ? cl : c - 1; // first/last rows repeat the corner column
    const colMax = r === 0 || r === H - 1 ? cr : c + 1;
    const clampCol = (col: number): number => (col < 0 ? 0 : col >= W ? W - 1 : col);
    const value = (col: number, row: number): number => {
      // Rows beyond the top or bottom: extrapolate along the column.
      if (row < 0) return H > 1 ? extrapolate(at(clampCol(col), 0), at(clampCol(col), 1)) : at(clampCol(col), 0);
      if (row >= H) return H > 1 ? extrapolate(at(clampCol(col), H - 1), at(clampCol(col), H - 2)) : at(clampCol(col), H - 1);
      // Columns beyond the left or right edge (interior rows only): extrapolate along the row.
      if (col < 0) return W > 1 ? extrapolate(at(0, row), at(1, row)) : at(0, row);
      if (col >= W) return W > 1 ? extrapolate(at(W - 1, row), at(W - 2, row)) : at(W - 1, row);
      return at(col, row);
    };
    const cols = [colMin, c, colMax];
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) {
        const v = value(cols[j] as number, r - 1 + i);
        win[i * 3 + j] = isNodata(v) ? centre : v;
      }
    }
    return shadeOf(win);
  };

  // Interior cells: the window in locals (the hot loop; edges and holes take the general path above).
  const markerValue = marker ?? NaN;
  for (let r = 0; r < H; r++) {
    const interiorRow = r > 0 && r < H - 1;
    if (!interiorRow) {
      for (let c = 0; c < W; c++) shade[r * W + c] = edgeCell(c, r);
      continue;
    }
    shade[r * W] = edgeCell(0, r);
    if (W > 1) shade[r * W + W - 1] = edgeCell(W - 1, r);
    for (let c = 1; c < W - 1; c++) {
      const i = r * W + c;
      const z4 = heights[i] as number;
      if (z4 !== z4 || z4 === markerValue) continue; // 0 = no data
      let z0 = heights[i - W - 1] as number;
      let z1 = heights[i - W] as number;
      let z2 = heights[i - W + 1] as number;
      let z3 = heights[i - 1] as number;
      let z5 = heights[i + 1] as number;
      let z6 = heights[i + W - 1] as number;
      let z7 = heights[i + W] as number;
      let z8 = heights[i + W + 1] as number;
      // NaN (or the marker) anywhere in the window makes the sum NaN (or is checked below).
      const sum = z0 + z1 + z2 + z3 + z5 + z6 + z7 + z8;
      if (
        sum !== sum ||
        (marker !== null &&
          (z0 === marker ||
            z1 === marker ||
            z2 === marker ||
            z3 === marker ||
            z5 === marker ||
            z6 === marker ||
            z7 === marker ||
            z8 === marker))
      ) {
        if (isNodata(z0)) z0 = z4;
        if (isNodata(z1)) z1 = z4;
        if (isNodata(z2)) z2 = z4;
        if (isNodata(z3)) z3 = z4;
        if (isNodata(z5)) z5 = z4;
        if (isNodata(z6)) z6 = z4;
        if (isNodata(z7)) z7 = z4;
        if (isNodata(z8)) z8 = z4;
      }
      const x = (z0 + z3 + z3 + z6 - (z2 + z5 + z5 + z8)) * invEw;
      const y = (z6 + z7 + z7 + z8 - (z0 + z1 + z1 + z2)) * invNs;
      const value = (sinAlt254 - (y * cosAz254 - x * sinAz254)) / Math.sqrt(1 + s2 * (x * x + y * y));
      shade[i] = value <= 0 ? 1 : Math.round(1 + value);
    }
  }

  return { ...gridSpecOf(terrain), shade };
}
