import type { SweepWidthTableInput, SweepWidthTableListQuery, SweepWidthTableUpdate } from '@/shared/schemas/sweep-width';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { sweepWidthTablesRepository as repo } from '@/server/data/repositories/sweep-width-tables-repository';
import { AppError } from '@/server/domain/app-error';
import type { Actor } from '../actor';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';
import { writeVersioned } from '@/server/domain/audit/versioned-write';

const WHAT = 'That sweep-width table';
const ENTITY = 'sweep-width-table';

const retired = () => AppError.conflict('This table is retired: it is kept for the record and cannot change.', 'table_retired');

/** The organisation's sweep-width tables. */
export const listSweepWidthTables = (actor: Actor, query: SweepWidthTableListQuery) => repo.page(actor.organizationId, query);

/** Adds a table (edition and source required by the schema), with its audit event, in one transaction. */
export const createSweepWidthTable = ({ db }: UseCaseDeps, actor: Actor, input: SweepWidthTableInput) =>
  db.transaction(async (t) => {
    const after = await repo.create(actor.organizationId, input, t);
    await auditRepository.record(actor, { action: 'create', entityType: ENTITY, entityId: after.id, after }, t);
    return after;
  });

/** Edits a table that is not retired, if nobody changed it since `version`. */
export const updateSweepWidthTable = ({ db }: UseCaseDeps, actor: Actor, id: string, input: SweepWidthTableUpdate) =>
  db.transaction(async (t) => {
    const before = await repo.find(actor.organizationId, id, t);
    if (!before) throw AppError.notFound(WHAT);
    if (before.retiredAt) throw retired();
    const { version, ...changes } = input;
    return writeVersioned(actor, t, { entityType: ENTITY, entityId: id, before }, () =>
      repo.updateIfVersion(actor.organizationId, id, version, changes, t),
    );
  });

/** Retires a table: kept, listed only on request, no longer editable. */
export const retireSweepWidthTable = ({ db }: UseCaseDeps, actor: Actor, id: string, version: number) =>
  db.transaction(async (t) => {
    const before = await repo.find(actor.organizationId, id, t);
    if (!before) throw AppError.notFound(WHAT);
    if (before.retiredAt) throw retired();
    return writeVersioned(actor, t, { action: 'retire', entityType: ENTITY, entityId: id, before }, () =>
      repo.updateIfVersion(actor.organizationId, id, version, { retiredAt: new Date() }, t),
    );
  });
