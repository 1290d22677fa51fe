import type { Page } from 'playwright-core';
import { DEMO } from '@/tests/support/agents';
import { browserForFile, eachViewport, SCREENSHOT_DIR, type ViewportName, VIEWPORTS } from '@/tests/support/browser';
import { apiJson, e2eUrl, openSiteMap, shot, signIn, watchErrors } from '@/tests/support/e2e';

const browser = browserForFile();

const DAY_MS = 86_400_000;

/**
 * Whether what shows at the middle of the main navigation is part of an open
 * modal (react-native-web puts a Modal's content in a fixed layer at the end
 * of the body): the bar must not sit over a dialog's backdrop.
 */
async function navIsCovered(page: Page) {
  const nav = (await page.getByRole('navigation', { name: 'Main' }).boundingBox())!;
  return page.evaluate(
    ({ x, y }) => {
      const top = document.elementFromPoint(x, y);
      return !!top?.closest('[aria-modal="true"]') && !top.closest('[aria-label="Main"]');
    },
    { x: nav.x + nav.width / 2, y: nav.y + nav.height / 2 },
  );
}

/** A site and post of this test's own, so the demo posts other tests use stay as they are. */
async function sitePost(page: Page, viewport: ViewportName) {
  const { site } = await apiJson<{ site: { id: string } }>(page, 'POST', '/sites', {
    name: `Roster moor ${viewport}`,
    kind: 'forest-district',
  });
  const { post } = await apiJson<{ post: { id: string; name: string } }>(page, 'POST', `/sites/${site.id}/posts`, {
    name: `Heath watch tower ${viewport}`,
    kind: 'tower',
    location: { latDeg: 61.1, lonDeg: 14.2 },
    groundElevationM: 380,
    structureHeightM: 15,
  });
  return { siteId: site.id, post };
}

