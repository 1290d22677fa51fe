import { createTerrainRaster } from '@/shared/terrain/terrain-raster';
import { seaSideFromMask } from '@/shared/terrain/shore-strips';
import { traceShoreline } from '@/shared/terrain/trace-shoreline';

/** A plane rising northwards 1 m per cell from −50 m: the 0 m contour is the east–west line through row 50's … */
function ramp() {
  const width = 120;
  const height = 100;
  const heights = new Float32Array(width * height);
  // Row 0 is north: height = 49.5 − row, so 0 m lies half-way between rows 49 and 50.
  for (let row = 0; row < height; row++) heights.fill(49.5 - row, row * width, (row + 1) * width);
  return createTerrainRaster({ heights, width, height, cellSize: 10, xll: 500_000, yll: 6_000_000 });
}

describe('tracing a shoreline from the terrain', () => {
  it('follows the level on a plane, with the sea (below the level) on its left', () => {
    // Source: linear interpolation between cell centres (marching squares, d3-contour): on a plane the contour
    // is a straight line where the plane crosses the level — common practice, no source.
    const t = ramp();
    const line = traceShoreline(t, 0)!;
    expect(line.length).toBeGreaterThan(2);
    // Row 49's centre is y = yll + (100 − 49.5)·10, row 50's 10 m south; the level is half-way.
    const expectedY = t.yll + (100 - 50) * 10;
    for (const [, y] of line) expect(Math.abs(y - expectedY)).toBeLessThan(0.01);
    // Sea to the south: walking west (x falling) puts the south on the left.
    expect(line[0]![0]).toBeGreaterThan(line[line.length - 1]![0]);
    const sea = t.heights.map((h) => (h <= 0 ? 1 : 0));
    expect(seaSideFromMask(t, line, Uint8Array.from(sea))).toBe('left');
  });

  it('gives nothing when the level does not cross the terrain', () => {
    expect(traceShoreline(ramp(), 500)).toBeNull();
  });
});
