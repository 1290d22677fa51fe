import type { Migration } from '../migrator';

/**
 * Verifying a printout looks a revision up by its content hash
 * (`GET /revisions/by-hash/:sha256`): an index on the hash. (Creating an
 * index is not an UPDATE of rows: the revisions' trigger lets it through.)
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addIndex('plan_revisions', ['content_hash'], { name: 'plan_revisions_content_hash' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeIndex('plan_revisions', 'plan_revisions_content_hash');
};
