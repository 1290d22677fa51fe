import { randomInt } from 'node:crypto';
import type { Transaction } from 'sequelize';
import {
  MAX_DRILL_SEED,
  type Drill,
  type DrillAnswer,
  type DrillKind,
  type DrillRequest,
  type DrillResult,
  type DrillUnits,
} from '@/shared/schemas/drill';
import { smoothEarthGround } from '@/shared/plans/smooth-earth-ground';
import { SightlineInputError } from '@/shared/sightline/sightline-error';
import { gridProjection, TerrainCrsError } from '@/shared/terrain/grid-projection';
import { DrillUnavailableError, generateDrill, type DrillSetup } from '@/shared/trainer/generate-drill';
import { scoreDrillAnswer } from '@/shared/trainer/score-drill-answer';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { conditionSetsRepository, targetsRepository } from '@/server/data/repositories/library-repository';
import { landmarksRepository } from '@/server/data/repositories/landmarks-repository';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
import { trainerCoursesRepository as coursesRepository } from '@/server/data/repositories/trainer-courses-repository';
import { trainerDrillsRepository as repo } from '@/server/data/repositories/trainer-drills-repository';
import type { Actor } from '@/server/domain/actor';
import { AppError } from '@/server/domain/app-error';
import type { TerrainCache } from '@/server/domain/ports/terrain-cache';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';

/** What the drill use cases need: the database and, for questions on a site's terrain, the terrain cache. */
export interface DrillDeps extends UseCaseDeps {
  terrainCache?: TerrainCache | null;
}

const ENTITY = 'drill';
const notFound = () => AppError.notFound('That drill');

/**
 * Sets one drill for the signed-in person: on one of the organisation's posts
 * (its height of eye above the ground its targets stand on, as the plans
 * count it) or on open water, with the organisation's targets and condition
 * sets, from the seed given or a random one (kept, so it can be set again).
 * A target-visible question on a post whose site has terrain is set on the
 * terrain profile from the post.
 *
 * @throws {AppError} 404 with `postId` for a post outside the organisation; 422 `drill_unavailable` with
 *   `kind` for a kind that cannot be set here (yet)
 */
export async function createDrill(deps: DrillDeps, actor: Actor, request: DrillRequest): Promise<Drill> {
  const seed = request.seed ?? randomInt(0, MAX_DRILL_SEED + 1);
  const place = await drillPlace(deps, actor, request.kind, request.postId);
  return deps.db.transaction((t) => insertDrill(actor, { ...request, seed, postId: request.postId ?? null, place }, t));
}

/** Where a drill is set: the post's height of eye and, for target-visible, its terrain. */
export interface DrillPlace {
  post: DrillSetup['post'];
  terrain: DrillSetup['terrain'];
  /** The other posts of the post's site (bearing-fix questions only). */
  otherPosts?: DrillSetup['otherPosts'];
  /** The landmarks of the post's site (landmark-range questions only). */
  landmarks?: DrillSetup['landmarks'];
}

/**
 * Resolves a post (404 with `postId` outside the organisation) into the height of eye above the ground its
 * targets stand on, as the plans count it, and for target-visible questions its site's terrain (read
 * outside any transaction); no post: open water.
 */
export async function drillPlace(
  { terrainCache = null }: DrillDeps,
  actor: Actor,
  kind: DrillKind,
  postId: string | null | undefined,
): Promise<DrillPlace> {
  if (postId === undefined || postId === null) return { post: null, terrain: null };
  const found = await postsRepository.findInOrganization(actor.organizationId, postId);
  const site = found && (await sitesRepository.findInOrganization(actor.organizationId, found.siteId));
  if (!found || !site) {
    throw new AppError(404, 'not_found', 'That post was not found.', { postId: 'No such post in your organisation.' });
  }
  const datum = smoothEarthGround(site, found);
  const post = {
    name: found.name,
    eyeHeightM: Math.max(0, found.groundElevationM + found.structureHeightM + found.eyeHeightM - datum.groundM),
    location: found.location,
  };
  if (kind === 'landmark-range') {
    const marks = await landmarksRepository.listInSite(actor.organizationId, found.siteId);
    const landmarks = marks.map((m) => ({ name: m.name, location: { latDeg: m.latDeg, lonDeg: m.lonDeg }, heightM: m.heightM }));
    return { post, terrain: null, landmarks };
  }
  if (kind === 'bearing-fix') {
    const siblings = await postsRepository.listInSite(actor.organizationId, found.siteId);
    const otherPosts = siblings.filter((p) => p.id !== found.id).map((p) => ({ name: p.name, location: p.location }));
    return { post, terrain: null, otherPosts };
  }
  const record =
    kind === 'target-visible' && terrainCache ? await terrainRepository.findActive(actor.organizationId, found.siteId) : null;
  if (!record || !terrainCache) return { post, terrain: null };
  const raster = await terrainCache.loadTerrain(record);
  try {
    const at = gridProjection(raster.crs).toGrid(found.location);
    return { post, terrain: { raster, x: at.x, y: at.y, eyeAboveGroundM: found.structureHeightM + found.eyeHeightM } };
  } catch (error) {
    if (!(error instanceof TerrainCrsError)) throw error;
    return { post, terrain: null };
  }
}

