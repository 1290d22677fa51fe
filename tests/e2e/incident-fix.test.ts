import { Geodesic } from 'geographiclib-geodesic';
import { magvar } from 'magvar';
import type { Page } from 'playwright-core';
import type { LatLon } from '@/shared/geo/types';
import type { CaughtMail } from '@/shared/schemas/mail';
import { createCaughtMailClient } from '@/server/mail/caught-mail-client';
import { DEMO } from '@/tests/support/agents';
import { browserForFile, SCREENSHOT_DIR } from '@/tests/support/browser';
import { apiJson, e2eUrl, openIncident, shot, signIn, signInToWatch, watchErrors } from '@/tests/support/e2e';

/*
 * Two lookouts on phones report bearings to one invented smoke in the demo
 * forest; the planner, on a wide screen, reads the fix, its error area and
 * what each tower can see of the place, then sees it on the site map; the
 * duty planners' e-mail is in the local mail catcher. The bearings are
 * worked out with geographiclib-geodesic's inverse problem (the reference
 * library, Karney 2013), the compass bearing with the magnetic model's
 * declination from the magvar package (WMM2025).
 */

const WGS84 = Geodesic.WGS84;
const TOLLIVER = 'lookout.tolliver@demo.kenning.test';
const FOREST = 'Harrowmere Forest District';

const browser = browserForFile();

const azimuthDeg = (a: LatLon, b: LatLon) => {
  const azi = WGS84.Inverse(a.latDeg, a.lonDeg, b.latDeg, b.lonDeg).azi1!;
  return azi < 0 ? azi + 360 : azi;
};

