import { randomInt } from 'node:crypto';
import { MAX_DRILL_SEED, type Drill, type DrillAnswer, type DrillRequest, type DrillResult } from '@/shared/schemas/drill';
import { smoothEarthGround } from '@/shared/plans/smooth-earth-ground';
import { SightlineInputError } from '@/shared/sightline/sightline-error';
import { gridProjection, TerrainCrsError } from '@/shared/terrain/grid-projection';
import { DrillUnavailableError, generateDrill, type DrillSetup } from '@/shared/trainer/generate-drill';
import { scoreDrillAnswer } from '@/shared/trainer/score-drill-answer';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { conditionSetsRepository, targetsRepository } from '@/server/data/repositories/library-repository';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
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
export async function createDrill({ db, terrainCache = null }: DrillDeps, actor: Actor, request: DrillRequest): Promise<Drill> {
  const seed = request.seed ?? randomInt(0, MAX_DRILL_SEED + 1);
  let post: DrillSetup['post'] = null;
  let terrain: DrillSetup['terrain'] = null;
  if (request.postId !== undefined) {
    const found = await postsRepository.findInOrganization(actor.organizationId, request.postId);
    const site = found && (await sitesRepository.findInOrganization(actor.organizationId, found.siteId));
    if (!found || !site) {
      throw new AppError(404, 'not_found', 'That post was not found.', { postId: 'No such post in your organisation.' });
    }
    const datum = smoothEarthGround(site, found);
    post = {
      name: found.name,
      eyeHeightM: Math.max(0, found.groundElevationM + found.structureHeightM + found.eyeHeightM - datum.groundM),
    };
    // Target-visible questions on a site with terrain use its terrain profile (read outside the transaction).
    const record =
      request.kind === 'target-visible' && terrainCache
        ? await terrainRepository.findActive(actor.organizationId, found.siteId)
        : null;
    if (record && terrainCache) {
      const raster = await terrainCache.loadTerrain(record);
      try {
        const at = gridProjection(raster.crs).toGrid(found.location);
        terrain = { raster, x: at.x, y: at.y, eyeAboveGroundM: found.structureHeightM + found.eyeHeightM };
      } catch (error) {
        if (!(error instanceof TerrainCrsError)) throw error;
      }
    }
  }
  return db.transaction(async (t) => {
    const setup: DrillSetup = {
      post,
      terrain,
      targets: await targetsRepository.list(actor.organizationId, t),
      conditionSets: await conditionSetsRepository.list(actor.organizationId, t),
    };
    let generated;
    try {
      generated = generateDrill(request.kind, seed, setup, request.units);
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
        postId: request.postId ?? null,
        kind: request.kind,
        seed,
        units: request.units,
        question: generated.question,
        solution: generated.solution,
      },
      t,
    );
    await auditRepository.record(
      actor,
      { action: 'create', entityType: ENTITY, entityId: drill.id, after: { kind: drill.kind, seed, postId: drill.postId } },
      t,
    );
    return drill;
  });
}

/** The person's own drill (with its result once answered). */
export async function getDrill(actor: Actor, id: string): Promise<Drill> {
  const drill = await repo.findOwn(actor.organizationId, actor.userId, id);
  if (!drill) throw notFound();
  return drill;
}

/**
 * Scores the one answer to the person's own drill and returns the correct
 * value, the score and the explanation. A second answer is refused by the
 * database (a conditional update in the same transaction): 409 `already_answered`.
 *
 * @throws {AppError} 404 for a drill that is not the caller's; 400 with `value` for an answer of the wrong
 *   sort (a number for a yes-no question, or the reverse); 409 `already_answered`
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
    if (found.answered) throw AppError.conflict('This drill is already answered; set a new one.', 'already_answered');
    const score = scoreDrillAnswer(solution.correctValue, answer.value, question.unit);
    if (!(await repo.answerOnce(actor.organizationId, actor.userId, id, { value: answer.value }, score, t))) {
      throw AppError.conflict('This drill is already answered; set a new one.', 'already_answered');
    }
    await auditRepository.record(
      actor,
      { action: 'answer', entityType: ENTITY, entityId: id, after: { value: answer.value, score } },
      t,
    );
    return { correctValue: solution.correctValue, score, explanation: solution.explanation, unit: question.unit };
  });
