import { QueryClientProvider } from '@tanstack/react-query';
import { render, screen } from '@testing-library/react';
import { createQueryClient } from '@/components/data/query-client';
import { SiteSketch } from '@/components/sites/site-sketch';
import type { Post, Site } from '@/shared/schemas/site';

// An invented coast stretch with a boundary and one post, kept in nautical units.
const site: Site = {
  id: '5b8e1c2a-3d4f-4a6b-8c9d-0e1f2a3b4c5d',
  name: 'Wrenholm Sound',
  kind: 'coast-stretch',
  notes: '',
  boundary: [
    [-9.9, 51.5],
    [-9.8, 51.5],
    [-9.8, 51.56],
    [-9.9, 51.56],
    [-9.9, 51.5],
  ],
  priorityZones: [],
  defaultUnits: 'nautical',
  timeZone: 'Europe/Dublin',
  seaLevelMaxM: null,
  seaArea: null,
  targetGroundM: null,
  version: 1,
  updatedAt: '2026-12-03T10:00:00.000Z',
};

const post = {
  id: '9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d',
  siteId: site.id,
  name: 'Gannet Head',
  kind: 'shore-post',
  location: { latDeg: 51.53, lonDeg: -9.85 },
  groundElevationM: 40,
  structureHeightM: 0,
  eyeHeightM: 1.6,
  sector: null,
  status: 'existing',
} as unknown as Post;

it('draws nothing and throws nothing before its first layout, in any units', () => {
  // Before the fix the scale bar was asked for a negative metres-per-pixel at width 0 and the page fell over.
  render(
    <QueryClientProvider client={createQueryClient()}>
      <SiteSketch site={site} posts={[post]} />
    </QueryClientProvider>,
  );
  expect(screen.queryByRole('img', { name: 'Sketch of Wrenholm Sound' })).toBeNull();
  expect(screen.getByText(/Sketch, north up/)).toBeTruthy();
});
