import { browserForFile, eachViewport } from '@/tests/support/browser';
import { apiJson, e2eUrl, invitePerson, shot, signIn, watchErrors } from '@/tests/support/e2e';

// A planner chooses feet on the account page; a post's heights are typed in feet, stored in
// metres and shown in feet. A planner of its own (invited here), so the demo planner other
// browser tests use at the same time keeps metric forms.

const browser = browserForFile();

/** Waits (up to 10 s) until `check` holds; fails with what it waited for otherwise. */
async function until(check: () => Promise<boolean>) {
  const deadline = Date.now() + 10_000;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${check.toString()}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

type PostRow = { id: string; name: string; groundElevationM: number; structureHeightM: number; eyeHeightM: number };

eachViewport('units on the %s viewport', (viewport) => {
  it('a planner sets feet on the account page, types a post in feet, and it is stored in metres and shown in feet', async () => {
    const person = await invitePerson({
      emailPrefix: 'feet',
      name: 'Feet Planner',
      role: 'planner',
      password: 'feet-and-inches-planner',
    });
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    const name = `Feet tower ${viewport}`;
    try {
      await signIn(page, person.email, person.password);
      await page.getByRole('link', { name: 'Harrowmere Forest District' }).waitFor();

      // The account page: choose imperial units and save them on the server.
      await page.goto(`${e2eUrl()}/account`);
      const units = page.getByLabel('Units', { exact: true }).filter({ has: page.getByRole('radiogroup') });
      await units.getByRole('radio', { name: 'Imperial (ft, mi)' }).click();
      await units.getByRole('button', { name: 'Save units' }).click();
      await units.getByText('Saved: Imperial (ft, mi).').waitFor();
      await shot(page, 'units-account', viewport);
      const me = await (await page.request.get(`${e2eUrl()}/api/me`)).json();
      expect(me.user.unitPreference).toBe('imperial');

      // A metric site: the new post form still starts in the planner's feet.
      await page.goto(e2eUrl());
      await page.getByRole('link', { name: 'Harrowmere Forest District' }).click();
      const form = page.getByLabel('New post');
      const switcher = form.getByRole('radiogroup', { name: 'Units' });
      expect(await switcher.getByRole('radio', { name: 'ft · mi' }).getAttribute('aria-checked')).toBe('true');
      // Source: the default eye height 1.6 m / 0.3048 = 5.249… ft, shown as 5.25 (NIST SP 811 B.8).
      expect(await form.getByLabel('Eye above platform').inputValue()).toBe('5.25');

      await form.getByLabel('Name').fill(name);
      await form.getByLabel('Location').fill('33U 521500 5737500');
      await form.getByText(/Read as/).waitFor();
      await form.getByLabel('Ground elevation').fill('1000');
      await form.getByLabel('Structure height').fill('50');
      await form.getByLabel('Eye above platform').fill('40');
      await form.getByRole('button', { name: 'Save post' }).click();
      // Source: the post schema's 10 m eye-height limit; 10 m / 0.3048 = 32.8 ft. Said in feet, nothing lost.
      await form.getByText('Eye height must be at most 32.8 ft.').waitFor();
      expect(await form.getByLabel('Ground elevation').inputValue()).toBe('1000');

      // Switching units re-types what was typed: 6 ft = 1.83 m, and back to 6 ft.
      await form.getByLabel('Eye above platform').fill('6');
      await switcher.getByRole('radio', { name: 'm · km' }).click();
      // Source: 6 × 0.3048 = 1.8288 m, shown to three significant digits; 1000 ft = 304.8 m.
      await until(async () => (await form.getByLabel('Eye above platform').inputValue()) === '1.83');
      expect(await form.getByLabel('Ground elevation').inputValue()).toBe('305');
      await shot(page, 'units-post-form-metres', viewport);
      await switcher.getByRole('radio', { name: 'ft · mi' }).click();
      await until(async () => (await form.getByLabel('Eye above platform').inputValue()) === '6');
      // Back in feet, what was typed comes back as typed (no 50 ft → 15.2 m → 49.9 ft drift).
      expect(await form.getByLabel('Ground elevation').inputValue()).toBe('1000');
      expect(await form.getByLabel('Structure height').inputValue()).toBe('50');
      await shot(page, 'units-post-form-feet', viewport);
      // Enter in a field saves the form.
      await form.getByLabel('Eye above platform').press('Enter');
      await page.getByRole('link', { name }).waitFor();

      // Stored in metres.
      const sites = await apiJson<{ items: { id: string; name: string }[] }>(page, 'GET', '/sites');
      const site = sites.items.find((s) => s.name === 'Harrowmere Forest District')!;
      const posts = await apiJson<{ items: PostRow[] }>(page, 'GET', `/sites/${site.id}/posts?pageSize=500`);
      const saved = posts.items.find((p) => p.name === name)!;
      // Source: NIST SP 811 Appendix B.8, 1 ft = 0.3048 m exactly: 1000 ft = 304.8 m, 50 ft = 15.24 m, 6 ft = 1.8288 m (tolerance 1e-9 m).
      expect(Math.abs(saved.groundElevationM - 304.8)).toBeLessThan(1e-9);
      expect(Math.abs(saved.structureHeightM - 15.24)).toBeLessThan(1e-9);
      expect(Math.abs(saved.eyeHeightM - 1.8288)).toBeLessThan(1e-9);

      // Shown in feet: 1000 + 50 + 6 = 1056 ft above sea level.
      const card = page.getByRole('link', { name });
      await card.getByText('Eye 1,056 ft above sea level (ground 1,000 ft + structure 50 ft + eye 6 ft)').waitFor();
      await card.scrollIntoViewIfNeeded();
      await shot(page, 'units-post-card', viewport);
      await card.click();
      await page.getByLabel('Post details').getByText('1,056 ft').waitFor();
      await shot(page, 'units-post-page', viewport);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
