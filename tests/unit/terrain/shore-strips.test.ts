import { computeHiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import {
  closeGapWith,
  intervalShares,
  watchedIntervals,
  eyeHeightForRange,
  seaSideFromMask,
  shoreStations,
  stationRuns,
  stationsFromRuns,
  stripFigures,
  watchedStations,
} from '@/shared/terrain/shore-strips';
import { eyeAboveWaterM } from '@/shared/terrain/tide-levels';
import { classifyVisibility, VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { flatPlain, PLAIN_CELL, PLAIN_CONDITIONS, PLAIN_EYE, PLAIN_RANGE, PLAIN_TARGET } from '@/tests/unit/terrain/flat-plain';

jest.setTimeout(60_000);

/*
 * A flat sea on a small test sphere (see flat-plain.ts): from an eye of 5 m a
 * 20 m target is seen out to exactly D = 3000 m, so each post's view is a
 * disc. The shoreline is the straight east–west line through row 130's cell
 * centres with the sea to the north (left, walking east).
 */
const terrain = flatPlain();
const ROW = 130;
const yOfRow = (row: number) => terrain.yll + (terrain.height - row - 0.5) * terrain.cellSize;
const xOfCol = (col: number) => terrain.xll + (col + 0.5) * terrain.cellSize;
const SHORE: [number, number][] = [
  [terrain.xll, yOfRow(ROW)],
  [terrain.xll + terrain.width * terrain.cellSize, yOfRow(ROW)],
];
const stations = shoreStations(SHORE, [terrain.width * terrain.cellSize], PLAIN_CELL, 'left');

/** Where a post at (col, ROW) sees the target: 1/0 per cell. */
function seenFrom(t: TerrainRaster, col: number, eye = PLAIN_EYE, target = PLAIN_TARGET): Uint8Array {
  const hidden = computeHiddenHeightRaster(t, { col, row: ROW, eyeHeight: eye }, PLAIN_CONDITIONS);
  const { classes } = classifyVisibility(hidden, target);
  return classes.map((c) => (c === VISIBILITY_CLASS.seen || c === VISIBILITY_CLASS.targetOnly ? 1 : 0));
}

describe('strip coverage along a straight shore on a flat sea', () => {
  it('a single post watches the closed-form chord 2·√(D² − d²) of the band’s outer line, within one cell', () => {
    // Source: chord of a circle of radius D at distance d from its centre, 2·√(D² − d²) (plane geometry,
    // common practice, no source); D is the geographic range √(2R′h) + √(2R′T) (Bowditch, from memory; flat-plain.ts).
    const seen = seenFrom(terrain, 290);
    for (const d of [500, 1000, 2000, 2800]) {
      const watched = watchedStations(terrain, stations, { fromM: 0, toM: d }, seen);
      const figures = stripFigures(stations, [watched]);
      const chord = 2 * Math.sqrt(PLAIN_RANGE ** 2 - d ** 2);
      expect(Math.abs(figures.watched1.lengthM - chord)).toBeLessThanOrEqual(PLAIN_CELL);
      expect(figures.watched2.lengthM).toBe(0);
      // The watched stretch is centred on the post (x of col 290).
      const [run] = stationRuns(watched);
      const middle = (stations[run![0]]!.x + stations[run![1]]!.x) / 2;
      expect(Math.abs(middle - xOfCol(290))).toBeLessThanOrEqual(PLAIN_CELL);
    }
  });

  it('a band farther out is watched along a shorter stretch; a band beyond the range not at all', () => {
    const seen = seenFrom(terrain, 290);
    const near = stripFigures(stations, [watchedStations(terrain, stations, { fromM: 0, toM: 1000 }, seen)]);
    const far = stripFigures(stations, [watchedStations(terrain, stations, { fromM: 1000, toM: 2500 }, seen)]);
    const beyond = stripFigures(stations, [watchedStations(terrain, stations, { fromM: 2500, toM: 3100 }, seen)]);
    expect(far.watched1.lengthM).toBeLessThan(near.watched1.lengthM);
    expect(beyond.watched1.lengthM).toBe(0);
    // common practice, no source: a shore nobody watches is one gap from end to end.
    expect(beyond.gaps).toEqual([expect.objectContaining({ kind: 'unwatched', fromM: 0, lengthM: beyond.shoreLengthM })]);
  });

  it('two posts whose ranges just touch leave one gap of zero length (within one cell)', () => {
    // Posts 2D = 6000 m apart (240 cells): their discs touch at the shore half-way between them.
    // Source: two circles of radius D with centres 2D apart meet at one point (plane geometry, common practice, no source).
    const a = seenFrom(terrain, 170);
    const b = seenFrom(terrain, 410);
    const band = { fromM: 0, toM: 25 };
    const perPost = [a, b].map((s) => watchedStations(terrain, stations, band, s));
    const figures = stripFigures(stations, perPost);
    const between = figures.gaps.filter((g) => g.toM > xOfCol(170) - terrain.xll && g.fromM < xOfCol(410) - terrain.xll);
    expect(between).toHaveLength(1);
    expect(between[0]!.lengthM).toBeLessThanOrEqual(PLAIN_CELL);
    // Where the gap sits: half-way between the posts, within a cell.
    const at = (between[0]!.fromM + between[0]!.toM) / 2 + terrain.xll;
    expect(Math.abs(at - (xOfCol(170) + xOfCol(410)) / 2)).toBeLessThanOrEqual(PLAIN_CELL);
  });

  it('two posts 4000 m apart overlap: no gap between them, and the overlap is watched by both', () => {
    const a = seenFrom(terrain, 210);
    const b = seenFrom(terrain, 370);
    const band = { fromM: 0, toM: 500 };
    const figures = stripFigures(
      stations,
      [a, b].map((s) => watchedStations(terrain, stations, band, s)),
    );
    const half = Math.sqrt(PLAIN_RANGE ** 2 - 500 ** 2);
    // Source: two chords of half-length L with centres s apart overlap over 2L − s (common practice, no source).
    expect(Math.abs(figures.watched2.lengthM - (2 * half - 4000))).toBeLessThanOrEqual(2 * PLAIN_CELL);
    expect(Math.abs(figures.watched1.lengthM - (4 * half - (2 * half - 4000)))).toBeLessThanOrEqual(2 * PLAIN_CELL);
    expect(figures.gaps.every((g) => g.kind === 'unwatched' && (g.fromM === 0 || g.toM === figures.shoreLengthM))).toBe(true);
  });

  it('takes only the posts on watch', () => {
    const a = watchedStations(terrain, stations, { fromM: 0, toM: 500 }, seenFrom(terrain, 210));
    const b = watchedStations(terrain, stations, { fromM: 0, toM: 500 }, seenFrom(terrain, 370));
    const both = stripFigures(stations, [a, b]);
    const onlyA = stripFigures(stations, [a, b], [true, false]);
    const none = stripFigures(stations, [a, b], [false, false]);
    expect(onlyA.watched1.lengthM).toBeLessThan(both.watched1.lengthM);
    expect(onlyA.watched1.lengthM).toBe(stripFigures(stations, [a]).watched1.lengthM);
    expect(none.watched1.pct).toBe(0);
  });

  it('keeps a post’s stations through runs', () => {
    const a = watchedStations(terrain, stations, { fromM: 0, toM: 500 }, seenFrom(terrain, 210));
    expect(stationsFromRuns(stationRuns(a), a.length)).toEqual(a);
  });

  it('finds the sea side from a sea mask', () => {
    const mask = new Uint8Array(terrain.width * terrain.height);
    for (let row = 0; row < ROW; row++) mask.fill(1, row * terrain.width, (row + 1) * terrain.width);
    expect(seaSideFromMask(terrain, SHORE, mask)).toBe('left');
    expect(seaSideFromMask(terrain, [SHORE[1]!, SHORE[0]!], mask)).toBe('right');
    expect(seaSideFromMask(terrain, SHORE, new Uint8Array(mask.length))).toBeNull();
  });
});

describe('closing a gap', () => {
  it('asks the eye height whose geographic range reaches the farthest point (inverse of the horizon arc)', () => {
    // Source: Bowditch (NGA Pub. 9), geographic range = horizon distance of the eye + of the object;
    // on the test sphere D = √(2R′h) + √(2R′T) (parabolic model): 3000 m for h = 5 m, T = 20 m. The exact arc
    // differs from the parabola by under 0.01 % at these distances.
    const h = eyeHeightForRange(3000, 20, 0, 100_000);
    expect(h).toBeCloseTo(5, 2);
    expect(eyeHeightForRange(1500, 20, 0, 100_000)).toBe(0);
  });

  it('names the nearest post that can close it and how much higher it must be', () => {
    const a = seenFrom(terrain, 170);
    const b = seenFrom(terrain, 450);
    const band = { fromM: 0, toM: 1000 };
    const perPost = [a, b].map((s) => watchedStations(terrain, stations, band, s));
    const gap = stripFigures(stations, perPost).gaps.find((g) => g.fromM > 3000 && g.toM < 12_000)!;
    expect(gap).toBeDefined();
    const post = (col: number) => ({
      x: xOfCol(col),
      y: yOfRow(ROW),
      eyeAboveWaterM: PLAIN_EYE,
      sector: null,
      gridConvergence: 0,
    });
    const closer = closeGapWith(
      stations,
      gap,
      band,
      [post(170), post(450)],
      { countsFromM: PLAIN_TARGET, rangeLimitM: null },
      {
        k: 0,
        earthRadiusM: 100_000,
      },
    )!;
    expect(closer.raiseByM).toBeGreaterThan(0);
    // The raised eye's range reaches the farthest point of the band along the gap.
    const reach = Math.sqrt(2 * 100_000 * closer.neededEyeM!) + Math.sqrt(2 * 100_000 * PLAIN_TARGET);
    expect(reach).toBeGreaterThanOrEqual(closer.farthestM * 0.999);
    // A range limit nearer than the gap: height cannot help.
    const limited = closeGapWith(
      stations,
      gap,
      band,
      [post(170)],
      { countsFromM: PLAIN_TARGET, rangeLimitM: 2000 },
      {
        k: 0,
        earthRadiusM: 100_000,
      },
    )!;
    expect(limited).toMatchObject({ blockedBy: 'range-limit', raiseByM: null });
    // A sector facing away (south) cannot close a gap to the sea side.
    const facingAway = closeGapWith(
      stations,
      gap,
      band,
      [{ ...post(170), sector: { fromDeg: 100, toDeg: 260 } }],
      { countsFromM: PLAIN_TARGET, rangeLimitM: null },
      { k: 0, earthRadiusM: 100_000 },
    )!;
    expect(facingAway.blockedBy).toBe('sector');
  });
});

describe('tide', () => {
  it('lowers a shore post’s eye above the water by the tide level; a vessel rides it', () => {
    // common practice, no source: heights above a datum less the water's height above it.
    expect(eyeAboveWaterM({ groundElevationM: 14, aboveGroundM: 7.6, floats: false }, 1.8)).toBeCloseTo(19.8, 9);
    expect(eyeAboveWaterM({ groundElevationM: 0, aboveGroundM: 6.1, floats: true }, 1.8)).toBeCloseTo(6.1, 9);
  });

  it('raises the horizon as √ of the eye height above the water predicts', () => {
    // Source: The American Practical Navigator (Bowditch, NGA Pub. 9), distance of the horizon D = √(2R′h):
    // halving the height shrinks the horizon by √2. A target of 0 m is seen to the horizon only.
    const post = { groundElevationM: 8, aboveGroundM: 0, floats: false };
    const reachAt = (tideM: number) => {
      const eye = eyeAboveWaterM(post, tideM);
      const seen = seenFrom(terrain, 290, eye, 0);
      const watched = watchedStations(terrain, stations, { fromM: 0, toM: 1 }, seen);
      return stripFigures(stations, [watched]).watched1.lengthM / 2;
    };
    const low = reachAt(0); // eye 8 m above the water
    const high = reachAt(6); // eye 2 m above the water
    // √(2·100 km·8 m) = 1264.9 m and √(2·100 km·2 m) = 632.5 m: a ratio of √(8/2) = 2.
    expect(Math.abs(low - Math.sqrt(2 * 100_000 * 8))).toBeLessThanOrEqual(PLAIN_CELL);
    expect(Math.abs(high - Math.sqrt(2 * 100_000 * 2))).toBeLessThanOrEqual(PLAIN_CELL);
    expect(low / high).toBeCloseTo(Math.sqrt(8 / 2), 1);
  });
});

describe('shares from chainage intervals', () => {
  it('agree with the stations they came from', () => {
    const band = { fromM: 0, toM: 500 };
    const perPost = [210, 370, 450].map((col) => watchedStations(terrain, stations, band, seenFrom(terrain, col)));
    const intervals = perPost.map((w) => watchedIntervals(stations, w));
    for (const on of [
      [true, true, true],
      [true, false, true],
      [false, true, false],
    ]) {
      const byStations = stripFigures(stations, perPost, on);
      const byIntervals = intervalShares(intervals, on, byStations.shoreLengthM);
      expect(byIntervals.watched1.lengthM).toBeCloseTo(byStations.watched1.lengthM, 6);
      expect(byIntervals.watched2.lengthM).toBeCloseTo(byStations.watched2.lengthM, 6);
    }
  });

  it('counts touching intervals once and overlaps twice', () => {
    // common practice, no source
    const shares = intervalShares([[[0, 10]], [[10, 30]], [[25, 40]]], [true, true, true], 100);
    expect(shares.watched1).toEqual({ lengthM: 40, pct: 40 });
    expect(shares.watched2).toEqual({ lengthM: 5, pct: 5 });
  });
});
