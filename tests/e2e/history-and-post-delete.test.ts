import { DEMO } from '@/tests/support/agents';
import { browserForFile, eachViewport } from '@/tests/support/browser';
import { e2eUrl, shot, signIn, watchErrors } from '@/tests/support/e2e';

const browser = browserForFile();

eachViewport('history and post deletion on the %s viewport', (viewport) => {
  it('a planner is told why a post in an approved plan stays, edits a site; a reviewer reads that as a sentence', async () => {
    const planner = await browser.newPage(viewport);
    const reviewer = await browser.newPage(viewport);
    const errors = [...watchErrors(planner.page), ...watchErrors(reviewer.page)];
    try {
      const page = planner.page;
      await signIn(page, DEMO.planner);
      await page.getByRole('link', { name: 'Harrowmere Forest District' }).click();
      await page.getByRole('link', { name: 'Crane Knoll Tower' }).first().click();
      await page.getByRole('button', { name: 'Delete post…' }).click();
      await page.getByRole('button', { name: 'Yes, delete the post' }).click();
      const refused = page.getByRole('alert').filter({ hasText: 'Not deleted' });
      await refused.getByText(/“Fire season cover 2026” \(approved\)/).waitFor();
      await shot(page, 'post-delete-refused', viewport);

      // A site of this test's own, edited through the edit screen.
      const made = await page.request.post(`${e2eUrl()}/api/v1/sites`, {
        data: { name: `Audit moor ${viewport}`, kind: 'forest-district' },
      });
      const siteId = (await made.json()).site.id as string;
      await page.goto(`${e2eUrl()}/sites/${siteId}/edit`);
      const form = page.getByLabel('Edit site');
      await form.getByLabel('Time zone').fill('Europe/Oslo');
      await form.getByLabel('Notes').fill('Heather and bog.');
      await form.getByRole('button', { name: 'Save changes' }).click();
      await page.getByText(/Forest district · Europe\/Oslo · Heather and bog\./).waitFor();

      await signIn(reviewer.page, DEMO.reviewer);
      await reviewer.page.getByRole('link', { name: 'Harrowmere Forest District' }).waitFor();
      await reviewer.page.goto(`${e2eUrl()}/sites/${siteId}`);
      await reviewer.page.getByRole('link', { name: 'History of this record' }).click();
      const sentence = reviewer.page.getByText(new RegExp(`^Teodor Ashby changed the site “Audit moor ${viewport}”: `));
      await sentence.waitFor();
      // The fields that changed, named for people (the record's field order).
      expect((await sentence.textContent())?.replace(/^.*”: /, '')).toBe('notes, time zone.');
      await reviewer.page.getByText('notes: not set → “Heather and bog.”').waitFor();
      await reviewer.page.getByText('time zone: “UTC” → “Europe/Oslo”').waitFor();
      await reviewer.page.getByText(/created the site “Audit moor/).waitFor();
      await shot(reviewer.page, 'history-record', viewport);
      // The organisation-wide history lists it too, with filters.
      await reviewer.page.getByRole('link', { name: 'Whole organisation' }).click();
      await reviewer.page.getByRole('checkbox', { name: 'site' }).click();
      await reviewer.page
        .getByText(/changed the site “Audit moor/)
        .first()
        .waitFor();
      await shot(reviewer.page, 'history-organisation', viewport);

      // Deleting: the demo district is kept for its approved plan, with the reason; the test's own site goes.
      const demoId = (
        (await (await page.request.get(`${e2eUrl()}/api/v1/sites`)).json()).items as { id: string; name: string }[]
      ).find((x) => x.name === 'Harrowmere Forest District')!.id;
      await page.goto(`${e2eUrl()}/sites/${demoId}/edit`);
      await page.getByRole('button', { name: 'Delete site…' }).click();
      await page.getByRole('button', { name: 'Yes, delete the site' }).click();
      await page
        .getByRole('alert')
        .filter({ hasText: 'Not deleted' })
        .getByText(/approved plan.*cannot be deleted/)
        .waitFor();
      await page.goto(`${e2eUrl()}/sites/${siteId}/edit`);
      await page.getByRole('button', { name: 'Delete site…' }).click();
      await page.getByRole('button', { name: 'Yes, delete the site' }).click();
      await page.getByText('Your sites').first().waitFor();
      await page.getByRole('link', { name: 'Harrowmere Forest District' }).waitFor();
      expect(await page.getByRole('link', { name: `Audit moor ${viewport}` }).count()).toBe(0);
      expect(errors).toEqual([]);
    } finally {
      await planner.context.close();
      await reviewer.context.close();
    }
  });
});
