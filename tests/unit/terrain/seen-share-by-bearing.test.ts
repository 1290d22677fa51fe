import { blindBearingRanges } from '@/shared/terrain/blind-bearing-ranges';
import { seenShareByBearing } from '@/shared/terrain/seen-share-by-bearing';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';

const { none, seen, targetOnly, blind, outOfRange } = VISIBILITY_CLASS;
const DEG = Math.PI / 180;

/**
 * A square synthetic layer of `size` × `size` cells with the post in the
 * middle; `classOf(dx, dy)` gives the class of the cell dx cells east and
 * dy cells north of the post. The answers below follow from the picture's
 * geometry, not from the code under test.
 */
function layer(size: number, classOf: (dx: number, dy: number) => number) {
  const mid = (size - 1) / 2;
  const classes = new Uint8Array(size * size);
  for (let row = 0; row < size; row++)
    for (let col = 0; col < size; col++) classes[row * size + col] = classOf(col - mid, mid - row);
  return { width: size, height: size, classes, col: mid, row: mid };
}

describe('seenShareByBearing', () => {
  it('counts a hand-made 3 × 3 layer cell by cell (4 sectors of 90°)', () => {
    // Source: hand count from the picture (common practice, no source):
    //   seen   blind  seen          bearings from the centre: 315°  0°  45°
    //   blind  post   target-only                              270°  —   90°
    //   none   out    blind                                    225° 180° 135°
    const classes = Uint8Array.from([seen, blind, seen, blind, seen, targetOnly, none, outOfRange, blind]);
    const sectors = seenShareByBearing({ width: 3, height: 3, classes, col: 1, row: 1, gridConvergenceRad: 0, sectorCount: 4 });
    expect(sectors.map((s) => [s.fromDeg, s.toDeg, s.inRangeCells, s.seenCells])).toEqual([
      [0, 90, 2, 1], // 0° blind, 45° seen
      [90, 180, 2, 1], // 90° target-only (counts as seen), 135° blind
      [180, 270, 0, 0], // 180° out of range, 225° no data: nothing in range
      [270, 360, 2, 1], // 270° blind, 315° seen
    ]);
    expect(sectors[2]!.seenShare).toBeNull();
    expect(sectors[0]!.seenShare).toBeCloseTo(0.5, 12);

    // A mask leaving out the north-east cell (45°, seen) leaves sector 0 with its blind cell only.
    const mask = Uint8Array.from([1, 1, 0, 1, 1, 1, 1, 1, 1]);
    const masked = seenShareByBearing({
      width: 3,
      height: 3,
      classes,
      col: 1,
      row: 1,
      gridConvergenceRad: 0,
      sectorCount: 4,
      mask,
    });
    expect([masked[0]!.inRangeCells, masked[0]!.seenCells, masked[0]!.seenShare]).toEqual([1, 0, 0]);
  });

  it('finds a blind south-east quadrant as one range 090°–180° (no convergence)', () => {
    // Source: geometry of the picture — cells with Δeast > 0 and Δnorth ≤ 0 lie at grid bearings [90°, 180°);
    // common practice, no source.
    const l = layer(201, (dx, dy) => (dx > 0 && dy <= 0 ? blind : seen));
    const sectors = seenShareByBearing({ ...l, gridConvergenceRad: 0 });
    expect(sectors).toHaveLength(36);
    for (let k = 9; k < 18; k++) expect(sectors[k]!.seenShare).toBe(0);
    expect(sectors[8]!.seenShare).toBe(1);
    expect(sectors[18]!.seenShare).toBe(1);
    expect(blindBearingRanges(sectors, 0.25)).toEqual([
      { fromDeg: 90, toDeg: 180, seenShare: 0, inRangeCells: expect.any(Number) },
    ]);
  });

  it('turns grid bearings into true bearings with the grid convergence (true = grid + γ)', () => {
    // Source: true bearing = grid bearing + γ, γ measured from true north clockwise to grid north
    // (common practice, no source; the convention gridConvergence documents). The same blind quadrant,
    // grid 090°–180°, lies at 095°–185° true when γ = +5°: the sectors 090°–100° and 180°–190° are about half
    // seen, so the blind range (below 25 %) is 100°–180°. With the sign wrong it would be 090°–170°.
    const l = layer(201, (dx, dy) => (dx > 0 && dy <= 0 ? blind : seen));
    const sectors = seenShareByBearing({ ...l, gridConvergenceRad: 5 * DEG });
    expect(sectors[9]!.seenShare).toBeGreaterThan(0.4);
    expect(sectors[9]!.seenShare).toBeLessThan(0.6);
    expect(sectors[18]!.seenShare).toBeGreaterThan(0.4);
    expect(sectors[18]!.seenShare).toBeLessThan(0.6);
    expect(blindBearingRanges(sectors).map((r) => [r.fromDeg, r.toDeg])).toEqual([[100, 180]]);
    const west = seenShareByBearing({ ...l, gridConvergenceRad: -5 * DEG });
    expect(blindBearingRanges(west).map((r) => [r.fromDeg, r.toDeg])).toEqual([[90, 170]]);
  });

  it('keeps a blind range across north whole (350°–010°)', () => {
    // Source: geometry — cells north of the post within 15° of grid north are blind; the sectors 350°–360° and
    // 000°–010° are wholly blind, 010°–020° and 340°–350° about half (common practice, no source).
    const l = layer(201, (dx, dy) => (dy > 0 && Math.abs(dx) < dy * Math.tan(15 * DEG) ? blind : seen));
    const ranges = blindBearingRanges(seenShareByBearing({ ...l, gridConvergenceRad: 0 }));
    expect(ranges.map((r) => [r.fromDeg, r.toDeg])).toEqual([[350, 10]]);
    expect(ranges[0]!.seenShare).toBe(0);
  });

  it('leaves cells without data or beyond the detection range out of the share', () => {
    // Source: definition — the share is of ground within the detection range (common practice, no source).
    // West of the post is out of range; east of it, the north-east quadrant is blind.
    const l = layer(101, (dx, dy) => (dx < 0 ? outOfRange : dy > 0 && dx > 0 ? blind : seen));
    const sectors = seenShareByBearing({ ...l, gridConvergenceRad: 0 });
    for (let k = 19; k < 36; k++) expect(sectors[k]!.seenShare).toBeNull();
    for (let k = 1; k < 9; k++) expect(sectors[k]!.seenShare).toBe(0);
    // Sector 0 holds the seen column due north (Δeast = 0, 50 cells) and the blind cells within 10° east of it
    // (about Σ dy·tan 10° ≈ 215): about 19 % seen, so it joins the blind range.
    expect(sectors[0]!.seenShare).toBeGreaterThan(0.1);
    expect(sectors[0]!.seenShare).toBeLessThan(0.25);
    expect(blindBearingRanges(sectors, 0.25).map((r) => [r.fromDeg, r.toDeg])).toEqual([[0, 90]]);
  });

  it('does not mutate its input and refuses bad input', () => {
    const l = layer(11, (dx) => (dx > 0 ? blind : seen));
    const copy = l.classes.slice();
    seenShareByBearing({ ...l, gridConvergenceRad: 0 });
    expect(l.classes).toEqual(copy);
    expect(() => seenShareByBearing({ ...l, gridConvergenceRad: 0, sectorCount: 0 })).toThrow(TerrainInputError);
    expect(() => seenShareByBearing({ ...l, col: 11, gridConvergenceRad: 0 })).toThrow(TerrainInputError);
    expect(() => seenShareByBearing({ ...l, classes: new Uint8Array(5), gridConvergenceRad: 0 })).toThrow(TerrainInputError);
    expect(() => blindBearingRanges([], 2)).toThrow(TerrainInputError);
  });
});

