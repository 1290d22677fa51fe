import type { Sequelize } from 'sequelize';

/**
 * Changes the title in revision 1 of a plan to "A quietly different plan"
 * behind the app's back (its frozen-revision trigger switched off for the
 * update), as someone with database access could: the stored hash no longer
 * matches the snapshot.
 */
export async function retitleFirstRevision(db: Sequelize, planId: string): Promise<void> {
  await db.query(`
    ALTER TABLE plan_revisions DISABLE TRIGGER plan_revisions_frozen;
    UPDATE plan_revisions SET snapshot = jsonb_set(snapshot, '{title}', '"A quietly different plan"')
      WHERE plan_id = '${planId}' AND number = 1;
    ALTER TABLE plan_revisions ENABLE TRIGGER plan_revisions_frozen;`);
}
