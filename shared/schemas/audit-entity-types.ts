/** Kinds of record the audit trail names (the `entityType` each write records); no zod, for the route that reads one from its address. */
export const AUDIT_ENTITY_TYPES = [
  'site',
  'post',
  'plan',
  'target',
  'condition-set',
  'assignment',
  'attachment',
  'site_terrain',
  'landmark',
] as const;
export type AuditEntityType = (typeof AUDIT_ENTITY_TYPES)[number];

export function isAuditEntityType(value: unknown): value is AuditEntityType {
  return (AUDIT_ENTITY_TYPES as readonly unknown[]).includes(value);
}
