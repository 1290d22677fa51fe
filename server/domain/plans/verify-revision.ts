import type { PlanSnapshot } from '@/shared/schemas/plan';
import { AppError } from '@/server/domain/app-error';
import { contentHash } from './build-snapshot';

/**
 * Re-computes a frozen revision's content hash each time it is read (for review,
 * for printing, for the field briefing) and refuses, loudly, one whose content no
 * longer matches: somebody changed it behind the database's guards. Returns the
 * revision unchanged when it matches.
 */
export function verifiedRevision<R extends { number: number; contentHash: string; snapshot?: PlanSnapshot }>(
  planId: string,
  revision: R,
): R {
  if (!revision.snapshot) return revision;
  const actual = contentHash(revision.snapshot);
  if (actual === revision.contentHash) return revision;
  console.error(
    `[kenning] INTEGRITY: plan ${planId} revision ${revision.number} was changed after it was frozen ` +
      `(recorded sha256 ${revision.contentHash}, content now ${actual}). It is withheld until an administrator looks into it.`,
  );
  throw new AppError(
    500,
    'revision_tampered',
    `Revision ${revision.number} of this plan no longer matches the content frozen when it was submitted: it has been changed since. It is withheld; tell your administrator.`,
  );
}
