import type { Page } from 'playwright-core';
import { DEMO } from '@/tests/support/agents';
import { browserForFile, eachViewport } from '@/tests/support/browser';
import { apiJson, createPlan, e2eUrl, findPlan, shot, signIn, watchErrors } from '@/tests/support/e2e';

const browser = browserForFile();

interface RunBody {
  current: {
    id: string;
    status: string;
    cases: { site: { seenBy1: { pct: number } }; detection: { rangeLimitM: number } }[];
  } | null;
}

const seenShare = async (page: Page) => {
  const tile = page
    .getByRole('region', { name: 'Terrain coverage' })
    .getByRole('listitem', { name: /^Seen by 1 post or more: / });
  const label = await tile.getAttribute('aria-label');
  return Number(/([\d.]+) %$/.exec(label ?? '')?.[1]);
};

eachViewport('detectable targets on the %s viewport', (viewport) => {
  it('a planner widens a target, sees the coverage go out of date, and the new figures after computing again', async () => {
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.planner);
      await page.getByRole('link', { name: 'Tallow Strand' }).waitFor();
      // A raft of its own for this test, and a plan on the demo coast (no terrain: the flat datum, quick to compute).
      const name = `Test raft (${viewport})`;
      const { target } = await apiJson<{ target: { id: string } }>(page, 'POST', '/targets', {
        name,
        kind: 'raft',
        heightM: 1,
        widthM: 1,
        requiredVisibleM: 0,
        period: 'day',
      });
      const coast = await findPlan(page, 'Summer watch');
      const sets = (await apiJson<{ items: { id: string; name: string }[] }>(page, 'GET', '/conditions')).items;
      const plan = await createPlan(page, {
        siteId: coast.siteId,
        title: `Raft cover (${viewport})`,
        postIds: coast.postIds,
        targetIds: [target.id],
        conditionSetIds: sets.filter((s) => s.name === 'Standard day').map((s) => s.id),
      });

      await page.goto(`${e2eUrl()}/plans/${plan.id}`);
      const card = page.getByRole('region', { name: 'Terrain coverage' });
      await card.scrollIntoViewIfNeeded();
      await card.getByRole('button', { name: 'Compute coverage' }).click();
      const verdict = card.getByText(/^(Meets|Does not meet) the standard$/).first();
      await verdict.waitFor({ timeout: 180_000 });
      // What limits detection, in words: a 1 m raft is lost by its size at 1′ (≈ 3.4 km), not at the horizon.
      const limits = card.getByLabel('What limits detection');
      await limits.getByText(/is detected out to 3\.4 km from a post at most \(angular size\)/).waitFor();
      await limits.getByText(/counted over the site’s sea only/).waitFor();
      const before = await seenShare(page);
      const run1 = await apiJson<RunBody>(page, 'GET', `/plans/${plan.id}/coverage`);
      expect(before).toBeCloseTo(run1.current!.cases[0]!.site.seenBy1.pct, 1);
      await shot(page, 'detection-before', viewport);

      // The planner widens the raft in the library.
      await page.goto(`${e2eUrl()}/library`);
      const edit = page.getByRole('button', { name: `Edit ${name}` });
      await edit.scrollIntoViewIfNeeded();
      await edit.click();
      const form = page.getByLabel(`Edit ${name}`);
      await form.getByLabel('Width').fill('3');
      await form.getByRole('button', { name: 'Save changes' }).click();
      await page
        .getByLabel(name, { exact: true })
        .getByText(/1 m tall, 3 m wide/)
        .waitFor();

      // Its plan's coverage is out of date until computed again; the new figures cover more sea.
      await page.goto(`${e2eUrl()}/plans/${plan.id}`);
      await card.getByText('Out of date').waitFor();
      await card.scrollIntoViewIfNeeded();
      await card.getByRole('button', { name: 'Compute again' }).click();
      await card.getByText('Out of date').waitFor({ state: 'detached', timeout: 180_000 });
      await limits.getByText(/is detected out to 10 km from a post at most \(angular size\)/).waitFor();
      const after = await seenShare(page);
      const run2 = await apiJson<RunBody>(page, 'GET', `/plans/${plan.id}/coverage`);
      expect(run2.current!.id).not.toBe(run1.current!.id);
      // Source: angular-size limit, range = width / tan(1′): 1 m → 3.44 km, 3 m → 10.3 km (common practice, no source).
      expect(run1.current!.cases[0]!.detection.rangeLimitM).toBeCloseTo(1 / Math.tan(Math.PI / 10_800), -1);
      expect(run2.current!.cases[0]!.detection.rangeLimitM).toBeCloseTo(3 / Math.tan(Math.PI / 10_800), -1);
      expect(after).toBeGreaterThan(before);
      await shot(page, 'detection-after', viewport);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('a reviewer reads how the verdict and the ranges move with refraction', async () => {
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.reviewer);
      await page.getByRole('link', { name: 'Tallow Strand' }).waitFor();
      const coast = (await apiJson<{ items: { id: string }[] }>(page, 'GET', `/plans?q=${encodeURIComponent('Summer watch')}`))
        .items[0]!;
      await page.goto(`${e2eUrl()}/plans/${coast.id}/review`);
      const band = page.getByLabel('Sensitivity to conditions');
      await band.scrollIntoViewIfNeeded();
      await band.getByText(/of the site seen\. (Meets|Fails) the standard under/).waitFor();
      // The plan's results: each line with its range over k 0–0.3.
      const results = page.getByRole(viewport === 'phone' ? 'list' : 'table', { name: 'Plan results' });
      await results.scrollIntoViewIfNeeded();
      await results
        .getByText(/^k 0–0\.3: /)
        .first()
        .waitFor();
      await shot(page, 'detection-review-band', viewport);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
