// Over 300 lines: one plan life cycle (draft, edit, submit, review, new version) whose steps share guards, snapshot and mail.
import type { Transaction } from 'sequelize';
import type { Plan, PlanInput, PlanListQuery, PlanSnapshot, PlanStatus } from '@/shared/schemas/plan';
import { attachmentsRepository } from '@/server/data/repositories/attachments-repository';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { conditionSetsRepository, targetsRepository } from '@/server/data/repositories/library-repository';
import { plansRepository } from '@/server/data/repositories/plans-repository';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import { AppError } from '@/server/domain/app-error';
import type { Mailer } from '@/server/domain/ports/mailer';
import { planSubmitted, reviewDecided } from '@/server/mail/templates';
import type { Actor } from '../actor';
import { coverageForSubmit } from '../coverage/coverage-snapshot';
import { standardVerdict, type StandardVerdict } from '@/shared/plans/standard-verdict';
import { buildSnapshot, contentHash } from './build-snapshot';
import { verifiedRevision } from './verify-revision';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';
import { staleMessage, writeVersioned } from '@/server/domain/audit/versioned-write';
import { isEditablePlanStatus } from '@/shared/plans/editable-plan-statuses';

/** Statuses in which a plan (and its coverage) may still change. */
const STALE = staleMessage('this plan');

export interface PlanDeps extends UseCaseDeps {
  mailer: Mailer | null;
  /** Absolute URL of a plan's page, for e-mails. */
  planUrl: (planId: string) => string;
}

/**
 * Observers see approved plans only; everyone else sees all of their
 * organisation's. The review queue holds the submitted plans someone else prepared.
 */
export function listPlans(actor: Actor, query: PlanListQuery) {
  const { status, queue, ...rest } = query;
  if (queue === 'review') {
    if (actor.role !== 'reviewer') throw AppError.forbidden('Only reviewers have a review queue.');
    return plansRepository.page(actor.organizationId, { ...rest, statuses: ['submitted'], notPreparedBy: actor.userId });
  }
  const statuses = actor.role === 'observer' ? (['approved'] as PlanStatus[]) : status;
  return plansRepository.page(actor.organizationId, { ...rest, statuses });
}

export async function getPlan(actor: Actor, id: string): Promise<Plan> {
  const plan = await plansRepository.find(actor.organizationId, id);
  if (!plan || (actor.role === 'observer' && plan.status !== 'approved')) throw AppError.notFound('That plan');
  return plan;
}

/** Loads what the plan refers to, refusing anything outside the organisation or the site. */
export async function loadPlanInputs(
  actor: Actor,
  p: Pick<PlanInput, 'siteId' | 'postIds' | 'targetIds' | 'conditionSetIds'> & { id?: string },
  t?: Transaction,
) {
  const site = await sitesRepository.findInOrganization(actor.organizationId, p.siteId, t);
  if (!site) throw AppError.badRequest('The plan has invalid fields.', { siteId: 'No such site in your organisation.' });
  // Every read goes through the write's transaction: a second connection taken while the
  // plan row is locked can exhaust the pool under a burst of writes to one plan.
  const posts = await postsRepository.listInSite(actor.organizationId, site.id, t);
  const targets = await targetsRepository.list(actor.organizationId, t);
  const sets = await conditionSetsRepository.list(actor.organizationId, t);
  const pick = <T extends { id: string }>(all: T[], ids: string[], field: string, what: string) => {
    const found = ids.map((id) => all.find((x) => x.id === id));
    const missing = found.findIndex((x) => !x);
    if (missing >= 0)
      throw AppError.badRequest('The plan has invalid fields.', { [`${field}.${missing}`]: `No such ${what} here.` });
    return found as T[];
  };
  const chosenPosts = pick(posts, p.postIds, 'postIds', 'post on this site');
  // A saved plan's own files and its posts' photos go into the revision (by reference and hash).
  const attachments = p.id
    ? await attachmentsRepository.ofOwners(
        actor.organizationId,
        [
          { ownerType: 'plan', ownerIds: [p.id] },
          { ownerType: 'post', ownerIds: chosenPosts.map((x) => x.id) },
        ],
        t,
      )
    : [];
  return {
    site,
    attachments,
    posts: chosenPosts,
    targets: pick(targets, p.targetIds, 'targetIds', 'target in your library'),
    conditionSets: pick(sets, p.conditionSetIds, 'conditionSetIds', 'condition set in your library'),
  };
}

