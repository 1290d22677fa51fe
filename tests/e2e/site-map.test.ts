import type { Page } from 'playwright-core';
import { DEMO } from '@/tests/support/agents';
import { browserForFile, eachViewport, SCREENSHOT_DIR } from '@/tests/support/browser';
import { openSiteMap, shot, touchGesture, watchErrors } from '@/tests/support/e2e';

const browser = browserForFile();

// The demo district's tower (server/seeders/demo.ts): UTM zone 33N, invented coordinates.
const CRANE_KNOLL = { easting: 516_200, northing: 5_741_300 };

/** Reads the scale bar: its ground length and drawn length, so metres per pixel. */
async function scale(page: Page): Promise<{ label: string; metresPerPx: number }> {
  const bar = page.getByRole('img', { name: /^Scale bar: / });
  const label = ((await bar.getAttribute('aria-label')) ?? '').replace('Scale bar: ', '');
  const svg = (await bar.locator('svg').boundingBox())!;
  const [value, unit] = label.split(' ');
  const metres = Number(value) * (unit === 'km' ? 1000 : 1);
  return { label, metresPerPx: metres / (svg.width - 4) }; // the bar is drawn 2 px in from each side
}

/** The read-out's position line, parsed as UTM (after switching to UTM). */
async function readUtm(page: Page): Promise<{ zone: string; easting: number; northing: number }> {
  const text = (await page.getByLabel('Coordinate read-out').textContent()) ?? '';
  const m = /(\d{1,2}[C-X]) (\d+) (\d+)/.exec(text);
  if (!m) throw new Error(`No UTM position in the read-out: ${text}`);
  return { zone: m[1]!, easting: Number(m[2]), northing: Number(m[3]) };
}

