import { randomBytes } from 'node:crypto';
import { Client } from 'pg';
import type { Sequelize } from 'sequelize';
import { APPLICATION_ROLE } from '@/server/data/application-role';
import type { ViewshedPool } from '@/server/workers/viewshed-pool';
import { appWithInlineCoverage, createTestDatabase } from '@/tests/support/test-db';
import { DEMO } from '@/tests/support/agents';
import { createForestPlan, listen } from '@/tests/support/live-server';

// The application connects as a member of kenning_application, not as the owner:
// the approved record cannot be rewritten behind the revision trigger's back.
// Source for the refusals: PostgreSQL documentation — TRUNCATE needs the TRUNCATE
// privilege; ALTER TABLE … DISABLE TRIGGER needs ownership; session_replication_role
// is a superuser setting ("Only superusers … can change this setting").

const login = `kenning_app_test_${randomBytes(4).toString('hex')}`;
const password = randomBytes(18).toString('base64url');
const adminUrl = process.env.KENNING_ADMIN_DATABASE_URL ?? '';

let db: Sequelize;
let url: string;
let drop: () => Promise<void>;
let asApp: Client;
let live: Awaited<ReturnType<typeof listen>>;
let pool: ViewshedPool;

const admin = async <T>(fn: (c: Client) => Promise<T>) => {
  const c = new Client({ connectionString: adminUrl });
  await c.connect();
  try {
    return await fn(c);
  } finally {
    await c.end();
  }
};

beforeAll(async () => {
  await admin((c) => c.query(`CREATE ROLE ${login} LOGIN PASSWORD '${password}' IN ROLE ${APPLICATION_ROLE}`));
  ({ db, url, drop } = await createTestDatabase({
    connectThrough: (u) => {
      u.username = login;
      u.password = password;
      return u;
    },
  }));
  const appUrl = new URL(url);
  appUrl.username = login;
  appUrl.password = password;
  asApp = new Client({ connectionString: appUrl.toString() });
  await asApp.connect();
  // Coverage computed in this process, as this role: run rows, progress and layers.
  const inline = appWithInlineCoverage(db);
  pool = inline.pool;
  live = await listen(inline.app);
});
afterAll(async () => {
  await live.close();
  await pool.close();
  await asApp.end();
  await drop();
  await admin((c) => c.query(`DROP ROLE IF EXISTS ${login}`));
});

/** The SQLSTATE a statement fails with as the application, or 'ok'. */
const attempt = async (sql: string) => {
  await asApp.query('BEGIN');
  try {
    await asApp.query(sql);
    return 'ok';
  } catch (e) {
    return (e as { code?: string }).code ?? 'error';
  } finally {
    await asApp.query('ROLLBACK');
  }
};

describe('the application role', () => {
  it('is neither a superuser nor the owner of the tables', async () => {
    const { rows } = await asApp.query(
      "SELECT rolsuper, (SELECT tableowner FROM pg_tables WHERE tablename = 'plans') AS owner FROM pg_roles WHERE rolname = current_user",
    );
    expect(rows[0].rolsuper).toBe(false);
    expect(rows[0].owner).not.toBe(login);
  });

  // 42501 = insufficient_privilege.
  it.each([
    ['TRUNCATE audit_events', 'TRUNCATE audit_events'],
    ['TRUNCATE plans', 'TRUNCATE plans CASCADE'],
    ['disabling the revision trigger', 'ALTER TABLE plan_revisions DISABLE TRIGGER ALL'],
    ['replica mode (skips triggers)', 'SET session_replication_role = replica'],
    ['rewriting an audit event', "UPDATE audit_events SET action = 'x'"],
    ['deleting audit events', 'DELETE FROM audit_events'],
    ['rewriting a review decision', "UPDATE plan_reviews SET decision = 'approve'"],
    ['deleting a revision', 'DELETE FROM plan_revisions'],
    ['rewriting a frozen run layer', "UPDATE coverage_layers SET layer = 'x'"],
    ['changing the migration record', 'DELETE FROM schema_migrations'],
  ])('is refused %s', async (_what, sql) => {
    expect(await attempt(sql)).toBe('42501');
  });

  it('cannot change or remove a coverage run that has ended', async () => {
    const { rows } = await asApp.query("SELECT count(*)::int AS n FROM coverage_runs WHERE status = 'done'");
    expect(rows[0].n).toBeGreaterThan(0); // the demo's computed runs
    // P0001 = raise_exception, from the coverage_runs_finished_frozen trigger (migration 0019).
    expect(await attempt("UPDATE coverage_runs SET status = 'queued' WHERE status = 'done'")).toBe('P0001');
    expect(await attempt("UPDATE coverage_runs SET cases = '[]' WHERE status = 'done'")).toBe('P0001');
    expect(await attempt("DELETE FROM coverage_runs WHERE status = 'done'")).not.toBe('ok');
  });

  it('may read, add audit events and edit ordinary rows', async () => {
    expect(await attempt('SELECT count(*) FROM plans')).toBe('ok');
    expect(await attempt("UPDATE plans SET title = title WHERE status = 'draft'")).toBe('ok');
    expect(
      await attempt(
        "INSERT INTO audit_events (organization_id, actor_id, action, entity_type, entity_id, summary, created_at) SELECT organization_id, actor_id, 'x', 'y', entity_id, '{}', now() FROM audit_events LIMIT 1",
      ),
    ).toBe('ok');
  });
});

it('runs the everyday API as that role: sign-in, plans, coverage, watches, invitations, sign-out', async () => {
  const planner = await live.signIn(DEMO.planner);
  const plan = await createForestPlan(live, planner, 'As the app role');
  expect(plan.status).toBe(201);
  const edited = await live.call('PATCH', `/api/v1/plans/${plan.body.plan.id}`, {
    cookie: planner,
    json: { title: 'As the app role, edited', rowVersion: 0 },
  });
  expect(edited.status).toBe(200);
  const coverage = await live.call('POST', `/api/v1/plans/${plan.body.plan.id}/coverage`, { cookie: planner, json: {} });
  expect(coverage.status).toBe(202);
  const run = (await live.call('GET', `/api/v1/coverage-runs/${coverage.body.run.id}`, { cookie: planner })).body.run;
  expect(run.status).toBe('done');
  const target = await live.call('POST', '/api/v1/targets', {
    cookie: planner,
    json: { name: 'Role check', kind: 'vehicle', heightM: 3, widthM: 2 },
  });
  expect(target.status).toBe(201);
  const people = (await live.call('GET', '/api/v1/people', { cookie: planner })).body.items;
  const watch = await live.call('POST', '/api/v1/assignments', {
    cookie: planner,
    json: {
      postId: plan.body.plan.postIds[0],
      userId: people[0].id,
      startsAt: '2032-01-01T06:00:00Z',
      endsAt: '2032-01-01T10:00:00Z',
    },
  });
  expect(watch.status).toBe(201);

  const admin = await live.signIn(DEMO.admin);
  const invite = await live.call('POST', '/api/v1/users', {
    cookie: admin,
    json: { email: 'role.check@demo.kenning.test', name: 'Role Check', role: 'observer' },
  });
  expect(invite.status).toBe(201);
  expect((await live.call('POST', '/api/auth/sign-out', { cookie: planner })).status).toBe(204);
  expect((await live.call('GET', '/api/me', { cookie: planner })).status).toBe(401);
});
