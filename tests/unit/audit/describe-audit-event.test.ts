import { auditChanges } from '@/shared/audit/audit-changes';
import { auditValue, describeAuditEvent, fieldLabel } from '@/shared/audit/describe-audit-event';

// Wording of Kenning's own audit sentences: product behaviour, no outside source.
describe('auditChanges', () => {
  it('lists only the fields that differ, without bookkeeping', () => {
    const before = { id: 'x', name: 'A', kind: 'tower', sector: { fromDeg: 0, toDeg: 90 }, version: 1, updatedAt: 't1' };
    const after = { id: 'x', name: 'B', kind: 'tower', sector: { fromDeg: 0, toDeg: 120 }, version: 2, updatedAt: 't2' };
    expect(auditChanges(before, after)).toEqual([
      { field: 'name', before: 'A', after: 'B' },
      { field: 'sector', before: { fromDeg: 0, toDeg: 90 }, after: { fromDeg: 0, toDeg: 120 } },
    ]);
  });

  it('lists every field of a create or delete with the other side absent, and nothing for no record', () => {
    expect(auditChanges(undefined, { name: 'A', version: 0 })).toEqual([{ field: 'name', before: undefined, after: 'A' }]);
    expect(auditChanges({ title: 'P' }, undefined)).toEqual([{ field: 'title', before: 'P', after: undefined }]);
    expect(auditChanges(null, undefined)).toEqual([]);
  });
});

describe('describeAuditEvent', () => {
  const actor = { name: 'Maren Holt' };
  it('reads as a sentence naming who, what and which record, with the changed fields of an update', () => {
    expect(
      describeAuditEvent({
        action: 'update',
        entityType: 'site',
        entityName: 'Harrowmere',
        actor,
        changes: [
          { field: 'timeZone', before: 'UTC', after: 'Europe/Oslo' },
          { field: 'groundElevationM', before: 1, after: 2 },
        ],
      }),
    ).toBe('Maren Holt changed the site “Harrowmere”: time zone, ground elevation (m).');
    expect(describeAuditEvent({ action: 'approve', entityType: 'plan', entityName: 'Fire cover', actor, changes: [] })).toBe(
      'Maren Holt approved the plan “Fire cover”.',
    );
    expect(
      describeAuditEvent({ action: 'delete', entityType: 'condition-set', entityName: null, actor: null, changes: [] }),
    ).toBe('Someone deleted a condition set.');
  });

  it('says values in a few words', () => {
    expect(fieldLabel('priorityZones')).toBe('priority zones');
    expect(fieldLabel('postIds')).toBe('posts');
    expect(fieldLabel('fromDeg')).toBe('from (°)');
    expect(auditValue(null)).toBe('not set');
    expect(auditValue('Oslo')).toBe('“Oslo”');
    expect(
      auditValue([
        [1, 2],
        [3, 4],
        [5, 6],
        [1, 2],
      ]),
    ).toBe('an outline of 3 corners');
    expect(auditValue([{ name: 'Harbour', weight: 3, ring: [] }])).toBe('“Harbour”');
    expect(auditValue({ latDeg: 61.05, lonDeg: 14.1 })).toBe('61.05000, 14.10000');
    expect(auditValue(false)).toBe('no');
  });
});
