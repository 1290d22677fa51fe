import type { ConditionSet, Target } from '@/shared/schemas/library';
import type { Post, Site } from '@/shared/schemas/site';

// Invented test data (no real place): a square district, its towers, a smoke and a condition set, for plan snapshots.
// Each factory fills every field with a plain value; a test states what it depends on through `over`.

export const STAMP = '2026-01-01T00:00:00.000Z';

/** A closed ring 0.2° × 0.1° at 61° N, 14° E, as [lon, lat]. */
export const SQUARE_RING: [number, number][] = [
  [14.0, 61.0],
  [14.2, 61.0],
  [14.2, 61.1],
  [14.0, 61.1],
  [14.0, 61.0],
];

export const testSite = (over: Partial<Site> = {}): Site => ({
  id: '00000000-0000-4000-8000-000000000001',
  name: 'Test district',
  kind: 'forest-district',
  notes: '',
  boundary: SQUARE_RING,
  priorityZones: [],
  defaultUnits: 'metric',
  timeZone: 'UTC',
  seaLevelMaxM: null,
  seaArea: null,
  targetGroundM: null,
  version: 0,
  updatedAt: STAMP,
  ...over,
});

export const testPost = (over: Partial<Post> = {}): Post => ({
  id: '00000000-0000-4000-8000-000000000101',
  siteId: testSite().id,
  name: 'Tower',
  kind: 'tower',
  location: { latDeg: 61.05, lonDeg: 14.1 },
  groundElevationM: 300,
  structureHeightM: 20,
  eyeHeightM: 1.6,
  sector: null,
  status: 'existing',
  version: 0,
  updatedAt: STAMP,
  ...over,
});

export const testSmoke = (over: Partial<Target> = {}): Target => ({
  id: '00000000-0000-4000-8000-000000000201',
  name: 'Smoke 30 m',
  kind: 'smoke-column',
  heightM: 30,
  widthM: 200,
  requiredVisibleM: 0,
  period: 'day',
  lightIntensityCd: null,
  onWater: false,
  version: 0,
  updatedAt: STAMP,
  ...over,
});

export const testConditionSet = (over: Partial<ConditionSet> = {}): ConditionSet => ({
  id: '00000000-0000-4000-8000-000000000301',
  name: 'Standard',
  conditions: [{ preset: 'standard-optical' }],
  visibilityM: null,
  visibilityKind: 'mor-5pct',
  seaState: null,
  significantWaveHeightM: null,
  backgroundLighting: 'none',
  version: 0,
  updatedAt: STAMP,
  ...over,
});
