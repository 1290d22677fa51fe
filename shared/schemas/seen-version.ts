import { z } from 'zod';

/** The largest value of a PostgreSQL `integer` column (the `version` / `row_version` columns). */
export const INT_COLUMN_MAX = 2_147_483_647;

/**
 * The version of a record the client last saw, sent back with a write for the
 * optimistic-concurrency check. Bounded to the column's range so an absurd value
 * is a field error, not a database error.
 */
export const SeenVersionSchema = z
  .number({ error: 'Send the version you last saw.' })
  .int('A version is a whole number.')
  .min(0, 'A version is 0 or more.')
  // A write stores version + 1, so the last value a write can carry is one below the column's top.
  .max(INT_COLUMN_MAX - 1, 'No record has a version that high. Reload and try again.');
