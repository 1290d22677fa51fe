import type { Transaction } from 'sequelize';
import type { CoverageSnapshot } from '@/shared/schemas/coverage';
import type { ConditionSet, Target } from '@/shared/schemas/library';
import type { Plan } from '@/shared/schemas/plan';
import type { Post, Site } from '@/shared/schemas/site';
import { coverageRepository, type CoverageRunRecord } from '@/server/data/repositories/coverage-repository';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
import { buildCoverageInputs, coverageInputsHash, type CoverageRunInputs } from './coverage-inputs';

/** A plan's resolved inputs, as `loadPlanInputs` returns them. */
export interface LoadedPlanInputs {
  site: Site;
  posts: Post[];
  targets: Target[];
  conditionSets: ConditionSet[];
}

/** The coverage inputs of a plan today, their hash, and whether the site has terrain. */
export async function currentCoverageInputs(
  organizationId: string,
  plan: Pick<Plan, 'standard' | 'lookout'>,
  loaded: LoadedPlanInputs,
  transaction?: Transaction,
): Promise<{ inputs: CoverageRunInputs; inputsHash: string; hasTerrain: boolean }> {
  const terrain = await terrainRepository.findActive(organizationId, loaded.site.id, transaction);
  const inputs = buildCoverageInputs({
    ...loaded,
    terrain: terrain && { id: terrain.id, sha256: terrain.sha256 },
    standard: plan.standard,
    lookout: plan.lookout,
  });
  return { inputs, inputsHash: coverageInputsHash(inputs), hasTerrain: terrain !== null };
}

/** What a revision freezes of a finished run. */
export async function coverageSnapshotOf(
  run: CoverageRunRecord,
  inputs: CoverageRunInputs,
  transaction?: Transaction,
): Promise<CoverageSnapshot> {
  return {
    runId: run.id,
    inputsHash: run.inputsHash,
    datum: run.datum,
    terrainId: run.terrainId,
    terrainSha256: inputs.terrain?.sha256 ?? null,
    grid: run.grid!,
    cases: run.cases,
    layerHashes: await coverageRepository.layerHashes(run.id, transaction),
  };
}

/**
 * The coverage a plan would freeze on submit: its finished run for today's
 * inputs. Null when there is none, with `required` saying whether
 * submitting must wait for one (the site has terrain).
 */
export async function coverageForSubmit(
  organizationId: string,
  plan: Pick<Plan, 'id' | 'standard' | 'lookout'>,
  loaded: LoadedPlanInputs,
  transaction: Transaction,
): Promise<{ snapshot: CoverageSnapshot | null; required: boolean; pending: boolean }> {
  const { inputs, inputsHash, hasTerrain } = await currentCoverageInputs(organizationId, plan, loaded, transaction);
  const run = await coverageRepository.findCurrent(plan.id, inputsHash, transaction);
  if (run?.status === 'done')
    return { snapshot: await coverageSnapshotOf(run, inputs, transaction), required: hasTerrain, pending: false };
  return { snapshot: null, required: hasTerrain, pending: run !== null };
}
