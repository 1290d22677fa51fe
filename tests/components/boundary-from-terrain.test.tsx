import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { createQueryClient } from '@/components/data/query-client';
import { TerrainPanel } from '@/components/sites/terrain-panel';
import type { Site } from '@/shared/schemas/site';
import type { SiteTerrain } from '@/shared/schemas/terrain';
import { fakeApi } from '@/tests/support/fake-api';

const SITE_ID = '7d3f7d6e-2f0a-4c55-9b1e-0d6f1f3d9a01';
const TERRAIN_ID = '2c1b5a4e-8d7f-4e3a-9c2b-1a0f9e8d7c6b';

const site: Site = {
  id: SITE_ID,
  name: 'Carrig Head',
  kind: 'search-area',
  notes: '',
  boundary: null,
  priorityZones: [],
  defaultUnits: 'metric',
  timeZone: 'Europe/Dublin',
  seaLevelMaxM: null,
  seaArea: null,
  targetGroundM: null,
  version: 3,
  updatedAt: '2026-12-03T10:00:00.000Z',
};

// The fixture terrain's facts (tests/fixtures/terrain/README.md).
const terrain: SiteTerrain = {
  id: TERRAIN_ID,
  siteId: SITE_ID,
  active: true,
  originalName: 'small-hill-utm29.tif',
  originalFormat: 'geotiff',
  width: 160,
  height: 150,
  cellSizeM: 30,
  xllM: 425_000,
  yllM: 5_717_000,
  crs: { epsg: 32629, wkt: null, label: 'WGS 84 / UTM zone 29N (EPSG:32629)' },
  nodataValue: -9999,
  nodataCells: 0,
  minElevationM: 21,
  maxElevationM: 285,
  sha256: 'a'.repeat(64),
  coversBoundary: null,
  uploadedBy: { id: null, name: 'Joss Fenwright' },
  createdAt: '2026-12-03T10:00:00.000Z',
  baseLayer: {
    kind: 'image',
    style: 'hillshade',
    url: `/api/v1/sites/${SITE_ID}/terrain/hillshade.png?terrainId=${TERRAIN_ID}`,
    widthPx: 160,
    heightPx: 150,
    gridBounds: { west: 425_000, south: 5_717_000, east: 429_800, north: 5_721_500 },
    corners: {
      northWest: { latDeg: 51.6397, lonDeg: -10.0838 },
      northEast: { latDeg: 51.6401, lonDeg: -10.0145 },
      southEast: { latDeg: 51.5997, lonDeg: -10.0136 },
      southWest: { latDeg: 51.599, lonDeg: -10.0829 },
    },
  },
};

const ring: [number, number][] = [
  [-10.0826434, 51.5991834],
  [-10.0137855, 51.5997982],
  [-10.0146814, 51.6399841],
  [-10.0836002, 51.6393684],
  [-10.0826434, 51.5991834],
];

const clients: ReturnType<typeof createQueryClient>[] = [];
const renderPanel = (canUpload: boolean) => {
  const client = createQueryClient();
  clients.push(client);
  return render(
    <QueryClientProvider client={client}>
      <TerrainPanel site={site} canUpload={canUpload} />
    </QueryClientProvider>,
  );
};

afterEach(() => {
  for (const c of clients.splice(0)) c.clear();
  delete (globalThis as { fetch?: unknown }).fetch;
});

const terrainPath = `GET /api/v1/sites/${SITE_ID}/terrain`;
const extentPath = `POST /api/v1/sites/${SITE_ID}/boundary-from-terrain`;

describe('TerrainPanel: the terrain’s extent as the boundary', () => {
  it('says how the boundary is made, asks first, and sends the version last seen', async () => {
    const sent = fakeApi({
      [terrainPath]: [{ body: { terrain } }],
      [extentPath]: [{ body: { site: { ...site, boundary: ring, version: 4 }, terrainId: TERRAIN_ID, corners: 5 } }],
    });
    renderPanel(true);
    await screen.findByText('This site has no boundary yet: the terrain’s extent can be its boundary.');
    expect(screen.getAllByText(/reprojected to WGS 84/).length).toBeGreaterThan(0);
    fireEvent.click(screen.getByRole('button', { name: 'Use the terrain’s extent as the boundary' }));
    const dialog = await screen.findByRole('dialog', { name: 'Use the terrain’s extent as the boundary?' });
    expect(within(dialog).getByText(/through the centres of its outermost cells/)).toBeTruthy();
    // Nothing is sent before the planner says yes.
    expect(sent.filter((s) => s.key === extentPath)).toEqual([]);
    fireEvent.click(within(dialog).getByRole('button', { name: 'Use the extent' }));
    await screen.findByText('The site’s boundary is now the terrain’s extent.');
    expect(sent.filter((s) => s.key === extentPath)).toEqual([{ key: extentPath, body: { version: 3 } }]);
  });

  it('keeps the dialog open with the server’s reason when someone else changed the site first', async () => {
    fakeApi({
      [terrainPath]: [{ body: { terrain } }],
      [extentPath]: [
        {
          status: 409,
          body: { error: { code: 'stale_version', message: 'Someone else changed this since you opened it.' } },
        },
      ],
    });
    renderPanel(true);
    fireEvent.click(await screen.findByRole('button', { name: 'Use the terrain’s extent as the boundary' }));
    const dialog = await screen.findByRole('dialog', { name: 'Use the terrain’s extent as the boundary?' });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Use the extent' }));
    await within(dialog).findByText('Someone else changed this since you opened it.');
    expect(screen.queryByText('The site’s boundary is now the terrain’s extent.')).toBeNull();
  });

  it('is not offered to people who cannot change the site', async () => {
    fakeApi({ [terrainPath]: [{ body: { terrain } }] });
    renderPanel(false);
    await screen.findByText('160 × 150 cells · 4.80 km × 4.50 km');
    expect(screen.queryByRole('button', { name: 'Use the terrain’s extent as the boundary' })).toBeNull();
  });
});
