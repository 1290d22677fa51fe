import { browserForFile, eachViewport } from '@/tests/support/browser';
import { openPlace, shot, signIn, watchErrors } from '@/tests/support/e2e';
import { DEMO } from '@/tests/support/agents';

const browser = browserForFile();

eachViewport('search effort on the %s viewport', (viewport) => {
  it('computes W, C and POD from a table row, a typed W and a curve, with the cautions and field errors', async () => {
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.planner);
      await page.getByText('Your sites').first().waitFor();
      await openPlace(page, 'Search effort');
      await page.getByText('Estimates only').waitFor();
      await page
        .getByText(/Visibility is not detection/)
        .first()
        .waitFor();

      // The demo's starter table is marked as an example wherever it is shown.
      await page.getByRole('checkbox', { name: /^Example — invented sweep widths/ }).click();
      await page.getByText('Example values').waitFor();
      await page.getByRole('checkbox', { name: 'Life raft, 4 persons · visibility 5 km · height 10 m → W 2 km' }).click();
      await page.getByRole('textbox', { name: 'Track spacing S' }).fill('2000');
      await page.getByRole('button', { name: 'Compute POD' }).click();
      const result = page.getByLabel('Search effort result');
      await result.waitFor();
      // C = 2000 / 2000 = 1. Source: Koopman, Search and Screening — inverse-cube parallel sweep
      // erf(√π/2) ≈ 0.79 and random search 1 − e⁻¹ ≈ 0.63 (from memory; see tests/unit/sightline/sweep-width.test.ts).
      await result.getByLabel('Coverage factor C: 1.00').waitFor();
      await result.getByLabel('POD: 79 %').waitFor();
      await result.getByLabel('POD, random search: 63 %').waitFor();
      await shot(page, 'search-effort-table', viewport);

      // Phone first: nothing runs off the side of a 390-pixel screen.
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      expect(overflow).toBeLessThanOrEqual(0);

      // A typed sweep width with the definite-range law: W = 1500, S = 3000 → C = 0.5, POD = min(1, C) = 50 %.
      // Source: definite-range law (Koopman, from memory).
      await page.getByRole('radio', { name: 'Sweep width' }).click();
      await page.getByRole('textbox', { name: 'Sweep width W' }).fill('1500');
      await page.getByRole('radio', { name: 'Definite range' }).click();
      await page.getByRole('textbox', { name: 'Track spacing S' }).fill('3000');
      await page.getByRole('button', { name: 'Compute POD' }).click();
      await result.getByLabel('POD: 50 %').waitFor();

      // Bad input is refused under its field and the last answer stays.
      await page.getByRole('textbox', { name: 'Track spacing S' }).fill('0');
      await page.getByRole('button', { name: 'Compute POD' }).click();
      await page.getByText('The track spacing must be more than 0 m.').waitFor();
      await result.getByLabel('POD: 50 %').waitFor();

      // A lateral-range curve; a spacing that would need too many tracks is the server's 422 on the spacing.
      await page.getByRole('radio', { name: 'Lateral-range curve' }).click();
      await page.getByRole('textbox', { name: 'Lateral-range curve' }).fill('0, 1\n10000, 0');
      await page.getByRole('textbox', { name: 'Track spacing S' }).fill('1');
      await page.getByRole('button', { name: 'Compute POD' }).click();
      await page.getByText(/at most 2000: use a spacing of at least 5\.00 m/).waitFor();
      // The triangle 1 − x/10 km has W = 10 km; with S = 20 km the tracks never overlap and POD = W/S = 50 %.
      // Source: common practice, no source (area under the curve over the spacing).
      await page.getByRole('textbox', { name: 'Track spacing S' }).fill('20000');
      await page.getByRole('button', { name: 'Compute POD' }).click();
      await result.getByLabel('Sweep width W: 10 km').waitFor();
      await result.getByLabel('POD: 50 %').waitFor();
      await shot(page, 'search-effort-curve', viewport);

      // A planner enters a table from a publication (edition and source required), uses it, and retires it.
      const form = page.getByLabel('New sweep-width table');
      await form.getByRole('textbox', { name: 'Table name' }).fill(`Trial table ${viewport}`);
      await form.getByRole('textbox', { name: 'Rows' }).fill('Test raft; 10000; 15; 3000');
      await form.getByRole('button', { name: 'Save table' }).click();
      await form.getByText('Give the edition.').waitFor();
      await form.getByText('Give the source.').waitFor();
      await form.getByRole('textbox', { name: 'Edition' }).fill('Trial edition 1');
      await form.getByRole('textbox', { name: 'Source' }).fill('Own trials (invented for this test)');
      await form.getByRole('button', { name: 'Save table' }).click();
      await form.getByText(`Added Trial table ${viewport}.`).waitFor();
      await page.getByRole('checkbox', { name: 'Test raft · visibility 10 km · height 15 m → W 3 km' }).click();
      await page.getByRole('textbox', { name: 'Track spacing S' }).fill('3000');
      await page.getByRole('radio', { name: 'Inverse-cube law (Koopman)' }).click();
      await page.getByRole('button', { name: 'Compute POD' }).click();
      await result.getByLabel('POD: 79 %').waitFor();
      await page.getByRole('button', { name: 'Retire this table' }).click();
      await page.getByRole('checkbox', { name: `Trial table ${viewport}` }).waitFor({ state: 'detached' });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
