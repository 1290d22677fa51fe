import { AUDIT_ENTITY_LABELS, type AuditEntityType, type AuditEvent } from '@/shared/schemas/audit';

const VERBS: Record<string, string> = {
  create: 'created',
  update: 'changed',
  delete: 'deleted',
  submit: 'submitted',
  approve: 'approved',
  return: 'returned',
  'new-version': 'started a new version of',
  upload: 'uploaded',
  'coverage-request': 'asked for a coverage run of',
  'coverage-cancel': 'cancelled a coverage run of',
};

const UNIT_SUFFIXES: [RegExp, string][] = [
  [/M$/, ' (m)'],
  [/Deg$/, ' (°)'],
  [/Pct$/, ' (%)'],
  [/Arcmin$/, ' (′)'],
];

/** A field name for people: `timeZone` → "time zone", `groundElevationM` → "ground elevation (m)". */
export function fieldLabel(field: string): string {
  let unit = '';
  let name = field;
  for (const [re, suffix] of UNIT_SUFFIXES) {
    if (re.test(name) && name.length > 3) {
      name = name.replace(re, '');
      unit = suffix;
      break;
    }
  }
  const words = name
    .replace(/Ids$/, 's')
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/[_-]/g, ' ')
    .toLowerCase();
  return `${words}${unit}`;
}

const isPair = (v: unknown) => Array.isArray(v) && v.length === 2 && typeof v[0] === 'number' && typeof v[1] === 'number';

/** A recorded value in a few words: text quoted, outlines by their corners, lists by their length. */
export function auditValue(value: unknown): string {
  if (value === undefined || value === null || value === '') return 'not set';
  if (typeof value === 'string') return `“${value.length > 80 ? `${value.slice(0, 79)}…` : value}”`;
  if (typeof value === 'number') return String(value);
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (Array.isArray(value)) {
    if (value.length > 0 && value.every(isPair)) {
      const first = value[0] as number[];
      const last = value[value.length - 1] as number[];
      const corners = first[0] === last[0] && first[1] === last[1] ? value.length - 1 : value.length;
      return `an outline of ${corners} corners`;
    }
    if (value.length === 0) return 'none';
    if (value.every((v) => v && typeof v === 'object' && typeof (v as { name?: unknown }).name === 'string')) {
      return value.map((v) => `“${(v as { name: string }).name}”`).join(', ');
    }
    return `${value.length} item${value.length === 1 ? '' : 's'}`;
  }
  if (typeof value === 'object') {
    const r = value as Record<string, unknown>;
    if (typeof r.name === 'string') return `“${r.name}”`;
    if (typeof r.latDeg === 'number' && typeof r.lonDeg === 'number') return `${r.latDeg.toFixed(5)}, ${r.lonDeg.toFixed(5)}`;
    const text = JSON.stringify(value);
    return text.length > 80 ? `${text.slice(0, 79)}…` : text;
  }
  return String(value);
}

/**
 * An audit event as one sentence, e.g. "Maren Holt changed the site
 * “Harrowmere Forest District”: name, time zone." (who, what, which record;
 * for an update, the fields that changed).
 *
 * @example
 * describeAuditEvent({ action: 'delete', entityType: 'post', entityName: 'Crane Knoll Tower', actor: { name: 'A' }, changes: [] })
 * // 'A deleted the post “Crane Knoll Tower”.'
 */
export function describeAuditEvent(
  event: Pick<AuditEvent, 'action' | 'entityType' | 'entityName' | 'changes'> & { actor: { name: string } | null },
): string {
  const who = event.actor?.name ?? 'Someone';
  const verb = VERBS[event.action] ?? `did “${event.action}” to`;
  const kind = AUDIT_ENTITY_LABELS[event.entityType as AuditEntityType] ?? event.entityType;
  const what = event.entityName ? `the ${kind} “${event.entityName}”` : `a ${kind}`;
  const fields =
    event.action === 'update' && event.changes.length > 0 ? `: ${event.changes.map((c) => fieldLabel(c.field)).join(', ')}` : '';
  return `${who} ${verb} ${what}${fields}.`;
}
