import { DEMO } from '@/tests/support/agents';
import { listenTestApp, type Live } from '@/tests/support/live-server';

// A burst of writes to one plan must not hold the connection pool: every read of a
// write runs inside its transaction, and a request that cannot get a connection
// within the pool's acquire timeout is answered 503 `busy`.

let live: Live;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ live, close } = await listenTestApp());
});
afterAll(() => close());

describe('50 concurrent writes to one plan', () => {
  it('leave connections for an unrelated read of another organisation, and give every write a definite answer', async () => {
    const planner = await live.signIn(DEMO.planner);
    const other = await live.signIn(DEMO.otherPlanner);

    const sites = (await live.call('GET', '/api/v1/sites', { cookie: planner })).body.items;
    const site = sites.find((s: { name: string }) => s.name === 'Harrowmere Forest District');
    const posts = (await live.call('GET', `/api/v1/sites/${site.id}/posts`, { cookie: planner })).body.items;
    const targets = (await live.call('GET', '/api/v1/targets', { cookie: planner })).body.items;
    const sets = (await live.call('GET', '/api/v1/conditions', { cookie: planner })).body.items;
    const created = await live.call('POST', '/api/v1/plans', {
      cookie: planner,
      json: {
        siteId: site.id,
        title: 'Burst target',
        postIds: posts.slice(0, 3).map((p: { id: string }) => p.id),
        targetIds: targets.slice(0, 2).map((t: { id: string }) => t.id),
        conditionSetIds: sets.slice(0, 2).map((s: { id: string }) => s.id),
      },
    });
    expect(created.status).toBe(201);
    const planId = created.body.plan.id as string;

    // Half edits, half submissions, all with the version first seen: at most one edit can win.
    const burst = Array.from({ length: 50 }, (_, i) =>
      i % 2 === 0
        ? live.call('PATCH', `/api/v1/plans/${planId}`, { cookie: planner, json: { title: `Burst ${i}`, rowVersion: 0 } })
        : live.call('POST', `/api/v1/plans/${planId}/submit`, { cookie: planner, json: { rowVersion: 0 } }),
    );
    // The unrelated reads start while the burst is in flight.
    await new Promise((r) => setTimeout(r, 30));
    const during = await Promise.all(
      Array.from({ length: 3 }, (_, i) =>
        new Promise((r) => setTimeout(r, i * 100)).then(() => live.call('GET', '/api/v1/sites', { cookie: other })),
      ),
    );
    const writes = await Promise.all(burst);

    // Served, not refused as busy: the burst did not take every connection. How long they waited is a
    // benchmark figure on a shared machine, not something a test can assert.
    for (const r of during) expect(r.status).toBe(200);

    // Every write got a definite answer: done, refused as stale / not ready, or told to retry.
    const statuses = writes.map((r) => r.status);
    for (const s of statuses) expect([200, 409, 503]).toContain(s);
    const won = statuses.filter((s) => s === 200).length;
    // At most one edit can win with the version first seen (the plan row is locked without waiting, so under
    // load every one of them may find it held and be told it is busy: then none won).
    expect(won).toBeLessThanOrEqual(1);
    const after = await live.call('GET', `/api/v1/plans/${planId}`, { cookie: planner });
    expect(after.body.plan.rowVersion).toBe(won);
    // Nothing is left locked: the next edit with the version now seen goes through.
    const next = await live.call('PATCH', `/api/v1/plans/${planId}`, {
      cookie: planner,
      json: { title: 'After the burst', rowVersion: after.body.plan.rowVersion },
    });
    expect(next.status).toBe(200);
    expect(next.body.plan.rowVersion).toBe(won + 1);
  }, 60_000);
});
