/**
 * The first screens load without the heavy code: the sign-in page's first load
 * (the scripts its HTML names) has neither three.js (the `scenes-3d` chunk) nor
 * the deferred signed-in screens with zod and the schemas (the
 * `deferred-screens` chunk), which the sign-in form fetches in the background
 * once it is up; three.js comes only with a 3D view. Sizes and times are
 * figures for `npm run bench -- web`, not assertions here.
 *
 * Chunk names are the module names Metro's web export gives async chunks
 * (`scenes/scenes-3d.ts`, `components/shell/deferred-screens.ts`).
 * Source: issue 12 ("keep 3D and other heavy code out of the first bundle");
 * the split itself is common practice, no source.
 */
import type { Page } from 'playwright-core';
import { browserForFile, eachViewport } from '@/tests/support/browser';
import { createPlan, e2eUrl, findPlan, shot, signIn, watchErrors } from '@/tests/support/e2e';
import { DEMO } from '@/tests/support/agents';

const browser = browserForFile();

/** Every script the page requests, by file name. */
function watchScripts(page: Page): string[] {
  const scripts: string[] = [];
  page.on('request', (r) => {
    if (r.resourceType() === 'script') scripts.push(new URL(r.url()).pathname.split('/').pop()!);
  });
  return scripts;
}
const has = (scripts: string[], chunk: string) => scripts.some((s) => s.startsWith(`${chunk}-`));

eachViewport('on the %s viewport', (viewport) => {
  it('signs in without the 3D and deferred chunks in the first load, preloads the deferred one, and loads 3D where needed', async () => {
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    const scripts = watchScripts(page);
    try {
      const html = await (await page.request.get(`${e2eUrl()}/sign-in`)).text();
      const firstLoad = [...html.matchAll(/<script[^>]*\ssrc="([^"]+)"/g)].map((m) => m[1]!.split('/').pop()!);
      expect(has(firstLoad, 'entry')).toBe(true);
      expect(has(firstLoad, 'deferred-screens')).toBe(false);
      expect(has(firstLoad, 'scenes-3d')).toBe(false);

      await page.goto(`${e2eUrl()}/sign-in`);
      await page.getByRole('button', { name: 'Sign in' }).waitFor();
      expect(has(scripts, 'entry')).toBe(true);
      expect(has(scripts, 'scenes-3d')).toBe(false);
      // The form's check (zod, in the deferred chunk) is fetched while the person types.
      await page.waitForRequest((r) => /\/deferred-screens-[^/]*\.js$/.test(r.url()), { timeout: 15_000 }).catch(() => null);
      expect(has(scripts, 'deferred-screens')).toBe(true);

      await signIn(page, DEMO.planner);
      await page.getByText('Harrowmere Forest District').first().waitFor();
      expect(has(scripts, 'scenes-3d')).toBe(false);

      // A deferred screen: the chunk arrives, the screen works.
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Quick check' }).click();
      await page.getByRole('table', { name: 'Sightline results' }).waitFor();
      expect(has(scripts, 'scenes-3d')).toBe(false);

      // The 3D view: three.js arrives only now.
      await page.getByRole('button', { name: 'Show in 3D' }).click();
      await page.getByLabel('3D sightline view').locator('canvas').waitFor();
      expect(has(scripts, 'scenes-3d')).toBe(true);

      // The edit-plan route (plan data loaded inside the deferred chunk), opened by address. The draft is the
      // test's own: a seeded plan's status may change under it while other browser tests run.
      const proposal = await findPlan(page, 'Blackmoss tower proposal');
      const draft = await createPlan(page, {
        siteId: proposal.siteId,
        title: `First-bundle edit (${viewport})`,
        postIds: proposal.postIds,
        targetIds: proposal.targetIds,
        conditionSetIds: proposal.conditionSetIds,
        standard: proposal.standard,
      });
      await page.goto(`${e2eUrl()}/plans/${draft.id}/edit`);
      await page.getByText('Edit coverage plan').first().waitFor();
      await expect(page.getByLabel('Title').inputValue()).resolves.toBe(`First-bundle edit (${viewport})`);
      await shot(page, 'first-bundle-edit-plan', viewport);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
