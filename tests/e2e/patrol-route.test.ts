import type { Browser, Page } from 'playwright-core';
import { DEMO } from '@/tests/support/agents';
import { launchBrowser, newPage, VIEWPORTS, type ViewportName } from '@/tests/support/browser';
import { apiJson, e2eUrl, signIn, watchErrors } from '@/tests/support/e2e';

let browser: Browser;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ browser, close } = await launchBrowser());
});
afterAll(() => close());

interface PostBody {
  id: string;
  name: string;
  location: { latDeg: number; lonDeg: number };
  version: number;
  route: unknown;
}

/** Screenshots of this test go to /tmp/patrol-<name>-<viewport>.png. */
const patrolShot = (page: Page, name: string, viewport: ViewportName) =>
  page.screenshot({ path: `/tmp/patrol-${name}-${viewport}.png`, fullPage: true });

describe.each(Object.keys(VIEWPORTS) as ViewportName[])('a patrol route on the %s viewport', (viewport) => {
  it('a supervisor draws a route for the demo vessel, computes, and reads the swept layer and the time-in-view legend', async () => {
    const { context, page } = await newPage(browser, viewport);
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.planner);
      await page.getByRole('link', { name: 'Tallow Strand' }).waitFor();
      // A copy of the demo vessel for this run, without its route, so the demo's own plans stay as they are.
      const sites = (await apiJson<{ items: { id: string; name: string }[] }>(page, 'GET', '/sites')).items;
      const coast = sites.find((s) => s.name === 'Tallow Strand')!;
      const posts = (await apiJson<{ items: PostBody[] }>(page, 'GET', `/sites/${coast.id}/posts`)).items;
      const demoVessel = posts.find((p) => p.name === 'Patrol vessel Kittiwake')!;
      const { post: copy } = await apiJson<{ post: PostBody }>(
        page,
        'POST',
        `/sites/${coast.id}/posts/${demoVessel.id}/duplicate`,
      );
      const { post: vessel } = await apiJson<{ post: PostBody }>(page, 'PATCH', `/sites/${coast.id}/posts/${copy.id}`, {
        name: `Kittiwake patrol (${viewport})`,
        // Moored 2.5 km south of the demo vessel, so their marks and names on the map stay apart.
        location: { latDeg: demoVessel.location.latDeg - 0.0225, lonDeg: demoVessel.location.lonDeg },
        route: null,
        speedMps: null,
        cycleMinutes: null,
        version: copy.version,
      });

      await page.goto(`${e2eUrl()}/sites/${coast.id}/posts/${vessel.id}`);
      await page.getByRole('heading', { name: vessel.name }).waitFor();
      if (viewport === 'phone') await page.getByRole('button', { name: 'Edit post' }).click();
      const form = page.getByLabel('Edit post');
      // Nautical units on this form: distances in nautical miles, the speed in knots.
      await form.getByRole('radiogroup', { name: 'Units' }).getByRole('radio', { name: 'ft · nmi' }).click();
      const patrol = form.getByLabel('Patrol route');
      await patrol.getByRole('button', { name: 'Draw the route on the map' }).click();
      const map = page.getByLabel(/^Route map: tap to add a waypoint/);
      await map.scrollIntoViewIfNeeded();
      // Three waypoints over the sea around the demo vessel's own mark (the middle of the strand's sea), then back
      // to the start: a loop.
      const mark = (await map.getByText('Patrol vessel Kittiwake', { exact: true }).first().boundingBox())!;
      const vesselAt = { x: mark.x - 12, y: mark.y + mark.height / 2 };
      for (const [dx, dy] of [
        [-60, 30],
        [60, 30],
        [0, -40],
      ] as const) {
        await page.mouse.click(vesselAt.x + dx, vesselAt.y + dy);
        await page.waitForTimeout(300); // apart, so two taps are not read as a double tap (zoom)
      }
      await page.getByText('3 waypoints, 2 legs.', { exact: false }).waitFor();
      await page.getByRole('button', { name: 'Back to the start' }).click();
      await page.getByText(/4 waypoints, 3 legs, back at the start/).waitFor();
      await patrolShot(page, 'draw', viewport);
      await page.getByRole('button', { name: 'Use this route' }).click();
      // The legs and the time to run them, from the speed in knots (the coast's nautical units).
      await patrol
        .getByLabel('Legs of the route')
        .getByText(/^Leg 3: waypoint 3 → 4, [\d.]+ nmi$/)
        .waitFor();
      await patrol.getByLabel('Speed').fill('12');
      await patrol.getByLabel('Cycle (time on station)').fill('120');
      await patrol.getByText(/one run takes [\d.]+ min at this speed · held [\d.]+ min at the last waypoint/).waitFor();
      await patrol.getByText('12 kn = 6.17 m/s (stored)').waitFor();
      await patrolShot(page, 'form', viewport);
      await form.getByRole('button', { name: 'Save changes' }).click();
      await page.getByText('Changes saved.').waitFor();
      const saved = (await apiJson<{ items: PostBody[] }>(page, 'GET', `/sites/${coast.id}/posts`)).items.find(
        (p) => p.id === vessel.id,
      )!;
      expect(Array.isArray(saved.route) && saved.route.length).toBe(4);

      // A plan with the patrol and a boat to find, computed on the flat datum.
      const targets = (await apiJson<{ items: { id: string; name: string }[] }>(page, 'GET', '/targets')).items;
      const sets = (await apiJson<{ items: { id: string; name: string }[] }>(page, 'GET', '/conditions')).items;
      const { plan } = await apiJson<{ plan: { id: string } }>(page, 'POST', '/plans', {
        siteId: coast.id,
        title: `Patrol cover (${viewport})`,
        postIds: [vessel.id, ...posts.filter((p) => p.name === 'Gull Point').map((p) => p.id)],
        targetIds: targets.filter((t) => t.name === 'Small open boat').map((t) => t.id),
        conditionSetIds: sets.filter((s) => s.name === 'Standard day').map((s) => s.id),
      });
      await page.goto(`${e2eUrl()}/plans/${plan.id}`);
      const card = page.getByRole('region', { name: 'Terrain coverage' });
      await card.scrollIntoViewIfNeeded();
      await card.getByRole('button', { name: 'Compute coverage' }).click();
      await card
        .getByText(/^(Meets|Does not meet) the standard$/)
        .first()
        .waitFor({ timeout: 240_000 });
      const figures = card.getByLabel(`Patrol ${vessel.name}`);
      await figures.getByText(/^Watched at least once: [\d.]+ % of the judged area/).waitFor();
      await figures.getByText(/^Probability of detection in one cycle: [\d.]+ %/).waitFor();
      await card.getByLabel('Patrols').scrollIntoViewIfNeeded();
      await patrolShot(page, 'figures', viewport);

      // On the map: the patrol's time-in-view layer with its legend.
      await card.getByRole('link', { name: 'Open on the map' }).click();
      await page.waitForURL('**/map**');
      const chip = page.getByRole('checkbox', { name: `${vessel.name}: time in view` });
      if (viewport === 'phone') await page.getByRole('button', { name: 'Legend and layers' }).click();
      await chip.click();
      await page.getByText('Share of the patrol cycle in view').first().waitFor();
      for (const label of ['Never', 'Up to 25 %', 'Over 75 %']) await page.getByText(label, { exact: true }).first().waitFor();
      await page.getByText('Share of the patrol cycle in view').first().scrollIntoViewIfNeeded();
      await patrolShot(page, 'map', viewport);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
