import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import type request from 'supertest';
import { DateTime } from 'luxon';
import { fromUtm } from '@/shared/geo/from-utm';
import { CoverageRunSchema } from '@/shared/schemas/coverage';
import { AssignmentModel, PostModel, SiteModel, UserModel } from '@/server/data/models';
import type { ViewshedPool } from '@/server/workers/viewshed-pool';
import { DEMO, signedInAgent } from '@/tests/support/agents';
import { appWithInlineCoverage, createTestDatabase } from '@/tests/support/test-db';

/*
 * Coast watch through the API on the demo coast (Tallow Strand, flat datum,
 * sea to the north): the shoreline, bands, datum and tide on the site; the
 * run's bands, gaps and hourly series; the hourly series for another day
 * from the roster as it is now.
 */

jest.setTimeout(180_000);

let db: Sequelize;
let drop: () => Promise<void>;
let pool: ViewshedPool;
let app: Express;
let planner: request.Agent;
let siteId: string;

const lonLat = (e: number, n: number) => {
  const p = fromUtm({ zone: 33, hemisphere: 'N', easting: e, northing: n });
  return [p.lonDeg, p.latDeg] as [number, number];
};
// Along the south edge of the demo's sea area, west to east (the sea on the left).
const SHORELINE = [
  lonLat(530_200, 5_751_520),
  lonLat(536_000, 5_751_600),
  lonLat(541_000, 5_751_900),
  lonLat(547_800, 5_752_090),
];
const BANDS = [
  { name: 'Surf zone', fromM: 0, toM: 926 },
  { name: 'Inshore', fromM: 926, toM: 5556 },
];

beforeAll(async () => {
  ({ db, drop } = await createTestDatabase());
  ({ app, pool } = appWithInlineCoverage(db));
  planner = await signedInAgent(app, DEMO.planner);
  siteId = (await SiteModel.findOne({ where: { name: 'Tallow Strand' } }))!.id;
});
afterAll(async () => {
  await pool.close();
  await drop();
});

const site = async () => (await planner.get(`/api/v1/sites/${siteId}`).expect(200)).body.site;

describe('shoreline, bands, datum and tide on a site', () => {
  it('stores them and reads them back', async () => {
    const { version } = await site();
    const res = await planner
      .patch(`/api/v1/sites/${siteId}`)
      .send({ shoreline: SHORELINE, bands: BANDS, heightDatum: 'chart-datum', tide: { lowM: 0.4, highM: 2.1 }, version });
    expect(res.status).toBe(200);
    expect(res.body.site).toMatchObject({
      shoreline: SHORELINE,
      bands: BANDS,
      heightDatum: 'chart-datum',
      tide: { lowM: 0.4, highM: 2.1 },
    });
    expect((await site()).bands).toEqual(BANDS);
  });

  it.each([
    [{ shoreline: [SHORELINE[0]] }, 'shoreline', /at least two/],
    [{ shoreline: [SHORELINE[0], SHORELINE[0]] }, 'shoreline', /two distinct/],
    [{ bands: [{ name: 'Inshore', fromM: 3000, toM: 900 }] }, 'bands.0.toM', /farther out/],
    [{ bands: [{ name: 'Far', fromM: 0, toM: 200_000 }] }, 'bands.0.toM', /100 km/],
    [{ bands: [BANDS[0], { ...BANDS[1], name: 'surf zone' }] }, 'bands.1.name', /Two bands/],
    [{ bands: [{ name: ' ', fromM: 0, toM: 100 }] }, 'bands.0.name', /Name the band/],
    [{ heightDatum: 'lowest low' }, 'heightDatum', /mean-sea-level, chart-datum/],
    [{ tide: { lowM: 2, highM: 1 } }, 'tide.highM', /at or above low water/],
  ])('refuses %j with the field and why, and keeps the site as it was', async (change, field, why) => {
    const before = await site();
    const res = await planner.patch(`/api/v1/sites/${siteId}`).send({ ...change, version: before.version });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.fields[field as string]).toMatch(why as RegExp);
    const after = await site();
    expect(after.version).toBe(before.version);
    expect(after.bands).toEqual(before.bands);
  });
});

