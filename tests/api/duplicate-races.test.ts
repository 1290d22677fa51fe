import { createApp } from '@/server/app';
import type { CoverageQueue } from '@/server/queue/coverage-queue';
import { createTestApp, TEST_CONFIG } from '@/tests/support/test-db';
import { DEMO } from '@/tests/support/agents';
import { createForestPlan, listen } from '@/tests/support/live-server';

// Identical requests sent at the same instant: the database refuses the duplicates
// a check-then-insert lets through, and the API answers 409 (or the existing
// record), never 500 and never a second copy.

let ctx: Awaited<ReturnType<typeof createTestApp>>;
let live: Awaited<ReturnType<typeof listen>>;
const enqueued: string[] = [];

beforeAll(async () => {
  ctx = await createTestApp();
  // A queue that only records: these tests are about the run rows, not the computation.
  const queue: CoverageQueue = {
    enqueue: async (runId) => {
      enqueued.push(runId);
      return `job-${runId}`;
    },
    cancel: async () => {},
  };
  live = await listen(createApp({ db: ctx.db, config: TEST_CONFIG, files: ctx.files, coverageQueue: queue }));
});
afterAll(async () => {
  await live.close();
  await ctx.close();
});

const together = <T>(n: number, send: (i: number) => Promise<T>) => Promise.all(Array.from({ length: n }, (_, i) => send(i)));

it('30 identical watch requests create one watch; the rest are 409 assignment_overlap', async () => {
  const planner = await live.signIn(DEMO.planner);
  const people = (await live.call('GET', '/api/v1/people', { cookie: planner })).body.items;
  const person = people.find((p: { email?: string; role?: string }) => p.role === 'observer') ?? people[0];
  const sites = (await live.call('GET', '/api/v1/sites', { cookie: planner })).body.items;
  const posts = (await live.call('GET', `/api/v1/sites/${sites[0].id}/posts`, { cookie: planner })).body.items;
  const watch = { postId: posts[0].id, userId: person.id, startsAt: '2031-06-01T06:00:00Z', endsAt: '2031-06-01T18:00:00Z' };

  const answers = await together(30, () => live.call('POST', '/api/v1/assignments', { cookie: planner, json: watch }));
  const statuses = answers.map((a) => a.status);
  expect(statuses.filter((s) => s === 201)).toHaveLength(1);
  expect(statuses.filter((s) => s === 409)).toHaveLength(29);
  for (const a of answers.filter((x) => x.status === 409)) expect(a.body.error.code).toBe('assignment_overlap');

  const listed = await live.call(
    'GET',
    `/api/v1/assignments?userId=${person.id}&from=2031-06-01T00:00:00Z&to=2031-06-02T00:00:00Z`,
    { cookie: planner },
  );
  expect(listed.body.items).toHaveLength(1);

  // A watch that only touches the first one (hand-over at 18:00) is still allowed: ranges are half-open.
  const next = await live.call('POST', '/api/v1/assignments', {
    cookie: planner,
    json: { ...watch, startsAt: '2031-06-01T18:00:00Z', endsAt: '2031-06-02T06:00:00Z' },
  });
  expect(next.status).toBe(201);
});

it('10 identical coverage requests give one run, returned to every caller', async () => {
  const planner = await live.signIn(DEMO.planner);
  const plan = await createForestPlan(live, planner, 'Race for one run');
  expect(plan.status).toBe(201);
  const planId = plan.body.plan.id;

  const answers = await together(10, () => live.call('POST', `/api/v1/plans/${planId}/coverage`, { cookie: planner, json: {} }));
  for (const a of answers) expect([200, 202]).toContain(a.status);
  const ids = new Set(answers.map((a) => a.body.run.id));
  expect(ids.size).toBe(1);
  expect(enqueued.filter((id) => ids.has(id))).toHaveLength(1);
});

it('20 invitations of one e-mail create one account; the rest are 409 email_taken', async () => {
  const admin = await live.signIn(DEMO.admin);
  const answers = await together(20, () =>
    live.call('POST', '/api/v1/users', {
      cookie: admin,
      json: { email: 'twenty.times@demo.kenning.test', name: 'Twenty Times', role: 'observer' },
    }),
  );
  const statuses = answers.map((a) => a.status);
  expect(statuses.filter((s) => s === 201)).toHaveLength(1);
  expect(statuses.filter((s) => s === 409)).toHaveLength(19);
  for (const a of answers.filter((x) => x.status === 409)) {
    expect(a.body.error).toMatchObject({ code: 'email_taken', fields: { email: expect.any(String) } });
  }
});