describe('blindBearingRanges', () => {
  const sector = (k: number, seenShare: number | null) => ({
    fromDeg: k * 90,
    toDeg: (k + 1) * 90,
    inRangeCells: seenShare === null ? 0 : 100,
    seenCells: seenShare === null ? 0 : seenShare * 100,
    seenShare,
  });
  it('merges neighbours, weights the share by cells, and ends a range at a sector with nothing in range', () => {
    // Source: hand count (common practice, no source): 10 + 20 seen of 200 cells = 0.15.
    expect(blindBearingRanges([sector(0, 0.1), sector(1, 0.2), sector(2, null), sector(3, 0.9)])).toEqual([
      { fromDeg: 0, toDeg: 180, seenShare: 0.15, inRangeCells: 200 },
    ]);
    expect(blindBearingRanges([sector(0, 0.1), sector(1, null), sector(2, 0.1), sector(3, 0.9)])).toHaveLength(2);
  });
  it('answers one range all round when every sector is blind, and none when none is', () => {
    expect(blindBearingRanges([0, 1, 2, 3].map((k) => sector(k, 0))).map((r) => [r.fromDeg, r.toDeg])).toEqual([[0, 360]]);
    expect(blindBearingRanges([0, 1, 2, 3].map((k) => sector(k, 0.5)))).toEqual([]);
  });
});
