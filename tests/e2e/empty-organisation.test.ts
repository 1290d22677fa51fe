import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { DEMO } from '@/tests/support/agents';
import { browserForFile, eachViewport } from '@/tests/support/browser';
import { apiJson, drag, e2eUrl, shot, signIn, tapAt, watchErrors } from '@/tests/support/e2e';

const browser = browserForFile();

// The invented fixture terrain (tests/fixtures/terrain/README.md): 160 × 150 cells of 30 m in UTM zone 29N.
const TERRAIN_FILE = path.join(__dirname, '..', 'fixtures', 'terrain', 'small-hill-utm29.tif');
// Source: GDAL 3.6.2 gdaltransform and gdallocationinfo of the fixture at two cell centres (its README).
const HILL_TOP = { text: '51.6244749, -10.0602753', groundM: 285 };
const RIDGE = { text: '51.6085855, -10.0269786', groundM: 144 };

interface SiteBody {
  id: string;
  boundary: [number, number][] | null;
  priorityZones: { name: string; weight: number }[];
}
interface PostBody {
  id: string;
  name: string;
  location: { latDeg: number; lonDeg: number };
  groundElevationM: number;
  structureHeightM: number;
}

/** The fixture's height in the cell under a WGS 84 position, read by GDAL (nearest cell, no interpolation). */
function gdalCellHeight(latDeg: number, lonDeg: number): number {
  const out = execFileSync('gdallocationinfo', ['-valonly', '-wgs84', TERRAIN_FILE, String(lonDeg), String(latDeg)]);
  return Number(out.toString().trim());
}

/** Centre of a post's symbol on the site map. */
async function symbolCentre(page: Page, name: string) {
  const box = (await page.locator(`[aria-label="${name} symbol"]`).boundingBox())!;
  return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
}

