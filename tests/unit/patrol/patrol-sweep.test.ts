import { samplePatrol, patrolSampleSpacing, type GridPoint } from '@/shared/patrol/patrol-samples';
import { geographicRange } from '@/shared/sightline/geographic-range';
import { computeHiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import { locatePostCell } from '@/shared/terrain/locate-post-cell';
import { PatrolSweep, patrolFractionCodes, PATROL_FRACTION_CODE } from '@/shared/terrain/patrol-sweep';
import { createTerrainRaster } from '@/shared/terrain/terrain-raster';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';

// A flat sea at the datum on a small test sphere (R = 100 km, k = 0), so that ranges are a few dozen
// cells: the engine lowers the sea by d²/(2R′), and a target of height T is seen from an eye at h out
// to the geographic range D = √(2R′h) + √(2R′T).
// Source: geographic range, D = √(2R′h) + √(2R′T) (e.g. Bowditch, The American Practical Navigator,
// "distance of the horizon", from memory), computed by shared/sightline's geographicRange.
const SPHERE = { k: 0, earthRadiusM: 100_000 };
const CONDITIONS = { refractionCoefficient: 0, earthRadius: 100_000 };
const CELL = 25;
const WIDTH = 400;
const HEIGHT = 160;
const EYE = 2;
const TARGET = 0.5;
const D = geographicRange(EYE, TARGET, SPHERE).value!; // ≈ 948.7 m
const XLL = 500_000;
const YLL = 6_000_000;
const sea = createTerrainRaster({
  heights: new Float32Array(WIDTH * HEIGHT),
  width: WIDTH,
  height: HEIGHT,
  cellSize: CELL,
  xll: XLL,
  yll: YLL,
});
// The track runs west–east along the centre of row 80, from 1 km to 9 km.
const ROW = 80;
const Y = YLL + (HEIGHT - ROW - 0.5) * CELL;
const A: GridPoint = { x: XLL + 1000 + CELL / 2, y: Y };
const B: GridPoint = { x: XLL + 9000 + CELL / 2, y: Y };
const SPEED = 5; // m/s, about 10 kn

const swept = new Map<string, ReturnType<typeof sweepOnce>>();
// The same sweep is asked by several tests: computed once.
function sweep(route: GridPoint[], cycleS: number, spacingM: number) {
  const key = JSON.stringify([route, cycleS, spacingM]);
  if (!swept.has(key)) swept.set(key, sweepOnce(route, cycleS, spacingM));
  return swept.get(key)!;
}

function sweepOnce(route: GridPoint[], cycleS: number, spacingM: number) {
  const { samples } = samplePatrol(route, SPEED, cycleS, spacingM);
  const patrol = new PatrolSweep(sea, [{ countsFromM: TARGET, rangeM: null }]);
  for (const s of samples) {
    const cell = locatePostCell(sea, s.x, s.y);
    patrol.add(computeHiddenHeightRaster(sea, { ...cell, eyeHeight: EYE }, CONDITIONS), s.weightS);
  }
  return { result: patrol.result(0), samples: samples.length };
}

const watched = (c: number) => c === VISIBILITY_CLASS.seen || c === VISIBILITY_CLASS.targetOnly;
const columnOf = (x: number) => Math.floor((x - XLL) / CELL);

describe('a patrol on a straight leg over a flat sea', () => {
  const spacing = patrolSampleSpacing(D, CELL);
  const { result } = sweep([A, B], 3600, spacing);

  it('sweeps a corridor twice the geographic range wide, within one cell', () => {
    // Source: the union of discs of radius D along a straight track is a corridor of width 2D
    // (with half-discs at the ends) — plane geometry, common practice, no source; D from geographicRange.
    for (const x of [3000, 5000, 7000]) {
      const col = columnOf(XLL + x);
      let cells = 0;
      for (let row = 0; row < HEIGHT; row++) cells += +watched(result.classes[row * WIDTH + col]!);
      expect(Math.abs(cells * CELL - 2 * D)).toBeLessThanOrEqual(CELL);
    }
    // Nothing beyond the corridor: a cell 2 cells outside D is never watched.
    const outside = (ROW - Math.ceil(D / CELL) - 2) * WIDTH + columnOf(XLL + 5000);
    expect(watched(result.classes[outside]!)).toBe(false);
  });

  it('sweeps the closed-form area, a corridor 2D × L plus a disc of radius D, within a cell along its rim', () => {
    // Source: area of a stadium, 2D·L + πD² — plane geometry, common practice, no source.
    const L = B.x - A.x;
    const expected = 2 * D * L + Math.PI * D * D;
    const rim = 2 * L + 2 * Math.PI * D; // perimeter, m
    const area = result.classes.reduce((n, c) => n + +watched(c), 0) * CELL * CELL;
    expect(Math.abs(area - expected)).toBeLessThan(rim * CELL * 0.5);
  });

  it('keeps the spacing justified by the sagitta: s²/(8D) ≤ one cell and s ≤ D/4', () => {
    // Source: sagitta of a circular arc, h = R − √(R² − s²/4) ≈ s²/(8R) — plane geometry, common practice, no source.
    expect((spacing * spacing) / (8 * D)).toBeLessThanOrEqual(CELL + 1e-9);
    expect(spacing).toBeLessThanOrEqual(D / 4 + 1e-9);
    expect(spacing).toBeGreaterThanOrEqual(CELL);
  });
});

describe('fraction of the cycle in view on an out-and-back leg', () => {
  const cycleS = 3600;
  // A → B → A: 16 km at 5 m/s = 3200 s, held 400 s at A (4 km from the middle, out of view of it).
  const route = [A, B, A];
  const mid = columnOf(XLL + 5000);
  const expectedFraction = (offsetCells: number) => {
    // Source: a cell at lateral distance d from a straight track is in view while the craft is within
    // √(D² − d²) of its abeam point: 2√(D² − d²)/v per pass, two passes per cycle (out and back) —
    // plane geometry, common practice, no source.
    const d = offsetCells * CELL;
    return d >= D ? 0 : (2 * 2 * Math.sqrt(D * D - d * d)) / SPEED / cycleS;
  };

  it.each([0, 10, 30])('matches the closed form for a cell %i cells off the track (fine sampling)', (offset) => {
    const { result } = sweep(route, cycleS, CELL);
    const f = result.timeInViewS[(ROW - offset) * WIDTH + mid]! / cycleS;
    // Each pass's two edges are off by at most half a piece and half a cell (the craft's cell): 4 edges.
    const tolerance = (4 * (CELL / 2 + CELL / 2)) / SPEED / cycleS;
    expect(Math.abs(f - expectedFraction(offset))).toBeLessThanOrEqual(tolerance + 1e-6);
  });

  it('matches it at the justified spacing within the bound that spacing gives', () => {
    const spacing = patrolSampleSpacing(D, CELL);
    const { result } = sweep(route, cycleS, spacing);
    const f = result.timeInViewS[(ROW - 10) * WIDTH + mid]! / cycleS;
    const tolerance = (4 * (spacing / 2 + CELL / 2)) / SPEED / cycleS;
    expect(Math.abs(f - expectedFraction(10))).toBeLessThanOrEqual(tolerance);
    expect(f).toBeGreaterThan(0.15); // about 0.2: the closed form is far from 0
  });

  it('writes the fraction as layer codes 1 + ⌈100·f⌉, 1 for never, the hold at the last waypoint included', () => {
    const { result } = sweep(route, cycleS, CELL);
    const codes = patrolFractionCodes(result, cycleS, null);
    const atA = ROW * WIDTH + columnOf(A.x);
    // Source: definition of the layer (this module) — common practice, no source. The cell under A is
    // in view during the hold (400 s) and while the craft is within D of A on both passes.
    const expectedAtA = (400 + (2 * D) / SPEED) / cycleS;
    expect(Math.abs(codes[atA]! - 1 - 100 * expectedAtA)).toBeLessThanOrEqual(2);
    expect(codes[5 * WIDTH + mid]).toBe(PATROL_FRACTION_CODE.never);
  });
});

describe('sampling spacing convergence', () => {
  it('the swept area and the fractions settle as the spacing shrinks; the justified spacing is within 1 % of the finest', () => {
    const cycleS = 3600;
    const route = [A, B, A];
    const reference = sweep(route, cycleS, CELL).result;
    const refArea = reference.classes.reduce((n, c) => n + +watched(c), 0);
    const errors = [8 * D, 2 * D, D, patrolSampleSpacing(D, CELL)].map((s) => {
      const r = sweep(route, cycleS, s).result;
      const area = r.classes.reduce((n, c) => n + +watched(c), 0);
      let diff = 0;
      let cells = 0;
      for (let i = 0; i < r.timeInViewS.length; i++) {
        if (!watched(reference.classes[i]!)) continue;
        diff += Math.abs(r.timeInViewS[i]! - reference.timeInViewS[i]!) / cycleS;
        cells++;
      }
      return { s, area: Math.abs(area - refArea) / refArea, fraction: diff / cells };
    });
    // Source: convergence of the trapezoid rule as the step shrinks — common practice, no source.
    for (let i = 1; i < errors.length; i++) {
      expect(errors[i]!.area).toBeLessThanOrEqual(errors[i - 1]!.area + 1e-9);
      expect(errors[i]!.fraction).toBeLessThanOrEqual(errors[i - 1]!.fraction + 1e-9);
    }
    // Measured (8D, 2D, D, the justified 237 m): area off by 52.6 %, 10.8 %, 2.4 %, 0 %; the fraction
    // off by 16.8, 4.6, 2.6 and 0.7 % of the cycle on average over the watched cells.
    const chosen = errors[errors.length - 1]!;
    expect(errors[0]!.area).toBeGreaterThan(0.05); // a coarse spacing leaves gaps between the views
    expect(chosen.area).toBeLessThan(0.01);
    expect(chosen.fraction).toBeLessThan(0.01); // mean error of the fraction, share of the cycle
  });
});

describe('samplePatrol', () => {
  it('gives weights that sum to the cycle and never mutates the route', () => {
    const route = [A, B, A];
    const copy = JSON.parse(JSON.stringify(route));
    const { samples, transitS, holdS } = samplePatrol(route, SPEED, 3600, 300);
    // Source: time = distance ÷ speed — common practice, no source.
    expect(transitS).toBeCloseTo(16_000 / SPEED, 6);
    expect(holdS).toBeCloseTo(400, 6);
    expect(samples.reduce((t, s) => t + s.weightS, 0)).toBeCloseTo(3600, 6);
    expect(route).toEqual(copy);
  });
});
