/**
 * Ground height at a fractional grid position by bilinear interpolation of the
 * four surrounding cell centres: the one terrain surface of the core (point
 * elevations, terrain profiles).
 *
 * `u` is the column and `v` the row position measured from the centre of the
 * north-west cell (so integer (u, v) are cell centres, row 0 = north; see
 * `GridSpec`); both are clamped to the grid, so the surface is flat beyond the
 * outermost centres. Nodes with zero weight are not read.
 *
 * Source: bilinear interpolation on a regular grid (common practice, no source).
 *
 * @param heights row-major heights, metres, `width × height` values
 * @param nodata the raster's nodata marker, or null (NaN always marks nodata)
 * @returns metres, or NaN when a node with non-zero weight is nodata
 * @example
 * // 2 × 1 grid at 100 m and 110 m: halfway between the two centres
 * bilinearSample(new Float32Array([100, 110]), 2, 1, null, 0.5, 0); // 105
 */
export function bilinearSample(
  heights: Float32Array,
  width: number,
  height: number,
  nodata: number | null,
  uRaw: number,
  vRaw: number,
): number {
  const u = uRaw < 0 ? 0 : uRaw > width - 1 ? width - 1 : uRaw;
  const v = vRaw < 0 ? 0 : vRaw > height - 1 ? height - 1 : vRaw;
  const c = Math.min(Math.floor(u), Math.max(0, width - 2));
  const r = Math.min(Math.floor(v), Math.max(0, height - 2));
  const fx = u - c;
  const fy = v - r;
  const c1 = Math.min(c + 1, width - 1);
  const r1 = Math.min(r + 1, height - 1);
  let z = 0;
  const add = (col: number, row: number, w: number): boolean => {
    if (w === 0) return true;
    const value = heights[row * width + col] as number;
    if (value !== value || value === nodata) return false;
    z += w * value;
    return true;
  };
  if (!add(c, r, (1 - fx) * (1 - fy)) || !add(c1, r, fx * (1 - fy)) || !add(c, r1, (1 - fx) * fy) || !add(c1, r1, fx * fy)) {
    return NaN;
  }
  return z;
}
