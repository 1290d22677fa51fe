import type { Express } from 'express';
import request from 'supertest';
import { AuditEventModel, SweepWidthTableModel } from '@/server/data/models';
import { EXAMPLE_SWEEP_WIDTH_TABLE } from '@/server/seeders/sweep-width-examples';
import { SweepWidthResultSchema, SweepWidthTableListSchema } from '@/shared/schemas/sweep-width';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

let app: Express;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ app, close } = await createTestApp());
});
afterAll(() => close());

const table = {
  name: 'Test table',
  edition: 'Trial edition 2',
  sourceName: 'Own trials, invented for this test',
  rows: [{ searchObject: 'Test raft', visibilityM: 10_000, heightM: 8, sweepWidthM: 1800 }],
};

describe('POST /api/v1/sweep-width', () => {
  it('answers W, C and the inverse-cube POD with the caution', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const res = await observer.post('/api/v1/sweep-width').send({ sweepWidthM: 2000, trackSpacingM: 2000 }).expect(200);
    const body = SweepWidthResultSchema.parse(res.body);
    expect(body).toMatchObject({ model: 'inverse-cube', sweepWidthM: 2000, coverageFactor: 1 });
    // Source: Koopman, Search and Screening, inverse-cube parallel sweep POD = erf((√π/2)·C) ≈ 0.79 at C = 1 —
    // from memory; 1 − e⁻¹ for a random search.
    expect(body.pod).toBeCloseTo(0.7899, 4);
    expect(body.podRandomSearch).toBeCloseTo(0.6321, 4);
    expect(body.caution).toMatch(/estimate/);
    expect(body.caution).toMatch(/Visibility is not detection/);
  });

  it('computes from a lateral-range curve, summed over the tracks', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const curve = [
      { rangeM: 0, pod: 1 },
      { rangeM: 500, pod: 1 },
      { rangeM: 500.001, pod: 0 },
    ];
    const res = await planner.post('/api/v1/sweep-width').send({ lateralRangeCurve: curve, trackSpacingM: 4000 }).expect(200);
    // Source: definite-range law, W = 2R and POD = W/S below C = 1 (Koopman — from memory).
    expect(res.body.model).toBe('lateral-range-curve');
    expect(res.body.sweepWidthM).toBeCloseTo(1000, 1);
    expect(res.body.pod).toBeCloseTo(0.25, 2);
    expect(res.body.tracksEachSide).toBe(1);
  });

  it('answers bad input with the field at fault: 400 for the shape, 422 for what cannot be computed', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const missing = await planner.post('/api/v1/sweep-width').send({ trackSpacingM: 100 });
    expect(missing.status).toBe(400);
    expect(missing.body.error).toMatchObject({ code: 'invalid_input', fields: { sweepWidthM: expect.any(String) } });

    const shape = await planner.post('/api/v1/sweep-width').send({ sweepWidthM: -1, trackSpacingM: 'wide' });
    expect(shape.status).toBe(400);
    expect(Object.keys(shape.body.error.fields).sort()).toEqual(['sweepWidthM', 'trackSpacingM']);

    const unordered = await planner.post('/api/v1/sweep-width').send({
      lateralRangeCurve: [
        { rangeM: 0, pod: 1 },
        { rangeM: 300, pod: 0.5 },
        { rangeM: 200, pod: 0 },
      ],
      trackSpacingM: 500,
    });
    expect(unordered.status).toBe(422);
    expect(unordered.body.error).toMatchObject({
      code: 'sweep_input',
      fields: { 'lateralRangeCurve.2.rangeM': expect.any(String) },
    });

    const tooFine = await planner.post('/api/v1/sweep-width').send({
      lateralRangeCurve: [
        { rangeM: 0, pod: 1 },
        { rangeM: 10_000, pod: 0 },
      ],
      trackSpacingM: 1,
    });
    expect(tooFine.status).toBe(422);
    expect(tooFine.body.error.fields.trackSpacingM).toMatch(/at most 2000/);
  });

  it('needs a session', async () => {
    await request(app).post('/api/v1/sweep-width').send({ sweepWidthM: 1, trackSpacingM: 1 }).expect(401);
  });
});

