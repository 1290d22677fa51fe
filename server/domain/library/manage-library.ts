import type { ConditionSet, ConditionSetInput, LibraryListQuery, Target, TargetInput } from '@/shared/schemas/library';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import {
  conditionSetsRepository,
  targetsRepository,
  type LibraryRepository,
} from '@/server/data/repositories/library-repository';
import { AppError } from '@/server/domain/app-error';
import type { Actor } from '../actor';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';
import { writeVersioned } from '@/server/domain/audit/versioned-write';

/**
 * Create, edit and remove entries of an organisation library (targets, condition sets):
 * one transaction per write, optimistic versions, an audit event each.
 */
export function libraryUseCases<Dto extends { id: string }, Input extends object>(
  { db }: UseCaseDeps,
  repo: LibraryRepository<Dto, Input>,
  entityType: string,
  what: string,
  check: (merged: Input) => void = () => {},
) {
  return {
    list: (actor: Actor, query: LibraryListQuery) => repo.page(actor.organizationId, query),
    create: (actor: Actor, input: Input) =>
      db.transaction(async (t) => {
        check(input);
        const after = await repo.create(actor.organizationId, input, t);
        await auditRepository.record(actor, { action: 'create', entityType, entityId: after.id, after }, t);
        return after;
      }),
    update: (actor: Actor, id: string, input: Partial<Input> & { version: number }) =>
      db.transaction(async (t) => {
        const before = await repo.find(actor.organizationId, id, t);
        if (!before) throw AppError.notFound(what);
        const { version, ...changes } = input;
        check({ ...(before as unknown as Input), ...(changes as Partial<Input>) });
        return writeVersioned(actor, t, { entityType, entityId: id, before }, () =>
          repo.updateIfVersion(actor.organizationId, id, version, changes as Partial<Input>, t),
        );
      }),
    remove: (actor: Actor, id: string) =>
      db.transaction(async (t) => {
        const before = await repo.find(actor.organizationId, id, t);
        if (!before) throw AppError.notFound(what);
        await repo.softDelete(actor.organizationId, id, t);
        await auditRepository.record(actor, { action: 'delete', entityType, entityId: id, before }, t);
      }),
  };
}

const checkTarget = (t: TargetInput) => {
  if (t.requiredVisibleM > t.heightM) {
    throw AppError.badRequest('The target has invalid fields.', {
      requiredVisibleM: 'The part that must show cannot exceed the height.',
    });
  }
};

/** The organisation's target profiles. */
export const targetUseCases = (deps: UseCaseDeps) =>
  libraryUseCases<Target, TargetInput>(deps, targetsRepository, 'target', 'That target', checkTarget);

/** The organisation's condition sets. */
export const conditionSetUseCases = (deps: UseCaseDeps) =>
  libraryUseCases<ConditionSet, ConditionSetInput>(deps, conditionSetsRepository, 'condition-set', 'That condition set');