/**
 * The results a plan would freeze if it were submitted now: the same
 * snapshot, computed from today's posts, targets and conditions, not stored.
 */
export async function previewPlan(actor: Actor, id: string): Promise<PlanSnapshot> {
  const plan = await getPlan(actor, id);
  const inputs = await loadPlanInputs(actor, plan);
  return buildSnapshot({ title: plan.title, standard: plan.standard, lookout: plan.lookout, ...inputs });
}

export function createPlan({ db }: PlanDeps, actor: Actor, input: PlanInput): Promise<Plan> {
  return db.transaction(async (t) => {
    await loadPlanInputs(actor, input, t);
    const plan = await plansRepository.create(actor.organizationId, actor.userId, input, t);
    await auditRepository.record(actor, { action: 'create', entityType: 'plan', entityId: plan.id, after: plan }, t);
    return plan;
  });
}

export function updatePlan(
  { db }: PlanDeps,
  actor: Actor,
  id: string,
  input: Partial<Omit<PlanInput, 'siteId'>> & { rowVersion: number },
): Promise<Plan> {
  return db.transaction(async (t) => {
    const before = await plansRepository.find(actor.organizationId, id, t);
    if (!before) throw AppError.notFound('That plan');
    if (!isEditablePlanStatus(before.status)) {
      throw AppError.conflict(
        `A ${before.status} plan cannot be edited. Start a new version to change an approved plan.`,
        'plan_frozen',
      );
    }
    const { rowVersion, ...changes } = input;
    await loadPlanInputs(actor, { ...before, ...changes }, t);
    return writeVersioned(actor, t, { entityType: 'plan', entityId: id, before, stale: STALE }, () =>
      plansRepository.updateIfRowVersion(actor.organizationId, id, rowVersion, changes, t),
    );
  });
}

/** Sends after the write has committed; a mail failure is logged and reported as `mailed: false`. */
async function notify(deps: PlanDeps, to: string[], message: () => { subject: string; text: string; html?: string }) {
  if (!deps.mailer || to.length === 0) return false;
  try {
    await deps.mailer.send({ to, ...message() });
    return true;
  } catch (e) {
    console.error('[kenning] notification mail failed:', e);
    return false;
  }
}

/** Plain words for the plan's failing rules, for the 422 answers. */
function shortfall(verdict: StandardVerdict): string {
  const n = verdict.failingCaseCount;
  return `The plan does not meet its coverage standard in ${n} of ${verdict.caseCount} case${verdict.caseCount === 1 ? '' : 's'}`;
}

/** 422 `exception_required`: a plan that fails its standard goes on only as a recorded exception. */
function exceptionRequired(message: string, field: string, reason: string) {
  return new AppError(422, 'exception_required', message, { [field]: reason });
}

/**
 * Freezes every input and result in a new revision, with the plan's verdict
 * against its standard, and hands the plan to the reviewers. A plan that
 * fails its standard is submitted only with an exception note saying why
 * (422 `exception_required` otherwise); the note is frozen with the revision.
 */
