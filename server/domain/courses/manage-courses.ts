import { randomInt } from 'node:crypto';
import type {
  Course,
  CourseAttempt,
  CourseInput,
  CoursePersonResult,
  Qualification,
  QualificationQuery,
} from '@/shared/schemas/course';
import { MAX_DRILL_SEED, type DrillKind } from '@/shared/schemas/drill';
import { seededRandom } from '@/shared/trainer/seeded-random';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import { trainerCoursesRepository as repo, type AttemptRow } from '@/server/data/repositories/trainer-courses-repository';
import { trainerDrillsRepository } from '@/server/data/repositories/trainer-drills-repository';
import type { Actor } from '@/server/domain/actor';
import { AppError } from '@/server/domain/app-error';
import { drillPlace, insertDrill, type DrillDeps, type DrillPlace } from '@/server/domain/drills/manage-drills';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';

const ENTITY = 'course';
const DAY_MS = 86_400_000;
const notFound = () => AppError.notFound('That course');
/** Observers see the courses assigned to them, and only their own results. */
const seesOnlyOwn = (actor: Actor) => actor.role === 'observer';

async function checkPeople(actor: Actor, userIds: string[], field: string) {
  const found = await repo.activePeople(actor.organizationId, userIds);
  const fields = Object.fromEntries(
    userIds.flatMap((id, i) => (found.has(id) ? [] : [[`${field}.${i}`, 'No such active person in your organisation.']])),
  );
  if (Object.keys(fields).length > 0) throw AppError.badRequest('Some people were not found.', fields);
}

/** A planner composes a course and assigns it, in one transaction with its audit event. */
export async function createCourse({ db }: UseCaseDeps, actor: Actor, input: CourseInput): Promise<Course> {
  const missing: Record<string, string> = {};
  for (const [i, postId] of input.postIds.entries()) {
    if (!(await postsRepository.findInOrganization(actor.organizationId, postId))) {
      missing[`postIds.${i}`] = 'No such post in your organisation.';
    }
  }
  if (Object.keys(missing).length > 0) throw AppError.badRequest('Some posts were not found.', missing);
  await checkPeople(actor, input.assigneeIds, 'assigneeIds');
  return db.transaction(async (t) => {
    const { assigneeIds, ...course } = input;
    const id = await repo.create(actor.organizationId, { ...course, createdById: actor.userId }, t);
    await repo.assign(actor.organizationId, id, assigneeIds, actor.userId, t);
    const after = (await repo.find(actor.organizationId, id, t))!;
    await auditRepository.record(actor, { action: 'create', entityType: ENTITY, entityId: id, after }, t);
    return after;
  });
}

/** Assigns more people to a course (planners); those already assigned stay. */
export async function assignCourse({ db }: UseCaseDeps, actor: Actor, id: string, userIds: string[]): Promise<Course> {
  await checkPeople(actor, userIds, 'userIds');
  return db.transaction(async (t) => {
    const before = await repo.find(actor.organizationId, id, t);
    if (!before) throw notFound();
    await repo.assign(actor.organizationId, id, userIds, actor.userId, t);
    const after = (await repo.find(actor.organizationId, id, t))!;
    await auditRepository.record(actor, { action: 'assign', entityType: ENTITY, entityId: id, before, after }, t);
    return after;
  });
}

/** Every course of the organisation; an observer's own assigned courses. */
export const listCourses = (actor: Actor) => repo.list(actor.organizationId, seesOnlyOwn(actor) ? actor.userId : undefined);

/** One course; an observer sees it only when assigned. */
export async function getCourse(actor: Actor, id: string): Promise<Course> {
  const course = await repo.find(actor.organizationId, id);
  if (!course || (seesOnlyOwn(actor) && !course.assignees.some((a) => a.id === actor.userId))) throw notFound();
  return course;
}

