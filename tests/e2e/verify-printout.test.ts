import { browserForFile } from '@/tests/support/browser';
import { apiJson, e2eUrl, shot, signIn, watchErrors } from '@/tests/support/e2e';
import { DEMO } from '@/tests/support/agents';

const browser = browserForFile();

interface PlanList {
  items: { id: string; title: string }[];
}

describe('verify a printout', () => {
  it('an observer reaches it from the plan’s exports on a phone and checks the hash read off the paper', async () => {
    const { context, page } = await browser.newPage('phone');
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.observer);
      await page.waitForURL(/\/briefing/);
      const plans = await apiJson<PlanList>(page, 'GET', '/plans?status=approved');
      const plan = plans.items.find((p) => p.title === 'Fire season cover 2026')!;
      const { revision } = await apiJson<{ revision: { contentHash: string } }>(page, 'GET', `/plans/${plan.id}/revisions/1`);

      // The plan page has its exports, and the way to the verify screen.
      await page.goto(`${e2eUrl()}/plans/${plan.id}`);
      const exportsCard = page.getByLabel('Exports', { exact: true });
      await exportsCard.getByRole('button', { name: 'Download the results as CSV' }).waitFor();
      await exportsCard.getByRole('button', { name: 'Download the layer as GeoTIFF' }).waitFor();
      await exportsCard.scrollIntoViewIfNeeded();
      await shot(page, 'plan-exports', 'phone');
      await exportsCard.getByRole('link', { name: 'Verify a printout' }).click();
      await page.waitForURL(/\/verify$/);

      // Text that is not a hash is refused under the field, before anything is asked.
      const field = page.getByRole('textbox', { name: 'Content hash' });
      await field.fill('3f9a 12');
      await page.getByRole('button', { name: 'Verify', exact: true }).click();
      await page.getByText('A content hash is 64 characters long.').waitFor();

      // Read off paper: in capitals, in groups of eight.
      await field.fill(
        revision.contentHash
          .toUpperCase()
          .replace(/(.{8})/g, '$1 ')
          .trim(),
      );
      await page.getByRole('button', { name: 'Verify', exact: true }).click();
      await page.getByText('Current approved revision').waitFor();
      const printed = page.getByLabel('The printed revision');
      await printed.getByText('Fire season cover 2026 · v1 · revision 1').waitFor();
      await printed.getByText(revision.contentHash).waitFor();
      await printed.getByText('Approved by Lin Okonkwo-Hale', { exact: false }).waitFor();
      await page
        .getByText(/visibility is not detection/)
        .first()
        .waitFor();
      await shot(page, 'verify-printout-approved', 'phone');
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      expect(overflow).toBeLessThanOrEqual(0);

      // A hash no revision has: said plainly. (sha256 of the empty string.)
      await field.fill('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
      await page.getByRole('button', { name: 'Verify', exact: true }).click();
      await page.getByText('No revision has this hash').waitFor();
      await shot(page, 'verify-printout-unknown', 'phone');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('shows the same on a wide screen when the hash comes in the address', async () => {
    const { context, page } = await browser.newPage('wide');
    try {
      await signIn(page, DEMO.reviewer);
      await page.getByText('Your sites').first().waitFor();
      const plans = await apiJson<PlanList>(page, 'GET', '/plans?status=approved');
      const plan = plans.items.find((p) => p.title === 'Fire season cover 2026')!;
      const { revision } = await apiJson<{ revision: { contentHash: string } }>(page, 'GET', `/plans/${plan.id}/revisions/1`);
      await page.goto(`${e2eUrl()}/verify?hash=${revision.contentHash}`);
      await page.getByText('Current approved revision').waitFor();
      await shot(page, 'verify-printout-approved', 'wide');
      await page.goto(`${e2eUrl()}/plans/${plan.id}`);
      await page
        .getByLabel('Exports', { exact: true })
        .getByRole('button', { name: 'Download the layer as an ASCII grid' })
        .waitFor();
      await page.getByLabel('Exports', { exact: true }).scrollIntoViewIfNeeded();
      await shot(page, 'plan-exports', 'wide');
    } finally {
      await context.close();
    }
  });
});
