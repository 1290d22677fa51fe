import type { Plan } from '@/shared/schemas/plan';
import type { RevisionByHash, RevisionStanding } from '@/shared/schemas/printout';
import { plansRepository } from '@/server/data/repositories/plans-repository';
import { revisionLookupRepository } from '@/server/data/repositories/revision-lookup-repository';
import { AppError } from '@/server/domain/app-error';
import type { Actor } from '../actor';
import { verifiedRevision } from '../plans/verify-revision';

type Review = Awaited<ReturnType<typeof plansRepository.reviews>>[number];

const approvalOf = (reviews: Review[], revision: number) =>
  reviews.find((r) => r.revision === revision && r.decision === 'approve') ?? null;

/** The approved revision of an approved plan: the one its latest approval names. */
async function approvedRevisionOf(plan: Plan) {
  const reviews = await plansRepository.reviews(plan.id);
  const approval = reviews.filter((r) => r.decision === 'approve').at(-1);
  if (!approval) return null;
  const revision = (await plansRepository.revisions(plan.id, false)).find((r) => r.number === approval.revision);
  if (!revision) return null;
  return {
    planId: plan.id,
    title: plan.title,
    version: plan.version,
    revision: revision.number,
    contentHash: revision.contentHash,
    approvedAt: approval.at,
  };
}

/**
 * The approved plan people should work from instead of `plan`: the approved
 * version among all versions of the plan — back through the versions it
 * replaces to the first, then forward through every newer version (breadth
 * first). Null when none is approved.
 */
async function currentApprovedOf(actor: Actor, plan: Plan) {
  if (plan.status === 'approved') return approvedRevisionOf(plan);
  let first = plan;
  const walked = new Set([plan.id]);
  while (first.previousId && !walked.has(first.previousId)) {
    walked.add(first.previousId);
    const previous = await plansRepository.find(actor.organizationId, first.previousId);
    if (!previous) break;
    first = previous;
  }
  if (first.status === 'approved') return approvedRevisionOf(first);
  const queue = [first.id];
  const seen = new Set(queue);
  while (queue.length > 0) {
    for (const next of await revisionLookupRepository.successors(actor.organizationId, queue.shift()!)) {
      if (seen.has(next.id)) continue;
      seen.add(next.id);
      if (next.status === 'approved') {
        const found = await plansRepository.find(actor.organizationId, next.id);
        return found ? approvedRevisionOf(found) : null;
      }
      queue.push(next.id);
    }
  }
  return null;
}

const SUMMARIES: Record<RevisionStanding, string> = {
  'approved-current': 'This is the approved revision of the plan, and it still is: work from it.',
  superseded:
    'This revision was approved, but a newer version of the plan has been approved since. Do not work from this printout.',
  'under-review': 'This revision has been submitted and is waiting for review: it is not approved yet.',
  returned: 'This revision was returned to the planner and never approved.',
  replaced: 'A later revision of the plan took the place of this one; this one was never approved.',
};

/** One revision described for the verify screen, or null when the caller may not see it. */
async function describe(actor: Actor, planId: string, number: number, contentHash: string): Promise<RevisionByHash | null> {
  const plan = await plansRepository.find(actor.organizationId, planId);
  if (!plan) return null;
  const revisions = await plansRepository.revisions(planId, true);
  const found = revisions.find((r) => r.number === number);
  if (!found) return null;
  const reviews = await plansRepository.reviews(planId);
  const approval = approvalOf(reviews, number);
  // Observers see plans once approved: a revision that never was stays hidden from them.
  if (actor.role === 'observer' && !approval) return null;
  // Hashed again now: a revision changed behind the database's guards is refused (500 revision_tampered).
  verifiedRevision(planId, found);
  const latest = Math.max(...revisions.map((r) => r.number));
  const standing: RevisionStanding = approval
    ? plan.status === 'approved'
      ? 'approved-current'
      : 'superseded'
    : number < latest
      ? 'replaced'
      : reviews.some((r) => r.revision === number && r.decision === 'return')
        ? 'returned'
        : 'under-review';
  const currentApproved = await currentApprovedOf(actor, plan);
  return {
    contentHash,
    verified: true,
    plan: {
      id: plan.id,
      title: plan.title,
      version: plan.version,
      status: plan.status,
      siteId: plan.siteId,
      siteName: plan.siteName,
    },
    revision: { number, submittedAt: found.submittedAt, submittedBy: found.submittedBy },
    standing,
    isCurrentApproved: standing === 'approved-current',
    approval: approval && { at: approval.at, by: approval.reviewer },
    currentApproved,
    summary: SUMMARIES[standing],
  };
}

/**
 * Verifies a printout by the content hash it carries: which of the
 * organisation's plan revisions has that content (hashed again now), and
 * whether it is still the approved one. Identical content frozen twice (a
 * revision re-submitted unchanged) answers the revision that is approved
 * now, else the newest. Another organisation's hash, or one an observer may
 * not see (never approved), is a 404.
 *
 * @param sha256 64 lower-case hex digits (the route normalises what was typed)
 */
export async function revisionByHash(actor: Actor, sha256: string): Promise<RevisionByHash> {
  const matches = await revisionLookupRepository.byContentHash(actor.organizationId, sha256);
  const described: RevisionByHash[] = [];
  for (const m of matches) {
    const d = await describe(actor, m.planId, m.number, sha256);
    if (d) described.push(d);
  }
  const best = described.find((d) => d.isCurrentApproved) ?? described[0];
  if (!best) {
    throw new AppError(
      404,
      'unknown_hash',
      'No plan revision of your organisation has this content hash. Check the characters against the printout; a printout from another organisation cannot be checked here.',
    );
  }
  return best;
}
