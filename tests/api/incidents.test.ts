import type { Express } from 'express';
import { Geodesic } from 'geographiclib-geodesic';
import { magvar } from 'magvar';
import request from 'supertest';
import type { Sequelize } from 'sequelize';
import { createApp } from '@/server/app';
import { PostModel, SiteModel } from '@/server/data/models';
import { startMailCatcher } from '@/server/mail/mail-catcher';
import { createMailer, type Mailer } from '@/server/mail/mailer';
import type { LatLon } from '@/shared/geo/types';
import { IncidentDetailSchema, IncidentReportResultSchema } from '@/shared/schemas/incident';
import { DEMO_PASSWORD } from '@/server/seeders/demo';
import { DEMO } from '@/tests/support/agents';
import { createTestDatabase, scratchFileStore, TEST_CONFIG } from '@/tests/support/test-db';

/*
 * Incidents on the demo forest district: bearings to an invented smoke are
 * computed with geographiclib-geodesic's inverse problem (the reference
 * library, Karney 2013); the incident's fix must give the smoke back. The
 * demo observer is on a watch at Crane Knoll Tower (seeded until further
 * notice); Bram Tolliver's watch starts tomorrow.
 */

const WGS84 = Geodesic.WGS84;
let app: Express;
let db: Sequelize;
let drop: () => Promise<void>;
let catcher: Awaited<ReturnType<typeof startMailCatcher>>;
let mailer: Mailer;
let siteId: string;
const posts: Record<string, { id: string; at: LatLon }> = {};

const agentFor = async (email: string) => {
  const agent = request.agent(app);
  await agent.post('/api/auth/sign-in').send({ email, password: DEMO_PASSWORD }).expect(200);
  return agent;
};
const azimuthDeg = (a: LatLon, b: LatLon) => {
  const azi = WGS84.Inverse(a.latDeg, a.lonDeg, b.latDeg, b.lonDeg).azi1!;
  return azi < 0 ? azi + 360 : azi;
};
const distanceM = (a: LatLon, b: LatLon) => WGS84.Inverse(a.latDeg, a.lonDeg, b.latDeg, b.lonDeg).s12!;

beforeAll(async () => {
  ({ db, drop } = await createTestDatabase());
  catcher = await startMailCatcher({ port: 0, onError: () => {} });
  mailer = createMailer({ host: '127.0.0.1', port: catcher.port, from: 'Kenning <no-reply@demo.kenning.test>' });
  app = createApp({ db, config: TEST_CONFIG, mailer, files: scratchFileStore().files });
  siteId = (await SiteModel.findOne({ where: { name: 'Harrowmere Forest District' } }))!.id;
  for (const name of ['Crane Knoll Tower', 'Sedge Ridge Tower', 'Blackmoss Tower']) {
    const row = (await PostModel.findOne({ where: { name } }))!;
    const [lonDeg, latDeg] = row.location.coordinates;
    posts[name] = { id: row.id, at: { latDeg, lonDeg } };
  }
});
afterAll(async () => {
  mailer.close();
  await catcher.close();
  await drop();
});

/** An invented smoke: 7 km from Crane Knoll Tower on 120°. */
const smoke = (): LatLon => {
  const { at } = posts['Crane Knoll Tower']!;
  const r = WGS84.Direct(at.latDeg, at.lonDeg, 120, 7000);
  return { latDeg: r.lat2!, lonDeg: r.lon2! };
};
const observedAt = () => new Date(Date.now() - 60_000).toISOString();
let keyCount = 0;
const report = (post: string, extra: Record<string, unknown> = {}) => ({
  postId: posts[post]!.id,
  observedAt: observedAt(),
  bearingDeg: azimuthDeg(posts[post]!.at, smoke()),
  bearingReference: 'true',
  bearingSigmaDeg: 0.5,
  kind: 'smoke',
  note: '',
  idempotencyKey: `test-report-${++keyCount}-${Date.now()}`,
  ...extra,
});

const open = async (agent: request.Agent, title = 'Smoke east of Crane Knoll') =>
  IncidentDetailSchema.parse((await agent.post('/api/v1/incidents').send({ siteId, title }).expect(201)).body);