export async function submitPlan(
  deps: PlanDeps,
  actor: Actor,
  id: string,
  input: { rowVersion: number; exceptionNote?: string },
) {
  const { rowVersion } = input;
  const { plan, revision, siteName, verdict } = await deps.db.transaction(async (t) => {
    const before = await plansRepository.find(actor.organizationId, id, t);
    if (!before) throw AppError.notFound('That plan');
    if (!isEditablePlanStatus(before.status))
      throw AppError.conflict(`A ${before.status} plan cannot be submitted.`, 'wrong_status');
    if (before.rowVersion !== rowVersion) throw AppError.conflict(STALE, 'stale_version');
    const inputs = await loadPlanInputs(actor, before, t);
    const coverage = await coverageForSubmit(actor.organizationId, before, inputs, t);
    if (!coverage.snapshot && coverage.required) {
      throw AppError.conflict(
        coverage.pending
          ? 'The terrain coverage for these inputs is still being computed. Submit when it has finished.'
          : 'Compute the terrain coverage first: a plan on a site with terrain is submitted with its coverage.',
        'coverage_missing',
      );
    }
    const verdict = standardVerdict(coverage.snapshot?.cases);
    const note = input.exceptionNote?.trim() ?? '';
    if (!verdict.passed && note === '') {
      throw exceptionRequired(
        `${shortfall(verdict)}. Submit it only as an exception: say why in an exception note, or change the plan.`,
        'exceptionNote',
        'Say why this plan should be reviewed although it does not meet its standard.',
      );
    }
    const snapshot = buildSnapshot({
      title: before.title,
      standard: before.standard,
      lookout: before.lookout,
      ...inputs,
      coverage: coverage.snapshot,
    });
    // A note on a plan that meets its standard has nothing to except: it is not kept as one.
    const exceptionNote = verdict.passed ? null : note;
    const revision = await plansRepository.addRevision(
      id,
      actor.userId,
      snapshot,
      contentHash(snapshot),
      { verdict, exceptionNote },
      t,
    );
    await plansRepository.setStatus(id, 'submitted', t);
    await auditRepository.record(
      actor,
      {
        action: 'submit',
        entityType: 'plan',
        entityId: id,
        before: { status: before.status },
        after: { status: 'submitted', revision, verdictPassed: verdict.passed, exceptionNote },
      },
      t,
    );
    return {
      plan: (await plansRepository.find(actor.organizationId, id, t))!,
      revision,
      siteName: inputs.site.name,
      verdict,
    };
  });
  const message = () =>
    planSubmitted({
      planTitle: plan.title,
      siteName,
      version: plan.version,
      preparedBy: plan.preparedBy.name,
      reviewUrl: deps.planUrl(id),
    });
  const mailed = await notify(deps, await plansRepository.reviewerEmails(actor.organizationId), message);
  return { plan, revision, verdict, mailed };
}

/**
 * The verdict submitting the plan now would freeze: its finished coverage
 * run for today's inputs against its standard (not checked without one).
 */
export async function submitVerdict(deps: Pick<PlanDeps, 'db'>, actor: Actor, id: string): Promise<StandardVerdict> {
  return deps.db.transaction(async (t) => {
    const plan = await getPlan(actor, id);
    const inputs = await loadPlanInputs(actor, plan, t);
    const coverage = await coverageForSubmit(actor.organizationId, plan, inputs, t);
    return standardVerdict(coverage.snapshot?.cases);
  });
}

/**
 * A reviewer approves or returns the revision they read. Approving a
 * revision that fails its standard needs a written justification (422
 * `exception_required` otherwise), kept with the review, which the database
 * never lets change.
 */
