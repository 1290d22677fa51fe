import { DEMO } from '@/tests/support/agents';
import { browserForFile, eachViewport } from '@/tests/support/browser';
import { apiJson, createPlan, e2eUrl, findPlan, shot, signIn, watchErrors } from '@/tests/support/e2e';

const browser = browserForFile();

eachViewport('on the %s viewport', (viewport) => {
  it('submits and approves a plan that fails its standard only as a recorded exception', async () => {
    const planner = await browser.newPage(viewport);
    const reviewer = await browser.newPage(viewport);
    const errors = [...watchErrors(planner.page), ...watchErrors(reviewer.page)];
    try {
      const p = planner.page;
      await signIn(p, DEMO.planner);
      await p.getByText('Harrowmere Forest District').first().waitFor();
      // A forest plan with a standard its towers cannot meet (all of a hilly district seen).
      const season = await findPlan(p, 'Fire season cover 2026');
      const title = `Exception check (${viewport})`;
      const plan = await createPlan(p, {
        siteId: season.siteId,
        title,
        postIds: season.postIds,
        targetIds: season.targetIds.slice(0, 1),
        conditionSetIds: season.conditionSetIds,
        standard: { minSeenPct: 100, priorityMinPosts: 2 },
      });
      await apiJson(p, 'POST', `/plans/${plan.id}/coverage`, {});
      for (let i = 0; i < 180; i++) {
        const c = await apiJson<{ current: { status: string } | null }>(p, 'GET', `/plans/${plan.id}/coverage`);
        if (c.current?.status === 'done') break;
        await p.waitForTimeout(1000);
      }

      await p.goto(`${e2eUrl()}/plans/${plan.id}`);
      await p.getByRole('region', { name: 'Terrain coverage' }).getByText('Does not meet the standard').first().waitFor();
      await p.getByRole('button', { name: 'Submit for review' }).click();
      const submit = p.getByRole('dialog', { name: 'Submit as an exception?' });
      await submit.getByText('Does not meet its coverage standard').waitFor();
      await submit
        .getByRole('list', { name: 'Failing rules' })
        .getByText(/of 100 %/)
        .first()
        .waitFor();
      // No note, no submission.
      await submit.getByRole('button', { name: 'Submit as an exception' }).click();
      await submit.getByText(/Say why this plan should be reviewed/).waitFor();
      await submit.getByLabel('Exception note').fill('Two towers are all the district has this season.');
      await shot(p, 'exception-submit-dialog', viewport);
      await submit.getByRole('button', { name: 'Submit as an exception' }).click();
      await p.getByText(/Revision 1 is frozen and waiting for review/).waitFor();

      const r = reviewer.page;
      await signIn(r, DEMO.reviewer);
      await r.getByText('Harrowmere Forest District').first().waitFor();
      await r.goto(`${e2eUrl()}/plans/${plan.id}/review`);
      await r.getByText('Two towers are all the district has this season.').waitFor();
      await r.getByRole('button', { name: 'Approve as an exception' }).click();
      const approve = r.getByRole('dialog', { name: 'Approve as an exception?' });
      await approve.getByText('Does not meet its coverage standard').waitFor();
      await approve.getByRole('button', { name: 'Approve as an exception' }).click();
      await approve.getByText(/Write why this plan is approved/).waitFor();
      await approve.getByLabel('Justification').fill('Approved for this season only; patrols cover the unseen valleys.');
      await shot(r, 'exception-approve-dialog', viewport);
      await approve.getByRole('button', { name: 'Approve as an exception' }).click();
      await r.getByText('Approved', { exact: true }).waitFor();

      await r.goto(`${e2eUrl()}/plans/${plan.id}/history`);
      await r.getByText(/Approved as an exception: “Approved for this season only/).waitFor();
      await r.getByText(/Submitted as an exception: “Two towers/).waitFor();
      expect(errors).toEqual([]);
    } finally {
      await planner.context.close();
      await reviewer.context.close();
    }
  });
});
