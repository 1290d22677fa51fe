import { DEMO } from '@/tests/support/agents';
import { browserForFile, eachViewport } from '@/tests/support/browser';
import { e2eUrl, shot, signIn, watchErrors } from '@/tests/support/e2e';

const browser = browserForFile();

eachViewport('library editing on the %s viewport', (viewport) => {
  it('a planner edits a target: field errors under the field, the version conflict said, then saved; and retires one', async () => {
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.otherPlanner);
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Library' }).click();
      // A target of this test's own, so the two viewports do not meet.
      const name = `Skiff ${viewport}`;
      const made = await page.request.post(`${e2eUrl()}/api/v1/targets`, {
        data: { name, kind: 'small-craft', heightM: 1.2, widthM: 2 },
      });
      expect(made.status()).toBe(201);
      const target = (await made.json()).target as { id: string; version: number };
      await page.reload();
      await page.getByRole('button', { name: `Edit ${name}` }).click();
      const form = page.getByLabel(`Edit ${name}`);
      await form.getByLabel('Height', { exact: true }).fill('-1');
      await form.getByRole('button', { name: 'Save changes' }).click();
      await form.getByText('Height must be at least 0 m.').waitFor();

      // Someone else saves first: the form says so and keeps what was typed.
      const other = await page.request.patch(`${e2eUrl()}/api/v1/targets/${target.id}`, {
        data: { widthM: 2.5, version: target.version },
      });
      expect(other.status()).toBe(200);
      await form.getByLabel('Height', { exact: true }).fill('1.5');
      await form.getByRole('button', { name: 'Save changes' }).click();
      await form.getByText('Not saved: this target changed').waitFor();
      expect(await form.getByLabel('Height', { exact: true }).inputValue()).toBe('1.5');
      await shot(page, 'library-edit-conflict', viewport);
      await form.getByRole('button', { name: 'Reload the target' }).click();
      const fresh = page.getByLabel(`Edit ${name}`);
      // The form starts again from their version.
      await page.waitForFunction(() => [...document.querySelectorAll('input')].some((i) => i.value === '2.5'));
      expect(await fresh.getByLabel('Width').inputValue()).toBe('2.5');
      await fresh.getByLabel('Height', { exact: true }).fill('1.5');
      await fresh.getByRole('button', { name: 'Save changes' }).click();
      const card = page.getByLabel(name, { exact: true });
      await card.getByText(/1\.5 m tall, 2\.5 m wide/).waitFor();

      await page.getByRole('button', { name: `Retire ${name}` }).click();
      await card.waitFor({ state: 'detached' });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