describe('a shoreline traced from the terrain', () => {
  it('follows a stated level on the forest district’s terrain, and refuses a level the terrain does not cross', async () => {
    const forest = (await SiteModel.findOne({ where: { name: 'Harrowmere Forest District' } }))!.id;
    const traced = await planner.post(`/api/v1/sites/${forest}/shoreline-from-terrain`).send({ levelM: 600 });
    expect(traced.status).toBe(200);
    expect(traced.body.shoreline.length).toBeGreaterThan(10);
    expect(traced.body.levelM).toBe(600);
    const high = await planner.post(`/api/v1/sites/${forest}/shoreline-from-terrain`).send({ levelM: 8000 });
    expect(high.status).toBe(422);
    expect(high.body.error).toMatchObject({ code: 'level_not_crossed', fields: { levelM: expect.any(String) } });
    const bad = await planner.post(`/api/v1/sites/${forest}/shoreline-from-terrain`).send({ levelM: 'sea' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.levelM).toMatch(/number of metres/);
    // The coast has no terrain.
    expect((await planner.post(`/api/v1/sites/${siteId}/shoreline-from-terrain`).send({ levelM: 0 })).status).toBe(404);
  });
});

describe('the coverage run along the shore', () => {
  let plan: { id: string };
  let run: ReturnType<typeof CoverageRunSchema.parse>;

  beforeAll(async () => {
    // One tide level only, to keep the run short.
    const { version } = await site();
    await planner
      .patch(`/api/v1/sites/${siteId}`)
      .send({ tide: { levelM: 1.2 }, version })
      .expect(200);
    const posts = (await planner.get(`/api/v1/sites/${siteId}/posts`)).body.items as { id: string; name: string }[];
    const targets = (await planner.get('/api/v1/targets')).body.items as { id: string; name: string }[];
    const sets = (await planner.get('/api/v1/conditions')).body.items as { id: string; name: string }[];
    plan = (
      await planner
        .post('/api/v1/plans')
        .send({
          siteId,
          title: 'Coast strips, test',
          postIds: posts.map((p) => p.id),
          targetIds: [targets.find((t) => t.name === 'Small open boat')!.id],
          conditionSetIds: [sets.find((s) => s.name === 'Standard day')!.id],
          standard: {
            minSeenPct: 0,
            priorityMinPosts: 1,
            bandRules: [{ band: 'Inshore', minPosts: 1, minPct: 95, fromHour: 8, toHour: 20 }],
          },
        })
        .expect(201)
    ).body.plan;
    const started = (await planner.post(`/api/v1/plans/${plan.id}/coverage`).send({}).expect(202)).body.run;
    run = CoverageRunSchema.parse((await planner.get(`/api/v1/coverage-runs/${started.id}`).expect(200)).body.run);
  });

  it('gives every case its bands, gaps and hourly series, at the stated tide', async () => {
    expect(run.status).toBe('done');
    const [c] = run.cases;
    expect(c!.key).toMatch(/:tide-level$/);
    expect(c!.tideLevelM).toBe(1.2);
    expect(c!.conditionLabel).toMatch(/tide level \(1\.2 m above chart datum\)/);
    expect(c!.shore).toMatchObject({ seaSide: 'left' });
    // The shoreline's geodesic length: the corners are ~5.8, ~5.0 and ~6.8 km apart.
    expect(c!.shore!.lengthM).toBeGreaterThan(17_500);
    expect(c!.shore!.lengthM).toBeLessThan(17_800);
    expect(c!.bands.map((b) => b.name)).toEqual(['Surf zone', 'Inshore']);
    for (const b of c!.bands) {
      expect(b.watched1.pct).toBeGreaterThan(0);
      expect(b.watched1.pct).toBeLessThanOrEqual(100);
      expect(b.watched2.lengthM).toBeLessThanOrEqual(b.watched1.lengthM);
      expect(b.posts).toHaveLength(3);
    }
    // Gaps lie on the shore, and each names a post of the plan.
    for (const g of c!.gaps) {
      expect(g.fromM).toBeGreaterThanOrEqual(0);
      expect(g.toM).toBeLessThanOrEqual(c!.shore!.lengthM + 1);
      expect(g.closer?.postName).toMatch(/Gull Point|Fenwick Head|Kittiwake/);
    }
    expect(c!.hourly?.hours.length).toBeGreaterThanOrEqual(23);
    expect(c!.check.rules.map((r) => r.text)).toContain('Inshore: 95 % of the shore watched by ≥ 1 post, 08:00–20:00');
  });

  it('the hourly series of another day follows the roster as it is now, one unstaffed hour included', async () => {
    const coastPosts = await PostModel.findAll({ where: { siteId } });
    const postId = (name: string) => coastPosts.find((p) => p.name === name)!.id;
    const person = async (email: string) => (await UserModel.findOne({ where: { email } }))!.id;
    // A day well ahead; watches already on the coast's posts end before it.
    const day = DateTime.now().setZone('Europe/Berlin').startOf('day').plus({ days: 150 });
    await AssignmentModel.update(
      { endsAt: day.minus({ days: 1 }).toJSDate() },
      { where: { postId: coastPosts.map((p) => p.id), endsAt: null } },
    );
    const at = (h: number) => day.plus({ hours: h }).toUTC().toISO();
    const watch = async (post: string, email: string, from: number, to: number) =>
      (
        await planner
          .post('/api/v1/assignments')
          .send({ postId: postId(post), userId: await person(email), startsAt: at(from), endsAt: at(to) })
          .expect(201)
      ).body.assignment;
    await watch('Gull Point', 'lookout.marrow@demo.kenning.test', 8, 13);
    await watch('Gull Point', 'lookout.marrow@demo.kenning.test', 14, 20);
    await watch('Fenwick Head', 'lookout.tolliver@demo.kenning.test', 8, 13);
    const late = await watch('Fenwick Head', 'lookout.tolliver@demo.kenning.test', 14, 20);

    const key = run.cases[0]!.key;
    const ask = async () =>
      (await planner.get(`/api/v1/coverage-runs/${run.id}/hourly`).query({ caseKey: key, date: day.toISODate() }).expect(200))
        .body.hourly;
    const hourly = await ask();
    expect(hourly.hours).toHaveLength(24);
    const at13 = hourly.hours.find((h: { hour: number }) => h.hour === 13);
    expect(at13.postIds).toEqual([]);
    expect(at13.bands.every((b: { watched1Pct: number }) => b.watched1Pct === 0)).toBe(true);
    const at12 = hourly.hours.find((h: { hour: number }) => h.hour === 12);
    expect(at12.postIds.sort()).toEqual([postId('Gull Point'), postId('Fenwick Head')].sort());
    const inDay = hourly.unwatchedHours.filter(
      (u: { local: string }) => u.local.slice(11) >= '08:00' && u.local.slice(11) < '20:00',
    );
    expect(inDay.map((u: { local: string }) => u.local.slice(11))).toEqual(['13:00']);

    // Moving Fenwick Head's afternoon watch an hour earlier closes the hour.
    await planner
      .patch(`/api/v1/assignments/${late.id}`)
      .send({ startsAt: at(13), version: late.version })
      .expect(200);
    const after = await ask();
    const inDayAfter = after.unwatchedHours.filter(
      (u: { local: string }) => u.local.slice(11) >= '08:00' && u.local.slice(11) < '20:00',
    );
    expect(inDayAfter).toEqual([]);
    expect(after.hours.find((h: { hour: number }) => h.hour === 13).postIds).toEqual([postId('Fenwick Head')]);
  });

  it('refuses an unknown case and a week longer than seven days, naming the field', async () => {
    const bad = await planner.get(`/api/v1/coverage-runs/${run.id}/hourly`).query({ caseKey: 'nope' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.caseKey).toMatch(/Not a case/);
    const long = await planner.get(`/api/v1/coverage-runs/${run.id}/hourly`).query({ caseKey: run.cases[0]!.key, days: 8 });
    expect(long.status).toBe(400);
    expect(long.body.error.fields.days).toMatch(/1 to 7/);
  });

  it('prints the bands, the unwatched stretches and the patrol in the plan package', async () => {
    const res = await planner
      .get(`/api/v1/plans/${plan.id}/preview/report.pdf`)
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    const dir = mkdtempSync(path.join(os.tmpdir(), 'kenning-coast-report-'));
    try {
      const file = path.join(dir, 'package.pdf');
      writeFileSync(file, res.body as Buffer);
      // poppler-utils' pdftotext; runs of spaces squeezed to compare words.
      const flat = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
      const [c] = run.cases;
      expect(flat).toContain('The shore, band by band');
      for (const b of c!.bands) expect(flat).toContain(`${b.name} `);
      // The ≥ 1 share of the first band as the run has it, one decimal.
      expect(flat).toContain(`(${c!.bands[0]!.watched1.pct.toFixed(1)} %)`);
      const unwatched = c!.gaps.filter((g) => g.kind === 'unwatched');
      expect(flat).toContain(
        unwatched.length === 0 ? 'No unwatched stretch in any band' : `${unwatched.length} unwatched stretch`,
      );
      if (c!.patrols?.length) {
        expect(flat).toContain('Patrols');
        for (const p of c!.patrols) expect(flat).toContain(p.postName);
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
