import request from 'supertest';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

// Invitations, role changes and deactivations leave audit events; mail links come
// from the configured public address (TEST_CONFIG.PUBLIC_URL), never from the
// request's Host header; a password bcrypt would cut is refused with the limit.

let ctx: Awaited<ReturnType<typeof createTestApp>>;
let admin: request.Agent;

beforeAll(async () => {
  ctx = await createTestApp();
  admin = await signedInAgent(ctx.app, DEMO.admin);
});
afterAll(() => ctx.close());

const auditOf = async (entityId: string) =>
  (await ctx.db.query('SELECT action, summary FROM audit_events WHERE entity_type = :t AND entity_id = :id ORDER BY id', {
    replacements: { t: 'user', id: entityId },
    type: 'SELECT',
  })) as { action: string; summary: { before?: Record<string, unknown>; after?: Record<string, unknown> } }[];

let invitedId: string;
let token: string;

it('builds the set-password link from PUBLIC_URL whatever Host the request names', async () => {
  const res = await admin
    .post('/api/v1/users')
    .set('Host', 'attacker.example')
    .set('X-Forwarded-Host', 'attacker.example')
    .send({ email: 'trail@demo.kenning.test', name: 'Trail Person', role: 'observer' });
  expect(res.status).toBe(201);
  expect(res.body.setPasswordUrl).toMatch(/^https:\/\/kenning\.test\/set-password\?token=/);
  invitedId = res.body.user.id;
  token = new URL(res.body.setPasswordUrl).searchParams.get('token')!;
});

it('records the invitation, a role change and a deactivation as audit events (never the token)', async () => {
  let version = (await admin.get('/api/v1/users?pageSize=100')).body.items.find(
    (u: { id: string }) => u.id === invitedId,
  ).version;
  const role = await admin.patch(`/api/v1/users/${invitedId}`).send({ role: 'planner', version });
  expect(role.status).toBe(200);
  version = role.body.user.version;
  const off = await admin.patch(`/api/v1/users/${invitedId}`).send({ active: false, version });
  expect(off.status).toBe(200);
  const on = await admin.patch(`/api/v1/users/${invitedId}`).send({ active: true, version: off.body.user.version });
  expect(on.status).toBe(200);

  const events = await auditOf(invitedId);
  expect(events.map((e) => e.action)).toEqual(['invite', 'change-role', 'deactivate', 'reactivate']);
  expect(events[0]!.summary.after).toMatchObject({ email: 'trail@demo.kenning.test', role: 'observer' });
  expect(JSON.stringify(events)).not.toContain(token);
  expect(events[1]!.summary).toMatchObject({ before: { role: 'observer' }, after: { role: 'planner' } });
  expect(events[2]!.summary.after).toMatchObject({ status: 'deactivated' });
});

describe('passwords over 72 bytes', () => {
  // Source: OpenBSD bcrypt(3) — "the password argument is a NUL-terminated string of at most 72 characters" (bytes); from memory.
  it.each([
    ['73 ASCII characters', 'a'.repeat(73)],
    ['40 accented letters (80 bytes in UTF-8)', 'é'.repeat(40)],
    ['19 emoji (76 bytes)', '🔥'.repeat(19)],
  ])('refuses %s with a field error that gives the limit', async (_what, password) => {
    const res = await request(ctx.app).post('/api/auth/set-password').send({ token, password });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/72 bytes/);
  });

  it('accepts exactly 72 bytes, and that password signs in', async () => {
    const password = 'Lookout-'.padEnd(72, 'x');
    expect((await request(ctx.app).post('/api/auth/set-password').send({ token, password })).status).toBe(204);
    const signIn = await request(ctx.app).post('/api/auth/sign-in').send({ email: 'trail@demo.kenning.test', password });
    expect(signIn.status).toBe(200);
  });
});