eachViewport('on the %s viewport', (viewport) => {
  const phone = viewport === 'phone';

  it('taking someone off a watch asks first: Cancel keeps the watch, the named action removes it', async () => {
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.planner);
      await page.getByText('Your sites').first().waitFor();
      const { siteId, post } = await sitePost(page, viewport);
      const people = await apiJson<{ items: { id: string; name: string }[] }>(page, 'GET', '/people');
      const bram = people.items.find((p) => p.name === 'Bram Tolliver')!;
      // After the demo's relief watch (days 1–4), one day per viewport so the two runs never overlap.
      const day = Date.UTC(new Date().getUTCFullYear(), new Date().getUTCMonth(), new Date().getUTCDate());
      const starts = day + (phone ? 5 : 6) * DAY_MS + 6 * 3_600_000;
      const { assignment } = await apiJson<{ assignment: { id: string } }>(page, 'POST', '/assignments', {
        postId: post.id,
        userId: bram.id,
        startsAt: new Date(starts).toISOString(),
        endsAt: new Date(starts + 12 * 3_600_000).toISOString(),
        note: 'Cover for the browser test.',
      });
      const watchesOnSite = async () =>
        (await apiJson<{ items: { id: string }[] }>(page, 'GET', `/assignments?siteId=${siteId}`)).items.map((a) => a.id);

      await page.goto(`${e2eUrl()}/sites/${siteId}`);
      const roster = page.getByLabel('Watch roster');
      await roster.getByText('Bram Tolliver:').waitFor();
      const takeOff = roster.getByRole('button', { name: `Take Bram Tolliver off ${post.name}` });
      await takeOff.scrollIntoViewIfNeeded();
      await takeOff.click();
      const dialog = page.getByRole('dialog', { name: `Take Bram Tolliver off ${post.name}?` });
      await dialog.waitFor();
      // It says what will happen, and the button names the action (no bare OK).
      await dialog.getByText(/is removed from the roster, and the hours it covered show as uncovered/).waitFor();
      await dialog.getByRole('button', { name: 'Take off the watch' }).waitFor();
      if (phone) expect(await navIsCovered(page)).toBe(true);
      await page.screenshot({ path: `${SCREENSHOT_DIR}/roster-take-off-dialog-${viewport}.png` });

      // Cancel changes nothing.
      await dialog.getByRole('button', { name: 'Cancel' }).click();
      await dialog.waitFor({ state: 'detached' });
      expect(await watchesOnSite()).toEqual([assignment.id]);
      await roster.getByText('Bram Tolliver:').waitFor();

      // The named action takes him off; the roster then shows the post unwatched all week.
      await takeOff.click();
      await dialog.getByRole('button', { name: 'Take off the watch' }).click();
      await dialog.waitFor({ state: 'detached' });
      await roster.getByText('Bram Tolliver:').waitFor({ state: 'detached' });
      expect(await watchesOnSite()).toEqual([]);
      await roster.getByText(`${post.name}: 168 h uncovered`, { exact: false }).waitFor();
      await shot(page, 'roster-after-take-off', viewport);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('the navigation fits: one-line labels, at most five places on a phone with the rest under More', async () => {
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.planner);
      await page.getByText('Your sites').first().waitFor();
      const nav = page.getByRole('navigation', { name: 'Main' });
      // A planner has eight places: Sites, Quick check, Plans, Library, Incidents, Search effort, Training, Account.
      const places = ['Sites', 'Quick check', 'Plans', 'Library', 'Incidents', 'Search effort', 'Training', 'Account'];
      if (!phone) {
        for (const name of places) await nav.getByRole('link', { name }).waitFor();
        expect(await nav.getByRole('button', { name: 'More' }).count()).toBe(0);
        return;
      }
      const links = nav.getByRole('link');
      expect(await links.count()).toBe(4);
      const more = nav.getByRole('button', { name: 'More' });
      await more.waitFor();
      // Every label on one line, inside its own slot: no wrapping, no overlap (common practice, no source).
      const slots = [...(await links.all()), more];
      const width = VIEWPORTS.phone.width / slots.length;
      for (const slot of slots) {
        const label = slot.locator('div[dir="auto"]').last();
        const box = (await label.boundingBox())!;
        expect(box.height).toBeLessThanOrEqual(16); // one 15 px line
        expect(box.width).toBeLessThanOrEqual(width);
        expect(await label.evaluate((el) => el.scrollWidth <= el.clientWidth)).toBe(true);
      }
      await shot(page, 'phone-bar', viewport);

      await more.click();
      const list = page.getByRole('navigation', { name: 'More places' });
      await list.waitFor();
      expect(await list.getByRole('link').allTextContents()).toEqual(['Incidents', 'Search effort', 'Training', 'Account']);
      expect(await navIsCovered(page)).toBe(true);
      await page.screenshot({ path: `${SCREENSHOT_DIR}/phone-bar-more-${viewport}.png` });
      await list.getByRole('link', { name: 'Search effort' }).click();
      await page.waitForURL(/\/search-effort$/);
      await list.waitFor({ state: 'detached' });
      // More is marked while one of its places is open.
      expect(
        await more
          .locator('div')
          .first()
          .evaluate((el) => getComputedStyle(el).backgroundColor),
      ).not.toBe('rgba(0, 0, 0, 0)');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('a tapped point stays in sight above the profile sheet, and the results table says when columns are off-screen', async () => {
    const { context, page } = await browser.newPage(viewport, { touch: phone });
    const errors = watchErrors(page);
    try {
      const map = await openSiteMap(page, DEMO.planner, 'Harrowmere Forest District');
      const box = (await map.boundingBox())!;
      // Low on the map, above the scale bar and read-out: where the phone's profile sheet comes up.
      const at = { x: box.x + box.width * 0.3, y: box.y + box.height - 230 };
      if (phone) await page.touchscreen.tap(at.x, at.y);
      else await page.mouse.click(at.x, at.y);
      const marker = page.locator('svg text', { hasText: /^P1$/ }).last();
      await marker.waitFor();
      if (phone) {
        const sheet = page.getByRole('dialog', { name: 'Profile sheet' });
        await sheet.waitFor();
        await page.waitForFunction(() => {
          const texts = [...document.querySelectorAll('svg text')].filter((t) => t.textContent === 'P1');
          const sheetEl = document.querySelector('[aria-label="Profile sheet"]');
          const last = texts.at(-1)?.getBoundingClientRect();
          return !!last && !!sheetEl && last.bottom < sheetEl.getBoundingClientRect().top;
        });
        const sheetTop = (await sheet.boundingBox())!.y;
        const p1 = (await marker.boundingBox())!;
        expect(p1.y + p1.height).toBeLessThan(sheetTop);
        expect(p1.y).toBeGreaterThan(box.y);
      } else {
        // Wide screens show the profile beside the map: the point stays where it was clicked.
        const p1 = (await marker.boundingBox())!;
        expect(Math.abs(p1.y + p1.height / 2 - at.y)).toBeLessThan(40);
      }
      await page.screenshot({ path: `${SCREENSHOT_DIR}/map-tap-under-sheet-${viewport}.png` });

      // The quick check's results: three condition columns do not fit a phone.
      await page.goto(`${e2eUrl()}/check`);
      const table = page.getByRole('table', { name: 'Sightline results' });
      await table.waitFor();
      const cue = page.getByRole('status').filter({ hasText: /scroll sideways|to the left/ });
      if (phone) {
        await cue.getByText('More conditions → scroll sideways').waitFor();
        // Scrolled to the end (a sideways wheel over the table), the cue points the other way.
        await table.scrollIntoViewIfNeeded();
        const tableBox = (await table.boundingBox())!;
        await page.mouse.move(tableBox.x + tableBox.width / 2, tableBox.y + 20);
        await page.mouse.wheel(600, 0);
        await cue.getByText('← more conditions to the left').waitFor();
        await table.screenshot({ path: `${SCREENSHOT_DIR}/results-scroll-cue-end-${viewport}.png` });
      } else {
        await table.getByRole('columnheader').first().waitFor();
        expect(await cue.count()).toBe(0);
      }
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