async function attemptWithDrills(actor: Actor, attempt: AttemptRow): Promise<CourseAttempt> {
  const drills = await trainerDrillsRepository.ofAttempt(actor.organizationId, attempt.id);
  return {
    id: attempt.id,
    courseId: attempt.courseId,
    userId: attempt.userId,
    startedAt: attempt.startedAt,
    completedAt: attempt.completedAt,
    scorePct: attempt.scorePct,
    passMarkPct: attempt.passMarkPct,
    passed: attempt.passed,
    answered: drills.filter((d) => d.result !== null).length,
    questionCount: attempt.questionCount,
    drills,
  };
}

/**
 * Starts an attempt for an assigned person: the course's number of drills, the
 * kinds in turn, each on one of the course's posts (or open water) chosen with
 * its seed from the attempt's seed — all stored in one transaction. The drills
 * are answered through `POST /drills/:id/answer`; the last answer scores the attempt.
 *
 * @throws {AppError} 404 for a course outside the organisation; 403 `not_assigned`; 422 `drill_unavailable`
 */
export async function startAttempt(deps: DrillDeps, actor: Actor, courseId: string): Promise<CourseAttempt> {
  const course = await repo.find(actor.organizationId, courseId);
  if (!course) throw notFound();
  if (!course.assignees.some((a) => a.id === actor.userId)) {
    throw new AppError(403, 'not_assigned', 'This course is not assigned to you; a planner can assign it.');
  }
  const seed = randomInt(0, MAX_DRILL_SEED + 1);
  const random = seededRandom(seed);
  const plan = Array.from({ length: course.questionCount }, (_, position) => ({
    position,
    kind: course.kinds[position % course.kinds.length] as DrillKind,
    postId: course.postIds.length > 0 ? random.pick(course.postIds) : null,
    seed: random.int(0, MAX_DRILL_SEED),
  }));
  // Places (terrains, a site's other posts) are read before the transaction, once per post and kind.
  const places = new Map<string, DrillPlace>();
  for (const q of plan) {
    const key = `${q.postId}|${q.kind}`;
    if (!places.has(key)) places.set(key, await drillPlace(deps, actor, q.kind, q.postId));
  }
  const attempt = await deps.db.transaction(async (t) => {
    const row = await repo.createAttempt(
      actor.organizationId,
      { courseId, userId: actor.userId, seed, questionCount: course.questionCount, passMarkPct: course.passMarkPct },
      t,
    );
    for (const q of plan) {
      const place = places.get(`${q.postId}|${q.kind}`)!;
      await insertDrill(actor, { ...q, units: course.units, place, attemptId: row.id }, t);
    }
    await auditRepository.record(
      actor,
      { action: 'start', entityType: 'course-attempt', entityId: row.id, after: { courseId, seed } },
      t,
    );
    return row;
  });
  return attemptWithDrills(actor, attempt);
}

/** An attempt with its drills: the person's own, or anyone's in the organisation for planners and reviewers. */
export async function getAttempt(actor: Actor, courseId: string, attemptId: string): Promise<CourseAttempt> {
  const attempt = await repo.findAttempt(actor.organizationId, attemptId);
  if (!attempt || attempt.courseId !== courseId || (seesOnlyOwn(actor) && attempt.userId !== actor.userId)) {
    throw AppError.notFound('That attempt');
  }
  return attemptWithDrills(actor, attempt);
}

/**
 * Results per person (an observer: their own): attempts with score and verdict, mean score per kind of
 * question, and the qualification — passed within the course's validity, counted from the completion.
 */
