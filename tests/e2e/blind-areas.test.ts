import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import { COVERAGE_LAYER } from '@/shared/terrain/posts-per-cell';
import { DEMO } from '@/tests/support/agents';
import { browserForFile, eachViewport } from '@/tests/support/browser';
import { apiJson, e2eUrl, shot, signIn, watchErrors } from '@/tests/support/e2e';

const browser = browserForFile();

interface BlindArea {
  area: number;
  centroid: { x: number; y: number };
  interior: { x: number; y: number; latDeg: number; lonDeg: number };
}

eachViewport('on the %s viewport', (viewport) => {
  it('opens a blind area on the map at a point inside it, outlined', async () => {
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.reviewer);
      await page.getByText('Harrowmere Forest District').first().waitFor();
      const plans = await apiJson<{ items: { id: string; title: string }[] }>(page, 'GET', '/plans?status=approved');
      const season = plans.items.find((p) => p.title === 'Fire season cover 2026')!;
      const history = await apiJson<{ revisions: { number: number }[] }>(page, 'GET', `/plans/${season.id}/revisions`);
      const { revision } = await apiJson<{
        revision: { snapshot: { coverage: { runId: string; cases: { key: string; blindAreas: BlindArea[] }[] } } };
      }>(page, 'GET', `/plans/${season.id}/revisions/${history.revisions.at(-1)!.number}`);
      const shown = revision.snapshot.coverage.cases[0]!;
      const first = shown.blindAreas[0]!;

      // The point the link uses is a blind cell of this case's posts-per-cell layer.
      const layer = await apiJson<Parameters<typeof decodeClassRaster>[0]>(
        page,
        'GET',
        `/coverage-runs/${revision.snapshot.coverage.runId}/layers/posts-per-cell?caseKey=${encodeURIComponent(shown.key)}`,
      );
      const values = decodeClassRaster(layer);
      const cellOf = (p: { x: number; y: number }) =>
        Math.floor((layer.yll + layer.height * layer.cellSize - p.y) / layer.cellSize) * layer.width +
        Math.floor((p.x - layer.xll) / layer.cellSize);
      expect(values[cellOf(first.interior)]).toBe(COVERAGE_LAYER.unseen);

      await page.goto(`${e2eUrl()}/plans/${season.id}`);
      const link = page.getByRole('link', { name: 'Blind area 1 on the map' });
      await link.scrollIntoViewIfNeeded();
      await link.click();
      await page.waitForURL(/\/map\?/);
      const url = new URL(page.url());
      expect(url.searchParams.get('blind')).toBe('1');
      expect(Number(url.searchParams.get('lat'))).toBeCloseTo(first.interior.latDeg, 5);
      expect(Number(url.searchParams.get('lon'))).toBeCloseTo(first.interior.lonDeg, 5);
      // The outline: a dark edge over a lantern halo around the area.
      await page.locator('svg path[stroke="#E8B04A"]').first().waitFor();
      await shot(page, 'blind-area-map', viewport);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