async function mailTo(to: string, subject: RegExp): Promise<CaughtMail> {
  const url = process.env.KENNING_CAUGHT_MAIL_URL;
  if (!url) throw new Error('This test needs the mail catcher `npm test` starts (KENNING_CAUGHT_MAIL_URL).');
  const catcher = createCaughtMailClient(url);
  const deadline = Date.now() + 20_000;
  for (;;) {
    const found = (await catcher.list()).find((m) => m.to.some((a) => a.includes(to)) && subject.test(m.subject));
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`no mail to ${to} matching ${subject}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

/** Sends one bearing from the incident page's form (the post is already chosen: the lookout's watch post). */
async function reportBearing(page: Page, bearing: string, reference: 'true' | 'magnetic', { offline = false } = {}) {
  const form = page.getByLabel('Report a bearing');
  await form.waitFor();
  if (reference === 'magnetic') {
    await form.getByRole('checkbox', { name: 'Magnetic (compass)' }).click();
    // The declination Kenning will add is shown before sending.
    await form.getByText(/the magnetic model gives \d+\.\d° [EW]/).waitFor();
  }
  await form.getByLabel('Bearing', { exact: true }).fill(bearing);
  await form.getByRole('checkbox', { name: /Hand compass/ }).click();
  expect(await form.getByLabel('Uncertainty of the bearing').inputValue()).toBe('1.5');
  const send = form.getByRole('button', { name: 'Send the bearing' });
  // A double tap sends the report once (one idempotency key per report).
  await send.dblclick();
  if (offline) await form.getByText(/^No network: the bearing .* is kept on this device/).waitFor();
  else await form.getByText(/^(Sent|Already received \(stored once\)): /).waitFor();
}

describe('bearings from two phones give the planner a fix', () => {
  it('two lookouts report a smoke, the planner sees the fix, its error area and the map, and the e-mail is caught', async () => {
    const title = `Smoke east of Crane Knoll ${Date.now().toString(36)}`;
    const planner = await browser.newPage('wide');
    const first = await browser.newPage('phone');
    // The second lookout's phone runs in field mode: his bearing is written with no network and sent later.
    const second = await browser.newPage('phone', { fieldMode: true });
    const errors = [planner, first, second].map(({ page }) => watchErrors(page));
    let watchId: string | null = null;
    try {
      // Setup through the API: Bram Tolliver on a watch at Sedge Ridge Tower now (his seeded watch starts tomorrow).
      await signIn(planner.page, DEMO.admin);
      await planner.page.getByText('Your sites').first().waitFor();
      const users = await apiJson<{ items: { id: string; email: string }[] }>(planner.page, 'GET', '/users?pageSize=100');
      const tolliverId = users.items.find((u) => u.email === TOLLIVER)!.id;
      await planner.page.request.post(`${e2eUrl()}/api/auth/sign-out`);
      await signIn(planner.page, DEMO.planner);
      await planner.page.getByText('Your sites').first().waitFor();
      const sites = await apiJson<{ items: { id: string; name: string }[] }>(planner.page, 'GET', '/sites');
      const siteId = sites.items.find((s) => s.name === FOREST)!.id;
      const posts = await apiJson<{ items: { id: string; name: string; location: LatLon }[] }>(
        planner.page,
        'GET',
        `/sites/${siteId}/posts`,
      );
      const crane = posts.items.find((p) => p.name === 'Crane Knoll Tower')!;
      const sedge = posts.items.find((p) => p.name === 'Sedge Ridge Tower')!;
      const now = Date.now();
      watchId = (
        await apiJson<{ assignment: { id: string } }>(planner.page, 'POST', '/assignments', {
          postId: sedge.id,
          userId: tolliverId,
          startsAt: new Date(now - 60_000).toISOString(),
          endsAt: new Date(now + 2 * 3_600_000).toISOString(),
          note: 'Browser test: incident fix.',
        })
      ).assignment.id;

      // The smoke: 7 km from Crane Knoll Tower on 120° true (invented).
      const s = WGS84.Direct(crane.location.latDeg, crane.location.lonDeg, 120, 7000);
      const smoke = { latDeg: s.lat2!, lonDeg: s.lon2! };
      const craneTrue = azimuthDeg(crane.location, smoke);
      const sedgeTrue = azimuthDeg(sedge.location, smoke);
      // Source: NOAA WMM2025 through the magvar package; true = magnetic + declination (east positive).
      const year = new Date().getUTCFullYear() + new Date().getUTCMonth() / 12;
      const sedgeMagnetic = (sedgeTrue - magvar(sedge.location.latDeg, sedge.location.lonDeg, 0, year) + 360) % 360;

      // 1. Sami Rookwood, on watch at Crane Knoll Tower, opens the incident on a phone and reports a true bearing.
      const a = first.page;
      await signInToWatch(a, DEMO.observer);
      const incidentId = await openIncident(a, FOREST, title, () => shot(a, 'incident-open', 'phone'));
      // The lookout's watch post is chosen already (once the watch has loaded).
      await a.getByRole('checkbox', { name: 'Crane Knoll Tower', checked: true }).waitFor();
      await reportBearing(a, craneTrue.toFixed(1), 'true');
      await a.getByText('Bearings from one post so far. A fix needs bearings from at least two posts.').waitFor();
      await shot(a, 'incident-first-bearing', 'phone');

      // 2. Bram Tolliver at Sedge Ridge Tower reads a compass bearing; Kenning adds the model's declination.
      const b = second.page;
      await signInToWatch(b, TOLLIVER);
      await b.goto(`${e2eUrl()}/incidents/${incidentId}`);
      await b.getByRole('heading', { name: title }).waitFor();
      await b.getByRole('checkbox', { name: 'Sedge Ridge Tower', checked: true }).waitFor();
      // No signal on the ridge: the report waits on the phone, then goes once the network is back.
      await second.context.setOffline(true);
      await reportBearing(b, sedgeMagnetic.toFixed(1), 'magnetic', { offline: true });
      const outbox = b.getByLabel('Outbox');
      await outbox.getByText(/^Waiting to be sent since/).waitFor();
      await shot(b, 'incident-bearing-kept-offline', 'phone');
      await second.context.setOffline(false);
      await outbox.getByText(/^Sent at/).waitFor();
      // Sent once: the incident holds one report from each post.
      const { reports } = await apiJson<{ reports: { postName: string }[] }>(b, 'GET', `/incidents/${incidentId}`);
      expect(reports.map((r) => r.postName).sort()).toEqual(['Crane Knoll Tower', 'Sedge Ridge Tower']);
      await b.getByLabel('Fix position').waitFor();
      await b.getByText(/^MGRS 33U/).waitFor();
      await b.getByRole('heading', { name: title }).scrollIntoViewIfNeeded();
      await shot(b, 'incident-fix', 'phone');
      await b.getByText('Can each post see the place?').scrollIntoViewIfNeeded();
      await shot(b, 'incident-fix-visibility', 'phone');
      // On the phone's map: the incident is listed under the legend, drawn over the map.
      await b.getByRole('link', { name: 'Show on the map' }).click();
      await b.waitForURL(/\/sites\/[0-9a-f-]{36}\/map\?/);
      await b.getByRole('button', { name: 'Legend and layers' }).waitFor();
      await b.waitForTimeout(500);
      await b.screenshot({ path: `${SCREENSHOT_DIR}/incident-map-phone.png` });
      await b.getByRole('button', { name: 'Legend and layers' }).click();
      await b
        .getByLabel('Incidents on the map')
        .getByText(new RegExp(`${title}: fix at`))
        .waitFor();

      // 3. The planner on a wide screen: the fix, its error area, each post's distance and view, the intact log.
      const p = planner.page;
      await p.goto(`${e2eUrl()}/incidents/${incidentId}`);
      await p.getByRole('heading', { name: title }).waitFor();
      await p.getByLabel('Fix position').waitFor();
      await p.getByText(/^Error area \d/).waitFor();
      await p.getByText('Can each post see the place?').waitFor();
      await p.getByText(/Crane Knoll Tower (sees the ground there|cannot see the ground there)/).waitFor();
      await p.getByText('Log intact').waitFor();
      // The fix is within its error area of the smoke: both bearings were exact.
      const fix = (
        await apiJson<{ incident: { fix: { latDeg: number; lonDeg: number; errorAreaM2: number } } }>(
          p,
          'GET',
          `/incidents/${incidentId}`,
        )
      ).incident.fix;
      // Source: Karney (2013) through geographiclib-geodesic: the crossing of exact bearings is the smoke itself.
      expect(WGS84.Inverse(fix.latDeg, fix.lonDeg, smoke.latDeg, smoke.lonDeg).s12!).toBeLessThan(Math.sqrt(fix.errorAreaM2));
      await shot(p, 'incident-planner', 'wide');

      // 4. On the site map: the bearings, the fix and its error area over the map, and the incident in the panel.
      await p.getByRole('link', { name: 'Show on the map' }).click();
      await p.waitForURL(/\/sites\/[0-9a-f-]{36}\/map\?/);
      const panel = p.getByLabel('Incidents on the map');
      await panel.getByText(new RegExp(`${title}: fix at`)).waitFor();
      await p.waitForTimeout(500);
      await p.screenshot({ path: `${SCREENSHOT_DIR}/incident-map-wide.png` });

      // 5. The duty planners' e-mail, with the position and error area.
      const mail = await mailTo(DEMO.planner, new RegExp(`New fix: ${title}`));
      expect(mail.text).toMatch(/Position/);
      expect(mail.text).toMatch(/MGRS 33U/);
      expect(mail.text).toMatch(/Error area/);
      expect(mail.text).toContain(`/incidents/${incidentId}`);

      // 6. The planner closes the incident: asked first, with a note for the log.
      await p.goto(`${e2eUrl()}/incidents/${incidentId}`);
      await p.getByRole('button', { name: 'Close the incident' }).click();
      const dialog = p.getByRole('dialog', { name: 'Close this incident?' });
      await dialog.getByLabel('Note for the log (optional)').fill('Crew on scene; out.');
      await dialog.getByRole('button', { name: 'Close', exact: true }).click();
      await dialog.waitFor({ state: 'detached' });
      await p.getByText(/· Closed ·/).waitFor();
      await p.getByText('Crew on scene; out.').waitFor();
      expect(await p.getByLabel('Report a bearing').count()).toBe(0);
      await shot(p, 'incident-closed', 'wide');

      expect(errors.flat()).toEqual([]);
    } finally {
      if (watchId) await planner.page.request.delete(`${e2eUrl()}/api/v1/assignments/${watchId}`).catch(() => undefined);
      await Promise.all([planner, first, second].map(({ context }) => context.close()));
    }
  });
});
