import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Plan } from '@/shared/schemas/plan';
import { DEMO } from '@/tests/support/agents';
import { browserForFile } from '@/tests/support/browser';
import { apiJson, e2eUrl, shot, signIn, watchErrors } from '@/tests/support/e2e';

const browser = browserForFile();
let work: string;

beforeAll(() => {
  work = mkdtempSync(path.join(os.tmpdir(), 'kenning-e2e-package-'));
});
afterAll(() => rmSync(work, { recursive: true, force: true }));

it('lets a reviewer download the package of the approved demo plan', async () => {
  const { context, page } = await browser.newPage('wide');
  const errors = watchErrors(page);
  try {
    await signIn(page, DEMO.reviewer);
    await page.waitForURL((url) => !url.pathname.endsWith('/sign-in'));
    const { items } = await apiJson<{ items: Plan[] }>(page, 'GET', '/plans?status=approved');
    const plan = items.find((p) => p.title === 'Fire season cover 2026')!;
    await page.goto(`${e2eUrl()}/plans/${plan.id}`);

    const link = page.getByRole('link', { name: 'Download plan package (PDF)' });
    await link.waitFor();
    await shot(page, 'plan-package-link', 'wide');
    const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
    expect(download.suggestedFilename()).toMatch(
      /^harrowmere-forest-district_fire-season-cover-2026_v1-rev1_\d{4}-\d{2}-\d{2}\.pdf$/,
    );
    const file = path.join(work, download.suggestedFilename());
    await download.saveAs(file);

    const bytes = readFileSync(file);
    expect(bytes.subarray(0, 4).toString('latin1')).toBe('%PDF');
    const text = execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' });
    expect(text).toContain('Fire season cover 2026');
    expect(errors).toEqual([]);
  } finally {
    await context.close();
  }
});

it('shows an observer their post’s crew card on a phone, with the PDF beside it, and again with no network', async () => {
  const { context, page } = await browser.newPage('phone', { fieldMode: true });
  const errors = watchErrors(page);
  try {
    await signIn(page, DEMO.observer);
    await page.waitForURL(/\/briefing$/);
    // The briefing's first post (the observer keeps watch at Crane Knoll Tower in the demo).
    await page.getByRole('link', { name: 'Crew card', exact: true }).first().click();
    await page.waitForURL(/\/sites\/[^/]+\/crew-card\/[^/]+$/);
    await page.getByText('How far from here').waitFor();
    await page.getByText(/^MGRS 33U /).waitFor();
    // The plan the card is drawn from is whichever approved plan uses the post now (other browser tests approve
    // plans of the demo forest too): read it from the card's own API.
    const [, siteId, postId] = /\/sites\/([^/]+)\/crew-card\/([^/]+)$/.exec(page.url())!;
    const { card } = await apiJson<{ card: { basis: { kind: string; planTitle?: string } } }>(
      page,
      'GET',
      `/sites/${siteId}/posts/${postId}/card`,
    );
    expect(card.basis.kind).toBe('approved-plan');
    const basisLine = `From the approved plan “${card.basis.planTitle}”`;
    await page.getByText(basisLine, { exact: false }).waitFor();
    await page.getByText(/Magnetic bearings: not available/).waitFor();
    await page.getByText('Read before you rely on this').waitFor();
    const pdfLink = page.getByRole('link', { name: 'Crew card (PDF, A5)' });
    expect(await pdfLink.getAttribute('href')).toMatch(/\/card\.pdf\?coords=/);
    await shot(page, 'crew-card', 'phone');
    expect(errors).toEqual([]);

    // In the field: the phone goes offline and the card is opened again from cold, from the device's copy.
    const cardUrl = page.url();
    await page.waitForFunction(async () => !!navigator.serviceWorker?.controller && (await caches.keys()).length > 0, null, {
      timeout: 60_000,
    });
    await page.waitForTimeout(1500); // the device's copy is written a second after the last change
    await context.setOffline(true);
    await page.close();
    const cold = await context.newPage();
    await cold.goto(cardUrl);
    await cold.getByRole('status', { name: 'Offline' }).waitFor();
    await cold.getByText('How far from here').waitFor();
    await cold.getByText(basisLine, { exact: false }).waitFor();
    await shot(cold, 'crew-card-offline', 'phone');
  } finally {
    await context.close();
  }
});
