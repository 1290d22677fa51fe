import type { AuditChange } from '@/shared/schemas/audit';

/** Bookkeeping fields left out of a change list: they change on every write. */
const BOOKKEEPING = new Set(['version', 'rowVersion', 'updatedAt', 'createdAt']);

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/**
 * The fields that differ between a record's recorded `before` and `after`
 * (top-level fields; a changed nested value is one change), in the order the
 * record lists them, without bookkeeping fields. With only `after` (a create)
 * or only `before` (a delete) every field is listed with the other side absent.
 *
 * @example
 * auditChanges({ name: 'A', version: 1 }, { name: 'B', version: 2 }); // [{ field: 'name', before: 'A', after: 'B' }]
 */
export function auditChanges(before: unknown, after: unknown): AuditChange[] {
  const b = before && typeof before === 'object' && !Array.isArray(before) ? (before as Record<string, unknown>) : null;
  const a = after && typeof after === 'object' && !Array.isArray(after) ? (after as Record<string, unknown>) : null;
  if (!a && !b) return [];
  const fields = [...new Set([...Object.keys(b ?? {}), ...Object.keys(a ?? {})])].filter(
    (f) => !BOOKKEEPING.has(f) && f !== 'id',
  );
  const changes: AuditChange[] = [];
  for (const field of fields) {
    const was = b?.[field];
    const now = a?.[field];
    if (b && a && same(was, now)) continue;
    changes.push({ field, before: was, after: now });
  }
  return changes;
}
