import type { Page } from 'playwright-core';
import type { Plan } from '@/shared/schemas/plan';
import { DEMO } from '@/tests/support/agents';
import { browserForFile, eachViewport, SCREENSHOT_DIR, type ViewportName } from '@/tests/support/browser';
import { apiJson, createPlan, e2eUrl, findPlan, shot, signIn, watchErrors } from '@/tests/support/e2e';

const browser = browserForFile();

/**
 * A fresh draft on the forest district (which has terrain) with the demo
 * proposal's inputs, so each viewport starts from "not computed" whatever
 * other browser tests did to the seeded plans.
 */
async function freshForestDraft(page: Page, viewport: ViewportName): Promise<Plan> {
  const proposal = await findPlan(page, 'Blackmoss tower proposal');
  return createPlan(page, {
    siteId: proposal.siteId,
    title: `Coverage check (${viewport})`,
    postIds: proposal.postIds,
    targetIds: proposal.targetIds,
    conditionSetIds: proposal.conditionSetIds,
    standard: proposal.standard,
  });
}

eachViewport('terrain coverage on the %s viewport', (viewport) => {
  it('computes a plan’s coverage, shows it on the map and in 3D, and compares it with the approved plan', async () => {
    const phone = viewport === 'phone';
    const { context, page } = await browser.newPage(viewport, { touch: phone });
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.planner);
      await page.getByRole('link', { name: 'Harrowmere Forest District' }).waitFor();
      const plan = await freshForestDraft(page, viewport);
      await page.goto(`${e2eUrl()}/plans/${plan.id}`);

      // Submitting first is refused: the site has terrain and the plan no coverage yet.
      const card = page.getByRole('region', { name: 'Terrain coverage' });
      await card.getByText('Not computed yet.').waitFor();
      const refused = page.waitForResponse((r) => r.url().endsWith(`/plans/${plan.id}/submit`));
      await page.getByRole('button', { name: 'Submit for review' }).click();
      const submitDialog = page.getByRole('dialog', { name: 'Submit this plan for review?' });
      await submitDialog.getByText('Standard not checked').waitFor();
      await submitDialog.getByRole('button', { name: 'Submit for review' }).click();
      const refusal = await refused;
      expect(refusal.status()).toBe(409);
      const { error } = (await refusal.json()) as { error: { code: string; message: string } };
      expect(error.code).toBe('coverage_missing');
      const notice = page.getByRole('alert').filter({ hasText: 'Coverage first' });
      await notice.getByText(error.message).waitFor();
      await notice.getByText(/Terrain coverage section below/).waitFor();

      // Compute: the bar shows with its stage while the worker runs, then the figures.
      await card.scrollIntoViewIfNeeded();
      const answered = page.waitForResponse(
        (r) => r.url().endsWith(`/plans/${plan.id}/coverage`) && r.request().method() === 'POST',
      );
      await card.getByRole('button', { name: 'Compute coverage' }).click();
      expect((await answered).status()).toBe(202);
      await card.getByRole('progressbar').waitFor();
      await card.getByRole('button', { name: 'Cancel the run' }).waitFor();
      await shot(page, 'plan-coverage-progress', viewport);
      const verdict = card.getByText(/^(Meets|Does not meet) the standard$/).first();
      await verdict.waitFor({ timeout: 180_000 });
      // Coverage is done: the refusal's notice goes (once the plan's coverage is asked again after the run).
      await page.getByRole('alert').filter({ hasText: 'Coverage first' }).waitFor({ state: 'detached', timeout: 10_000 });

      // The figures agree with the API's run.
      const { current } = await apiJson<{
        current: {
          id: string;
          status: string;
          cases: { key: string; site: { seenBy1: { pct: number } }; check: { passed: boolean }; posts: unknown[] }[];
        };
      }>(page, 'GET', `/plans/${plan.id}/coverage`);
      expect(current.status).toBe('done');
      const first = current.cases[0]!;
      expect(await verdict.textContent()).toBe(first.check.passed ? 'Meets the standard' : 'Does not meet the standard');
      await card.getByRole('listitem', { name: `Seen by 1 post or more: ${first.site.seenBy1.pct.toFixed(1)} %` }).waitFor();
      expect(await card.getByRole('table', { name: 'Share of the site each post sees' }).getByRole('row').count()).toBe(
        first.posts.length + 1,
      );
      await card.getByText(/Seen is not detected/).waitFor();
      await card.getByText(/Refraction near the horizon varies widely/).waitFor();
      await shot(page, 'plan-coverage-figures', viewport);

      // A change to the plan's inputs (here its standard) marks the figures out of date until computed again.
      const { plan: seen } = await apiJson<{ plan: { rowVersion: number } }>(page, 'GET', `/plans/${plan.id}`);
      const changed = page.request.fetch(`${e2eUrl()}/api/v1/plans/${plan.id}`, {
        method: 'PATCH',
        data: { standard: { minSeenPct: 60, priorityMinPosts: 1 }, rowVersion: seen.rowVersion },
      });
      expect((await changed).status()).toBe(200);
      await page.reload();
      await card.getByText('Out of date').waitFor();
      await card.getByRole('button', { name: 'Compute again' }).click();
      await card.getByText('Out of date').waitFor({ state: 'detached', timeout: 180_000 });
      await verdict.waitFor();
      const again = await apiJson<{ current: { id: string; status: string } | null }>(page, 'GET', `/plans/${plan.id}/coverage`);
      expect(again.current?.status).toBe('done');
      expect(again.current?.id).not.toBe(current.id);

      // The map with the run's layers: posts per cell drawn over the hillshade.
      await card.getByRole('link', { name: 'Open on the map' }).click();
      await page.waitForURL(/\/sites\/[0-9a-f-]+\/map\?.*runId=/);
      expect(new URL(page.url()).searchParams.get('runId')).toBe(again.current!.id);
      expect(new URL(page.url()).searchParams.get('caseKey')).toBe(first.key);
      const map = page.getByRole('application', { name: /^Map: drag to pan/ });
      await map.waitFor();
      await page.waitForFunction(() => {
        const img = document.querySelector<HTMLImageElement>('img[data-layer="posts-per-cell"]');
        return !!img && img.complete && img.naturalWidth > 0;
      });
      // Layers and cases live in the legend panel (a sheet on phones).
      if (phone) await page.getByRole('button', { name: 'Legend and layers' }).click();
      const panel = page.getByLabel('Coverage run');
      await panel.getByRole('group', { name: 'Case' }).waitFor();
      await page.getByRole('checkbox', { name: 'Cross-bearings' }).click();
      await page.locator('img[data-layer="cross-bearing"]').waitFor();
      await shot(page, 'plan-coverage-map', viewport);
      if (phone) await page.getByLabel('Legend and layers').getByRole('button', { name: 'Close' }).click();

      // Tap inside the site: the read-out names the layer's class there, and the profile answers.
      const profile = page.waitForResponse((r) => r.url().includes('/terrain/profile') && r.request().method() === 'POST');
      const box = (await map.boundingBox())!;
      const at = { x: box.x + box.width * 0.5, y: box.y + box.height * 0.3 };
      if (phone) await page.touchscreen.tap(at.x, at.y);
      else await page.mouse.click(at.x, at.y);
      expect((await profile).status()).toBe(200);
      await page
        .getByLabel('Coordinate read-out')
        .getByText(/^Cross-bearing quality: (No bearing|Single bearing|Weak crossing|Good crossing|outside the layer)$/)
        .waitFor();
      await page.getByRole('list', { name: 'Verdict per condition' }).waitFor();
      await shot(page, 'plan-coverage-profile', viewport);

      // 3D with the chosen layer on the ground (software WebGL here), or the readable fallback.
      await page.getByRole('radio', { name: '3D view' }).click();
      const view = page.getByLabel('3D terrain view');
      const fallback = page.getByText('3D view not available');
      await Promise.race([view.locator('canvas').waitFor({ timeout: 60_000 }), fallback.waitFor({ timeout: 60_000 })]);
      if (await view.locator('canvas').count()) {
        await page.getByText(/Coloured ground: Cross-bearings/).waitFor();
        await page.waitForTimeout(2500);
      }
      await shot(page, 'plan-coverage-3d', viewport);

      // Compare with the approved plan of the site: posts, figures and the difference map.
      await page.goto(`${e2eUrl()}/plans/${plan.id}`);
      await page.getByRole('link', { name: 'Compare with…' }).click();
      await page.waitForURL(/\/plans\/compare\?/);
      const pickA = page.getByRole('group', { name: 'Plan A (before)' });
      await pickA.getByRole('checkbox', { name: /^Fire season cover 2026 · v1 \(approved\)/ }).click();
      await page.getByText('What changes from A to B').waitFor({ timeout: 60_000 });
      const posts = page.getByRole('table', { name: 'Posts in both plans' });
      await posts.getByRole('row').filter({ hasText: 'Blackmoss Tower' }).getByText('new in B').waitFor();
      const change = page.getByRole('table', { name: 'Change in coverage' });
      const seen1 = change.getByRole('row').filter({ hasText: 'Seen by 1 post or more' });
      expect(await seen1.textContent()).toMatch(/[+−±]/);
      await page
        .getByRole('region', { name: 'Plan A' })
        .getByText(/^(✓|✕) /)
        .waitFor();
      await page
        .getByRole('region', { name: 'Plan B' })
        .getByText(/^(✓|✕) /)
        .waitFor();
      await page.waitForFunction(() => {
        const img = document.querySelector<HTMLImageElement>('img[data-layer="coverage-change"]');
        return !!img && img.complete && img.naturalWidth > 0;
      });
      await shot(page, 'plan-compare', viewport);

      // A case plan B does not have (the approved plan also covers a developed smoke): B's own case is compared, named.
      const other = page.waitForResponse((r) => r.url().includes('/coverage-compare?') && r.url().includes('caseKeyB='));
      await page.getByRole('group', { name: 'Plan A: Target' }).getByRole('checkbox', { name: 'Developed smoke column' }).click();
      expect((await other).status()).toBe(200);
      await page
        .getByText(/^Plan B has no case with the same target and condition ids; it is compared by “Early smoke column/)
        .waitFor();
      await page.getByRole('group', { name: 'Plan B: Case' }).waitFor();
      await page
        .getByRole('region', { name: 'Plan A' })
        .getByText(/^Developed smoke column · /)
        .waitFor();
      await page
        .getByRole('table', { name: 'Change in coverage' })
        .screenshot({ path: `${SCREENSHOT_DIR}/plan-compare-figures-${viewport}.png` });

      // A plan without a finished run is named, with a way to its page; a plan of another site is refused.
      const bare = await freshForestDraft(page, viewport);
      await page.goto(`${e2eUrl()}/plans/compare?a=${bare.id}&b=${plan.id}`);
      const missing = page.getByRole('note').filter({ hasText: 'No coverage to compare for plan A' });
      await missing.getByText(/has not been computed yet/).waitFor();
      await missing.getByRole('link', { name: 'Open its plan page' }).waitFor();
      const coast = await apiJson<{ items: { id: string }[] }>(page, 'GET', `/plans?q=${encodeURIComponent('Summer watch')}`);
      await page.goto(`${e2eUrl()}/plans/compare?a=${coast.items[0]!.id}&b=${plan.id}`);
      await page
        .getByRole('alert')
        .filter({ hasText: 'Different sites' })
        .getByText(/choose two plans of the same site/)
        .waitFor();
      expect(await page.getByText('What changes from A to B').count()).toBe(0);
      await shot(page, 'plan-compare-refused', viewport);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
