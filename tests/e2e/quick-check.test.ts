import { browserForFile, eachViewport } from '@/tests/support/browser';
import { e2eUrl, shot, signIn, watchErrors } from '@/tests/support/e2e';
import { DEMO } from '@/tests/support/agents';
import { SCREENSHOT_DIR } from '@/tests/support/browser';

const browser = browserForFile();

// Geometric horizon of a 30 m eye on a 6 371 008.8 m sphere, R·acos(R/(R+h)) = 19.55 km.
// Source: spherical geometry of the tangent line, common practice, no source.
const R = 6371008.8;
const geometricHorizonKm = (R * Math.acos(R / (R + 30))) / 1000;

eachViewport('quick check on the %s viewport', (viewport) => {
  it('answers, shows cautions, the lookout’s view and 3D, flags bad input, and works offline', async () => {
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.observer);
      await page.waitForURL(/\/briefing$/);
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Quick check' }).click();
      const table = page.getByRole('table', { name: 'Sightline results' });
      await table.waitFor();
      // Default conditions: no refraction, standard optical, 4/3 earth — one column each.
      expect(await table.getByRole('columnheader').count()).toBe(4);
      const horizonRow = table.getByRole('row').filter({ hasText: 'Horizon distance' });
      expect(await horizonRow.textContent()).toContain(`${geometricHorizonKm.toFixed(1)} km`);
      await page.getByText('Read before you rely on this').waitFor();
      await page
        .getByText(/visibility is not detection|not necessarily detected/i)
        .first()
        .waitFor();
      await shot(page, 'quick-check', viewport);
      await table.screenshot({ path: `${SCREENSHOT_DIR}/quick-check-table-${viewport}.png` });
      // On a phone the three condition columns do not fit: the table says so.
      if (viewport === 'phone') await page.getByText('More conditions → scroll sideways').waitFor();

      // One tap takes a library target into the form; converted lengths are rounded sensibly.
      const targets = (await (await page.request.get(`${e2eUrl()}/api/v1/targets`)).json()).items as {
        name: string;
        heightM: number;
      }[];
      const smoke = targets.find((t) => t.name === 'Early smoke column')!;
      await page.getByRole('group', { name: 'Library targets' }).getByRole('checkbox', { name: smoke.name }).click();
      expect(Number(await page.getByLabel('Target height').inputValue())).toBe(smoke.heightM);
      await page.getByRole('radiogroup', { name: 'Units' }).getByRole('radio', { name: 'ft · nmi' }).click();
      // Source: 30 m = 98.425 ft (1 ft = 0.3048 m exactly), shown to three significant digits.
      expect(await page.getByLabel('Height of eye').inputValue()).toBe('98.4');
      await shot(page, 'quick-check-library-ft', viewport);
      await page.getByRole('radiogroup', { name: 'Units' }).getByRole('radio', { name: 'm · km' }).click();
      expect(await page.getByLabel('Height of eye').inputValue()).toBe('30');
      // Back to the default target for what follows.
      await page.getByLabel('Target height').fill('10');
      await page.getByLabel('Target size').fill('3');
      await page.getByLabel('Part that must show').fill('0');
      // The view as the lookout sees it: at k = 0 the horizon of a 30 m eye lies √(2h/R) = 10.6′ below eye level.
      // Source: dip of the horizon, √(2h/R) radians for small angles — common practice, no source.
      const dip = ((Math.sqrt((2 * 30) / R) * 180 * 60) / Math.PI).toFixed(1);
      const seen = page.getByLabel('The target as the lookout sees it');
      await seen.scrollIntoViewIfNeeded();
      await seen.getByRole('img', { name: new RegExp(`^Horizon −${dip.replace('.', '\\.')}′ below eye level\\.`) }).waitFor();
      await seen
        .getByRole('img', { name: /detected .* km/ })
        .first()
        .waitFor();
      await seen.screenshot({ path: `${SCREENSHOT_DIR}/quick-check-lookout-view-${viewport}.png` });

      // A negative height is refused under its field; the last answer stays.
      const eye = page.getByLabel('Height of eye');
      await eye.fill('-5');
      await page.getByText('Observer height cannot be negative.').waitFor();
      await page.getByText('Check the fields marked in red').waitFor();
      await eye.fill('30');
      await table.waitFor();

      // Offline: the same core runs in the browser and says so. (Chromium's offline
      // emulation leaves loopback alone, so the connection is cut at the request.)
      await page.route('**/api/v1/sightline', (route) => route.abort('internetdisconnected'));
      await eye.fill('45');
      await page.getByText('Offline', { exact: true }).waitFor();
      // 45 m, k = 0: R·acos(R/(R+45)) = 23.95 km (same source as above).
      const offlineHorizon = ((R * Math.acos(R / (R + 45))) / 1000).toFixed(1);
      expect(await table.getByRole('row').filter({ hasText: 'Horizon distance' }).textContent()).toContain(
        `${offlineHorizon} km`,
      );
      await shot(page, 'quick-check-offline', viewport);
      await page.unroute('**/api/v1/sightline');

      // A condition from weather readings adds a column: standard atmosphere gives
      // k = 503·P/T²·(0.0343 + dT/dh) = 503·1013.25/288.15²·(0.0343 − 0.0065) ≈ 0.171.
      // Source: the surveying refraction relation (from memory).
      await page.getByRole('checkbox', { name: /From weather readings/ }).click();
      await table.getByRole('columnheader', { name: /Weather: 1013.25 hPa/ }).waitFor();
      expect(await table.getByRole('row').filter({ hasText: 'k · regime' }).textContent()).toContain('0.171');

      // 3D, loaded on demand, drawn with WebGL (software renderer here).
      await page.getByRole('button', { name: 'Show in 3D' }).click();
      const view = page.getByLabel('3D sightline view');
      await view.waitFor();
      await view.locator('canvas').waitFor();
      await page.waitForTimeout(1500);
      await view.screenshot({ path: `${SCREENSHOT_DIR}/quick-check-3d-${viewport}.png` });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
