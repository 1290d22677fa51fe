import { parseRingText, RingTextError } from '@/shared/geo/parse-ring-text';
import { ringSelfIntersection } from '@/shared/geo/ring-self-intersection';
import { RingSchema } from '@/shared/schemas/site';

describe('parseRingText', () => {
  it('reads one corner per line in mixed formats, latitude first, into [lon, lat] pairs', () => {
    // Source: parseCoordinate's documented examples (DMS 61°14'04.2"N 149°52'35.4"W = 61.2345, −149.8765).
    const ring = parseRingText(`61.2345, -149.8765\n\n61°14'04.2"N 149°52'35.4"W ; N61 20.000 W149 50.000`);
    expect(ring).toHaveLength(3);
    expect(ring[0]).toEqual([-149.8765, 61.2345]);
    expect(ring[1]![0]).toBeCloseTo(-149.8765, 4);
    expect(ring[1]![1]).toBeCloseTo(61.2345, 4);
    // 20 minutes = 1/3 degree (definition of the minute of arc, common practice, no source).
    expect(ring[2]![1]).toBeCloseTo(61 + 1 / 3, 9);
  });

  it('names the line that cannot be read', () => {
    expect(() => parseRingText('61, 14\n61, 14.2\n91, 14')).toThrow(RingTextError);
    try {
      parseRingText('61, 14\n61, 14.2\n91, 14');
    } catch (e) {
      expect((e as RingTextError).line).toBe(3);
      expect((e as Error).message).toMatch(/^Line 3 \(“91, 14”\)/);
    }
  });

  it('wants at least three corners', () => {
    expect(() => parseRingText('61, 14\n61, 14.2')).toThrow(/at least three corners; only 2 were given/);
  });
});

describe('ringSelfIntersection and the shared ring schema', () => {
  // Plain plane geometry (common practice, no source): the diagonals of a unit square cross at its middle.
  const bowTie: [number, number][] = [
    [0, 0],
    [1, 1],
    [1, 0],
    [0, 1],
    [0, 0],
  ];
  const square: [number, number][] = [
    [0, 0],
    [1, 0],
    [1, 1],
    [0, 1],
    [0, 0],
  ];

  it('finds the crossing of a bow tie and none in a square, a repeated corner or an open ring', () => {
    expect(ringSelfIntersection(bowTie)).toEqual([0.5, 0.5]);
    expect(ringSelfIntersection(square)).toBeNull();
    expect(
      ringSelfIntersection([
        [0, 0],
        [1, 0],
        [1, 0],
        [1, 1],
        [0, 1],
      ]),
    ).toBeNull();
  });

  it('does not change its input', () => {
    const copy = structuredClone(bowTie);
    ringSelfIntersection(bowTie);
    expect(bowTie).toEqual(copy);
  });

  it('makes the ring schema refuse a crossing ring with where it crosses', () => {
    const r = RingSchema.safeParse(bowTie.slice(0, 4));
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.message).toMatch(/crosses itself near 0\.50000, 0\.50000/);
    expect(RingSchema.safeParse(square.slice(0, 4)).success).toBe(true);
  });
});
