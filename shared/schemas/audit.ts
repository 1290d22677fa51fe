import { z } from 'zod';
import { pageOf } from './list';
import { AUDIT_ENTITY_TYPES, type AuditEntityType } from './audit-entity-types';

export { AUDIT_ENTITY_TYPES, type AuditEntityType } from './audit-entity-types';

export const AUDIT_ENTITY_LABELS: Record<AuditEntityType, string> = {
  site: 'site',
  post: 'post',
  plan: 'plan',
  target: 'target',
  'condition-set': 'condition set',
  assignment: 'watch',
  attachment: 'attachment',
  site_terrain: 'terrain',
  landmark: 'landmark',
};

const isoTime = (what: string) =>
  z.iso.datetime({ offset: true, error: `${what} must be an ISO 8601 time, e.g. 2026-06-01T00:00:00Z.` }).optional();

/** `GET /api/v1/audit-events` query: filters (all optional) and the page. */
export const AuditEventQuerySchema = z
  .object({
    entityType: z.enum(AUDIT_ENTITY_TYPES, { error: `Kinds: ${AUDIT_ENTITY_TYPES.join(', ')}.` }).optional(),
    entityId: z.uuid({ error: 'Not a record id.' }).optional(),
    actorId: z.uuid({ error: 'Not a person’s id.' }).optional(),
    /** ISO 8601; events at or after. */
    from: isoTime('From'),
    /** ISO 8601; events before. */
    to: isoTime('To'),
    page: z.coerce.number().int().min(1, 'Pages start at 1.').default(1),
    pageSize: z.coerce.number().int().min(1).max(200, 'At most 200 per page.').default(50),
  })
  .refine((q) => !q.from || !q.to || Date.parse(q.from) < Date.parse(q.to), { message: 'From must be before To.', path: ['to'] });
export type AuditEventQuery = z.infer<typeof AuditEventQuerySchema>;

/** One changed field of a record: its value before and after (JSON values; absent = not set). */
export const AuditChangeSchema = z.object({
  field: z.string(),
  /** Absent when the field had no value before (a create). */
  before: z.unknown().optional(),
  /** Absent when the field has no value after (a delete). */
  after: z.unknown().optional(),
});
export type AuditChange = z.infer<typeof AuditChangeSchema>;

/** One write in the audit trail: who did what to which record, when, and what changed. */
export const AuditEventSchema = z.object({
  id: z.string(),
  action: z.string(),
  entityType: z.string(),
  entityId: z.uuid(),
  /** The record's name or title at the time, when it has one. */
  entityName: z.string().nullable(),
  /** Who made the change (null when the account is gone or the system did it). */
  actor: z.object({ id: z.uuid(), name: z.string() }).nullable(),
  /** ISO 8601. */
  at: z.string(),
  /** Fields that differ between before and after (for updates), or the details recorded (other actions). */
  changes: z.array(AuditChangeSchema),
});
export type AuditEvent = z.infer<typeof AuditEventSchema>;

export const AuditEventListSchema = pageOf(AuditEventSchema);
