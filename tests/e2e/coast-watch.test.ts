import type { Browser, Page } from 'playwright-core';
import { DateTime } from 'luxon';
import { DEMO } from '@/tests/support/agents';
import { launchBrowser, VIEWPORTS, type ViewportName } from '@/tests/support/browser';
import { apiJson, e2eUrl, signIn, watchErrors } from '@/tests/support/e2e';

let browser: Browser;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ browser, close } = await launchBrowser());
});
afterAll(() => close());

const coastShot = (page: Page, name: string, viewport: ViewportName) =>
  page.screenshot({ path: `/tmp/coast-${name}-${viewport}.png`, fullPage: true });

type Item = { id: string; name: string };

describe.each(Object.keys(VIEWPORTS) as ViewportName[])('coast watch on the %s viewport', (viewport) => {
  it('a supervisor draws the shoreline, sets two bands, computes, reads the strips and gaps, and closes an unwatched hour', async () => {
    const phone = viewport === 'phone';
    const context = await browser.newContext({
      viewport: VIEWPORTS[viewport],
      deviceScaleFactor: 1,
      hasTouch: phone,
      serviceWorkers: 'block',
    });
    const page = await context.newPage();
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.planner);
      await page.getByRole('heading', { name: 'Your sites' }).or(page.getByText('Your sites')).first().waitFor();
      const sites = await apiJson<{ items: Item[] }>(page, 'GET', '/sites');
      const coast = sites.items.find((s) => s.name === 'Tallow Strand')!;
      await page.goto(`${e2eUrl()}/sites/${coast.id}/edit`);
      const form = page.getByLabel('Edit site');
      await form.getByLabel('Name', { exact: true }).waitFor();

      // The shoreline, drawn with taps from west to east along the south of the stretch (the sea to the north).
      await form.getByRole('button', { name: /Enter the shoreline|Change the shoreline/ }).click();
      const map = page.getByRole('application', { name: /^Drawing map for shoreline/ });
      await map.waitFor();
      await map.scrollIntoViewIfNeeded();
      // A shoreline drawn before (the other viewport's run) is started over.
      const startOver = page.getByRole('button', { name: 'Start over' });
      if (await startOver.isEnabled()) await startOver.click();
      const box = (await map.boundingBox())!;
      // Inside the stretch's boundary, clear of the map's controls, scale bar and read-out (the phone's map is narrower).
      const taps = phone
        ? [
            [0.17, 0.6],
            [0.4, 0.595],
            [0.62, 0.59],
            [0.82, 0.585],
          ]
        : [
            [0.12, 0.74],
            [0.4, 0.73],
            [0.65, 0.71],
            [0.88, 0.7],
          ];
      for (const [fx, fy] of taps as [number, number][]) {
        const p = { x: box.x + box.width * fx, y: box.y + box.height * fy };
        if (phone) await page.touchscreen.tap(p.x, p.y);
        else await page.mouse.click(p.x, p.y);
        await page.waitForTimeout(150);
      }
      await coastShot(page, 'shoreline-drawn', viewport);
      await page.getByText(/4 corners\. Tap to go on along the shore/).waitFor();
      await page.getByRole('button', { name: 'Use this line' }).click();
      await form.getByText(/4 corners, chainage 0 at/).waitFor();

      // Two bands, typed in nautical miles (the site's units).
      const bands = form.getByLabel('Shore and offshore bands');
      while ((await bands.getByRole('button', { name: /^Remove band/ }).count()) > 0) {
        await bands
          .getByRole('button', { name: /^Remove band/ })
          .first()
          .click();
      }
      await bands.getByRole('button', { name: 'Add a band' }).click();
      await bands.getByLabel('Band 1 name').fill('Surf zone');
      await bands.getByLabel('Band 1').getByLabel('From the shore').fill('0');
      await bands.getByLabel('Band 1').getByLabel('Out to').fill('0.5');
      await bands.getByRole('button', { name: 'Add a band' }).click();
      await bands.getByLabel('Band 2 name').fill('Inshore');
      await bands.getByLabel('Band 2').getByLabel('Out to').fill('3');
      await coastShot(page, 'bands', viewport);
      await form.getByRole('button', { name: 'Save changes' }).click();
      await page.waitForURL(new RegExp(`/sites/${coast.id}$`));
      const saved = await apiJson<{ site: { shoreline: unknown[]; bands: { name: string; fromM: number; toM: number }[] } }>(
        page,
        'GET',
        `/sites/${coast.id}`,
      );
      expect(saved.site.shoreline).toHaveLength(4);
      // Source: 1 international nautical mile = 1852 m (International Hydrographic Conference, 1929).
      expect(saved.site.bands).toEqual([
        { name: 'Surf zone', fromM: 0, toM: 926 },
        { name: 'Inshore', fromM: 926, toM: 5556 },
      ]);

      // A plan for the strand, computed from its page.
      const posts = await apiJson<{ items: Item[] }>(page, 'GET', `/sites/${coast.id}/posts`);
      const targets = await apiJson<{ items: Item[] }>(page, 'GET', '/targets');
      const sets = await apiJson<{ items: Item[] }>(page, 'GET', '/conditions');
      const { plan } = await apiJson<{ plan: { id: string } }>(page, 'POST', '/plans', {
        siteId: coast.id,
        title: `Strand strips ${viewport}`,
        postIds: posts.items.map((p) => p.id),
        targetIds: [targets.items.find((t) => t.name === 'Small open boat')!.id],
        conditionSetIds: [sets.items.find((s) => s.name === 'Standard day')!.id],
        standard: {
          minSeenPct: 0,
          priorityMinPosts: 1,
          bandRules: [{ band: 'Inshore', minPosts: 1, minPct: 95, fromHour: 8, toHour: 20 }],
        },
      });
      await page.goto(`${e2eUrl()}/plans/${plan.id}`);
      await page.getByRole('button', { name: 'Compute coverage' }).click();
      const strips = page.getByLabel('Shore watch', { exact: true });
      await strips.waitFor({ timeout: 120_000 });
      await strips.getByRole('img', { name: /Strip chart of the shore: Surf zone watched along/ }).waitFor();
      await strips.getByRole('table', { name: 'Bands along the shore' }).getByText('Inshore').waitFor();
      const gaps = strips.getByRole('list', { name: 'Gaps along the shore' });
      await gaps.or(strips.getByText('No gaps: every band is watched along the whole shore.')).first().waitFor();
      if (await gaps.count()) {
        // Each gap names the post that could close it.
        await expect(gaps.getByRole('listitem').first().textContent()).resolves.toMatch(
          /Nearest: (Gull Point|Fenwick Head|Patrol vessel Kittiwake)/,
        );
      }
      await strips.getByRole('img', { name: /Strip chart of the shore/ }).scrollIntoViewIfNeeded();
      await coastShot(page, 'strips', viewport);

      // An unwatched hour on a day ahead (a gap between two watches), closed on the roster screen.
      const run = (await apiJson<{ latest: { id: string; cases: { key: string }[] } }>(page, 'GET', `/plans/${plan.id}/coverage`))
        .latest;
      const day = DateTime.now()
        .setZone('Europe/Berlin')
        .startOf('day')
        .plus({ days: phone ? 190 : 200 });
      const people = await apiJson<{ items: { id: string; name: string }[] }>(page, 'GET', '/people');
      const person = (name: string) => people.items.find((p) => p.name === name)!.id;
      const post = (name: string) => posts.items.find((p) => p.name === name)!.id;
      const at = (h: number) => day.plus({ hours: h }).toUTC().toISO()!;
      // Earlier watches of these posts that run on into that day end the day before.
      for (const p of ['Gull Point', 'Fenwick Head']) {
        const open = await apiJson<{ items: { id: string; version: number; startsAt: string; endsAt: string | null }[] }>(
          page,
          'GET',
          `/assignments?postId=${post(p)}&from=${encodeURIComponent(at(0))}&to=${encodeURIComponent(at(24))}`,
        );
        for (const w of open.items) {
          if (Date.parse(w.startsAt) < Date.parse(at(0))) {
            await apiJson(page, 'PATCH', `/assignments/${w.id}`, {
              endsAt: day.minus({ hours: 1 }).toUTC().toISO(),
              version: w.version,
            });
          }
        }
      }
      await apiJson(page, 'POST', '/assignments', {
        postId: post('Gull Point'),
        userId: person('Ines Marrow'),
        startsAt: at(8),
        endsAt: at(13),
      });
      await apiJson(page, 'POST', '/assignments', {
        postId: post('Gull Point'),
        userId: person('Ines Marrow'),
        startsAt: at(14),
        endsAt: at(20),
      });
      const hourly = async () =>
        (
          await apiJson<{ hourly: { unwatchedHours: { local: string }[] } }>(
            page,
            'GET',
            `/coverage-runs/${run.id}/hourly?caseKey=${encodeURIComponent(run.cases[0]!.key)}&date=${day.toISODate()}`,
          )
        ).hourly.unwatchedHours
          .map((u) => u.local.slice(11))
          .filter((h) => h >= '08:00' && h < '20:00');
      expect(await hourly()).toEqual(['13:00']);
      // The supervisor closes the hour on the site's roster: Ines Marrow on Gull Point 13:00–14:00 that day
      // (the site's local time), between her two watches.
      const planUrl = page.url();
      await page.goto(`${e2eUrl()}/sites/${coast.id}`);
      const watchForm = page.getByLabel('Put someone on a post');
      await watchForm.getByRole('checkbox', { name: 'Gull Point' }).click();
      await watchForm.getByRole('checkbox', { name: 'Ines Marrow' }).click();
      await watchForm.getByLabel('From', { exact: true }).fill(`${day.toISODate()} 13:00`);
      await watchForm.getByLabel('To', { exact: true }).fill(`${day.toISODate()} 14:00`);
      await watchForm.getByLabel('From', { exact: true }).scrollIntoViewIfNeeded();
      await coastShot(page, 'close-hour', viewport);
      await watchForm.getByRole('button', { name: 'Put on watch' }).click();
      // Saved: the form clears its times for the next watch.
      const from = watchForm.getByLabel('From', { exact: true });
      for (let i = 0; i < 100 && (await from.inputValue()) !== ''; i++) await page.waitForTimeout(100);
      expect(await from.inputValue()).toBe('');
      expect(await hourly()).toEqual([]);

      // Today's hour by hour on the plan's page.
      await page.goto(planUrl);
      await strips.getByLabel('Hour by hour', { exact: true }).scrollIntoViewIfNeeded();
      await strips.getByRole('table', { name: 'Watched share of each band by hour' }).waitFor();
      await coastShot(page, 'hourly', viewport);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
