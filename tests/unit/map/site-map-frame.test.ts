import { siteMapFrame } from '@/components/map/site-map-frame';
import { fromUtm } from '@/shared/geo/from-utm';
import type { Post, Site } from '@/shared/schemas/site';
import type { SiteTerrain } from '@/shared/schemas/terrain';

const utm33 = (easting: number, northing: number) => fromUtm({ zone: 33, hemisphere: 'N', easting, northing });
const ring = (corners: [number, number][]) =>
  corners.map(([e, n]) => {
    const p = utm33(e, n);
    return [p.lonDeg, p.latDeg] as [number, number];
  });

// The invented demo district (server/seeders/demo.ts), in UTM zone 33N.
const site: Site = {
  id: '00000000-0000-4000-8000-000000000010',
  name: 'Harrowmere Forest District',
  kind: 'forest-district',
  notes: '',
  boundary: ring([
    [513_000, 5_732_000],
    [526_000, 5_732_500],
    [525_500, 5_745_000],
    [514_500, 5_744_000],
    [513_000, 5_732_000],
  ]),
  priorityZones: [
    {
      name: 'Old-growth stand',
      weight: 9,
      ring: ring([
        [517_000, 5_736_000],
        [521_000, 5_736_000],
        [521_000, 5_740_000],
      ]),
    },
  ],
  defaultUnits: 'metric',
  timeZone: 'Europe/Berlin',
  seaLevelMaxM: null,
  seaArea: null,
  targetGroundM: null,
  version: 1,
  updatedAt: '2025-01-01T00:00:00Z',
};
const post: Post = {
  id: '00000000-0000-4000-8000-000000000011',
  siteId: site.id,
  name: 'Crane Knoll Tower',
  kind: 'tower',
  location: (({ latDeg, lonDeg }) => ({ latDeg, lonDeg }))(utm33(516_200, 5_741_300)),
  groundElevationM: 578.4,
  structureHeightM: 22,
  eyeHeightM: 1.6,
  sector: { fromDeg: 90, toDeg: 180 },
  status: 'existing',
  version: 1,
  updatedAt: '2025-01-01T00:00:00Z',
};
const terrain = {
  id: '00000000-0000-4000-8000-000000000012',
  crs: { epsg: 32633, wkt: null, label: 'WGS 84 / UTM zone 33N (EPSG:32633)' },
  baseLayer: {
    kind: 'image',
    style: 'hillshade',
    url: '/api/v1/sites/x/terrain/hillshade.png?terrainId=y',
    widthPx: 600,
    heightPx: 600,
    gridBounds: { west: 510_000, south: 5_730_000, east: 525_000, north: 5_745_000 },
    corners: {} as SiteTerrain['baseLayer']['corners'],
  },
} as unknown as SiteTerrain;

describe('siteMapFrame', () => {
  test('with terrain: the terrain’s grid, posts and boundary in grid metres, the hillshade over gridBounds', () => {
    const frame = siteMapFrame(site, [post], terrain)!;
    expect(frame.base?.rect).toEqual(terrain.baseLayer.gridBounds);
    expect(frame.posts[0]!.x).toBeCloseTo(516_200, 3);
    expect(frame.posts[0]!.y).toBeCloseTo(5_741_300, 3);
    expect(frame.boundary!.points[1]!.x).toBeCloseTo(526_000, 3);
    expect(frame.zones[0]!.name).toBe('Old-growth stand');
    // The first view holds the whole site with a margin.
    expect(frame.initial.west).toBeLessThan(513_000);
    expect(frame.initial.north).toBeGreaterThan(5_745_000);
    expect(frame.zoom.minPxPerM).toBeLessThan(frame.zoom.maxPxPerM);
  });

  test('a post far outside the boundary is drawn but does not shrink the first view', () => {
    const far: Post = {
      ...post,
      id: '00000000-0000-4000-8000-000000000013',
      name: 'Far tower',
      location: { latDeg: 61.05, lonDeg: 14.1 },
    };
    const frame = siteMapFrame(site, [post, far], terrain)!;
    const near = siteMapFrame(site, [post], terrain)!;
    expect(frame.initial).toEqual(near.initial);
    expect(frame.posts).toHaveLength(2);
    expect(frame.posts[1]!.y).toBeGreaterThan(6_700_000); // about 1000 km north, still placed
    expect(frame.zoom.minPxPerM).toBeLessThan(near.zoom.minPxPerM); // and reachable by zooming out
  });

  test('grid convergence at the post: the demo district lies east of zone 33’s central meridian, so γ > 0', () => {
    // Source: γ = atan(tan Δλ · sin φ) (Snyder, USGS PP 1395, from memory), Δλ from 15° E.
    const frame = siteMapFrame(site, [post], terrain)!;
    const { latDeg, lonDeg } = post.location;
    const expected = Math.atan(Math.tan(((lonDeg - 15) * Math.PI) / 180) * Math.sin((latDeg * Math.PI) / 180));
    expect(frame.posts[0]!.convergence).toBeCloseTo(expected, 5);
  });

  test('without terrain: the UTM zone of the site’s middle, no base layer', () => {
    const frame = siteMapFrame(site, [post], null)!;
    expect(frame.base).toBeNull();
    expect(frame.projection.epsg).toBe(32633);
    expect(frame.posts[0]!.x).toBeCloseTo(516_200, 3);
  });

  test('nothing to place: null', () => {
    expect(siteMapFrame({ ...site, boundary: null, priorityZones: [] }, [], null)).toBeNull();
  });
});
