import { PNG } from 'pngjs';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, newPage, VIEWPORTS, type ViewportName } from '@/tests/support/browser';
import { e2eUrl, shot, signIn, watchErrors } from '@/tests/support/e2e';
import { DEMO } from '@/tests/support/agents';

let browser: Browser;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ browser, close } = await launchBrowser());
});
afterAll(() => close());

/** A 320 × 240 picture of a ridge line under a sky, written by pngjs. */
function ridgePng(): Buffer {
  const png = new PNG({ width: 320, height: 240 });
  for (let y = 0; y < 240; y++) {
    for (let x = 0; x < 320; x++) {
      const ridge = 150 + 25 * Math.sin(x / 30) + 10 * Math.sin(x / 7);
      const i = (y * 320 + x) * 4;
      const px = y < ridge ? [150 + y / 3, 185 + y / 4, 225, 255] : [60, 95 - (y - ridge) / 4, 55, 255];
      png.data.set(px.map(Math.round), i);
    }
  }
  return PNG.sync.write(png);
}

/** A post of its own for this run, so the demo posts other tests use stay as they are. */
async function newPost(page: Page, name: string) {
  const sites = await (await page.request.get(`${e2eUrl()}/api/v1/sites`)).json();
  const site = sites.items.find((s: { name: string }) => s.name === 'Harrowmere Forest District');
  const res = await page.request.post(`${e2eUrl()}/api/v1/sites/${site.id}/posts`, {
    data: { name, kind: 'tower', location: { latDeg: 61.05, lonDeg: 14.1 }, groundElevationM: 412, structureHeightM: 18 },
  });
  expect(res.status()).toBe(201);
  return { siteId: site.id as string, post: (await res.json()).post as { id: string; version: number } };
}

describe.each(Object.keys(VIEWPORTS) as ViewportName[])('the post page on the %s viewport', (viewport) => {
  it('lets a planner edit the post, see a clash with another edit, and add a photo with its bearing', async () => {
    const { context, page } = await newPage(browser, viewport);
    const errors = watchErrors(page);
    const name = `Photo tower ${viewport}`;
    try {
      await signIn(page, DEMO.planner);
      await page.getByRole('link', { name: 'Harrowmere Forest District' }).waitFor();
      const { siteId, post } = await newPost(page, name);

      // From the site page, the post card leads to the post page.
      await page.getByRole('link', { name: 'Harrowmere Forest District' }).click();
      await page.getByRole('link', { name }).click();
      await page.waitForURL(`**/sites/${siteId}/posts/${post.id}`);
      await page.getByRole('heading', { name }).waitFor();
      await page.getByText('No photos yet').waitFor();
      await page.getByLabel('Post details').getByText('431.6 m').waitFor(); // 412 + 18 + 1.6 (the default eye height)
      await shot(page, 'post-empty', viewport);

      // Edit a field and save.
      const edit = page.getByLabel('Edit post');
      if (viewport === 'phone') await page.getByRole('button', { name: 'Edit post' }).click();
      await edit.getByLabel('Structure height').fill('21');
      await edit.getByRole('button', { name: 'Save changes' }).click();
      await page.getByText('Changes saved.').waitFor();
      // 412 + 21 + 1.6 = 434.6 m.
      await page.getByLabel('Post details').getByText('434.6 m').waitFor();

      // Someone else saves first: the form says so and reloads their version.
      const current = await (await page.request.get(`${e2eUrl()}/api/v1/sites/${siteId}/posts`)).json();
      const version = current.items.find((p: { id: string }) => p.id === post.id).version;
      const other = await page.request.patch(`${e2eUrl()}/api/v1/sites/${siteId}/posts/${post.id}`, {
        data: { eyeHeightM: 2, version },
      });
      expect(other.status()).toBe(200);
      if (viewport === 'phone') await page.getByRole('button', { name: 'Edit post' }).click();
      await edit.getByLabel('Name').fill(`${name} renamed`);
      await edit.getByRole('button', { name: 'Save changes' }).click();
      await edit.getByText('Not saved: this post changed').waitFor();
      await shot(page, 'post-clash', viewport);
      await edit.getByRole('button', { name: 'Reload the post' }).click();
      await page.getByLabel('Post details').getByText('435.0 m').waitFor(); // 412 + 21 + 2
      await page.getByRole('heading', { name, exact: true }).waitFor();

      // Upload a photo with its bearing; the answer is held back a moment so the progress bar shows.
      await page.route('**/api/v1/attachments', async (route) => {
        if (route.request().method() === 'POST') await new Promise((r) => setTimeout(r, 1500));
        await route.continue();
      });
      const add = page.getByLabel('Add a photo');
      await add.getByLabel('Bearing').fill('45');
      await add.getByLabel('Caption').fill('Over the old burn to the ridge');
      const chooser = page.waitForEvent('filechooser');
      await add.getByRole('button', { name: 'Choose a photo…' }).click();
      await (await chooser).setFiles({ name: 'north-east.png', mimeType: 'image/png', buffer: ridgePng() });
      await add.getByText('north-east.png').waitFor();
      await add.getByRole('button', { name: 'Upload photo' }).click();
      await add.getByRole('progressbar').waitFor();
      await shot(page, 'post-uploading', viewport);
      await add.getByText('Added north-east.png.').waitFor();
      expect(await add.getByRole('progressbar').count()).toBe(0);

      const thumb = page.getByRole('img', { name: 'View towards 045° NE: Over the old burn to the ridge' });
      await thumb.waitFor();
      const card = page.getByLabel('Photo Over the old burn to the ridge');
      await card.getByText('045° NE').waitFor();
      await card.getByText(/320 × 240 px/).waitFor();
      // The thumbnail really loaded the picture from the server.
      const img = await thumb.locator('img').elementHandle();
      await page.waitForFunction((el) => (el as HTMLImageElement).complete && (el as HTMLImageElement).naturalWidth > 0, img);
      expect(await img!.evaluate((el) => (el as HTMLImageElement).naturalWidth)).toBe(320);
      expect(await card.getByText('The picture could not be loaded.').count()).toBe(0);
      await shot(page, 'post-photo', viewport);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