export async function courseResults(actor: Actor, courseId: string, now = new Date()) {
  const course = await getCourse(actor, courseId);
  const attempts = await repo.attempts(actor.organizationId, courseId, seesOnlyOwn(actor) ? actor.userId : undefined);
  const scores = await trainerDrillsRepository.scoresOfAttempts(
    actor.organizationId,
    attempts.map((a) => a.id),
  );
  const people = seesOnlyOwn(actor)
    ? course.assignees.filter((a) => a.id === actor.userId)
    : [
        ...course.assignees,
        ...attempts.filter((a) => !course.assignees.some((p) => p.id === a.userId)).map((a) => ({ id: a.userId, name: '' })),
      ];
  const seen = new Set<string>();
  const results: CoursePersonResult[] = [];
  for (const person of people) {
    if (seen.has(person.id)) continue;
    seen.add(person.id);
    const mine = attempts.filter((a) => a.userId === person.id);
    const passedAt = mine
      .filter((a) => a.passed && a.completedAt)
      .map((a) => Date.parse(a.completedAt!))
      .sort((a, b) => b - a)[0];
    const until = passedAt === undefined ? null : passedAt + course.validityDays * DAY_MS;
    const ids = new Set(mine.map((a) => a.id));
    const byKind = course.kinds.map((kind) => {
      const own = scores.filter((s) => ids.has(s.attemptId) && s.kind === kind);
      return { kind, answered: own.length, meanScore: own.length ? own.reduce((sum, s) => sum + s.score, 0) / own.length : 0 };
    });
    const completed = mine.filter((a) => a.scorePct !== null);
    const [before, latest] = completed.slice(-2);
    results.push({
      user: person,
      trendPct: before && latest ? latest.scorePct! - before.scorePct! : null,
      attempts: mine.map((a) => ({
        id: a.id,
        startedAt: a.startedAt,
        completedAt: a.completedAt,
        scorePct: a.scorePct,
        passed: a.passed,
      })),
      lastPassedAt: passedAt === undefined ? null : new Date(passedAt).toISOString(),
      qualifiedUntil: until === null ? null : new Date(until).toISOString(),
      qualified: until !== null && until > now.getTime(),
      byKind,
    });
  }
  return { course, people: results };
}

/**
 * Qualifications by course and person, for the watch roster and the briefing: every assigned person (and
 * anyone who took an attempt) of each course, qualified while a passed attempt is within the validity, `due`
 * when assigned and not qualified. Observers get their own only.
 */
export async function listQualifications(actor: Actor, query: QualificationQuery, now = new Date()): Promise<Qualification[]> {
  const userId = seesOnlyOwn(actor) ? actor.userId : query.userId;
  const courses = (await listCourses(actor)).filter((c) => query.courseId === undefined || c.id === query.courseId);
  const out: Qualification[] = [];
  for (const course of courses) {
    const { people } = await courseResults(actor, course.id, now);
    for (const person of people) {
      if (userId !== undefined && person.user.id !== userId) continue;
      const assigned = course.assignees.some((a) => a.id === person.user.id);
      out.push({
        user: person.user,
        course: { id: course.id, name: course.name, validityDays: course.validityDays },
        due: assigned && !person.qualified,
        qualified: person.qualified,
        qualifiedUntil: person.qualifiedUntil,
        lastPassedAt: person.lastPassedAt,
      });
    }
  }
  return out;
}

/**
 * What a planner is told when putting someone on a watch: one line per course assigned to that person in
 * which they are not qualified now. A warning, not a refusal: the course record is the agency's training
 * record, and the planner may know what it does not (a course just set, an equivalent qualification, no one
 * else free); the decision stays with the planner and the agency's procedures.
 */
export async function qualificationWarnings(actor: Actor, userId: string, now = new Date()): Promise<string[]> {
  const items = await listQualifications(actor, { userId }, now);
  return items
    .filter((q) => q.due)
    .map((q) =>
      q.qualifiedUntil
        ? `${q.user.name} has not passed “${q.course.name}” again since the qualification ran out on ${q.qualifiedUntil.slice(0, 10)}. The watch is kept: a warning only, the decision is yours.`
        : `${q.user.name} has not passed “${q.course.name}” yet. The watch is kept: a warning only, the decision is yours.`,
    );
}
