import type { Browser, CDPSession, Page } from 'playwright-core';
import { DEMO } from '@/tests/support/agents';
import { launchBrowser, VIEWPORTS, type ViewportName } from '@/tests/support/browser';
import { e2eUrl, shot, signIn, watchErrors } from '@/tests/support/e2e';

let browser: Browser;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ browser, close } = await launchBrowser());
});
afterAll(() => close());

/** A one-finger drag through the DevTools protocol (Chromium turns it into pointer events). */
async function touchDrag(cdp: CDPSession, from: { x: number; y: number }, to: { x: number; y: number }, steps = 8) {
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchStart', touchPoints: [from] });
  for (let i = 1; i <= steps; i++) {
    const p = { x: from.x + ((to.x - from.x) * i) / steps, y: from.y + ((to.y - from.y) * i) / steps };
    await cdp.send('Input.dispatchTouchEvent', { type: 'touchMove', touchPoints: [p] });
    await new Promise((r) => setTimeout(r, 30));
  }
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchEnd', touchPoints: [] });
}

async function tapAt(page: Page, phone: boolean, p: { x: number; y: number }) {
  if (phone) await page.touchscreen.tap(p.x, p.y);
  else await page.mouse.click(p.x, p.y);
}

describe.each(Object.keys(VIEWPORTS) as ViewportName[])('site setup on the %s viewport', (viewport) => {
  it('a planner of an empty organisation creates a site by drawing its boundary with taps and typing a zone', async () => {
    const phone = viewport === 'phone';
    const context = await browser.newContext({ viewport: VIEWPORTS[viewport], deviceScaleFactor: 1, hasTouch: phone });
    const page = await context.newPage();
    const cdp = await context.newCDPSession(page);
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.otherPlanner);
      await page.getByRole('heading', { name: 'Your sites' }).or(page.getByText('Your sites')).first().waitFor();
      // The demo's second organisation starts with no sites: the empty state says what to do next.
      if (phone) {
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
      await form.getByRole('radio', { name: 'Nautical (m, nmi)' }).click();
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
      if (phone) await touchDrag(cdp, from, to);
      else {
        await page.mouse.move(from.x, from.y);
        await page.mouse.down();
        await page.mouse.move(to.x, to.y, { steps: 8 });
        await page.mouse.up();
      }
      await page.waitForTimeout(200);
      await shot(page, 'site-setup-drawn', viewport);
      await map.screenshot({ path: `${__dirname}/screenshots/site-setup-map-${viewport}.png` });
      // Undo takes the drag back, then the drag is made again.
      await form.getByRole('button', { name: 'Undo' }).click();
      await page.waitForTimeout(100);
      if (phone) await touchDrag(cdp, from, to);
      else {
        await page.mouse.move(from.x, from.y);
        await page.mouse.down();
        await page.mouse.move(to.x, to.y, { steps: 8 });
        await page.mouse.up();
      }
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

      // What was saved: the dragged corner moved east and south of where it was tapped; the rest stayed square.
      const res = await page.request.get(`${e2eUrl()}/api/v1/sites/${siteId}`);
      const site = (await res.json()).site as { boundary: [number, number][]; priorityZones: { name: string; weight: number }[] };
      expect(site.boundary).toHaveLength(5);
      const [c0, c1, c2, c3] = site.boundary as [number, number][];
      expect(c1![1]).toBeCloseTo(c0![1], 4); // same row of taps: same latitude
      expect(c3![0]).toBeCloseTo(c0![0], 4); // same column: same longitude
      expect(c2![0]).toBeGreaterThan(c1![0] + 1e-4); // dragged east
      expect(c2![1]).toBeLessThan(c3![1] - 1e-4); // and south
      expect(site.priorityZones).toEqual([expect.objectContaining({ name: 'Harbour mouth', weight: 8 })]);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
