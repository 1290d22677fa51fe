import type request from 'supertest';
import { INT_COLUMN_MAX } from '@/shared/schemas/seen-version';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

// Hostile or broken request bodies get a 4xx naming what is wrong, never a 500.

let ctx: Awaited<ReturnType<typeof createTestApp>>;
let planner: request.Agent;
let planId: string;
let targetId: string;

beforeAll(async () => {
  ctx = await createTestApp();
  planner = await signedInAgent(ctx.app, DEMO.planner);
  const plans = (await planner.get('/api/v1/plans?status=draft')).body.items;
  planId = plans[0].id;
  targetId = (await planner.get('/api/v1/targets')).body.items[0].id;
});
afterAll(() => ctx.close());

describe('versions outside the integer column', () => {
  // Source: PostgreSQL documentation, 8.1.1 Integer Types — integer is -2147483648 to +2147483647.
  it.each([2 ** 31, 2 ** 31 - 1, 2 ** 53, -1, 1.5])('a plan edit with rowVersion %p is a field error', async (rowVersion) => {
    const res = await planner.patch(`/api/v1/plans/${planId}`).send({ title: 'x', rowVersion });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('rowVersion');
  });

  it('a submission and a library edit with version 2^31 are field errors', async () => {
    const submit = await planner.post(`/api/v1/plans/${planId}/submit`).send({ rowVersion: 2 ** 31 });
    expect(submit.status).toBe(400);
    expect(submit.body.error.fields).toHaveProperty('rowVersion');
    const target = await planner.patch(`/api/v1/targets/${targetId}`).send({ name: 'x', version: 2 ** 31 });
    expect(target.status).toBe(400);
    expect(target.body.error.fields).toHaveProperty('version');
  });

  it('the largest version a write can carry is accepted as input and only fails the version check', async () => {
    const res = await planner.patch(`/api/v1/plans/${planId}`).send({ title: 'x', rowVersion: INT_COLUMN_MAX - 1 });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('stale_version');
  });

  it('a revision number beyond the column is a 400, not a failure', async () => {
    const res = await planner.get(`/api/v1/plans/${planId}/revisions/${2 ** 31}`);
    expect(res.status).toBe(400);
  });
});

describe('bodies the parser cannot read', () => {
  const patch = () => planner.patch(`/api/v1/plans/${planId}`);

  it('an unsupported charset is 415 unsupported_charset', async () => {
    const res = await patch().set('Content-Type', 'application/json; charset=koi8-r').send('{"title":"x","rowVersion":0}');
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unsupported_charset');
  });

  it('an unsupported content encoding is 415 unsupported_encoding', async () => {
    const res = await patch()
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'x-snappy')
      .send('{"title":"x","rowVersion":0}');
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unsupported_encoding');
  });

  it('a gzip body that is not gzip is a 4xx', async () => {
    const res = await patch()
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'gzip')
      .send('{"title":"x","rowVersion":0}');
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
  });

  it('broken JSON is 400 malformed_json', async () => {
    const res = await patch().set('Content-Type', 'application/json').send('{"title": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_json');
  });
});
