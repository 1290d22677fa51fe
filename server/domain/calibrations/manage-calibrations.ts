import type { Transaction } from 'sequelize';
import type { Calibration, CalibrationInput, CalibrationListQuery } from '@/shared/schemas/calibration';
import { ConditionSetInputSchema, type ConditionSet } from '@/shared/schemas/library';
import { formatK } from '@/shared/sightline/format-k';
import { SightlineInputError } from '@/shared/sightline/sightline-error';
import { evaluateCalibration } from '@/shared/trainer/evaluate-calibration';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { calibrationsRepository as repo } from '@/server/data/repositories/calibrations-repository';
import { conditionSetsRepository } from '@/server/data/repositories/library-repository';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import type { Actor } from '@/server/domain/actor';
import { AppError } from '@/server/domain/app-error';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';

const ENTITY = 'calibration';
const MEASUREMENT_FIELDS = [
  'eyeHeightM',
  'observedDipArcmin',
  'accuracyArcmin',
  'distanceM',
  'zenithAngle1Deg',
  'zenithAngle2Deg',
  'accuracyArcsec',
  'markHeightM',
  'observedVisibleFromM',
  'markVisible',
  'accuracyM',
] as const;

const onlyPlanners = () =>
  AppError.forbidden(
    'Only planners save condition sets: send the calibration without saveAsConditionSet, and ask a planner to save it.',
  );

/** The method's measured fields alone, as stored and as the core takes them. */
function measurementOf(input: CalibrationInput): Record<string, number | boolean | string> {
  const out: Record<string, number | boolean | string> = {};
  for (const key of MEASUREMENT_FIELDS) {
    const value = (input as Record<string, unknown>)[key];
    if (typeof value === 'number' || typeof value === 'boolean') out[key] = value;
  }
  return out;
}

/** The default name of a condition set saved from a calibration: "observed, 2026-12-03" (UTC date of the sighting). */
export const observedSetName = (observedAt: string) => `observed, ${observedAt.slice(0, 10)}`;

/** k, then the low and high ends (distinct, within the condition schema's −10…10), as `{ k }` conditions. */
function conditionsOf(c: Calibration): { k: number }[] {
  const values = c.resultKind === 'estimate' ? [c.k, c.kMin, c.kMax] : [c.kMin ?? c.kMax];
  const out: { k: number }[] = [];
  for (const value of values) {
    if (value === null || value === undefined || value < -10 || value > 10) continue;
    const k = Number(formatK(value));
    if (!out.some((condition) => condition.k === k)) out.push({ k });
  }
  return out;
}

async function saveAsConditionSet(
  actor: Actor,
  calibration: Calibration,
  name: string | undefined,
  t: Transaction,
): Promise<{ calibration: Calibration; conditionSet: ConditionSet }> {
  if (calibration.conditionSetId) {
    throw AppError.conflict('This calibration is already saved as a condition set.', 'already_saved');
  }
  const conditions = conditionsOf(calibration);
  if (conditions.length === 0) {
    throw new AppError(422, 'nothing_to_save', 'This calibration found no k (nor a bound on it) to save as a condition set.');
  }
  const input = ConditionSetInputSchema.parse({ name: name ?? observedSetName(calibration.observedAt), conditions });
  const conditionSet = await conditionSetsRepository.create(actor.organizationId, input, t);
  await auditRepository.record(
    actor,
    { action: 'create', entityType: 'condition-set', entityId: conditionSet.id, after: conditionSet },
    t,
  );
  if (!(await repo.linkConditionSet(actor.organizationId, calibration.id, conditionSet.id, t))) {
    throw AppError.conflict('This calibration is already saved as a condition set.', 'already_saved');
  }
  const after = (await repo.find(actor.organizationId, calibration.id, t))!;
  await auditRepository.record(
    actor,
    { action: 'save-as-condition-set', entityType: ENTITY, entityId: calibration.id, before: calibration, after },
    t,
  );
  return { calibration: after, conditionSet };
}

/** The organisation's calibrations, newest sighting first, by post and time window. */
export const listCalibrations = (actor: Actor, query: CalibrationListQuery) => repo.page(actor.organizationId, query);

/**
 * Solves k from a field measurement and logs it (time, post, the signed-in
 * observer, weather) with its audit event — and, when asked by a planner,
 * the condition set "observed, <date>" — in one transaction.
 *
 * @throws {AppError} 403 when someone other than a planner asks to save a condition set (nothing is logged);
 *   404 with `postId` for a post outside the organisation; 422 `calibration_input` with the field the core refused
 */
export async function recordCalibration(
  { db }: UseCaseDeps,
  actor: Actor,
  input: CalibrationInput,
): Promise<{ calibration: Calibration; conditionSet: ConditionSet | null }> {
  if (input.saveAsConditionSet && actor.role !== 'planner') throw onlyPlanners();
  const measurement = measurementOf(input);
  let figures;
  try {
    figures = evaluateCalibration(input, input.weather);
  } catch (error) {
    if (error instanceof SightlineInputError) {
      throw new AppError(422, 'calibration_input', 'k cannot be solved from this measurement.', { [error.field]: error.message });
    }
    throw error;
  }
  return db.transaction(async (t) => {
    if (input.postId !== undefined) {
      const post = await postsRepository.findInOrganization(actor.organizationId, input.postId, t);
      if (!post)
        throw new AppError(404, 'not_found', 'That post was not found.', { postId: 'No such post in your organisation.' });
    }
    const calibration = await repo.create(
      actor.organizationId,
      {
        postId: input.postId ?? null,
        observerId: actor.userId,
        observedAt: input.observedAt ? new Date(input.observedAt) : new Date(),
        method: input.method,
        measurement,
        weather: input.weather ?? null,
        notes: input.notes,
        figures,
      },
      t,
    );
    await auditRepository.record(
      actor,
      { action: 'create', entityType: ENTITY, entityId: calibration.id, after: calibration },
      t,
    );
    if (!input.saveAsConditionSet) return { calibration, conditionSet: null };
    return saveAsConditionSet(actor, calibration, undefined, t);
  });
}

/** Saves a logged calibration as a condition set (planners), once. */
export const saveCalibrationAsConditionSet = ({ db }: UseCaseDeps, actor: Actor, id: string, name?: string) =>
  db.transaction(async (t) => {
    if (actor.role !== 'planner') throw onlyPlanners();
    const calibration = await repo.find(actor.organizationId, id, t);
    if (!calibration) throw AppError.notFound('That calibration');
    return saveAsConditionSet(actor, calibration, name, t);
  });
