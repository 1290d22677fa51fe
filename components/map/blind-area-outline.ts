import { COVERAGE_LAYER } from '@/shared/terrain/posts-per-cell';
import { rasterizePolygon } from '@/shared/terrain/rasterize-polygon';

/** A class raster's geometry: cells, cell size and south-west corner, metres. */
export interface OutlineGrid {
  readonly width: number;
  readonly height: number;
  readonly cellSize: number;
  readonly xll: number;
  readonly yll: number;
}

/** A blind area's outline: cell edges between the area and the rest, grid metres. */
export interface BlindAreaOutline {
  /** `x1, y1, x2, y2` per edge, one after another. */
  readonly segments: Float64Array;
  readonly cells: number;
}

/**
 * The blind area (8-connected site cells no post sees, as in
 * `computeCoverageStatistics`) that holds a point, outlined by the cell edges
 * it shares with anything else. Null when the point is outside the grid or on
 * a cell someone sees.
 *
 * @param values the posts-per-cell layer (`COVERAGE_LAYER` codes, row 0 = north)
 * @param grid the layer's geometry
 * @param boundary the site's outer ring in grid metres, or null (the whole grid counts)
 * @param at the point, grid metres (a blind area's interior point)
 */
export function blindAreaOutline(
  values: Uint8Array,
  grid: OutlineGrid,
  boundary: readonly { x: number; y: number }[] | null,
  at: { x: number; y: number },
): BlindAreaOutline | null {
  const { width: W, height: H, cellSize, xll, yll } = grid;
  const yTop = yll + H * cellSize;
  const col0 = Math.floor((at.x - xll) / cellSize);
  const row0 = Math.floor((yTop - at.y) / cellSize);
  if (col0 < 0 || col0 >= W || row0 < 0 || row0 >= H) return null;
  const site =
    boundary && boundary.length >= 3
      ? rasterizePolygon({ ...grid, crs: null }, [boundary.map((p) => [p.x, p.y] as [number, number])])
      : null;
  const blind = (i: number) => values[i] === COVERAGE_LAYER.unseen && (site === null || site[i] === 1);
  if (!blind(row0 * W + col0)) return null;

  const inArea = new Uint8Array(W * H);
  const stack = [row0 * W + col0];
  inArea[row0 * W + col0] = 1;
  let cells = 0;
  while (stack.length > 0) {
    const i = stack.pop()!;
    cells++;
    const c = i % W;
    const r = (i - c) / W;
    for (let rr = Math.max(0, r - 1); rr <= Math.min(H - 1, r + 1); rr++) {
      for (let cc = Math.max(0, c - 1); cc <= Math.min(W - 1, c + 1); cc++) {
        const j = rr * W + cc;
        if (inArea[j] === 0 && blind(j)) {
          inArea[j] = 1;
          stack.push(j);
        }
      }
    }
  }

  const segments: number[] = [];
  const inside = (c: number, r: number) => c >= 0 && c < W && r >= 0 && r < H && inArea[r * W + c] === 1;
  for (let r = 0; r < H; r++) {
    for (let c = 0; c < W; c++) {
      if (inArea[r * W + c] === 0) continue;
      const west = xll + c * cellSize;
      const east = west + cellSize;
      const north = yTop - r * cellSize;
      const south = north - cellSize;
      if (!inside(c, r - 1)) segments.push(west, north, east, north);
      if (!inside(c, r + 1)) segments.push(west, south, east, south);
      if (!inside(c - 1, r)) segments.push(west, south, west, north);
      if (!inside(c + 1, r)) segments.push(east, south, east, north);
    }
  }
  return { segments: Float64Array.from(segments), cells };
}
