import { Geodesic } from 'geographiclib-geodesic';
import type { LatLon } from '@/shared/geo/types';
import { DEMO } from '@/tests/support/agents';
import { browserForFile } from '@/tests/support/browser';
import { apiJson, e2eUrl, openIncident, openPlace, signIn, signInToWatch, watchErrors } from '@/tests/support/e2e';

/*
 * One lookout, one post: Sami Rookwood (on watch at Crane Knoll Tower)
 * reports a bearing and a vertical angle to the base of an invented smoke
 * and sees the fix with its range interval; the planner reads it on a wide
 * screen. Then a landmark-range practice question is answered with the
 * geodesic distance (geographiclib-geodesic, Karney 2013) to a demo landmark.
 * Screenshots go to /tmp/landmark-*.png.
 */

const FOREST = 'Harrowmere Forest District';
const browser = browserForFile();

it('a bearing and a vertical angle from one post give a fix with its range interval; a landmark-range drill is answered', async () => {
  const phone = await browser.newPage('phone');
  const wide = await browser.newPage('wide');
  const errors = [phone, wide].map(({ page }) => watchErrors(page));
  const title = `Smoke below Crane Knoll ${Date.now().toString(36)}`;

  // 1. The lookout on a phone: open the incident, report 140° true, −1.5° below the horizontal.
  const a = phone.page;
  await signInToWatch(a, DEMO.observer);
  const incidentId = await openIncident(a, FOREST, title);
  const form = a.getByLabel('Report a bearing');
  await form.getByLabel('Bearing', { exact: true }).fill('140');
  await form.getByLabel('Vertical angle (optional)').fill('-1.5');
  await form.getByText('A range from one angle is an estimate').waitFor();
  expect(await form.getByLabel('Uncertainty of the vertical angle').inputValue()).toBe('0.1');
  await a.screenshot({ path: '/tmp/landmark-report-form-phone.png', fullPage: true });
  await form.getByRole('button', { name: 'Send the bearing' }).click();
  await form.getByText(/^Sent: /).waitFor();
  const range = a.getByLabel('Range from the vertical angle');
  await range.getByText('Where the sight line meets the terrain').waitFor();
  await range.getByText(/^Range .* · between .* and .* for the angle ± 0\.1°/).waitFor();
  await a.getByRole('heading', { name: title }).scrollIntoViewIfNeeded();
  await a.screenshot({ path: '/tmp/landmark-vertical-fix-phone.png', fullPage: true });
  const { incident } = await apiJson<{
    incident: { fix: { method: string; latDeg: number; lonDeg: number; range: { distanceM: number; minM: number } } };
  }>(a, 'GET', `/incidents/${incidentId}`);
  expect(incident.fix.method).toBe('vertical-angle');
  expect(incident.fix.range.minM).toBeLessThanOrEqual(incident.fix.range.distanceM);

  // 2. The planner on a wide screen reads the same fix, then the map.
  const p = wide.page;
  await signIn(p, DEMO.planner);
  await p.getByText('Your sites').first().waitFor();
  await p.goto(`${e2eUrl()}/incidents/${incidentId}`);
  await p.getByRole('heading', { name: title }).waitFor();
  await p.getByLabel('Range from the vertical angle').waitFor();
  // The fix told from the demo forest's three landmarks too, nearest first.
  const fromLandmarks = p.getByRole('list', { name: 'From the landmarks' });
  await fromLandmarks.getByRole('listitem').first().waitFor();
  expect(await fromLandmarks.getByRole('listitem').count()).toBe(3);
  await fromLandmarks.getByText(/ at \d{3}\.\d° true from Tarnwick Fire Hut$/).waitFor();
  await p.screenshot({ path: '/tmp/landmark-vertical-fix-wide.png', fullPage: true });
  await p.getByRole('link', { name: 'Show on the map' }).click();
  await p.waitForURL(/\/sites\/[0-9a-f-]{36}\/map\?/);
  await p.waitForTimeout(1500);
  await p.screenshot({ path: '/tmp/landmark-vertical-fix-map-wide.png' });

  // 3. The lookout practises a landmark-range question on Crane Knoll Tower and answers it right.
  await openPlace(a, 'Training');
  const practice = a.getByLabel('Practice');
  await practice.getByRole('checkbox', { name: 'Range to a landmark' }).click();
  await practice.getByRole('checkbox', { name: FOREST }).click();
  await practice.getByRole('checkbox', { name: 'Crane Knoll Tower' }).click();
  await practice.getByRole('button', { name: 'New question' }).click();
  const question = a.getByLabel('Question');
  const text = (await question.getByText(/lies at \d{3}° true\. How far away is it\?/).textContent())!;
  const sites = await apiJson<{ items: { id: string; name: string }[] }>(a, 'GET', '/sites');
  const siteId = sites.items.find((s) => s.name === FOREST)!.id;
  const posts = await apiJson<{ items: { name: string; location: LatLon }[] }>(a, 'GET', `/sites/${siteId}/posts`);
  const crane = posts.items.find((x) => x.name === 'Crane Knoll Tower')!;
  const marks = await apiJson<{ items: { name: string; latDeg: number; lonDeg: number }[] }>(
    a,
    'GET',
    `/sites/${siteId}/landmarks`,
  );
  const mark = marks.items.find((m) => text.includes(m.name))!;
  // Source: Karney (2013) inverse problem, geographiclib-geodesic.
  const km = Geodesic.WGS84.Inverse(crane.location.latDeg, crane.location.lonDeg, mark.latDeg, mark.lonDeg).s12! / 1000;
  await question.getByLabel('Your answer').fill(km.toFixed(2));
  await question.getByRole('button', { name: 'Answer', exact: true }).click();
  await question
    .getByText(/Full credit|full credit|100 %/)
    .first()
    .waitFor();
  await a.screenshot({ path: '/tmp/landmark-drill-phone.png', fullPage: true });
  await p.goto(`${e2eUrl()}/training`);
  await p.getByLabel('Practice').waitFor();
  await p.screenshot({ path: '/tmp/landmark-training-wide.png', fullPage: true });

  expect(errors.flat()).toEqual([]);
});
