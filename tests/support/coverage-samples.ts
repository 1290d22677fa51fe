import {
  CoverageComparisonSchema,
  CoverageRunSchema,
  type CoverageCase,
  type CoverageComparison,
  type CoverageRun,
} from '@/shared/schemas/coverage';

/*
 * Invented coverage answers for client tests, parsed by the shared schemas
 * so a change of contract breaks them here first. No real place or person:
 * a 10 km² district with two towers, one priority zone.
 */

export const IDS = {
  plan: '00000000-0000-4000-8000-0000000000a1',
  planB: '00000000-0000-4000-8000-0000000000a2',
  site: '00000000-0000-4000-8000-0000000000b1',
  run: '00000000-0000-4000-8000-0000000000c1',
  runB: '00000000-0000-4000-8000-0000000000c2',
  target: '00000000-0000-4000-8000-0000000000d1',
  set: '00000000-0000-4000-8000-0000000000e1',
  postA: '00000000-0000-4000-8000-0000000000f1',
  postB: '00000000-0000-4000-8000-0000000000f2',
  user: '00000000-0000-4000-8000-000000000011',
} as const;

/** A measure with the percentage of a 10 km² (10 000 cells of 1000 m²) site. */
const m = (cells: number, total = 10_000) => ({ cells, area: cells * 1000, pct: (cells / total) * 100 });

const area = (seen1: number, seen2: number, good: number, total = 10_000) => ({
  total: m(total, total),
  noData: m(0, total),
  unseen: m(total - seen1, total),
  seenBy1: m(seen1, total),
  seenBy2: m(seen2, total),
  seenBy3: m(0, total),
  goodCrossBearing: m(good, total),
});

export function sampleCase(overrides: Partial<CoverageCase> = {}, conditionIndex = 0): CoverageCase {
  return {
    detection: null,
    detectionModel: null,
    tideLevelM: null,
    shore: null,
    bands: [],
    gaps: [],
    hourly: null,
    key: `${IDS.target}:${IDS.set}:${conditionIndex}`,
    targetId: IDS.target,
    targetName: 'Test smoke',
    targetHeightM: 30,
    conditionSetId: IDS.set,
    conditionSetName: 'Spread',
    conditionIndex,
    conditionLabel: conditionIndex === 0 ? 'standard optical (k 0.13)' : 'no refraction (k 0)',
    refractionCoefficient: conditionIndex === 0 ? 0.13 : 0,
    site: area(7240, 3100, 2500),
    zones: [{ ...area(800, 300, 250, 1000), name: 'North block', weight: 5 }],
    blindAreas: [
      { cells: 900, area: 900_000, centroid: { x: 516_000, y: 5_741_000, latDeg: 51.81234, lonDeg: 15.23456 } },
      { cells: 120, area: 120_000, centroid: { x: 518_000, y: 5_742_000, latDeg: 51.82, lonDeg: 15.26 } },
    ],
    blindSummary: { count: 5, area: 2_400_000, minArea: 50_000 },
    check: {
      interpretation: 'Standard v1: site seen by ≥ 1 post, priority zones by ≥ 2 posts.',
      passed: false,
      rules: [
        {
          id: 'site-min-seen',
          zoneName: null,
          minPosts: 1,
          minPct: 70,
          text: 'At least 70 % of the site seen by 1 post or more',
          actualPct: 72.4,
          passed: true,
          shortfallPct: 0,
          shortfallArea: 0,
          reasons: [],
        },
        {
          id: 'zone-min-posts:North block',
          zoneName: 'North block',
          minPosts: 2,
          minPct: 100,
          text: 'North block seen by 2 posts or more',
          actualPct: 30,
          passed: false,
          shortfallPct: 70,
          shortfallArea: 700_000,
          reasons: ['0.70 km² of North block is seen by fewer than 2 posts.'],
        },
      ],
      reasons: ['North block falls short.'],
    },
    posts: [
      { postId: IDS.postA, postName: 'Tower A', seenPct: 54.1 },
      { postId: IDS.postB, postName: 'Tower B', seenPct: 61.7 },
    ],
    ...overrides,
  };
}

export function sampleRun(overrides: Partial<CoverageRun> = {}): CoverageRun {
  return CoverageRunSchema.parse({
    id: IDS.run,
    planId: IDS.plan,
    siteId: IDS.site,
    terrainId: null,
    datum: 'terrain',
    inputsHash: 'hash-1',
    status: 'done',
    progress: 1,
    stage: 'Done',
    error: null,
    requestedBy: { id: IDS.user, name: 'Test Planner' },
    createdAt: '2026-06-01T10:00:00.000Z',
    startedAt: '2026-06-01T10:00:01.000Z',
    finishedAt: '2026-06-01T10:00:09.000Z',
    current: true,
    grid: { width: 100, height: 100, cellSizeM: 31.6, xllM: 514_000, yllM: 5_739_000, epsg: 32633 },
    cases: [sampleCase({}, 0), sampleCase({ check: { ...sampleCase().check, passed: true, rules: [] } }, 1)],
    elapsedS: 8,
    ...overrides,
  });
}

export function sampleComparison(): CoverageComparison {
  const measure = (cells: number) => ({ cells, area: cells * 1000 });
  return CoverageComparisonSchema.parse({
    a: { runId: IDS.run, planId: IDS.plan, caseKey: sampleCase().key, site: sampleCase().site },
    b: { runId: IDS.runB, planId: IDS.planB, caseKey: sampleCase().key, site: sampleCase().site },
    difference: { format: 'kenning-rle8/1', width: 1, height: 1, cellSize: 1000, xll: 0, yll: 0, epsg: 32633, data: 'AQE=' },
    statistics: {
      compared: measure(10_000),
      byChange: {
        unchanged: measure(8000),
        gained: measure(1200),
        lost: measure(300),
        morePosts: measure(400),
        fewerPosts: measure(100),
      },
      gainedSeenBy1: measure(1200),
      lostSeenBy1: measure(300),
      gainedSeenBy2: measure(500),
      lostSeenBy2: measure(600),
      netSeenBy1Area: 900_000,
      netSeenBy2Area: -100_000,
    },
  });
}
