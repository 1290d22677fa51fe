import type { Page } from 'playwright-core';
import { browserForFile, eachViewport } from '@/tests/support/browser';
import { e2eUrl, shot, signIn, watchErrors } from '@/tests/support/e2e';
import { DEMO } from '@/tests/support/agents';
import { ridgePng } from '@/tests/support/pictures';
import { fromUtm } from '@/shared/geo/from-utm';

const browser = browserForFile();

/** A post of its own for this run, so the demo posts other tests use stay as they are. */
async function newPost(page: Page, name: string) {
  const sites = await (await page.request.get(`${e2eUrl()}/api/v1/sites`)).json();
  const site = sites.items.find((s: { name: string }) => s.name === 'Harrowmere Forest District');
  const res = await page.request.post(`${e2eUrl()}/api/v1/sites/${site.id}/posts`, {
    // On the demo forest's terrain (UTM 33N), where every screen of the site can place it.
    data: {
      name,
      kind: 'tower',
      location: fromUtm({ zone: 33, hemisphere: 'N', easting: 520_600, northing: 5_736_400 }),
      groundElevationM: 412,
      structureHeightM: 18,
    },
  });
  expect(res.status()).toBe(201);
  return { siteId: site.id as string, post: (await res.json()).post as { id: string; version: number } };
}

eachViewport('the post page on the %s viewport', (viewport) => {
  it('lets a planner edit the post, see a clash with another edit, and add a photo with its bearing', async () => {
    const { context, page } = await browser.newPage(viewport);
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

      // Upload a photo with its bearing over a slow uplink (Chromium's network throttling), so the progress shows.
      const cdp = await context.newCDPSession(page);
      await cdp.send('Network.enable');
      const uplink = (bytesPerSecond: number) =>
        cdp.send('Network.emulateNetworkConditions', {
          offline: false,
          latency: 0,
          downloadThroughput: -1,
          uploadThroughput: bytesPerSecond,
        });
      const picture = ridgePng();
      await uplink(picture.length / 3); // about three seconds
      const add = page.getByLabel('Add a photo');
      await add.getByLabel('Bearing').fill('45');
      await add.getByLabel('Caption').fill('Over the old burn to the ridge');
      const chooser = page.waitForEvent('filechooser');
      await add.getByRole('button', { name: 'Choose a photo…' }).click();
      await (await chooser).setFiles({ name: 'north-east.png', mimeType: 'image/png', buffer: picture });
      await add.getByText('north-east.png').waitFor();
      await add.getByRole('button', { name: 'Upload photo' }).click();
      await add.getByRole('progressbar').waitFor();
      // The bar moves: some share sent, not all of it.
      await page.waitForFunction(() => {
        const now = Number(document.querySelector('[role="progressbar"]')?.getAttribute('aria-valuenow'));
        return now > 0 && now < 100;
      });
      await shot(page, 'post-uploading', viewport);
      await add.getByText('Added north-east.png.').waitFor();
      await uplink(-1);
      expect(await add.getByRole('progressbar').count()).toBe(0);

      const thumb = page.getByRole('img', { name: 'View towards 045° NE: Over the old burn to the ridge' });
      await thumb.waitFor();
      const card = page.getByLabel('Photo Over the old burn to the ridge');
      await card.getByText('045° NE').waitFor();
      await card.getByText(/640 × 480 px/).waitFor();
      // The thumbnail really loaded the picture from the server (react-native-web renders an <img> with the label as alt).
      const img = await thumb.elementHandle();
      await page.waitForFunction((el) => (el as HTMLImageElement).complete && (el as HTMLImageElement).naturalWidth > 0, img);
      expect(await img!.evaluate((el) => (el as HTMLImageElement).naturalWidth)).toBe(640);
      expect(await card.getByText('The picture could not be loaded.').count()).toBe(0);
      await shot(page, 'post-photo', viewport);

      // Turn the bearing, then delete the photo.
      await card.getByRole('button', { name: 'Edit photo Over the old burn to the ridge' }).click();
      await card.getByLabel('Bearing').fill('400');
      await card.getByRole('button', { name: 'Save' }).click();
      await card.getByText('Bearings run 0–360°.').waitFor();
      await card.getByLabel('Bearing').fill('92');
      await card.getByRole('button', { name: 'Save' }).click();
      await card.getByText('092° E').waitFor();
      await card.getByRole('button', { name: 'Delete photo Over the old burn to the ridge' }).click();
      await card.getByRole('button', { name: 'Delete photo', exact: true }).click();
      await page.getByText('No photos yet').waitFor();
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
