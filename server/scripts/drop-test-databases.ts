/** Drops every database a test run created (names containing the run id). */
import { Client } from 'pg';

async function main() {
  const runId = process.argv[2];
  const adminUrl = process.env.KENNING_ADMIN_DATABASE_URL;
  if (!runId || !/^[a-z0-9_]+$/.test(runId) || !adminUrl) throw new Error('usage: drop-test-databases RUN_ID');
  const admin = new Client({ connectionString: adminUrl });
  await admin.connect();
  try {
    const { rows } = await admin.query<{ datname: string }>(
      "SELECT datname FROM pg_database WHERE datname LIKE 'kenning\\_%' AND position($1 in datname) > 0",
      [runId],
    );
    for (const { datname } of rows) await admin.query(`DROP DATABASE IF EXISTS "${datname}" WITH (FORCE)`);
  } finally {
    await admin.end();
  }
}

main().catch((err: unknown) => {
  console.error('[kenning] dropping test databases failed:', err);
  process.exit(1);
});