describe('incidents', () => {
  it('fixes a smoke from two posts’ bearings, logs every step in a hash chain and e-mails the planners', async () => {
    const [planner, observer] = await Promise.all([agentFor(DEMO.planner), agentFor(DEMO.observer)]);
    const opened = await open(observer);
    expect(opened.incident).toMatchObject({ status: 'open', reportCount: 0, fix: null, siteId });
    expect(opened.entries.map((e) => e.kind)).toEqual(['opened']);
    expect(opened.chain).toMatchObject({ intact: true, entries: 1 });
    const id = opened.incident.id;

    const first = IncidentReportResultSchema.parse(
      (await observer.post(`/api/v1/incidents/${id}/reports`).send(report('Crane Knoll Tower')).expect(201)).body,
    );
    expect(first.fix).toBeNull();
    expect(first.fixProblem).toMatch(/two posts/);
    expect(first.report).toMatchObject({ declinationSource: 'none', declinationDeg: 0, kind: 'smoke' });

    // A compass bearing without a declination: the World Magnetic Model's at the post and time.
    // Source: the `magvar` package (WMM2025, NOAA NCEI / BGS) as the reference; magnetic = true − declination (east positive).
    const when = new Date();
    const sedge = posts['Sedge Ridge Tower']!.at;
    const declination = magvar(sedge.latDeg, sedge.lonDeg, 0, when);
    const second = IncidentReportResultSchema.parse(
      (
        await planner
          .post(`/api/v1/incidents/${id}/reports`)
          .send(
            report('Sedge Ridge Tower', {
              observedAt: when.toISOString(),
              bearingReference: 'magnetic',
              bearingDeg: (azimuthDeg(sedge, smoke()) - declination + 360) % 360,
              bearingSigmaDeg: 1.5,
            }),
          )
          .expect(201)
      ).body,
    );
    expect(second.report.declinationSource).toBe('model');
    expect(second.report.declinationDeg).toBeCloseTo(declination, 2);
    expect(second.fix).not.toBeNull();
    // The model's declination is given to 0.01°: at ~10 km that is under 2 m.
    expect(distanceM(second.fix!, smoke())).toBeLessThan(5);
    expect(second.fix!.method).toBe('two-bearing-intersection');
    expect(second.fix!.errorAreaM2).toBeGreaterThan(0);
    expect(second.fix!.fromReports).toEqual([first.report.seq, second.report.seq]);
    expect(second.mailed).toBe(true);
    const mail = catcher
      .messages()
      .find((m) => m.to.includes(DEMO.planner) && /New fix: Smoke east of Crane Knoll/.test(m.subject));
    expect(mail?.text).toMatch(/MGRS/);
    expect(mail?.text).toMatch(/Error area/);

    const detail = IncidentDetailSchema.parse((await planner.get(`/api/v1/incidents/${id}`).expect(200)).body);
    expect(detail.entries.map((e) => e.kind)).toEqual(['opened', 'report', 'report', 'fix']);
    expect(detail.chain).toMatchObject({ intact: true, entries: 4, firstBrokenSeq: null });
    for (const [i, e] of detail.entries.entries()) expect(e.prevHash).toBe(i === 0 ? null : detail.entries[i - 1]!.hash);
  });

  it('stores a report sent twice once (same idempotency key), and refuses the key for a different report', async () => {
    const observer = await agentFor(DEMO.observer);
    const { incident } = await open(observer, 'Light seen at dusk');
    const body = report('Crane Knoll Tower', { kind: 'light' });
    const a = await observer.post(`/api/v1/incidents/${incident.id}/reports`).send(body).expect(201);
    const b = await observer.post(`/api/v1/incidents/${incident.id}/reports`).send(body).expect(200);
    expect(b.body.replayed).toBe(true);
    expect(b.body.report.seq).toBe(a.body.report.seq);
    const detail = (await observer.get(`/api/v1/incidents/${incident.id}`)).body;
    expect(detail.reports).toHaveLength(1);
    const clash = await observer
      .post(`/api/v1/incidents/${incident.id}/reports`)
      .send({ ...body, bearingDeg: (body.bearingDeg + 10) % 360 })
      .expect(409);
    expect(clash.body.error.code).toBe('idempotency_conflict');
    expect(clash.body.error.fields.idempotencyKey).toBeDefined();
  });

  it('flags the bearing that disagrees when three posts report and one is wrong', async () => {
    const planner = await agentFor(DEMO.planner);
    const { incident } = await open(planner, 'Three towers on one smoke');
    const url = `/api/v1/incidents/${incident.id}/reports`;
    await planner.post(url).send(report('Crane Knoll Tower')).expect(201);
    await planner.post(url).send(report('Sedge Ridge Tower')).expect(201);
    const wrong = report('Blackmoss Tower');
    const res = await planner
      .post(url)
      .send({ ...wrong, bearingDeg: (wrong.bearingDeg + 8) % 360 })
      .expect(201);
    const fix = IncidentReportResultSchema.parse(res.body).fix!;
    expect(fix.method).toBe('least-squares');
    expect(fix.lines.find((l) => l.postId === posts['Blackmoss Tower']!.id)!.flagged).toBe(true);
    expect(fix.lines.filter((l) => l.flagged)).toHaveLength(1);
  });

  it('uses a post’s latest bearing only: a newer one replaces the older in the fix', async () => {
    const planner = await agentFor(DEMO.planner);
    const { incident } = await open(planner, 'Drifting smoke');
    const url = `/api/v1/incidents/${incident.id}/reports`;
    await planner
      .post(url)
      .send(report('Crane Knoll Tower', { bearingDeg: 100 }))
      .expect(201);
    const c = await planner.post(url).send(report('Crane Knoll Tower')).expect(201);
    const s = await planner.post(url).send(report('Sedge Ridge Tower')).expect(201);
    const fix = IncidentReportResultSchema.parse(s.body).fix!;
    expect(fix.fromReports).toEqual([c.body.report.seq, s.body.report.seq]);
    expect(distanceM(fix, smoke())).toBeLessThan(1);
  });

  it('detects an edited log entry', async () => {
    const planner = await agentFor(DEMO.planner);
    const { incident } = await open(planner, 'Tamper check');
    await planner.post(`/api/v1/incidents/${incident.id}/reports`).send(report('Crane Knoll Tower')).expect(201);
    // The application's role may not change entries at all; the owner can, with the trigger off — as an attacker with
    // the database's keys would. The chain must show it.
    await db.query(`ALTER TABLE incident_entries DISABLE TRIGGER incident_entries_frozen`);
    try {
      await db.query(
        `UPDATE incident_entries SET body = jsonb_set(body, '{bearingDeg}', '200') WHERE incident_id = :id AND seq = 2`,
        { replacements: { id: incident.id } },
      );
    } finally {
      await db.query(`ALTER TABLE incident_entries ENABLE TRIGGER incident_entries_frozen`);
    }
    const detail = IncidentDetailSchema.parse((await planner.get(`/api/v1/incidents/${incident.id}`).expect(200)).body);
    expect(detail.chain).toMatchObject({ intact: false, firstBrokenSeq: 2 });
    expect(detail.chain.message).toMatch(/altered/);
    // And the database refuses a change with its trigger on.
    await expect(
      db.query(`UPDATE incident_entries SET kind = 'report' WHERE incident_id = :id AND seq = 1`, {
        replacements: { id: incident.id },
      }),
    ).rejects.toThrow(/cannot be changed/);
  });

  it('lets every role read, and only planners and observers on watch write', async () => {
    const [planner, reviewer, offDuty, other] = await Promise.all([
      agentFor(DEMO.planner),
      agentFor(DEMO.reviewer),
      agentFor('lookout.tolliver@demo.kenning.test'),
      agentFor(DEMO.otherPlanner),
    ]);
    const { incident } = await open(planner, 'Access check');
    await reviewer.get(`/api/v1/incidents/${incident.id}`).expect(200);
    await offDuty.get(`/api/v1/incidents/${incident.id}`).expect(200);
    expect((await reviewer.get(`/api/v1/incidents?siteId=${siteId}&status=open`)).body.items.length).toBeGreaterThan(0);
    await reviewer.post(`/api/v1/incidents/${incident.id}/reports`).send(report('Crane Knoll Tower')).expect(403);
    const refused = await offDuty.post(`/api/v1/incidents/${incident.id}/reports`).send(report('Sedge Ridge Tower')).expect(403);
    expect(refused.body.error.message).toMatch(/on a watch/);
    await other.get(`/api/v1/incidents/${incident.id}`).expect(404);
    await other.post(`/api/v1/incidents/${incident.id}/reports`).send(report('Crane Knoll Tower')).expect(404);
    expect((await other.get('/api/v1/incidents')).body.items.map((i: { id: string }) => i.id)).not.toContain(incident.id);
    await other.post('/api/v1/incidents').send({ siteId, title: 'Not ours' }).expect(404);
  });

  it('answers bad reports with the fields at fault and refuses reports on a closed incident', async () => {
    const planner = await agentFor(DEMO.planner);
    const { incident } = await open(planner, 'Field errors');
    const url = `/api/v1/incidents/${incident.id}/reports`;
    const bad = await planner
      .post(url)
      .send({ ...report('Crane Knoll Tower'), bearingDeg: 400, kind: 'cloud', idempotencyKey: 'x', observedAt: 'now' })
      .expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['bearingDeg', 'idempotencyKey', 'kind', 'observedAt']);
    expect((await planner.get(`/api/v1/incidents/${incident.id}`)).body.entries).toHaveLength(1);

    const closed = await planner
      .patch(`/api/v1/incidents/${incident.id}`)
      .send({ version: incident.version, status: 'closed', note: 'False alarm: dust.' })
      .expect(200);
    expect(closed.body.incident.status).toBe('closed');
    expect(closed.body.entries.at(-1)).toMatchObject({ kind: 'closed', body: { note: 'False alarm: dust.' } });
    const late = await planner.post(url).send(report('Crane Knoll Tower')).expect(409);
    expect(late.body.error.code).toBe('incident_closed');
    await planner.patch(`/api/v1/incidents/${incident.id}`).send({ version: incident.version, status: 'open' }).expect(409);
  });

  it('exports the log as RFC 4180 CSV and the bearings, fix and error area as RFC 7946 GeoJSON', async () => {
    const planner = await agentFor(DEMO.planner);
    const { incident } = await open(planner, 'Export, with "quotes", and commas');
    const url = `/api/v1/incidents/${incident.id}/reports`;
    await planner
      .post(url)
      .send(report('Crane Knoll Tower', { note: 'Grey, thin\ncolumn' }))
      .expect(201);
    await planner.post(url).send(report('Sedge Ridge Tower')).expect(201);

    const csv = await planner.get(`/api/v1/incidents/${incident.id}/log.csv`).expect(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    expect(csv.headers['content-disposition']).toMatch(
      /harrowmere-forest-district_export-with-quotes-and-commas_incident-log_\d{4}-\d{2}-\d{2}\.csv/,
    );
    // Source: RFC 4180 §2 — CRLF line breaks; fields with commas, quotes or line breaks in double quotes, quotes doubled.
    const text: string = csv.text;
    expect(text.endsWith('\r\n')).toBe(true);
    expect(text.split('\r\n')[0]).toMatch(/^seq,recorded_at_utc,entry,.*true_bearing_deg,bearing_sigma_deg,.*,hash$/);
    expect(text).toContain('"Grey, thin\ncolumn"');
    expect(text).toContain('"Export, with ""quotes"", and commas"');
    expect(text.match(/\r\n(?=\d+,)/g)).toHaveLength(4);

    const geo = await planner.get(`/api/v1/incidents/${incident.id}/incident.geojson`).expect(200);
    expect(geo.headers['content-type']).toMatch(/application\/geo\+json/);
    const fc = JSON.parse(geo.text);
    expect(fc.type).toBe('FeatureCollection');
    const kinds = fc.features.map((f: { geometry: { type: string } }) => f.geometry.type);
    expect(kinds).toEqual(['LineString', 'LineString', 'Point', 'Polygon']);
    const [lon, lat] = fc.features[2].geometry.coordinates;
    // Source: RFC 7946 §3.1.1 — positions are [longitude, latitude].
    expect(distanceM({ latDeg: lat, lonDeg: lon }, smoke())).toBeLessThan(1);
    const ring = fc.features[3].geometry.coordinates[0];
    // Source: RFC 7946 §3.1.6 — a linear ring is closed and the exterior ring is counter-clockwise.
    expect(ring.at(-1)).toEqual(ring[0]);
    let twiceArea = 0;
    for (let i = 0; i + 1 < ring.length; i++) twiceArea += ring[i][0] * ring[i + 1][1] - ring[i + 1][0] * ring[i][1];
    expect(twiceArea).toBeGreaterThan(0);
    // The bearing line from Crane Knoll starts at the post and passes the smoke.
    const line = fc.features[0].geometry.coordinates;
    expect(distanceM({ latDeg: line[0][1], lonDeg: line[0][0] }, posts['Crane Knoll Tower']!.at)).toBeLessThan(1);
    expect(distanceM({ latDeg: line.at(-1)[1], lonDeg: line.at(-1)[0] }, posts['Crane Knoll Tower']!.at)).toBeGreaterThan(7000);
  });
});
