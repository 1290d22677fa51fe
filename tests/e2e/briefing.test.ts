import type { Briefing } from '@/shared/schemas/assignment';
import { DEMO } from '@/tests/support/agents';
import { browserForFile, eachViewport } from '@/tests/support/browser';
import { apiJson, shot, signIn, watchErrors } from '@/tests/support/e2e';

const browser = browserForFile();

const bearing = (deg: number) => `${String(Math.round(deg) % 360).padStart(3, '0')}°`;

eachViewport('on the %s viewport', (viewport) => {
  it('lands the observer on their briefing with what their tower sees over the terrain', async () => {
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.observer);
      await page.waitForURL(/\/briefing$/);
      const card = page.getByLabel('What you see over the terrain');
      await card.getByText('What you see from here, over the terrain').waitFor();

      // The figures on screen are the API's for this post (standard optical case of the first target).
      const briefing = await apiJson<Briefing>(page, 'GET', '/briefing');
      const crane = briefing.posts.find((p) => p.post.name === 'Crane Knoll Tower')!;
      const shown = crane.terrainView!.cases.find(
        (c) => c.targetId === crane.terrainView!.cases[0]!.targetId && /standard/i.test(c.conditionLabel),
      )!;
      // The demo tower sees about a quarter of the district and is blocked to the south (seeded terrain,
      // common practice, no source).
      expect(shown.seenPct).toBeLessThan(35);
      await card.getByText(`${Math.round(shown.seenPct)} % of Harrowmere Forest District`).waitFor();
      for (const b of shown.blindSectors)
        await card.getByText(`${bearing(b.fromDeg)} → ${bearing(b.toDeg)} true · ${b.seenPct.toFixed(1)} % seen`).waitFor();
      expect(shown.blindSectors.length).toBeGreaterThan(0);
      await page.getByRole('img', { name: /Seen share by bearing, true north up/ }).waitFor();
      await page.getByText('Detection ranges per target').waitFor();

      // Smooth-earth zone reaches are not offered for a tower on terrain; the cautions stay.
      expect(await page.getByText(/smooth earth, no terrain/i).count()).toBe(0);
      expect(await page.getByText(/: whole/).count()).toBe(0);
      await page.getByText('Read before you rely on this').waitFor();
      await page
        .getByText(/visibility is not|not necessarily detected/i)
        .first()
        .waitFor();
      await shot(page, 'briefing-terrain', viewport);
      await page.getByRole('img', { name: /Seen share by bearing/ }).scrollIntoViewIfNeeded();
      await shot(page, 'briefing-terrain-rose', viewport);
      await page.getByText('Detection ranges per target').scrollIntoViewIfNeeded();
      await shot(page, 'briefing-terrain-ranges', viewport);

      // Another condition: the chips switch the figures.
      const other = crane.terrainView!.cases.find((c) => c.targetId === shown.targetId && c.caseKey !== shown.caseKey)!;
      await card.getByRole('checkbox', { name: other.conditionLabel }).click();
      await card.getByText(`${Math.round(other.seenPct)} % of Harrowmere Forest District`).waitFor();

      // The site list is still one tap away.
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Sites' }).click();
      await page.getByText('Your sites').first().waitFor();
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
