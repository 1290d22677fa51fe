import { DateTime } from 'luxon';
import { DEMO } from '@/tests/support/agents';
import { browserForFile, eachViewport } from '@/tests/support/browser';
import { apiJson, e2eUrl, shot, signIn, tapAt, watchErrors } from '@/tests/support/e2e';

const browser = browserForFile();

type Item = { id: string; name: string };
interface PostBody extends Item {
  location: { latDeg: number; lonDeg: number };
  version: number;
  route: unknown;
}

eachViewport('coast watch on the %s viewport', (viewport) => {
  it('a supervisor draws the shoreline, sets two bands, draws a patrol route, computes, reads the strips and gaps, and closes an unwatched hour', async () => {
    const phone = viewport === 'phone';
    const { context, page } = await browser.newPage(viewport, { touch: phone });
    const errors = watchErrors(page);
    try {
      await signIn(page, DEMO.planner);
      await page.getByRole('link', { name: 'Tallow Strand' }).waitFor();
      const sites = await apiJson<{ items: Item[] }>(page, 'GET', '/sites');
      const coast = sites.items.find((s) => s.name === 'Tallow Strand')!;
      await page.goto(`${e2eUrl()}/sites/${coast.id}/edit`);
      const siteForm = page.getByLabel('Edit site');
      await siteForm.getByLabel('Name', { exact: true }).waitFor();

      // 1. The shoreline, drawn with taps from west to east along the south of the stretch (the sea to the north).
      await siteForm.getByRole('button', { name: /Enter the shoreline|Change the shoreline/ }).click();
      const shoreMap = page.getByRole('application', { name: /^Drawing map for shoreline/ });
      await shoreMap.waitFor();
      await shoreMap.scrollIntoViewIfNeeded();
      // A shoreline drawn before (the other viewport's run) is started over.
      const startOver = page.getByRole('button', { name: 'Start over' });
      if (await startOver.isEnabled()) await startOver.click();
      const box = (await shoreMap.boundingBox())!;
      // Inside the stretch's boundary, clear of the map's controls, scale bar and read-out (the phone's map is narrower).
      const taps = phone
        ? [
            [0.17, 0.6],
            [0.4, 0.595],
            [0.62, 0.59],
            [0.82, 0.585],
          ]
        : [
            [0.12, 0.74],
            [0.4, 0.73],
            [0.65, 0.71],
            [0.88, 0.7],
          ];
      for (const [fx, fy] of taps as [number, number][]) {
        await tapAt(page, phone, { x: box.x + box.width * fx, y: box.y + box.height * fy });
        await page.waitForTimeout(300); // apart, so two taps are not read as a double tap (zoom)
      }
      await page.getByText(/4 corners\. Tap to go on along the shore/).waitFor();
      await shot(page, 'coast-shoreline-drawn', viewport);
      await page.getByRole('button', { name: 'Use this line' }).click();
      await siteForm.getByText(/4 corners, chainage 0 at/).waitFor();

      // 2. Two bands, typed in nautical miles (the site's units).
      const bands = siteForm.getByLabel('Shore and offshore bands');
      while ((await bands.getByRole('button', { name: /^Remove band/ }).count()) > 0) {
        await bands
          .getByRole('button', { name: /^Remove band/ })
          .first()
          .click();
      }
      await bands.getByRole('button', { name: 'Add a band' }).click();
      await bands.getByLabel('Band 1 name').fill('Surf zone');
      await bands.getByLabel('Band 1').getByLabel('From the shore').fill('0');
      await bands.getByLabel('Band 1').getByLabel('Out to').fill('0.5');
      await bands.getByRole('button', { name: 'Add a band' }).click();
      await bands.getByLabel('Band 2 name').fill('Inshore');
      await bands.getByLabel('Band 2').getByLabel('Out to').fill('3');
      await shot(page, 'coast-bands', viewport);
      await siteForm.getByRole('button', { name: 'Save changes' }).click();
      await page.waitForURL(new RegExp(`/sites/${coast.id}$`));
      const saved = await apiJson<{
        site: { shoreline: unknown[]; bands: { name: string; fromM: number; toM: number }[] };
      }>(page, 'GET', `/sites/${coast.id}`);
      expect(saved.site.shoreline).toHaveLength(4);
      // Source: 1 international nautical mile = 1852 m (International Hydrographic Conference, 1929).
      expect(saved.site.bands).toEqual([
        { name: 'Surf zone', fromM: 0, toM: 926 },
        { name: 'Inshore', fromM: 926, toM: 5556 },
      ]);

      // 3. A patrol route for the vessel, drawn on the post form's map. The run uses a copy of the demo vessel
      // without its route, so the demo's own (frozen) plans stay as they are.
      const posts = (await apiJson<{ items: PostBody[] }>(page, 'GET', `/sites/${coast.id}/posts`)).items;
      const demoVessel = posts.find((p) => p.name === 'Patrol vessel Kittiwake')!;
      const { post: copy } = await apiJson<{ post: PostBody }>(
        page,
        'POST',
        `/sites/${coast.id}/posts/${demoVessel.id}/duplicate`,
      );
      const { post: vessel } = await apiJson<{ post: PostBody }>(page, 'PATCH', `/sites/${coast.id}/posts/${copy.id}`, {
        name: `Kittiwake patrol (${viewport})`,
        // Moored 2.5 km south (phone) or north (wide) of the demo vessel, so their marks and names on the map stay apart.
        location: { latDeg: demoVessel.location.latDeg + (phone ? -0.0225 : 0.0225), lonDeg: demoVessel.location.lonDeg },
        route: null,
        speedMps: null,
        cycleMinutes: null,
        version: copy.version,
      });
      await page.goto(`${e2eUrl()}/sites/${coast.id}/posts/${vessel.id}`);
      await page.getByRole('heading', { name: vessel.name }).waitFor();
      if (phone) await page.getByRole('button', { name: 'Edit post' }).click();
      const postForm = page.getByLabel('Edit post');
      // Nautical units on this form: distances in nautical miles, the speed in knots.
      await postForm.getByRole('radiogroup', { name: 'Units' }).getByRole('radio', { name: 'ft · nmi' }).click();
      const patrol = postForm.getByLabel('Patrol route');
      await patrol.getByRole('button', { name: 'Draw the route on the map' }).click();
      const routeMap = page.getByLabel(/^Route map: tap to add a waypoint/);
      await routeMap.scrollIntoViewIfNeeded();
      // Three waypoints over the sea around the demo vessel's own mark (the middle of the strand's sea), then back
      // to the start: a loop.
      const mark = (await routeMap.getByText('Patrol vessel Kittiwake', { exact: true }).first().boundingBox())!;
      const vesselAt = { x: mark.x - 12, y: mark.y + mark.height / 2 };
      for (const [dx, dy] of [
        [-60, 30],
        [60, 30],
        [0, -40],
      ] as const) {
        await tapAt(page, phone, { x: vesselAt.x + dx, y: vesselAt.y + dy });
        await page.waitForTimeout(300);
      }
      await page.getByText('3 waypoints, 2 legs.', { exact: false }).waitFor();
      await page.getByRole('button', { name: 'Back to the start' }).click();
      await page.getByText(/4 waypoints, 3 legs, back at the start/).waitFor();
      await shot(page, 'coast-route-drawn', viewport);
      await page.getByRole('button', { name: 'Use this route' }).click();
      // The legs and the time to run them, from the speed in knots (the coast's nautical units).
      await patrol
        .getByLabel('Legs of the route')
        .getByText(/^Leg 3: waypoint 3 → 4, [\d.]+ nmi$/)
        .waitFor();
      await patrol.getByLabel('Speed').fill('12');
      await patrol.getByLabel('Cycle (time on station)').fill('120');
      await patrol.getByText(/one run takes [\d.]+ min at this speed · held [\d.]+ min at the last waypoint/).waitFor();
      // Source: 1 knot = 1852 m per hour (International Hydrographic Conference, 1929): 12 kn = 6.1733 m/s.
      await patrol.getByText('12 kn = 6.17 m/s (stored)').waitFor();
      await shot(page, 'coast-route-form', viewport);
      await postForm.getByRole('button', { name: 'Save changes' }).click();
      await page.getByText('Changes saved.').waitFor();
      const routed = (await apiJson<{ items: PostBody[] }>(page, 'GET', `/sites/${coast.id}/posts`)).items.find(
        (p) => p.id === vessel.id,
      )!;
      expect(Array.isArray(routed.route) && routed.route.length).toBe(4);

      // 4. A plan for the strand with the two shore posts and the patrol, computed from its page.
      const planPosts = posts.filter((p) => p.name === 'Gull Point' || p.name === 'Fenwick Head').concat(vessel);
      const targets = await apiJson<{ items: Item[] }>(page, 'GET', '/targets');
      const sets = await apiJson<{ items: Item[] }>(page, 'GET', '/conditions');
      const { plan } = await apiJson<{ plan: { id: string } }>(page, 'POST', '/plans', {
        siteId: coast.id,
        title: `Strand strips ${viewport}`,
        postIds: planPosts.map((p) => p.id),
        targetIds: [targets.items.find((t) => t.name === 'Small open boat')!.id],
        conditionSetIds: [sets.items.find((s) => s.name === 'Standard day')!.id],
        standard: { minSeenPct: 0, priorityMinPosts: 1 },
      });
      const planUrl = `${e2eUrl()}/plans/${plan.id}`;
      // The standard's band rule, set on the plan form: "Inshore: 95 % of the shore by ≥ 1 post, 08:00–20:00".
      await page.goto(`${planUrl}/edit`);
      await page.getByRole('button', { name: 'Add a band rule' }).click();
      const rule = page.getByLabel('Band rule 1', { exact: true });
      await rule.getByRole('radio', { name: 'Inshore' }).click();
      await rule.getByLabel('Share of the shore').fill('95');
      await rule.getByLabel('From', { exact: true }).fill('08:00');
      await rule.getByLabel('To', { exact: true }).fill('20:00');
      await rule.getByText('Reads: Inshore: 95 % of the shore by ≥ 1 post, 08:00–20:00').waitFor();
      await rule.scrollIntoViewIfNeeded();
      await shot(page, 'coast-band-rule', viewport);
      await page.getByRole('button', { name: 'Save changes' }).click();
      await page.waitForURL(new RegExp(`/plans/${plan.id}$`));
      const ruled = await apiJson<{ plan: { standard: { bandRules?: unknown } } }>(page, 'GET', `/plans/${plan.id}`);
      expect(ruled.plan.standard.bandRules).toEqual([{ band: 'Inshore', minPosts: 1, minPct: 95, fromHour: 8, toHour: 20 }]);
      const card = page.getByRole('region', { name: 'Terrain coverage' });
      await card.scrollIntoViewIfNeeded();
      await card.getByRole('button', { name: 'Compute coverage' }).click();
      const strips = page.getByLabel('Shore watch', { exact: true });
      await strips.waitFor({ timeout: 240_000 });

      // 5. The strip chart, the bands and the gaps, each gap naming the post that could close it.
      await strips.getByRole('img', { name: /Strip chart of the shore: Surf zone watched along/ }).waitFor();
      await strips.getByRole('table', { name: 'Bands along the shore' }).getByText('Inshore').waitFor();
      const gaps = strips.getByRole('list', { name: 'Gaps along the shore' });
      await gaps.or(strips.getByText('No gaps: every band is watched along the whole shore.')).first().waitFor();
      if (await gaps.count()) {
        const names = planPosts.map((p) => p.name.replace(/[()]/g, '\\$&')).join('|');
        await expect(gaps.getByRole('listitem').first().textContent()).resolves.toMatch(new RegExp(`Nearest: (${names})`));
      }
      await strips.getByRole('img', { name: /Strip chart of the shore/ }).scrollIntoViewIfNeeded();
      await shot(page, 'coast-strips', viewport);
      // The patrol's own figures: swept once at least, and the probability of detection over one cycle.
      const figures = card.getByLabel(`Patrol ${vessel.name}`);
      await figures.getByText(/^Watched at least once: [\d.]+ % of the judged area/).waitFor();
      await figures.getByText(/^Probability of detection in one cycle: [\d.]+ %/).waitFor();
      await card.getByLabel('Patrols').scrollIntoViewIfNeeded();
      await shot(page, 'coast-patrol-figures', viewport);

      // 6. An unwatched hour on a day ahead (a gap between two watches), closed on the roster screen.
      const run = (
        await apiJson<{ latest: { id: string; cases: { key: string; gaps: { band: string; kind: string }[] }[] } }>(
          page,
          'GET',
          `/plans/${plan.id}/coverage`,
        )
      ).latest;
      const day = DateTime.now()
        .setZone('Europe/Berlin')
        .startOf('day')
        .plus({ days: phone ? 190 : 200 });
      const people = await apiJson<{ items: Item[] }>(page, 'GET', '/people');
      const person = (name: string) => people.items.find((p) => p.name === name)!.id;
      const post = (name: string) => posts.find((p) => p.name === name)!.id;
      const at = (h: number) => day.plus({ hours: h }).toUTC().toISO()!;
      // Earlier watches of these posts that run on into that day end the day before.
      for (const p of ['Gull Point', 'Fenwick Head']) {
        const open = await apiJson<{ items: { id: string; version: number; startsAt: string; endsAt: string | null }[] }>(
          page,
          'GET',
          `/assignments?postId=${post(p)}&from=${encodeURIComponent(at(0))}&to=${encodeURIComponent(at(24))}`,
        );
        for (const w of open.items) {
          if (Date.parse(w.startsAt) < Date.parse(at(0))) {
            await apiJson(page, 'PATCH', `/assignments/${w.id}`, {
              endsAt: day.minus({ hours: 1 }).toUTC().toISO(),
              version: w.version,
            });
          }
        }
      }
      for (const [from, to] of [
        [8, 13],
        [14, 20],
      ]) {
        await apiJson(page, 'POST', '/assignments', {
          postId: post('Gull Point'),
          userId: person('Ines Marrow'),
          startsAt: at(from!),
          endsAt: at(to!),
        });
      }
      const unwatched = async () =>
        (
          await apiJson<{ hourly: { unwatchedHours: { local: string }[] } }>(
            page,
            'GET',
            `/coverage-runs/${run.id}/hourly?caseKey=${encodeURIComponent(run.cases[0]!.key)}&date=${day.toISODate()}`,
          )
        ).hourly.unwatchedHours
          .map((u) => u.local.slice(11))
          .filter((h) => h >= '08:00' && h < '20:00');
      expect(await unwatched()).toEqual(['13:00']);
      // The supervisor closes the hour on the site's roster: Ines Marrow on Gull Point 13:00–14:00 that day
      // (the site's local time), between her two watches.
      await page.goto(`${e2eUrl()}/sites/${coast.id}`);
      const watchForm = page.getByLabel('Put someone on a post');
      await watchForm.getByRole('checkbox', { name: 'Gull Point' }).click();
      await watchForm.getByRole('checkbox', { name: 'Ines Marrow' }).click();
      await watchForm.getByLabel('From', { exact: true }).fill(`${day.toISODate()} 13:00`);
      await watchForm.getByLabel('To', { exact: true }).fill(`${day.toISODate()} 14:00`);
      await watchForm.getByLabel('From', { exact: true }).scrollIntoViewIfNeeded();
      await shot(page, 'coast-close-hour', viewport);
      await watchForm.getByRole('button', { name: 'Put on watch' }).click();
      // Saved: the form clears its times for the next watch.
      const fromField = watchForm.getByLabel('From', { exact: true });
      for (let i = 0; i < 100 && (await fromField.inputValue()) !== ''; i++) await page.waitForTimeout(100);
      expect(await fromField.inputValue()).toBe('');
      expect(await unwatched()).toEqual([]);

      // 7. Today's hour by hour on the plan's page, then the patrol's time-in-view layer on the map.
      await page.goto(planUrl);
      await strips.getByLabel('Hour by hour', { exact: true }).scrollIntoViewIfNeeded();
      await strips.getByRole('table', { name: 'Watched share of each band by hour' }).waitFor();
      await shot(page, 'coast-hourly', viewport);
      await card.getByRole('link', { name: 'Open on the map' }).click();
      await page.waitForURL('**/map**');
      if (phone) await page.getByRole('button', { name: 'Legend and layers' }).click();
      await page.getByRole('checkbox', { name: `${vessel.name}: time in view` }).click();
      await page.getByText('Share of the patrol cycle in view').first().waitFor();
      for (const label of ['Never', 'Up to 25 %', 'Over 75 %']) {
        await page.getByText(label, { exact: true }).first().waitFor();
      }
      await page.getByText('Share of the patrol cycle in view').first().scrollIntoViewIfNeeded();
      await shot(page, 'coast-map', viewport);
      // The shoreline with its chainage ticks from 0, and the case's gaps on it, named by band.
      await page.getByText('Shoreline, ticks at round chainages').first().waitFor();
      const gapsOfCase = run.cases[0]!.gaps;
      if (gapsOfCase.length > 0)
        await page
          .getByText(/^Gap along the shore/)
          .first()
          .waitFor();
      if (phone) await page.getByRole('button', { name: 'Legend and layers' }).click();
      const mapText = page.locator('svg text');
      await mapText
        .filter({ hasText: /^0 (nmi|km|mi)$/ })
        .first()
        .waitFor();
      for (const g of gapsOfCase.slice(0, 3)) {
        const label = `${g.band}: ${g.kind === 'seam' ? 'seam' : 'gap'}`;
        await mapText.filter({ hasText: label }).first().waitFor({ state: 'attached' });
      }
      await shot(page, 'coast-map-shore', viewport);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  }, 600_000);
});
