import { browserForFile, eachViewport, SCREENSHOT_DIR } from '@/tests/support/browser';
import { shot, signIn, watchErrors } from '@/tests/support/e2e';
import { DEMO } from '@/tests/support/agents';

const browser = browserForFile();

eachViewport('a site on the %s viewport', (viewport) => {
  it('shows the sketch and posts, and lets a planner add a post from a UTM coordinate', async () => {
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.planner);
      await page.getByRole('link', { name: 'Harrowmere Forest District' }).click();
      await page.getByRole('img', { name: 'Sketch of Harrowmere Forest District' }).waitFor();
      for (const name of ['Crane Knoll Tower', 'Sedge Ridge Tower', 'Blackmoss Tower'])
        await page.getByLabel(name).first().waitFor();
      // The demo plans of this site, with their status.
      await page.getByLabel('Fire season cover 2026').getByText('Approved').waitFor();
      await page.getByLabel('Blackmoss tower proposal').getByText('Draft').waitFor();
      await shot(page, 'site', viewport);
      await page.getByRole('img', { name: /Sketch of/ }).screenshot({ path: `${SCREENSHOT_DIR}/site-sketch-${viewport}.png` });

      const form = page.getByLabel('New post');
      await form.getByLabel('Name').fill(`Lookout ${viewport}`);
      await form.getByLabel('Location').fill('33U 999999 5738000');
      await form.getByRole('button', { name: 'Save post' }).click();
      // A UTM easting outside its zone is refused under the field, and nothing is saved.
      expect(await form.getByRole('alert').count()).toBeGreaterThan(0);
      await form.getByLabel('Location').fill('33U 521000 5737000');
      await form.getByText(/Read as/).waitFor();
      await form.getByLabel('Ground elevation').fill('530');
      await form.getByLabel('Structure height').fill('15');
      await form.getByRole('button', { name: 'Save post' }).click();
      await page.getByLabel(`Lookout ${viewport}`).first().waitFor();
      // 530 + 15 + 1.6 (the default eye height) = 546.6 m.
      await page
        .getByText(/Eye 546\.6 m above sea level/)
        .first()
        .waitFor();
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});

eachViewport('the library on the %s viewport', (viewport) => {
  it('lists the starter targets and condition sets and lets a planner add and remove entries', async () => {
    const { context, page } = await browser.newPage(viewport);
    try {
      await signIn(page, DEMO.planner);
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Library' }).click();
      await page.getByLabel('Early smoke column', { exact: true }).waitFor();
      await page.getByLabel('Refraction spread', { exact: true }).waitFor();
      const form = page.getByLabel('New target');
      await form.getByLabel('Name').fill(`Canoe ${viewport}`);
      await form.getByLabel('Height', { exact: true }).fill('-2');
      await form.getByLabel('Width').fill('0.8');
      await form.getByRole('button', { name: 'Save target' }).click();
      await form.getByText('Height must be at least 0 m.').waitFor();
      await form.getByLabel('Height', { exact: true }).fill('0.7');
      await form.getByRole('button', { name: 'Save target' }).click();
      await page.getByLabel(`Canoe ${viewport}`, { exact: true }).waitFor();

      // A condition set: two presets and a k of the planner's own, with a visibility.
      const sets = page.getByLabel('New condition set');
      await sets.getByLabel('Name').fill(`Valley fog ${viewport}`);
      await sets.getByRole('button', { name: 'Save condition set' }).click();
      await sets.getByText('Give at least one refraction condition.').waitFor();
      await sets.getByRole('checkbox', { name: 'Standard optical (k = 0.13)' }).click();
      await sets.getByLabel('Your own k values').fill('0.3 x');
      await sets.getByRole('button', { name: 'Save condition set' }).click();
      await sets.getByText(/Type k values as numbers/).waitFor();
      await sets.getByLabel('Your own k values').fill('0.3');
      await sets.getByLabel('Visibility').fill('1.5');
      await sets.getByRole('button', { name: 'Save condition set' }).click();
      const added = page.getByLabel(`Valley fog ${viewport}`, { exact: true });
      await added.getByText('• k = 0.3').waitFor();
      await added.getByText('Visibility 1.5 km (MOR)').waitFor();
      await shot(page, 'library', viewport);

      // Retiring an entry takes it off the list.
      await page.getByRole('button', { name: `Retire Canoe ${viewport}` }).click();
      await page.getByLabel(`Canoe ${viewport}`, { exact: true }).waitFor({ state: 'detached' });
    } finally {
      await context.close();
    }
  });
});