export async function reviewPlan(
  deps: PlanDeps,
  actor: Actor,
  id: string,
  input: { decision: 'approve' | 'return'; comment: string; revision: number; justification?: string },
) {
  const plan = await deps.db.transaction(async (t) => {
    const before = await plansRepository.find(actor.organizationId, id, t);
    if (!before) throw AppError.notFound('That plan');
    if (before.status !== 'submitted') throw AppError.conflict('Only a submitted plan can be reviewed.', 'wrong_status');
    if (before.preparedBy.id === actor.userId) throw AppError.forbidden('You cannot review a plan you prepared.');
    const latest = await plansRepository.latestRevisionNumber(id, t);
    if (latest !== input.revision) {
      throw AppError.conflict(
        `Revision ${input.revision} is not the one under review (${latest}). Reload the plan.`,
        'stale_revision',
      );
    }
    const verdict = await plansRepository.revisionVerdict(id, input.revision, t);
    const failing = verdict !== null && !verdict.passed;
    const justification = input.justification?.trim() ?? '';
    if (failing && input.decision === 'approve' && justification === '') {
      throw exceptionRequired(
        `${shortfall(verdict)}. Approve it only as an exception, with a written justification, or return it.`,
        'justification',
        'Write why this plan is approved although it does not meet its standard.',
      );
    }
    const exceptionJustification = failing && input.decision === 'approve' ? justification : null;
    await plansRepository.addReview(
      id,
      {
        revision: input.revision,
        decision: input.decision,
        comment: input.comment,
        reviewerId: actor.userId,
        exceptionJustification,
      },
      t,
    );
    const status = input.decision === 'approve' ? 'approved' : 'returned';
    await plansRepository.setStatus(id, status, t);
    // An approved new version supersedes the approved plan it replaces.
    if (status === 'approved' && before.previousId) await plansRepository.setStatus(before.previousId, 'superseded', t);
    await auditRepository.record(
      actor,
      {
        action: input.decision,
        entityType: 'plan',
        entityId: id,
        before: { status: before.status },
        after: { status, revision: input.revision, comment: input.comment, exceptionJustification },
      },
      t,
    );
    return (await plansRepository.find(actor.organizationId, id, t))!;
  });
  const to = await plansRepository.emailOf(plan.preparedBy.id);
  const reviewer = (await plansRepository.reviews(id)).at(-1)?.reviewer.name ?? 'A reviewer';
  const mailed = await notify(deps, to ? [to] : [], () =>
    reviewDecided({
      planTitle: plan.title,
      decision: input.decision === 'approve' ? 'approved' : 'returned',
      reviewer,
      comment: input.comment || null,
      planUrl: deps.planUrl(id),
    }),
  );
  return { plan, mailed };
}

/** A change to an approved plan starts a new draft version; approving it supersedes the old one. */
export function newPlanVersion({ db }: PlanDeps, actor: Actor, id: string): Promise<Plan> {
  return db.transaction(async (t) => {
    const before = await plansRepository.find(actor.organizationId, id, t);
    if (!before) throw AppError.notFound('That plan');
    if (before.status !== 'approved')
      throw AppError.conflict('Only an approved plan gets a new version; edit this one directly.', 'wrong_status');
    const { siteId, title, postIds, targetIds, conditionSetIds, standard, lookout } = before;
    const plan = await plansRepository.create(
      actor.organizationId,
      actor.userId,
      {
        siteId,
        title,
        postIds,
        targetIds,
        conditionSetIds,
        standard,
        lookout,
        version: before.version + 1,
        previousId: before.id,
      },
      t,
    );
    await auditRepository.record(
      actor,
      {
        action: 'new-version',
        entityType: 'plan',
        entityId: plan.id,
        before: { from: before.id, version: before.version },
        after: plan,
      },
      t,
    );
    return plan;
  });
}

/** Revisions, reviews and the signature chain: prepared → submitted → returned/approved. */
export async function planHistory(actor: Actor, id: string) {
  const plan = await getPlan(actor, id);
  const revisions = await plansRepository.revisions(id, false);
  const reviews = await plansRepository.reviews(id);
  const signatures = [
    ...revisions.map((r) => ({ step: 'submitted' as const, person: r.submittedBy, at: r.submittedAt, revision: r.number })),
    ...reviews.map((r) => ({
      step: r.decision === 'approve' ? ('approved' as const) : ('returned' as const),
      person: r.reviewer,
      at: r.at,
      revision: r.revision,
    })),
  ].sort((a, b) => a.at.localeCompare(b.at));
  return {
    revisions,
    reviews,
    signatures: [
      { step: 'prepared' as const, person: plan.preparedBy, at: signatures[0]?.at ?? plan.updatedAt, revision: null },
      ...signatures,
    ],
  };
}

export async function planRevision(actor: Actor, id: string, number: number) {
  await getPlan(actor, id);
  const found = (await plansRepository.revisions(id, true)).find((r) => r.number === number);
  if (!found) throw AppError.notFound('That revision');
  return verifiedRevision(id, found);
}
