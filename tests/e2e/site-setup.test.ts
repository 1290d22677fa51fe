import { toUtm } from '@/shared/geo/to-utm';
import { DEMO } from '@/tests/support/agents';
import { browserForFile, eachViewport } from '@/tests/support/browser';
import { apiJson, drag, e2eUrl, shot, signIn, tapAt, watchErrors } from '@/tests/support/e2e';

const browser = browserForFile();

eachViewport('site setup on the %s viewport', (viewport) => {
  it('a planner of an empty organisation creates a site by drawing its boundary with taps and typing a zone', async () => {
    const phone = viewport === 'phone';
    const { context, page } = await browser.newPage(viewport, { touch: phone });
    const cdp = await context.newCDPSession(page);
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.otherPlanner);
      await page.getByRole('heading', { name: 'Your sites' }).or(page.getByText('Your sites')).first().waitFor();
      // The demo's second organisation starts with no sites: the empty state says what to do next (checked while it
      // has none: the empty-organisation journey adds sites to it too).
      const existing = await apiJson<{ items: unknown[] }>(page, 'GET', '/sites');
      if (phone && existing.items.length === 0) {
        await page.getByText('No sites yet').waitFor();
        await page.getByText(/Start with a new site/).waitFor();
        await shot(page, 'site-setup-empty', viewport);
      }
      await page.getByRole('link', { name: 'New site' }).click();
      const form = page.getByLabel('New site');
      await form.getByLabel('Name').waitFor();

      // Nothing typed is lost when the form refuses: a missing name is named under its field.
      await form.getByRole('button', { name: 'Create site' }).click();
      await form.getByText('Name the site.').waitFor();

      const name = `Gull Point ${viewport}`;
      await form.getByLabel('Name').fill(name);
      await form.getByRole('radio', { name: 'Coast stretch' }).click();
      await form.getByRole('radio', { name: 'Nautical (ft, nmi)' }).click();
      await form.getByLabel('Time zone').fill('Europe/Dublin');

      // Boundary: drawn on a plain grid around a typed point, with taps.
      await form.getByRole('button', { name: 'Enter boundary' }).click();
      await form.getByLabel('A point inside the site').fill('52.10, -9.90');
      await form.getByRole('button', { name: 'Show the map there' }).click();
      const map = page.getByRole('application', { name: /^Drawing map for boundary/ });
      await map.waitFor();
      await map.scrollIntoViewIfNeeded();
      const box = (await map.boundingBox())!;
      const at = (fx: number, fy: number) => ({ x: box.x + box.width * fx, y: box.y + box.height * fy });
      const corners = [at(0.3, 0.25), at(0.7, 0.25), at(0.7, 0.6), at(0.3, 0.6)];
      for (const c of corners) {
        await tapAt(page, phone, c);
        await page.waitForTimeout(150);
      }
      await page.getByText('4 corners. Tap the first corner (or Close the ring) to finish.').waitFor();
      // Tapping the first corner closes the ring.
      await tapAt(page, phone, corners[0]!);
      await page.getByText(/^4 corners, closed\./).waitFor();
      // Drag the third corner down and to the right (a finger on the phone, the mouse on the wide screen).
      const from = corners[2]!;
      const to = { x: from.x + 40, y: from.y + 30 };
      await drag(page, cdp, phone, from, to);
      await page.waitForTimeout(200);
      await shot(page, 'site-setup-drawn', viewport);
      await map.screenshot({ path: `${__dirname}/screenshots/site-setup-map-${viewport}.png` });
      // Undo takes the drag back, then the drag is made again (pressing Undo may scroll the page: measure anew).
      await form.getByRole('button', { name: 'Undo' }).click();
      await page.waitForTimeout(100);
      await map.scrollIntoViewIfNeeded();
      const again = (await map.boundingBox())!;
      const from2 = { x: again.x + again.width * 0.7, y: again.y + again.height * 0.6 };
      const to2 = { x: from2.x + 40, y: from2.y + 30 };
      await drag(page, cdp, phone, from2, to2);
      await page.waitForTimeout(200);
      await map.screenshot({ path: `${__dirname}/screenshots/site-setup-map-after-undo-${viewport}.png` });
      await form.getByRole('button', { name: 'Use this outline' }).click();
      await form.getByText(/^4 corners, from /).waitFor();

      // A priority zone, its corners pasted as coordinates.
      await form.getByRole('button', { name: 'Add a priority zone' }).click();
      await form.getByLabel('Zone 1 name').fill('Harbour mouth');
      await form.getByLabel('Weight').fill('8');
      await form.getByRole('button', { name: 'Enter zone 1 outline' }).click();
      await form.getByRole('radio', { name: 'Typing corners' }).click();
      await form
        .getByLabel('Zone 1 outline: corners, one per line')
        .fill('52.100, -9.910\n52.100, -9.900\n52.105, -9.900\n52.105, -9.910');
      await form.getByRole('button', { name: 'Use these corners' }).click();
      await form.getByText('4 corners, from 52.10000, -9.91000.').waitFor();
      await shot(page, 'site-setup-form', viewport);

      await form.getByRole('button', { name: 'Create site' }).click();
      await page.getByText(name, { exact: true }).first().waitFor();
      await page.getByText(/Coast stretch · Europe\/Dublin/).waitFor();
      const siteId = /\/sites\/([0-9a-f-]{36})/.exec(page.url())?.[1];
      expect(siteId).toBeDefined();
      await shot(page, 'site-setup-created', viewport);

      // What was saved: the map is drawn in the UTM grid (grid north, not true north), so corners tapped on
      // one screen row share a northing and those in one column an easting; the dragged corner moved
      // east and south of where it was tapped.
      const res = await page.request.get(`${e2eUrl()}/api/v1/sites/${siteId}`);
      const site = (await res.json()).site as { boundary: [number, number][]; priorityZones: { name: string; weight: number }[] };
      expect(site.boundary).toHaveLength(5);
      const [g0, g1, g2, g3] = site.boundary.slice(0, 4).map(([lonDeg, latDeg]) => toUtm({ latDeg, lonDeg }, 29));
      // Taps land on whole pixels of about 20 m; the saved degrees keep 7 decimals (about 1 cm).
      expect(Math.abs(g1!.northing - g0!.northing)).toBeLessThan(1);
      expect(Math.abs(g3!.easting - g0!.easting)).toBeLessThan(1);
      expect(g2!.easting).toBeGreaterThan(g1!.easting + 100);
      expect(g2!.northing).toBeLessThan(g3!.northing - 100);
      expect(site.priorityZones).toEqual([expect.objectContaining({ name: 'Harbour mouth', weight: 8 })]);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
