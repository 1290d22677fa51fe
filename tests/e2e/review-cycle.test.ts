import type { Page } from 'playwright-core';
import type { CaughtMail } from '@/shared/schemas/mail';
import { createCaughtMailClient } from '@/server/mail/caught-mail-client';
import { DEMO } from '@/tests/support/agents';
import { browserForFile, eachViewport, type ViewportName, VIEWPORTS } from '@/tests/support/browser';
import { e2eUrl, shot, signIn, watchErrors } from '@/tests/support/e2e';
import { ridgePng } from '@/tests/support/pictures';

const browser = browserForFile();

/** The local mail catcher `npm test` starts; the server sends its notifications there. */
const catcher = () => {
  const url = process.env.KENNING_CAUGHT_MAIL_URL;
  if (!url) throw new Error('The review cycle needs the mail catcher `npm test` starts (KENNING_CAUGHT_MAIL_URL).');
  return createCaughtMailClient(url);
};

/** Waits for a message to `to` whose subject matches, and returns it. */
async function mailTo(to: string, subject: RegExp): Promise<CaughtMail> {
  const deadline = Date.now() + 20_000;
  for (;;) {
    const found = (await catcher().list()).find((m) => m.to.some((a) => a.includes(to)) && subject.test(m.subject));
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`no mail to ${to} matching ${subject}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

const linkIn = (mail: CaughtMail) => {
  const url = /https?:\/\/\S+\/plans\/[0-9a-f-]{36}/.exec(mail.text)?.[0];
  if (!url) throw new Error(`no plan link in "${mail.subject}"`);
  return url;
};

async function signedIn(email: string, viewport: ViewportName) {
  const { context, page } = await browser.newPage(viewport);
  const errors = watchErrors(page);
  await signIn(page, email);
  await page.getByRole('link', { name: 'Tallow Strand' }).waitFor();
  return { context, page, errors };
}

/** On a phone the site's form and lists are one column; scroll to what is needed. */
const open = async (page: Page, name: string | RegExp) => {
  const link = page.getByRole('link', { name });
  await link.scrollIntoViewIfNeeded();
  await link.click();
};

eachViewport('a coverage plan from draft to approval on the %s viewport', (viewport) => {
  it('is prepared with a new post and its photo, returned with a comment, fixed, resubmitted and approved — and its history shows it all', async () => {
    const title = `Harbour mouth watch (${viewport})`;
    const postName = `Breakwater post (${viewport})`;
    const planner = await signedIn(DEMO.planner, viewport);
    let reviewer: Awaited<ReturnType<typeof signedIn>> | null = null;
    try {
      const p = planner.page;
      // 1. A new shore post on the coast, typed in degrees and decimal minutes.
      await open(p, 'Tallow Strand');
      const form = p.getByLabel('New post');
      await form.getByLabel('Name').fill(postName);
      await form.getByRole('radio', { name: 'Shore post' }).click();
      await form.getByLabel('Location').fill('51°54.45′N 15°33.58′E');
      await form.getByLabel('Ground elevation').fill('9');
      await form.getByLabel('Structure height').fill('5');
      await form.getByRole('button', { name: 'Save post' }).click();
      await open(p, postName);
      await p.getByRole('heading', { name: postName }).waitFor();

      // 2. Its photo, looking out to sea.
      const add = p.getByLabel('Add a photo');
      await add.getByLabel('Bearing').fill('200');
      await add.getByLabel('Caption').fill('Out over the harbour mouth');
      const chooser = p.waitForEvent('filechooser');
      await add.getByRole('button', { name: 'Choose a photo…' }).click();
      await (await chooser).setFiles({ name: 'south-south-west.png', mimeType: 'image/png', buffer: ridgePng() });
      await add.getByRole('button', { name: 'Upload photo' }).click();
      await add.getByText('Added south-south-west.png.').waitFor();
      await p.getByRole('img', { name: /View towards 200° SSW/ }).waitFor();
      await shot(p, 'cycle-post-photo', viewport);

      // 3. The plan: the new post and Gull Point, one target, one condition set.
      await p.goto(`${e2eUrl()}/plans/new`);
      await p.getByRole('radio', { name: 'Tallow Strand' }).click();
      await p.getByLabel('Title').fill(title);
      await p.getByRole('checkbox', { name: postName }).click();
      await p.getByRole('checkbox', { name: 'Gull Point' }).click();
      await p.getByRole('checkbox', { name: 'Six-person life raft' }).click();
      await p.getByRole('checkbox', { name: 'Standard day' }).click();
      await p.getByRole('button', { name: 'Create draft' }).click();
      await p.getByRole('heading', { name: `${title} · v1` }).waitFor();
      await p.getByText('Results from today’s inputs').waitFor();
      await p.getByText('2 of 2 lines').waitFor();
      await shot(p, 'cycle-draft', viewport);
      await p.getByRole('button', { name: 'Submit for review' }).click();
      // The dialog says what submitting does; the coast has no terrain, so the standard is not checked.
      const submitDialog = p.getByRole('dialog', { name: 'Submit this plan for review?' });
      await submitDialog.getByText(/Nobody can edit it until a reviewer returns it/).waitFor();
      await submitDialog.getByText('Standard not checked').waitFor();
      await shot(p, 'cycle-submit-dialog', viewport);
      await submitDialog.getByRole('button', { name: 'Submit for review' }).click();
      await p.getByText(/Revision 1 is frozen and waiting for review\. The reviewers were e-mailed\./).waitFor();
      const planUrl = p.url();

      // 4. The reviewer gets the e-mail, follows its link and returns the plan with a comment.
      const forReview = await mailTo(DEMO.reviewer, new RegExp(`For review: ${title.replace(/[()]/g, '\\$&')}`));
      expect(linkIn(forReview)).toBe(planUrl);
      reviewer = await signedIn(DEMO.reviewer, viewport);
      const r = reviewer.page;
      await r.goto(linkIn(forReview));
      await r.getByRole('button', { name: 'Review this plan' }).click();
      await r.getByText('Your decision on revision 1').waitFor();
      await shot(r, 'cycle-review-1', viewport);
      if (viewport === 'phone') {
        // On a phone the decision stays in a bar at the bottom of the screen, in view without scrolling.
        const bar = r.getByRole('toolbar', { name: 'Page actions' });
        const box = (await bar.boundingBox())!;
        expect(box.y + box.height).toBeLessThanOrEqual(VIEWPORTS.phone.height);
        expect(box.y).toBeGreaterThan(VIEWPORTS.phone.height / 2);
      }
      await r.getByRole('button', { name: 'Return for changes' }).click();
      const returnDialog = r.getByRole('dialog', { name: 'Return for changes?' });
      await returnDialog.getByRole('button', { name: 'Return for changes' }).click();
      await returnDialog.getByText('Say what needs to change before returning the plan.').waitFor();
      await returnDialog.getByLabel('Comment').fill('Add the small open boat as a second target.');
      await shot(r, 'cycle-return-dialog', viewport);
      await returnDialog.getByRole('button', { name: 'Return for changes' }).click();
      await r.getByText('Returned', { exact: true }).waitFor();

      // 5. The planner reads the decision, fixes the plan and submits again.
      const returned = await mailTo(DEMO.planner, new RegExp(`Returned for changes: ${title.replace(/[()]/g, '\\$&')}`));
      expect(returned.text).toContain('Add the small open boat as a second target.');
      await p.goto(linkIn(returned));
      await p.getByText('Add the small open boat as a second target.').waitFor();
      await shot(p, 'cycle-returned', viewport);
      await p.getByRole('button', { name: 'Edit' }).click();
      await p.getByRole('checkbox', { name: 'Small open boat' }).click();
      await p.getByRole('button', { name: 'Save changes' }).click();
      await p.getByText('4 of 4 lines').waitFor();
      await p.getByRole('button', { name: 'Submit for review' }).click();
      await p
        .getByRole('dialog', { name: 'Submit this plan for review?' })
        .getByRole('button', { name: 'Submit for review' })
        .click();
      await p.getByText(/Revision 2 is frozen/).waitFor();

      // 6. The reviewer finds it in the queue, sees what changed, and approves.
      await r.goto(`${e2eUrl()}/plans/queue`);
      await open(r, new RegExp(title.replace(/[()]/g, '\\$&')));
      await r.getByRole('button', { name: 'Review this plan' }).click();
      const changes = r.getByLabel('Changes from revision 1 to 2');
      await changes.getByText('Added: Small open boat').waitFor();
      await shot(r, 'cycle-review-2', viewport);
      await r.getByRole('button', { name: 'Approve' }).click();
      const approveDialog = r.getByRole('dialog', { name: 'Approve revision 2?' });
      await approveDialog.getByText(/becomes the approved plan/).waitFor();
      await shot(r, 'cycle-approve-dialog', viewport);
      await approveDialog.getByRole('button', { name: 'Approve' }).click();
      await r.getByText('Approved', { exact: true }).waitFor();
      await mailTo(DEMO.planner, new RegExp(`Approved: ${title.replace(/[()]/g, '\\$&')}`));

      // 7. Approved means frozen: no editing, only a new version; the history holds the whole chain.
      await p.reload();
      await p.getByText('Results frozen in revision 2').waitFor();
      expect(await p.getByRole('button', { name: 'Edit' }).count()).toBe(0);
      await p.getByRole('button', { name: 'Start a new version' }).waitFor();
      await p.getByRole('button', { name: 'History and signatures' }).click();
      const chain = p.getByLabel('Signature chain');
      await chain.getByText('Approved · revision 2').waitFor();
      const steps = await chain.getByRole('listitem').allInnerTexts();
      expect(steps.map((s) => s.split('\n')[0])).toEqual([
        'Prepared',
        'Submitted · revision 1',
        'Returned · revision 1',
        'Submitted · revision 2',
        'Approved · revision 2',
      ]);
      await chain.getByText('“Add the small open boat as a second target.”').waitFor();
      await p.getByLabel('Changes from revision 1 to 2').getByText('Added: Small open boat').waitFor();
      await shot(p, 'cycle-history', viewport);

      // The frozen revisions answer the same content hash as when they were made.
      const planId = planUrl.split('/').at(-1)!;
      const history = await (await p.request.get(`${e2eUrl()}/api/v1/plans/${planId}/revisions`)).json();
      for (const rev of history.revisions as { number: number; contentHash: string }[]) {
        const full = await (await p.request.get(`${e2eUrl()}/api/v1/plans/${planId}/revisions/${rev.number}`)).json();
        expect(full.revision.contentHash).toBe(rev.contentHash);
      }
      expect(planner.errors).toEqual([]);
      expect(reviewer.errors).toEqual([]);
    } finally {
      await planner.context.close();
      await reviewer?.context.close();
    }
  });
});
