import { boundsOfPoints } from '@/shared/terrain/bounds-of-points';

describe('boundsOfPoints', () => {
  it('takes the least and greatest x and y of the points', () => {
    // Common practice, no source: a bounding box is the coordinate-wise minimum and maximum.
    expect(
      boundsOfPoints([
        { x: 3, y: 1 },
        { x: -2, y: 4 },
        { x: 0.5, y: -7 },
      ]),
    ).toEqual({ west: -2, south: -7, east: 3, north: 4 });
  });

  it('is one point wide for one point, and null for none', () => {
    // Common practice, no source.
    expect(boundsOfPoints([{ x: 518_500, y: 5_738_500 }])).toEqual({
      west: 518_500,
      south: 5_738_500,
      east: 518_500,
      north: 5_738_500,
    });
    expect(boundsOfPoints([])).toBeNull();
  });

  it('does not change its input', () => {
    const points = [
      { x: 2, y: 3 },
      { x: 1, y: 1 },
    ];
    const copy = structuredClone(points);
    boundsOfPoints(points);
    expect(points).toEqual(copy);
  });
});