describe('sweep-width tables', () => {
  it('every organisation starts with the example table, clearly marked, and sees only its own', async () => {
    const mine = SweepWidthTableListSchema.parse(
      (await (await signedInAgent(app, DEMO.observer)).get('/api/v1/sweep-width-tables').expect(200)).body,
    );
    const theirs = SweepWidthTableListSchema.parse(
      (await (await signedInAgent(app, DEMO.otherPlanner)).get('/api/v1/sweep-width-tables').expect(200)).body,
    );
    for (const list of [mine, theirs]) {
      const example = list.items.find((t) => t.isExample);
      expect(example).toMatchObject({ name: EXAMPLE_SWEEP_WIDTH_TABLE.name, isExample: true });
      expect(example!.name).toMatch(/Example/);
      expect(example!.sourceName).toMatch(/not from any publication/);
    }
    const ids = new Set(theirs.items.map((t) => t.id));
    expect(mine.items.filter((t) => ids.has(t.id))).toEqual([]);
  });

  it('a planner creates, edits (with versions) and retires a table; others get 403 or 404', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const created = await planner.post('/api/v1/sweep-width-tables').send(table).expect(201);
    const id = created.body.table.id;
    expect(created.body.table).toMatchObject({ ...table, isExample: false, retiredAt: null, version: 0 });

    await (await signedInAgent(app, DEMO.reviewer)).post('/api/v1/sweep-width-tables').send(table).expect(403);
    const other = await signedInAgent(app, DEMO.otherPlanner);
    await other.patch(`/api/v1/sweep-width-tables/${id}`).send({ name: 'Mine now', version: 0 }).expect(404);
    await other.post(`/api/v1/sweep-width-tables/${id}/retire`).send({ version: 0 }).expect(404);

    const edited = await planner
      .patch(`/api/v1/sweep-width-tables/${id}`)
      .send({ edition: 'Trial edition 3', version: 0 })
      .expect(200);
    expect(edited.body.table).toMatchObject({ edition: 'Trial edition 3', name: 'Test table', version: 1 });
    expect((await planner.patch(`/api/v1/sweep-width-tables/${id}`).send({ name: 'x', version: 0 })).body.error.code).toBe(
      'stale_version',
    );

    const retired = await planner.post(`/api/v1/sweep-width-tables/${id}/retire`).send({ version: 1 }).expect(200);
    expect(retired.body.table.retiredAt).not.toBeNull();
    const shown = (await planner.get('/api/v1/sweep-width-tables').expect(200)).body.items.map((t: { id: string }) => t.id);
    expect(shown).not.toContain(id);
    const all = (await planner.get('/api/v1/sweep-width-tables?includeRetired=true').expect(200)).body.items;
    expect(all.map((t: { id: string }) => t.id)).toContain(id);
    const again = await planner.patch(`/api/v1/sweep-width-tables/${id}`).send({ name: 'Back', version: 2 });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('table_retired');
    expect(await AuditEventModel.count({ where: { entityId: id } })).toBe(3);
  });

  it('requires the edition and the source, names bad rows, and writes nothing', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const before = await SweepWidthTableModel.count();
    const bad = await planner.post('/api/v1/sweep-width-tables').send({
      name: 'No source',
      edition: ' ',
      rows: [{ searchObject: '', visibilityM: 0, heightM: -1, sweepWidthM: 'wide' }],
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(
      expect.arrayContaining([
        'edition',
        'sourceName',
        'rows.0.searchObject',
        'rows.0.visibilityM',
        'rows.0.heightM',
        'rows.0.sweepWidthM',
      ]),
    );
    expect(await SweepWidthTableModel.count()).toBe(before);
    const unknown = await planner.patch('/api/v1/sweep-width-tables/00000000-0000-4000-8000-000000000000').send({ version: 0 });
    expect(unknown.status).toBe(404);
  });
});