eachViewport('an empty organisation on the %s viewport', (viewport) => {
  it('sets up a site from nothing — boundary by taps, zone pasted, terrain, two posts — and gets a plan approved', async () => {
    const phone = viewport === 'phone';
    const { context, page } = await browser.newPage(viewport, { touch: phone });
    const cdp = await context.newCDPSession(page);
    const errors = watchErrors(page);
    const { context: reviewerContext, page: r } = await browser.newPage(viewport, { touch: phone });
    const reviewerErrors = watchErrors(r);
    const siteName = `Carrig Head (${viewport})`;
    const hillName = `Carrig Hill ${viewport}`;
    const ridgeName = `Seal Ridge ${viewport}`;
    const title = `Carrig Head watch (${viewport})`;
    try {
      // 1. The second demo organisation's planner. While it has no sites (other browser tests add some to the
      //    same organisation), the list says what a site is and what to do first.
      await signIn(page, DEMO.otherPlanner);
      await page.getByRole('link', { name: 'New site' }).first().waitFor();
      const existing = await apiJson<{ items: unknown[] }>(page, 'GET', '/sites');
      if (existing.items.length === 0) {
        await page.getByText('No sites yet').waitFor();
        await page.getByText(/Start with a new site: name it, draw or import its boundary/).waitFor();
        await page.getByRole('link', { name: 'Create the first site' }).waitFor();
        // A plan cannot come first: the new-plan form says what to make before it.
        await page.goto(`${e2eUrl()}/plans/new`);
        await page.getByText(/No sites yet: a plan is made for a site with posts/).waitFor();
        await shot(page, 'empty-org-1-new-plan-without-sites', viewport);
        await page.goto(`${e2eUrl()}/`);
      }
      await shot(page, 'empty-org-1-sites', viewport);

      // 2. A new site, its boundary drawn with taps around a typed point.
      await page.getByRole('link', { name: 'New site' }).first().click();
      const form = page.getByLabel('New site');
      await form.getByLabel('Name').waitFor();
      await page.getByText('Only a terrain file to hand?').waitFor();
      await form.getByLabel('Name').fill(siteName);
      await form.getByRole('radio', { name: 'Search area' }).click();
      await form.getByLabel('Time zone').fill('Europe/Dublin');
      await form.getByRole('button', { name: 'Enter boundary' }).click();
      await form.getByLabel('A point inside the site').fill('51.6195, -10.0485');
      await form.getByRole('button', { name: 'Show the map there' }).click();
      const drawMap = page.getByRole('application', { name: /^Drawing map for boundary/ });
      await drawMap.waitFor();
      await drawMap.scrollIntoViewIfNeeded();
      const box = (await drawMap.boundingBox())!;
      const at = (fx: number, fy: number) => ({ x: box.x + box.width * fx, y: box.y + box.height * fy });
      // About 3.6 km × 3 km on either screen, inside the 4.8 km × 4.5 km terrain (the drawing map shows more on a wide one).
      const [x0, x1, y0, y1] = phone ? [0.31, 0.69, 0.38, 0.62] : [0.38, 0.62, 0.36, 0.64];
      const corners = [at(x0, y0), at(x1, y0 - 0.01), at(x1 + 0.01, y1), at(x0, y1)];
      for (const c of corners) {
        await tapAt(page, phone, c);
        await page.waitForTimeout(150);
      }
      await tapAt(page, phone, corners[0]!);
      await page.getByText(/^4 corners, closed\./).waitFor();
      await shot(page, 'empty-org-2-boundary', viewport);
      await form.getByRole('button', { name: 'Use this outline' }).click();
      await form.getByText(/^4 corners, from /).waitFor();

      // 3. A priority zone, its corners pasted as coordinates.
      await form.getByRole('button', { name: 'Add a priority zone' }).click();
      await form.getByLabel('Zone 1 name').fill('Carrig summit');
      await form.getByLabel('Weight').fill('7');
      await form.getByRole('button', { name: 'Enter zone 1 outline' }).click();
      await form.getByRole('radio', { name: 'Typing corners' }).click();
      await form
        .getByLabel('Zone 1 outline: corners, one per line')
        .fill('51.6180, -10.0620\n51.6180, -10.0520\n51.6260, -10.0520\n51.6260, -10.0620');
      await form.getByRole('button', { name: 'Use these corners' }).click();
      await form.getByText('4 corners, from 51.61800, -10.06200.').waitFor();
      await shot(page, 'empty-org-3-zone', viewport);
      await form.getByRole('button', { name: 'Create site' }).click();
      await page.getByText(/Search area · Europe\/Dublin/).waitFor();
      const siteId = /\/sites\/([0-9a-f-]{36})/.exec(page.url())?.[1];
      expect(siteId).toBeDefined();
      const { site } = await apiJson<{ site: SiteBody }>(page, 'GET', `/sites/${siteId}`);
      expect(site.boundary).toHaveLength(5);
      expect(site.priorityZones).toEqual([expect.objectContaining({ name: 'Carrig summit', weight: 7 })]);

      // 4. The new site's empty parts each say what to do next.
      const terrainPanel = page.getByLabel('Terrain', { exact: true });
      await terrainPanel.getByText('No terrain yet').waitFor();
      await terrainPanel.getByText(/Upload one below/).waitFor();
      await page.getByText('No posts yet').waitFor();
      await page.getByText(/Add the first with the New post form on this page/).waitFor();
      await page.getByText('No plans yet').waitFor();
      await page.getByText(/Place the site’s posts first, then start one here/).waitFor();
      await shot(page, 'empty-org-4-new-site', viewport);

      // 5. A small terrain, uploaded through the terrain panel.
      await terrainPanel.scrollIntoViewIfNeeded();
      const chooser = page.waitForEvent('filechooser');
      await terrainPanel.getByRole('button', { name: 'Choose file' }).click();
      await (
        await chooser
      ).setFiles({ name: 'small-hill-utm29.tif', mimeType: 'image/tiff', buffer: readFileSync(TERRAIN_FILE) });
      await terrainPanel.getByRole('button', { name: 'Upload terrain' }).click();
      await terrainPanel.getByText('small-hill-utm29.tif is now the site’s terrain.').waitFor();
      await terrainPanel.getByText('160 × 150 cells · 4.80 km × 4.50 km').waitFor();
      await terrainPanel.getByText('WGS 84 / UTM zone 29N (EPSG:32629)').waitFor();
      await terrainPanel.getByRole('button', { name: 'Use the terrain’s extent as the boundary' }).waitFor();
      await terrainPanel.scrollIntoViewIfNeeded();
      await shot(page, 'empty-org-5-terrain', viewport);

      // 6. The first post, typed in feet, its ground from the terrain.
      const newPost = page.getByLabel('New post');
      await newPost.scrollIntoViewIfNeeded();
      await newPost.getByLabel('Name').fill(hillName);
      await newPost.getByRole('radiogroup', { name: 'Units' }).getByRole('radio', { name: 'ft · mi' }).click();
      await newPost.getByRole('radio', { name: 'Hilltop' }).click();
      await newPost.getByLabel('Location').fill(HILL_TOP.text);
      await newPost.getByRole('button', { name: 'From terrain' }).click();
      // 28x m is 9xx ft (0.3048 m to the foot, NIST SP 811 B.8).
      await newPost.getByText(/^Ground from the terrain: 9\d\d\.\d ft\.$/).waitFor();
      await newPost.getByLabel('Structure height').fill('33');
      await shot(page, 'empty-org-6-first-post', viewport);
      await newPost.getByRole('button', { name: 'Save post' }).click();
      const hillLink = page.getByRole('link', { name: hillName });
      await hillLink.waitFor();

      // 7. The second post: a duplicate of the first, opened for editing, moved to the ridge and renamed.
      await hillLink.scrollIntoViewIfNeeded();
      await hillLink.click();
      await page.getByRole('heading', { name: hillName }).waitFor();
      await page.getByRole('button', { name: 'Duplicate' }).click();
      await page.getByRole('heading', { name: `${hillName} (copy)` }).waitFor();
      await page.getByText(/This post was made with the same settings as the one you duplicated/).waitFor();
      await shot(page, 'empty-org-7-copy-opened', viewport);
      const edit = page.getByLabel('Edit post');
      await edit.getByLabel('Name').fill(ridgeName);
      await edit.getByRole('radiogroup', { name: 'Units' }).getByRole('radio', { name: 'ft · mi' }).click();
      await edit.getByLabel('Location').fill(RIDGE.text);
      await edit.getByRole('button', { name: 'From terrain' }).click();
      // 14x m is 4xx ft.
      await edit.getByText(/^Ground from the terrain: 4\d\d\.\d ft\.$/).waitFor();
      await edit.getByLabel('Structure height').fill('20');
      await shot(page, 'empty-org-7-duplicate', viewport);
      await edit.getByRole('button', { name: 'Save changes' }).click();
      await page.getByRole('heading', { name: ridgeName }).waitFor();
      let posts = (await apiJson<{ items: PostBody[] }>(page, 'GET', `/sites/${siteId}/posts`)).items;
      const hill = posts.find((p) => p.name === hillName)!;
      const ridge = posts.find((p) => p.name === ridgeName)!;
      expect(Math.abs(hill.groundElevationM - HILL_TOP.groundM)).toBeLessThan(0.2);
      expect(Math.abs(ridge.groundElevationM - RIDGE.groundM)).toBeLessThan(0.2);
      // Typed in feet, stored in metres: 33 ft = 10.0584 m, 20 ft = 6.096 m (Source: NIST SP 811 B.8, 1 ft = 0.3048 m).
      expect(hill.structureHeightM).toBeCloseTo(10.0584, 4);
      expect(ridge.structureHeightM).toBeCloseTo(6.096, 4);

      // 8. On the map, the ridge post is dragged a little (a finger on the phone, the mouse on the wide screen),
      //    and saved after the question with the ground the terrain gives there.
      await page.goto(`${e2eUrl()}/sites/${siteId}/map`);
      const map = page.getByRole('application', { name: /^Map: drag to pan/ });
      await map.waitFor();
      await page.locator(`[aria-label="${ridgeName} symbol"]`).waitFor();
      await page.getByRole('switch', { name: 'Move posts by dragging' }).click();
      await page.getByText(/Drag a post’s pin to its new place/).waitFor();
      const from = await symbolCentre(page, ridgeName);
      await drag(page, cdp, phone, from, { x: from.x - 30, y: from.y + 20 });
      const moveDialog = page.getByRole('dialog', { name: `Move ${ridgeName} here?` });
      await moveDialog.getByText(/^Ground from the terrain there: \d+\.\d m \(recorded now: 14\d\.\d m\)/).waitFor();
      await shot(page, 'empty-org-8-move-dialog', viewport);
      await moveDialog.getByRole('button', { name: 'Move post' }).click();
      await page.getByText(new RegExp(`^${ridgeName} moved; ground \\d+\\.\\d m from the terrain`)).waitFor();
      await shot(page, 'empty-org-8-moved', viewport);
      posts = (await apiJson<{ items: PostBody[] }>(page, 'GET', `/sites/${siteId}/posts`)).items;
      const moved = posts.find((p) => p.id === ridge.id)!;
      expect(moved.location).not.toEqual(ridge.location);
      // Bilinear between cell centres stays within a few metres of the nearest cell's height on these slopes
      // (at most about 0.25 m per m here, and the nearest centre is within 21 m).
      expect(Math.abs(moved.groundElevationM - gdalCellHeight(moved.location.latDeg, moved.location.lonDeg))).toBeLessThan(6);

      // 9. A plan with both posts, its coverage on the terrain, and its submission.
      await page.goto(`${e2eUrl()}/plans/new`);
      await page.getByRole('radio', { name: siteName }).click();
      await page.getByLabel('Title').fill(title);
      await page.getByRole('checkbox', { name: hillName }).click();
      await page.getByRole('checkbox', { name: ridgeName }).click();
      await page.getByRole('checkbox', { name: 'Developed smoke column' }).click();
      await page.getByRole('checkbox', { name: 'Standard day' }).click();
      await shot(page, 'empty-org-9-plan-form', viewport);
      await page.getByRole('button', { name: 'Create draft' }).click();
      await page.getByRole('heading', { name: `${title} · v1` }).waitFor();
      const card = page.getByRole('region', { name: 'Terrain coverage' });
      await card.getByText('Not computed yet.').waitFor();
      await card.scrollIntoViewIfNeeded();
      await card.getByRole('button', { name: 'Compute coverage' }).click();
      const verdict = card.getByText(/^(Meets|Does not meet) the standard$/).first();
      await verdict.waitFor({ timeout: 180_000 });
      await card.getByText(/Refraction near the horizon varies widely/).waitFor();
      await shot(page, 'empty-org-10-coverage', viewport);
      const meets = (await verdict.textContent()) === 'Meets the standard';
      await page.getByRole('button', { name: 'Submit for review' }).click();
      if (meets) {
        await page
          .getByRole('dialog', { name: 'Submit this plan for review?' })
          .getByRole('button', { name: 'Submit for review' })
          .click();
      } else {
        const submit = page.getByRole('dialog', { name: 'Submit as an exception?' });
        await submit.getByLabel('Exception note').fill('Two posts are all this headland has until the mast is built.');
        await submit.getByRole('button', { name: 'Submit as an exception' }).click();
      }
      await page.getByText(/Revision 1 is frozen and waiting for review/).waitFor();
      const planUrl = page.url();
      await shot(page, 'empty-org-11-submitted', viewport);

      // 10. The organisation's reviewer finds it in the queue and approves it.
      await signIn(r, DEMO.otherReviewer);
      await r.getByRole('link', { name: siteName }).first().waitFor();
      await r.goto(`${e2eUrl()}/plans/queue`);
      const inQueue = r.getByRole('link', { name: new RegExp(title.replace(/[()]/g, '\\$&')) });
      await inQueue.scrollIntoViewIfNeeded();
      await inQueue.click();
      await r.getByRole('button', { name: 'Review this plan' }).click();
      await r.getByText('Your decision on revision 1').waitFor();
      await shot(r, 'empty-org-12-review', viewport);
      if (meets) {
        await r.getByRole('button', { name: 'Approve' }).click();
        await r.getByRole('dialog', { name: 'Approve revision 1?' }).getByRole('button', { name: 'Approve' }).click();
      } else {
        await r.getByRole('button', { name: 'Approve as an exception' }).click();
        const approve = r.getByRole('dialog', { name: 'Approve as an exception?' });
        await approve.getByLabel('Justification').fill('Approved until the mast is built; the shore patrol covers the gap.');
        await approve.getByRole('button', { name: 'Approve as an exception' }).click();
      }
      await r.getByText('Approved', { exact: true }).waitFor();
      await shot(r, 'empty-org-13-approved', viewport);

      // 11. Now the approved plan keeps its posts: a drag on the map is refused with the reason, and the pin goes back.
      await page.goto(`${e2eUrl()}/sites/${siteId}/map`);
      await page.locator(`[aria-label="${hillName} symbol"]`).waitFor();
      await page.getByRole('switch', { name: 'Move posts by dragging' }).click();
      const hillAt = await symbolCentre(page, hillName);
      await drag(page, cdp, phone, hillAt, { x: hillAt.x + 25, y: hillAt.y + 25 });
      const refuse = page.getByRole('dialog', { name: `Move ${hillName} here?` });
      await refuse.getByText(/^Ground from the terrain there:/).waitFor();
      await refuse.getByRole('button', { name: 'Move post' }).click();
      await refuse.getByText(new RegExp(`submitted or approved — “${title.replace(/[()]/g, '\\$&')}” \\(approved\\)`)).waitFor();
      expect(await refuse.getByRole('button', { name: 'Move post' }).isDisabled()).toBe(true);
      await shot(page, 'empty-org-14-move-refused', viewport);
      await refuse.getByRole('button', { name: 'Cancel' }).click();
      const back = await symbolCentre(page, hillName);
      expect(Math.hypot(back.x - hillAt.x, back.y - hillAt.y)).toBeLessThan(2);
      const after = (await apiJson<{ post: PostBody }>(page, 'GET', `/sites/${siteId}/posts/${hill.id}`)).post;
      expect(after.location).toEqual(hill.location);
      expect(planUrl).toContain('/plans/');
      expect(errors).toEqual([]);
      expect(reviewerErrors).toEqual([]);
    } catch (error) {
      // What the screens showed when a step failed, and any page errors, to read beside the failure.
      await shot(page, 'empty-org-failed-planner', viewport).catch(() => undefined);
      await shot(r, 'empty-org-failed-reviewer', viewport).catch(() => undefined);
      throw new Error(`${(error as Error).message}\npage errors: ${JSON.stringify([...errors, ...reviewerErrors])}`, {
        cause: error,
      });
    } finally {
      await context.close();
      await reviewerContext.close();
    }
  });
});