/** Generates one drill with the organisation's libraries and stores it with its audit event, in `t`. */
export async function insertDrill(
  actor: Actor,
  d: {
    kind: DrillKind;
    seed: number;
    units: DrillUnits;
    postId: string | null;
    place: DrillPlace;
    attemptId?: string | null;
    position?: number | null;
  },
  t: Transaction,
): Promise<Drill> {
  const setup: DrillSetup = {
    ...d.place,
    targets: await targetsRepository.list(actor.organizationId, t),
    conditionSets: await conditionSetsRepository.list(actor.organizationId, t),
  };
  let generated;
  try {
    generated = generateDrill(d.kind, d.seed, setup, d.units);
  } catch (error) {
    if (error instanceof DrillUnavailableError) {
      throw new AppError(422, 'drill_unavailable', error.message, { kind: error.message });
    }
    if (error instanceof SightlineInputError) {
      throw new AppError(422, 'drill_unavailable', 'This post cannot carry that drill.', { postId: error.message });
    }
    throw error;
  }
  const drill = await repo.create(
    actor.organizationId,
    {
      userId: actor.userId,
      postId: d.postId,
      kind: d.kind,
      seed: d.seed,
      units: d.units,
      question: generated.question,
      solution: generated.solution,
      attemptId: d.attemptId ?? null,
      position: d.position ?? null,
    },
    t,
  );
  await auditRepository.record(
    actor,
    { action: 'create', entityType: ENTITY, entityId: drill.id, after: { kind: drill.kind, seed: d.seed, postId: drill.postId } },
    t,
  );
  return drill;
}

/** The person's own drill (with its result once answered). */
export async function getDrill(actor: Actor, id: string): Promise<Drill> {
  const drill = await repo.findOwn(actor.organizationId, actor.userId, id);
  if (!drill) throw notFound();
  return drill;
}

/** The answer's response: the solution, the score and, for a course, the attempt as it stands. */
async function resultOf(
  actor: Actor,
  found: NonNullable<Awaited<ReturnType<typeof repo.solutionOf>>>,
  score: number,
  replayed: boolean,
  t: Transaction,
): Promise<DrillResult> {
  const attempt = found.attemptId ? await coursesRepository.completeIfAnswered(actor.organizationId, found.attemptId, t) : null;
  return {
    correctValue: found.solution.correctValue,
    score,
    explanation: found.solution.explanation,
    unit: found.question.unit,
    attempt: attempt && { id: attempt.id, completedAt: attempt.completedAt, scorePct: attempt.scorePct, passed: attempt.passed },
    replayed,
  };
}

const alreadyAnswered = () => AppError.conflict('This drill is already answered; set a new one.', 'already_answered');

/**
 * Scores the one answer to the person's own drill and returns the correct
 * value, the score and the explanation. A second answer is refused by the
 * database (a conditional update in the same transaction): 409 `already_answered`.
 * The same answer sent again (a phone resending after a lost response) gets
 * the stored result back, marked `replayed`, and changes nothing — so an
 * answer kept offline is counted exactly once.
 *
 * @throws {AppError} 404 for a drill that is not the caller's; 400 with `value` for an answer of the wrong
 *   sort (a number for a yes-no question, or the reverse); 409 `already_answered` for a different answer
 */
export const answerDrill = ({ db }: UseCaseDeps, actor: Actor, id: string, answer: DrillAnswer): Promise<DrillResult> =>
  db.transaction(async (t) => {
    const found = await repo.solutionOf(actor.organizationId, actor.userId, id, t);
    if (!found) throw notFound();
    const { question, solution } = found;
    const yesNo = question.unit === 'yes-no';
    if (yesNo !== (typeof answer.value === 'boolean')) {
      throw AppError.badRequest('The answer has invalid fields.', {
        value: yesNo ? 'Answer yes (true) or no (false).' : `Answer with a number of ${question.unit}.`,
      });
    }
    if (found.answered) {
      if (found.answered.value !== answer.value) throw alreadyAnswered();
      return resultOf(actor, found, found.answered.score, true, t);
    }
    const score = scoreDrillAnswer(solution.correctValue, answer.value, question.unit);
    if (!(await repo.answerOnce(actor.organizationId, actor.userId, id, { value: answer.value }, score, t))) {
      // Someone answered between the read and the write (the update waited for them): the same answer replays.
      const now = await repo.solutionOf(actor.organizationId, actor.userId, id, t);
      if (now?.answered && now.answered.value === answer.value) return resultOf(actor, now, now.answered.score, true, t);
      throw alreadyAnswered();
    }
    await auditRepository.record(
      actor,
      { action: 'answer', entityType: ENTITY, entityId: id, after: { value: answer.value, score } },
      t,
    );
    return resultOf(actor, found, score, false, t);
  });
