import { DEMO } from '@/tests/support/agents';
import { listenTestApp, type Live } from '@/tests/support/live-server';

// Sessions end on the server: a copy of a cookie stops working when its session
// is signed out, and every session of a person ends when they sign out
// everywhere or an administrator changes their role or deactivates them.

let ctx: Awaited<ReturnType<typeof listenTestApp>>['ctx'];
let live: Live;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ ctx, live, close } = await listenTestApp());
});
afterAll(() => close());

const me = async (cookie: string) => (await live.call('GET', '/api/me', { cookie })).status;

it('refuses a copied cookie after its session signed out, and keeps the person’s other sessions', async () => {
  const cookie = await live.signIn(DEMO.planner);
  const copy = cookie; // what an attacker lifted from the browser
  const phone = await live.signIn(DEMO.planner);
  expect(await me(copy)).toBe(200);

  expect((await live.call('POST', '/api/auth/sign-out', { cookie })).status).toBe(204);
  expect(await me(copy)).toBe(401);
  expect((await live.call('GET', '/api/v1/sites', { cookie: copy })).status).toBe(401);
  // Signing out here does not sign the phone out.
  expect(await me(phone)).toBe(200);
});

it('signs out everywhere: every earlier cookie of the person is refused, a new sign-in works', async () => {
  const laptop = await live.signIn(DEMO.reviewer);
  const phone = await live.signIn(DEMO.reviewer);
  expect((await live.call('POST', '/api/auth/sign-out-everywhere', { cookie: laptop })).status).toBe(204);
  expect(await me(laptop)).toBe(401);
  expect(await me(phone)).toBe(401);
  // Someone else's sessions are untouched.
  const other = await live.signIn(DEMO.planner);
  expect(await me(other)).toBe(200);
  const again = await live.signIn(DEMO.reviewer);
  expect(await me(again)).toBe(200);
  // An old cookie cannot be used to sign the person out again.
  expect((await live.call('POST', '/api/auth/sign-out-everywhere', { cookie: phone })).status).toBe(401);
  expect(await me(again)).toBe(200);
});

it('ends the sessions of a person whose role changes, or who is deactivated; reactivation revives no cookie', async () => {
  const admin = await live.signIn(DEMO.admin);
  const people = (await live.call('GET', '/api/v1/users?pageSize=100', { cookie: admin })).body.items;
  const observer = people.find((u: { email: string }) => u.email === DEMO.observer);

  let cookie = await live.signIn(DEMO.observer);
  let version = observer.version as number;
  const change = async (body: object) => {
    const res = await live.call('PATCH', `/api/v1/users/${observer.id}`, { cookie: admin, json: { ...body, version } });
    expect(res.status).toBe(200);
    version = res.body.user.version;
  };

  await change({ role: 'reviewer' });
  expect(await me(cookie)).toBe(401);
  cookie = await live.signIn(DEMO.observer);
  expect(await me(cookie)).toBe(200);

  await change({ active: false });
  expect(await me(cookie)).toBe(401);
  await change({ active: true });
  expect(await me(cookie)).toBe(401);
  expect(await me(await live.signIn(DEMO.observer))).toBe(200);

  // A change that leaves role and state as they were ends nothing.
  const kept = await live.signIn(DEMO.observer);
  await change({ role: 'reviewer' });
  expect(await me(kept)).toBe(200);
});

it('ends earlier sessions when a password is set with a link', async () => {
  // Today a link sets the first password of an invited account; a reset link would go the same way.
  const admin = await live.signIn(DEMO.admin);
  const invited = await live.call('POST', '/api/v1/users', {
    cookie: admin,
    json: { email: 'new.password@demo.kenning.test', name: 'New Password', role: 'planner' },
  });
  expect(invited.status).toBe(201);
  const generation = async () =>
    (
      (await ctx.db.query('SELECT session_generation AS g FROM users WHERE email = :email', {
        replacements: { email: 'new.password@demo.kenning.test' },
        plain: true,
      })) as { g: number }
    ).g;
  const before = await generation();
  const token = new URL(invited.body.setPasswordUrl).searchParams.get('token');
  const set = await live.call('POST', '/api/auth/set-password', { json: { token, password: 'a long first password 1' } });
  expect(set.status).toBe(204);
  expect(await generation()).toBe(before + 1);
  const cookie = await live.signIn('new.password@demo.kenning.test', 'a long first password 1');
  expect(await me(cookie)).toBe(200);
});
