import { z } from 'zod';
import { PLAN_STATUSES } from './plan';

/** A revision's content hash as printed: 64 hexadecimal digits (sha256), any case, spaces and line breaks ignored. */
export const ContentHashSchema = z
  .string({ error: 'Type or paste the 64-character content hash from the printout.' })
  .transform((s) => s.replace(/\s+/g, '').toLowerCase())
  .pipe(
    z
      .string()
      .regex(/^[0-9a-f]*$/, 'A content hash has only the digits 0–9 and the letters a–f.')
      .length(64, 'A content hash is 64 characters long.'),
  );

/**
 * Where a revision stands today:
 * - `approved-current` — approved, and still the plan's approved revision;
 * - `superseded` — approved once, replaced since by an approved newer version;
 * - `under-review` — submitted, not decided yet;
 * - `returned` — sent back to the planner (never approved);
 * - `replaced` — a later revision of the same plan took its place before any approval.
 */
export const REVISION_STANDINGS = ['approved-current', 'superseded', 'under-review', 'returned', 'replaced'] as const;
export type RevisionStanding = (typeof REVISION_STANDINGS)[number];

const Person = z.object({ id: z.uuid(), name: z.string(), role: z.string() });

/** Body of GET /revisions/by-hash/:sha256. */
export const RevisionByHashSchema = z.object({
  contentHash: z.string(),
  /** The content was hashed again on this request and matched the recorded hash. */
  verified: z.literal(true),
  plan: z.object({
    id: z.uuid(),
    title: z.string(),
    version: z.number().int(),
    status: z.enum(PLAN_STATUSES),
    siteId: z.uuid(),
    siteName: z.string(),
  }),
  revision: z.object({ number: z.number().int(), submittedAt: z.string(), submittedBy: Person }),
  standing: z.enum(REVISION_STANDINGS),
  /** Whether this is the approved revision people should be working from now. */
  isCurrentApproved: z.boolean(),
  /** The approval of this revision, when it was approved. */
  approval: z.object({ at: z.string(), by: Person }).nullable(),
  /** The approved revision that replaces this one (a newer version, or the plan's approved revision), when there is one. */
  currentApproved: z
    .object({
      planId: z.uuid(),
      title: z.string(),
      version: z.number().int(),
      revision: z.number().int(),
      contentHash: z.string(),
      approvedAt: z.string(),
    })
    .nullable(),
  /** What this means, for people. */
  summary: z.string(),
});
export type RevisionByHash = z.infer<typeof RevisionByHashSchema>;
