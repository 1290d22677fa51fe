import { readFileSync } from 'node:fs';
import { fromUtm } from '@/shared/geo/from-utm';
import { writeEsriAsciiGrid } from '@/shared/terrain/formats/esri-ascii-grid-writer';
import { readGeoTiff } from '@/shared/terrain/formats/geotiff-reader';
import { gridProjection } from '@/shared/terrain/grid-projection';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { elevationAt } from '@/shared/terrain/terrain-elevation';
import { DEMO_TERRAIN_FILE } from '@/server/seeders/demo';
import { DEMO } from '@/tests/support/agents';
import { browserForFile, eachViewport, SCREENSHOT_DIR } from '@/tests/support/browser';
import { e2eUrl, shot, signIn, watchErrors } from '@/tests/support/e2e';

const browser = browserForFile();

const lonLat = (e: number, n: number): [number, number] => {
  const p = fromUtm({ zone: 33, hemisphere: 'N', easting: e, northing: n });
  return [p.lonDeg, p.latDeg];
};

eachViewport('terrain on the %s viewport', (viewport) => {
  it('shows the demo district’s terrain panel and hillshade, and fills a post’s ground from the terrain', async () => {
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.planner);
      const hillshade = page.waitForResponse((r) => r.url().includes('/terrain/hillshade.png'));
      await page.getByRole('link', { name: 'Harrowmere Forest District' }).click();
      const panel = page.getByLabel('Terrain', { exact: true });
      await panel.getByText('600 × 600 cells · 15.0 km × 15.0 km').waitFor();
      await panel.getByText('WGS 84 / UTM zone 33N (EPSG:32633)').waitFor();
      await panel.getByText('Outline: the site boundary.', { exact: false }).waitFor();
      const response = await hillshade;
      expect(response.status()).toBe(200);
      expect(response.headers()['content-type']).toBe('image/png');
      const picture = panel.getByRole('img', { name: 'Hillshade of Harrowmere Forest District' });
      await picture.waitFor();
      // The PNG itself has loaded and decoded (600 × 600 px: the grid at full resolution).
      await page.waitForFunction(() => {
        const img = document.querySelector<HTMLImageElement>('img[src*="hillshade.png"]');
        return !!img && img.complete && img.naturalWidth === 600 && img.naturalHeight === 600;
      });
      const box = await picture.boundingBox();
      expect(box!.width).toBeGreaterThan(200);
      expect(Math.abs(box!.width - box!.height)).toBeLessThan(2); // a square grid
      await panel.scrollIntoViewIfNeeded();
      await panel.screenshot({ path: `${SCREENSHOT_DIR}/terrain-panel-${viewport}.png` });
      await shot(page, 'site-terrain', viewport);

      // "From terrain" in the post form: the ground at the typed location, from the demo grid.
      const bytes = readFileSync(DEMO_TERRAIN_FILE);
      const demo = await readGeoTiff(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
      const { x, y } = gridProjection(demo.crs).toGrid(
        fromUtm({ zone: 33, hemisphere: 'N', easting: 521_000, northing: 5_737_000 }),
      );
      const expected = Math.round((elevationAt(demo, x, y) as number) * 10) / 10;
      const form = page.getByLabel('New post');
      await form.getByRole('button', { name: 'From terrain' }).click();
      await form.getByText('Enter the location first.').waitFor();
      await form.getByLabel('Location').fill('33U 521000 5737000');
      await form.getByRole('button', { name: 'From terrain' }).click();
      await form.getByText(`Ground from the terrain: ${expected.toFixed(1)} m.`).waitFor();
      expect(Number(await form.getByLabel('Ground elevation').inputValue())).toBeCloseTo(expected, 6);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('lets a planner upload a terrain, with the server’s field error and progress', async () => {
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.planner);
      await page.getByRole('link', { name: 'Harrowmere Forest District' }).waitFor();
      const created = await page.request.post(`${e2eUrl()}/api/v1/sites`, {
        data: {
          name: `Upload test ${viewport}`,
          kind: 'search-area',
          boundary: [
            lonLat(600_500, 5_760_500),
            lonLat(602_000, 5_760_500),
            lonLat(602_000, 5_761_500),
            lonLat(600_500, 5_761_500),
          ],
          priorityZones: [],
        },
      });
      expect(created.status()).toBe(201);
      const siteId = (await created.json()).site.id as string;
      await page.goto(`${e2eUrl()}/sites/${siteId}`);
      const panel = page.getByLabel('Terrain', { exact: true });
      await panel.getByText('No terrain yet').waitFor();

      // An invented grid, 100 × 80 cells of 25 m in UTM zone 33N, as an ASCII grid without its .prj.
      const terrain = generateSyntheticTerrain({ width: 100, height: 80, cellSize: 25, xll: 600_000, yll: 5_760_000, seed: 12 });
      const { asc } = writeEsriAsciiGrid(terrain, terrain.heights);
      const chooser = page.waitForEvent('filechooser');
      await panel.getByRole('button', { name: 'Choose file' }).click();
      await (await chooser).setFiles({ name: 'search-area.asc', mimeType: 'text/plain', buffer: Buffer.from(asc) });
      await panel.getByText(/search-area\.asc · 0\.\d MB/).waitFor();
      await panel.getByRole('button', { name: 'Upload terrain' }).click();
      // No CRS in the file: the EPSG field says what to give.
      await panel
        .getByText(/Give its EPSG code/)
        .first()
        .waitFor();
      await panel.getByLabel('EPSG code, if the file has no coordinate system').fill('32633');
      await panel.getByRole('button', { name: 'Upload terrain' }).click();
      await panel.getByText('search-area.asc is now the site’s terrain.').waitFor();
      await panel.getByText('100 × 80 cells · 2.50 km × 2.00 km').waitFor();
      await panel.getByRole('img', { name: `Hillshade of Upload test ${viewport}` }).waitFor();
      await panel.getByRole('button', { name: 'Replace terrain' }).waitFor();
      await panel.screenshot({ path: `${SCREENSHOT_DIR}/terrain-upload-${viewport}.png` });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
