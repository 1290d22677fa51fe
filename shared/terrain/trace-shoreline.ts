import { contours } from 'd3-contour';
import { seaSideFromMask } from '@/shared/terrain/shore-strips';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';

/** Most corners a traced shoreline keeps (evenly thinned beyond). */
export const TRACED_MAX_CORNERS = 2000;

/**
 * A shoreline traced from a terrain at a stated level: the contour at
 * `levelM` (marching squares, d3-contour, linear interpolation between cell
 * centres), without its stretches along the grid's edge, as grid metres; the
 * longest such stretch is the shoreline, oriented so the sea (the side at or
 * below the level) is on its left. Nodata cells count as land. Null when the
 * level does not cross the terrain.
 *
 * Source: d3-contour (marching squares, Lorensen & Cline's case table in 2-D) — the library's own
 * documentation; the rest is common practice, no source.
 */
export function traceShoreline(terrain: TerrainRaster, levelM: number): [number, number][] | null {
  const { width: W, height: H, cellSize, xll, yll, heights } = terrain;
  const values = new Float64Array(W * H);
  for (let i = 0; i < values.length; i++) {
    const h = heights[i]!;
    values[i] = Number.isFinite(h) && h !== terrain.nodata ? h : levelM + 1e6;
  }
  const [land] = contours().size([W, H]).thresholds([levelM]).smooth(true)(values as unknown as number[]);
  if (!land) return null;
  // d3's frame: cell (col, row) is the unit square at (col, row); the data's edge is 0.5 in from the frame.
  const onEdge = ([x, y]: number[]) => x! <= 0.5 + 1e-9 || x! >= W - 0.5 - 1e-9 || y! <= 0.5 + 1e-9 || y! >= H - 0.5 - 1e-9;
  const toGrid = ([x, y]: number[]): [number, number] => [xll + x! * cellSize, yll + (H - y!) * cellSize];
  const length = (run: number[][]) =>
    run.reduce((s, p, i) => (i ? s + Math.hypot(p[0]! - run[i - 1]![0]!, p[1]! - run[i - 1]![1]!) : 0), 0);
  let best: number[][] = [];
  for (const polygon of land.coordinates) {
    for (const ring of polygon) {
      const points = ring.slice(0, -1);
      const edgeAt = points.findIndex(onEdge);
      if (edgeAt < 0) {
        if (length(ring) > length(best)) best = ring;
        continue;
      }
      // Walk the ring from an edge point; runs of inner points between edge points are candidates.
      let run: number[][] = [];
      for (let k = 1; k <= points.length; k++) {
        const p = points[(edgeAt + k) % points.length]!;
        if (onEdge(p)) {
          if (length(run) > length(best)) best = run;
          run = [];
        } else run.push(p);
      }
    }
  }
  if (best.length < 2) return null;
  const step = Math.ceil(best.length / TRACED_MAX_CORNERS);
  const thinned = best.filter((_, i) => i % step === 0 || i === best.length - 1);
  const line = thinned.map(toGrid);
  const sea = new Uint8Array(W * H);
  for (let i = 0; i < sea.length; i++) sea[i] = values[i]! <= levelM ? 1 : 0;
  return seaSideFromMask(terrain, line, sea) === 'right' ? line.reverse() : line;
}