eachViewport('site map on the %s viewport', (viewport) => {
  it('opens from the site page, zooms, pans, reads a coordinate, profiles a tapped point and shows 3D', async () => {
    const phone = viewport === 'phone';
    const { context, page } = await browser.newPage(viewport, { touch: phone });
    const cdp = await context.newCDPSession(page);
    const errors = watchErrors(page);
    try {
      const map = await openSiteMap(page, DEMO.planner, 'Harrowmere Forest District');
      await page.waitForFunction(() => {
        const img = document.querySelector<HTMLImageElement>('img[src*="hillshade.png"]');
        return !!img && img.complete && img.naturalWidth === 600;
      });
      await page.getByRole('img', { name: /^True north/ }).waitFor();
      await shot(page, 'site-map', viewport);
      const box = (await map.boundingBox())!;
      const centre = { x: box.x + box.width / 2, y: box.y + box.height * 0.35 };

      // Zoom: the + button doubles the scale, the scale bar follows with a round length.
      const before = await scale(page);
      await page.getByRole('button', { name: 'Zoom in' }).click();
      await page.waitForFunction((old) => !document.querySelector(`[aria-label="Scale bar: ${old}"]`), before.label);
      const zoomed = await scale(page);
      expect(zoomed.metresPerPx).toBeCloseTo(before.metresPerPx / 2, 1);
      expect(zoomed.label).toMatch(/^(1|2|5|10|20|50|100|200|500) (m|km)$/);

      // Zoom with the wheel (wide) or a pinch (phone): committed once the gesture ends.
      if (phone) {
        await touchGesture(cdp, [
          [
            { x: centre.x - 30, y: centre.y },
            { x: centre.x - 90, y: centre.y },
          ],
          [
            { x: centre.x + 30, y: centre.y },
            { x: centre.x + 90, y: centre.y },
          ],
        ]);
      } else {
        await page.mouse.move(centre.x, centre.y);
        await page.mouse.wheel(0, -300);
      }
      await page.waitForFunction((old) => !document.querySelector(`[aria-label="Scale bar: ${old}"]`), zoomed.label);
      const closer = await scale(page);
      expect(closer.metresPerPx).toBeLessThan(zoomed.metresPerPx * 0.75);

      // Read a coordinate in UTM: point at (or tap) the same screen spot before and after a drag.
      await page.getByRole('radio', { name: 'UTM zone, easting and northing' }).click();
      // On phones the first tap opens the profile sheet over the lower half: stay in the upper part.
      const probe = phone ? { x: centre.x - 40, y: box.y + box.height * 0.12 } : { x: centre.x - 40, y: centre.y - 20 };
      const dragFrom = phone ? { x: centre.x - 60, y: box.y + box.height * 0.16 } : { x: centre.x, y: centre.y + 40 };
      const readAt = async (p: { x: number; y: number }) => {
        if (phone) await page.touchscreen.tap(p.x, p.y);
        else await page.mouse.move(p.x, p.y);
        await page
          .getByLabel('Coordinate read-out')
          .getByText(/\d{1,2}[C-X] \d+ \d+/)
          .waitFor();
        await page.waitForTimeout(100);
        return readUtm(page);
      };
      const first = await readAt(probe);
      expect(first.zone).toBe('33U');
      const drag = { dx: 70, dy: 40 };
      if (phone) {
        await touchGesture(cdp, [
          [
            { x: dragFrom.x, y: dragFrom.y },
            { x: dragFrom.x + drag.dx, y: dragFrom.y + drag.dy },
          ],
        ]);
      } else {
        await page.mouse.move(dragFrom.x, dragFrom.y);
        await page.mouse.down();
        await page.mouse.move(dragFrom.x + drag.dx / 2, dragFrom.y + drag.dy / 2, { steps: 4 });
        await page.mouse.move(dragFrom.x + drag.dx, dragFrom.y + drag.dy, { steps: 4 });
        await page.mouse.up();
      }
      await page.waitForTimeout(300);
      const second = await readAt(probe);
      // Dragging the map right and down brings ground from the west and north under the same spot.
      // common practice, no source: a north-up map moves ground by (dx, dy) px × metres per pixel.
      const m = closer.metresPerPx;
      expect(Math.abs(second.easting - (first.easting - drag.dx * m))).toBeLessThan(3 * m + 2);
      expect(Math.abs(second.northing - (first.northing + drag.dy * m))).toBeLessThan(3 * m + 2);

      // The tower's symbol reads back as the tower's own position (the grid ↔ screen ↔ lat/lon round trip).
      if (phone) await page.getByRole('dialog', { name: 'Profile sheet' }).getByRole('button', { name: 'Close' }).click();
      await page.getByRole('button', { name: 'Show the whole site' }).click();
      await page.waitForTimeout(300);
      const fit = await scale(page);
      const symbol = (await page.locator('[aria-label="Crane Knoll Tower symbol"]').boundingBox())!;
      // The triangle's box centre sits 0.2 × 9 px above the post (it spans −r … +0.6 r).
      const tower = await readAt({ x: symbol.x + symbol.width / 2, y: symbol.y + symbol.height / 2 + 1.8 });
      expect(Math.abs(tower.easting - CRANE_KNOLL.easting)).toBeLessThan(2 * fit.metresPerPx + 2);
      expect(Math.abs(tower.northing - CRANE_KNOLL.northing)).toBeLessThan(2 * fit.metresPerPx + 2);
      await page.getByLabel('Coordinate read-out').screenshot({ path: `${SCREENSHOT_DIR}/site-map-readout-${viewport}.png` });

      // Tap a point: the profile from the chosen post, with a verdict in words that matches the API.
      await page.getByRole('radio', { name: 'Crane Knoll Tower', exact: true }).click();
      const answer = page.waitForResponse((r) => r.url().includes('/terrain/profile') && r.request().method() === 'POST');
      const mapBox = (await map.boundingBox())!;
      const target = { x: mapBox.x + mapBox.width * 0.62, y: mapBox.y + mapBox.height * 0.3 };
      if (phone) await page.touchscreen.tap(target.x, target.y);
      else await page.mouse.click(target.x, target.y);
      const body = await (await answer).json();
      expect(body.results).toHaveLength(2); // standard optical and no refraction
      const panel = page.getByLabel('Terrain profile');
      const verdicts = panel.getByRole('list', { name: 'Verdict per condition' });
      await verdicts.waitFor();
      const firstVerdict = (await verdicts.getByRole('listitem').first().textContent()) ?? '';
      expect(firstVerdict).toContain('Standard optical (k = 0.13)');
      expect(firstVerdict).toContain(body.results[0].groundSeen ? 'Seen:' : 'Not seen:');
      await panel.getByText(/^Vertical scale ×/).waitFor();
      await panel.getByRole('img', { name: /^Side view from the eye to the point/ }).waitFor();
      await panel.getByText(/not necessarily detected/).waitFor();
      await panel.getByText(/Refraction close to the ground varies widely/).waitFor();
      // A smoke column: the verdict speaks of the target's top.
      await panel.getByRole('checkbox', { name: '30 m (smoke)' }).click();
      await verdicts
        .getByText(/30 m target/)
        .first()
        .waitFor();
      await shot(page, 'site-map-profile', viewport);
      if (phone)
        await page
          .getByRole('dialog', { name: 'Profile sheet' })
          .screenshot({ path: `${SCREENSHOT_DIR}/site-map-sheet-phone.png` });

      // 3D: the canvas (software WebGL here), or the readable fallback.
      await page.getByRole('radio', { name: '3D view' }).click();
      const view = page.getByLabel('3D terrain view');
      const fallback = page.getByText('3D view not available');
      await Promise.race([view.locator('canvas').waitFor({ timeout: 60_000 }), fallback.waitFor({ timeout: 60_000 })]);
      await page.waitForTimeout(2500);
      await shot(page, 'site-map-3d', viewport);
      expect((await view.locator('canvas').count()) + (await fallback.count())).toBeGreaterThan(0);
      await page.getByRole('radio', { name: '2D map' }).click();
      await map.waitFor();

      // A post's page links to the map centred on it, with the post chosen.
      await page.getByRole('link', { name: 'Back to Harrowmere Forest District' }).click();
      await page.getByRole('link', { name: 'Blackmoss Tower', exact: true }).click();
      await page.getByRole('link', { name: 'Show on the map' }).click();
      await map.waitFor();
      expect(page.url()).toMatch(/\/sites\/[0-9a-f-]+\/map\?postId=[0-9a-f-]+/);
      expect(
        await page.getByRole('radio', { name: 'Blackmoss Tower (proposed)', exact: true }).getAttribute('aria-checked'),
      ).toBe('true');
      // The coordinate format is remembered for the session.
      expect(await page.getByRole('radio', { name: 'UTM zone, easting and northing' }).getAttribute('aria-checked')).toBe('true');
      const centred = (await page.locator('[aria-label="Blackmoss Tower symbol"]').boundingBox())!;
      const mapNow = (await map.boundingBox())!;
      expect(Math.abs(centred.x + centred.width / 2 - (mapNow.x + mapNow.width / 2))).toBeLessThan(4);
      expect(Math.abs(centred.y + centred.height / 2 - (mapNow.y + mapNow.height / 2))).toBeLessThan(4);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});

it('draws a site without terrain on a plain background in its UTM zone, and says a profile needs terrain', async () => {
  const { context, page } = await browser.newPage('phone', { touch: true });
  const errors = watchErrors(page);
  try {
    const map = await openSiteMap(page, DEMO.planner, 'Tallow Strand');
    await page.getByText('No terrain · WGS 84 / UTM zone 33N (EPSG:32633)').waitFor();
    expect(await page.locator('img[src*="hillshade.png"]').count()).toBe(0);
    // Tallow Strand's shore posts are drawn (invented coordinates in zone 33N).
    await page.locator('[aria-label="Gull Point symbol"]').waitFor();
    // Coast sites measure in nautical miles.
    expect(await page.getByRole('img', { name: /^Scale bar: / }).getAttribute('aria-label')).toMatch(/ NM$/);
    const box = (await map.boundingBox())!;
    await page.touchscreen.tap(box.x + box.width / 2, box.y + box.height * 0.3);
    await page.getByRole('dialog', { name: 'Profile sheet' }).getByText('No terrain for this site').waitFor();
    await page.getByRole('button', { name: 'Legend and layers' }).click();
    await page.getByText('No terrain: plain background').waitFor();
    await shot(page, 'site-map-no-terrain', 'phone');
    expect(errors).toEqual([]);
  } finally {
    await context.close();
  }
});
