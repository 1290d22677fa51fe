import request from 'supertest';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';
import { retitleFirstRevision } from '@/tests/support/tamper-revision';

// A frozen revision is re-verified against its recorded sha256 each time it is
// read; one changed behind the trigger's back (here by the owner, who may disable
// it — the application's own role may not) is withheld with a loud error.

let ctx: Awaited<ReturnType<typeof createTestApp>>;
let reviewer: request.Agent;

beforeAll(async () => {
  ctx = await createTestApp();
  reviewer = await signedInAgent(ctx.app, DEMO.reviewer);
});
afterAll(() => ctx.close());

it('serves a revision whose content matches its hash, and withholds it once changed', async () => {
  const plans = (await reviewer.get('/api/v1/plans?status=approved')).body.items;
  const planId = plans[0].id as string;
  const first = await reviewer.get(`/api/v1/plans/${planId}/revisions/1`);
  // Stored as JSONB and read back, the snapshot still hashes to what was recorded.
  expect(first.status).toBe(200);

  await retitleFirstRevision(ctx.db, planId);

  const errors = jest.spyOn(console, 'error').mockImplementation(() => {});
  try {
    const tampered = await reviewer.get(`/api/v1/plans/${planId}/revisions/1`);
    expect(tampered.status).toBe(500);
    expect(tampered.body.error.code).toBe('revision_tampered');
    expect(JSON.stringify(tampered.body)).not.toContain('A quietly different plan');
    expect(errors.mock.calls.some((c) => String(c[0]).includes('INTEGRITY'))).toBe(true);
  } finally {
    errors.mockRestore();
  }
});
