import { computeCoverage, flatTerrain, type ComputeViewsheds } from '@/server/domain/coverage/compute-coverage';
import { flatDatumGrid, type CoverageRunInputs } from '@/server/domain/coverage/coverage-inputs';
import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';
import { geographicRange } from '@/shared/sightline/geographic-range';
import { routeLegs } from '@/shared/patrol/route-legs';
import { gridProjection } from '@/shared/terrain/grid-projection';
import { computeHiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import { PATROL_FRACTION_CODE } from '@/shared/terrain/patrol-sweep';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';

// An invented stretch of open sea (no terrain: the flat datum), about 43 km × 33 km, with one fixed
// post near its west edge and a patrol vessel running out and back along the middle.
const ring: [number, number][] = [
  [-20.3, 49.85],
  [-19.7, 49.85],
  [-19.7, 50.15],
  [-20.3, 50.15],
];
const K = 0.13;
const EYE = 2; // m: the patrol's deck + eye
const route = [
  { latDeg: 50, lonDeg: -20.14 },
  { latDeg: 50, lonDeg: -19.86 },
  { latDeg: 50, lonDeg: -20.14 },
];
const speedMps = 6;
const grid = flatDatumGrid({ boundary: ring })!;
const inputs: CoverageRunInputs = {
  terrain: null,
  flatGrid: grid,
  site: { boundary: ring, zones: [], seaLevelMaxM: null, seaArea: null },
  posts: [
    {
      id: '00000000-0000-4000-8000-000000000001',
      name: 'West buoy',
      latDeg: 50,
      lonDeg: -20.2,
      groundElevationM: 0,
      aboveGroundM: EYE,
      sector: null,
    },
    {
      id: '00000000-0000-4000-8000-000000000002',
      name: 'Cutter',
      latDeg: 49.95,
      lonDeg: -20,
      groundElevationM: 0,
      aboveGroundM: EYE,
      sector: null,
      patrol: { route, speedMps, cycleMinutes: 120 },
    },
  ],
  targets: [
    {
      // A wide, low object (0.5 m that must be in view): only the geometry (the horizon) limits it. Not the
      // sea surface itself: the engine's 1 mm ground tolerance would add √(2R′·0.001) ≈ 121 m to its range.
      id: '00000000-0000-4000-8000-000000000010',
      name: 'Slick',
      heightM: 0.5,
      countsFromM: 0.5,
      requiredVisibleM: 0,
      widthM: 500,
      period: 'day',
      lightIntensityCd: null,
      onWater: true,
    },
  ],
  conditions: [
    {
      conditionSetId: '00000000-0000-4000-8000-000000000020',
      conditionSetName: 'Clear',
      conditionIndex: 0,
      label: 'k = 0.13',
      k: K,
      visibilityM: null,
      visibilityKind: 'mor-5pct',
      seaState: null,
      significantWaveHeightM: null,
      backgroundLighting: 'none',
    },
  ],
  skippedConditions: [],
  earthRadiusM: MEAN_EARTH_RADIUS_M,
  standard: { minSeenPct: 50, priorityMinPosts: 1, targetRules: [], crossBearingMinPct: null },
  resolutionArcmin: 1,
  detectionModel: 'test',
  blindAreaMinAreaM2: 10_000,
};

// One thread, the same engine as the pool.
const serial: ComputeViewsheds = async (terrain, jobs, onDone) =>
  jobs.map((job) => {
    const raster = computeHiddenHeightRaster(terrain, job.post, job.conditions);
    onDone();
    return raster;
  });

describe('a patrol in a plan’s coverage run', () => {
  let run: Awaited<ReturnType<typeof computeCoverage>>;
  beforeAll(async () => {
    run = await computeCoverage(inputs, flatTerrain(grid), serial, async () => {});
  }, 120_000);

  it('counts like a post: its swept area is in the site’s seen share, and it has a per-post share and a layer', () => {
    const c = run.cases[0]!;
    const patrol = c.patrols![0]!;
    const cutter = c.posts.find((p) => p.postName === 'Cutter')!;
    expect(c.posts).toHaveLength(2);
    expect(cutter.seenPct).toBeCloseTo(patrol.sweptPct, 1);
    // Source: the area seen by a set of posts is at least each one's — common practice, no source.
    expect(c.site.seenBy1.area).toBeGreaterThanOrEqual(patrol.sweptAreaM2 - 1);
    expect(c.site.seenBy1.area).toBeGreaterThan(patrol.sweptAreaM2);
    const layer = run.layers.find((l) => l.layer === 'patrol-fraction' && l.postId === patrol.postId);
    expect(layer).toBeDefined();
    expect(layer!.encoded.width).toBe(grid.width);
  });

  it('sweeps the closed-form stadium 2D·L + πD² and its cells are in view πD²/(swept area) of the cycle on average', () => {
    const patrol = run.cases[0]!.patrols![0]!;
    // Source: geographic range of a 0.5 m object from an eye at h, D = √(2R′h) + √(2R′·0.5), R′ = R/(1 − k)
    // (shared/sightline geographicRange; e.g. Bowditch, "distance of the horizon", from memory).
    const D = geographicRange(EYE, 0.5, { k: K }).value!;
    // Source: geodesic length of the route (Karney's algorithm, shared/patrol routeLegs); the grid's UTM
    // scale differs from 1 by < 0.1 % here (UTM scale factor 0.9996 on the central meridian).
    const oneWay = routeLegs(route, speedMps).totalM / 2;
    expect(Math.abs(patrol.routeLengthM / (2 * oneWay) - 1)).toBeLessThan(0.001);
    const L = patrol.routeLengthM / 2;
    // Source: area of a stadium, 2D·L + πD² — plane geometry, common practice, no source. The flat
    // datum's grid uses the same drop model, so the view from each sample is a disc of radius D.
    const stadium = 2 * D * L + Math.PI * D * D;
    expect(Math.abs(patrol.sweptAreaM2 / stadium - 1)).toBeLessThan(0.01);
    // Source: at every instant the craft watches a disc of area πD², so the time-integral of the watched
    // area over the cycle is πD²·T, and the mean share of the cycle over the swept area is πD² / swept area
    // (plane geometry, common practice, no source).
    expect(Math.abs(patrol.meanFractionInView / ((Math.PI * D * D) / stadium) - 1)).toBeLessThan(0.02);
  });

  it('gives the probability of detection of the stated model: W = 2D, C = W·L/A, POD = 1 − e^(−C)', () => {
    const c = run.cases[0]!;
    const patrol = c.patrols![0]!;
    const D = geographicRange(EYE, 0.5, { k: K }).value!;
    // Source: definite-range law, W = 2R (Koopman, Search and Screening, from memory); coverage factor
    // C = W·L/A and random-search POD = 1 − e^(−C) (Koopman; IAMSAR Manual Vol. II, from memory).
    expect(patrol.sweepWidthM!).toBeCloseTo(2 * D, 0);
    expect(patrol.searchAreaM2).toBeCloseTo(c.site.total.area, -2);
    const C = (2 * D * patrol.routeLengthM) / c.site.total.area;
    expect(patrol.coverageFactor!).toBeCloseTo(C, 3);
    expect(patrol.pod!).toBeCloseTo(1 - Math.exp(-C), 3);
    expect(patrol.transitMinutes).toBeCloseTo(patrol.routeLengthM / speedMps / 60, 1);
  });

  it('writes the fraction layer: the closed form on the track’s middle, “never” in the far corners', () => {
    const patrol = run.cases[0]!.patrols![0]!;
    const layer = run.layers.find((l) => l.layer === 'patrol-fraction' && l.postId === patrol.postId)!;
    const codes = decodeClassRaster(layer.encoded);
    const projection = gridProjection({ epsg: grid.epsg, wkt: null });
    const cellAt = (latDeg: number, lonDeg: number) => {
      const { x, y } = projection.toGrid({ latDeg, lonDeg });
      const col = Math.floor((x - grid.xllM) / grid.cellSizeM);
      const row = grid.height - 1 - Math.floor((y - grid.yllM) / grid.cellSizeM);
      return codes[row * grid.width + col]!;
    };
    const D = geographicRange(EYE, 0.5, { k: K }).value!;
    // Source: a cell on the track is in view while the craft is within D of it, 2D/v per pass, two passes
    // per cycle — plane geometry, common practice, no source. Code = 1 + ⌈100·fraction⌉.
    const cycleS = 120 * 60;
    const expected = (2 * 2 * D) / speedMps / cycleS;
    // Each of the four edges of the stays (two passes) is off by at most half the sample spacing and half a cell.
    const tolerance = (4 * (patrol.sampleSpacingM / 2 + grid.cellSizeM / 2)) / speedMps / cycleS;
    expect(Math.abs(cellAt(50, -20) - 1 - 100 * expected)).toBeLessThanOrEqual(100 * tolerance + 1);
    expect(cellAt(50.14, -20.29)).toBe(PATROL_FRACTION_CODE.never);
    expect(cellAt(49.86, -19.71)).toBe(PATROL_FRACTION_CODE.never);
  });
});
