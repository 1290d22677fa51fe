import { browserForFile, eachViewport } from '@/tests/support/browser';
import { e2eUrl, shot, signIn, watchErrors } from '@/tests/support/e2e';
import { DEMO } from '@/tests/support/agents';

const browser = browserForFile();

/** Waits until the tab's title is the one expected (titles are set after the page's data arrives). */
async function titleIs(page: import('playwright-core').Page, expected: string | RegExp) {
  await page.waitForFunction(
    ([source, flags]) => new RegExp(source!, flags).test(document.title),
    typeof expected === 'string'
      ? [expected.replace(/[.*+?^${}()|[\]\\]/g, '\\$&') + '$', '']
      : [expected.source, expected.flags],
  );
  return page.title();
}

eachViewport('on the %s viewport', (viewport) => {
  it('gives every page its own tab title, and an unknown address a page that says so with a way back', async () => {
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    try {
      await page.goto(`${e2eUrl()}/`);
      await page.getByRole('button', { name: 'Sign in' }).waitFor();
      expect(await titleIs(page, 'Sign in · Kenning')).toBe('Sign in · Kenning');
      await signIn(page, DEMO.reviewer);
      await page.getByText('Harrowmere Forest District').first().waitFor();

      const seen = new Set<string>();
      for (const [path, expected] of [
        ['/plans', /· Kenning$/],
        ['/check', /· Kenning$/],
        ['/library', /· Kenning$/],
        ['/account', /· Kenning$/],
      ] as const) {
        await page.goto(`${e2eUrl()}${path}`);
        seen.add(await titleIs(page, expected));
      }
      // Four pages, four different titles.
      expect(seen.size).toBe(4);

      // A plan's page, its review and its history name the plan.
      const plans = await (await page.request.get(`${e2eUrl()}/api/v1/plans?status=approved`)).json();
      const season = plans.items.find((p: { title: string }) => p.title === 'Fire season cover 2026');
      await page.goto(`${e2eUrl()}/plans/${season.id}`);
      const planTitle = await titleIs(page, /^Fire season cover 2026 · v1 · Kenning$/);
      await page.goto(`${e2eUrl()}/plans/${season.id}/history`);
      const historyTitle = await titleIs(page, /^History: Fire season cover 2026/);
      expect(historyTitle).not.toBe(planTitle);
      // The history records the approved exception.
      await page
        .getByText(/Approved as an exception:/)
        .first()
        .waitFor();
      await page
        .getByText(/Submitted as an exception:/)
        .first()
        .waitFor();
      await shot(page, 'history-exception', viewport);

      await page.goto(`${e2eUrl()}/no/such/page`);
      await page.getByText('No page at this address').waitFor();
      await page.getByText('/no/such/page').waitFor();
      expect(await titleIs(page, 'Page not found · Kenning')).toBe('Page not found · Kenning');
      await shot(page, 'not-found', viewport);
      await page.getByRole('link', { name: 'Go to the home page' }).click();
      await page.getByText('Harrowmere Forest District').first().waitFor();
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
