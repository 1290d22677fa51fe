import { canonicalJson } from '@/shared/plans/canonical-json';
import type { PlanResultRow, PlanSnapshot } from '@/shared/schemas/plan';

/** One field that differs between two revisions. */
export interface FieldChange {
  readonly field: string;
  readonly before: unknown;
  readonly after: unknown;
}

/** A post, target or condition set that was added, removed or changed. */
export interface EntityChange {
  readonly id: string;
  readonly name: string;
  readonly change: 'added' | 'removed' | 'changed';
  /** The fields that differ (only for `changed`). */
  readonly fields: readonly FieldChange[];
}

/** A result line (post × target × condition) whose figures differ. */
export interface ResultChange {
  readonly key: string;
  readonly postName: string;
  readonly targetName: string;
  readonly conditionSetName: string;
  readonly conditionIndex: number;
  readonly change: 'added' | 'removed' | 'changed';
  /** Detection range before and after, metres (null where none). */
  readonly detectionRangeM: { readonly before: number | null; readonly after: number | null };
  readonly limitedBy: { readonly before: string | null; readonly after: string | null };
  /** Zones whose reach changed, by name. */
  readonly zones: readonly { readonly name: string; readonly before: string | null; readonly after: string | null }[];
}

/** What changed from one frozen revision of a plan to another. */
export interface SnapshotDiff {
  readonly plan: readonly FieldChange[];
  readonly site: readonly FieldChange[];
  readonly posts: readonly EntityChange[];
  readonly targets: readonly EntityChange[];
  readonly conditionSets: readonly EntityChange[];
  readonly results: readonly ResultChange[];
  readonly assumptions: { readonly added: readonly string[]; readonly removed: readonly string[] };
  /** True when nothing differs. */
  readonly same: boolean;
}

type Entity = Record<string, unknown>;

function fieldChanges(before: Entity, after: Entity, prefix = ''): FieldChange[] {
  const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])].filter((k) => k !== 'id').sort();
  return keys
    .filter((k) => canonicalJson(before[k]) !== canonicalJson(after[k]))
    .map((k) => ({ field: prefix + k, before: before[k] ?? null, after: after[k] ?? null }));
}

function entityChanges(before: readonly Entity[], after: readonly Entity[]): EntityChange[] {
  const byId = (list: readonly Entity[]) => new Map(list.map((e) => [String(e.id), e]));
  const a = byId(before);
  const b = byId(after);
  const name = (e: Entity) => String(e.name ?? e.id);
  const out: EntityChange[] = [];
  for (const [id, e] of a) {
    const next = b.get(id);
    if (!next) out.push({ id, name: name(e), change: 'removed', fields: [] });
    else {
      const fields = fieldChanges(e, next);
      if (fields.length) out.push({ id, name: name(next), change: 'changed', fields });
    }
  }
  for (const [id, e] of b) if (!a.has(id)) out.push({ id, name: name(e), change: 'added', fields: [] });
  return out;
}

const resultKey = (r: PlanResultRow) => `${r.postId}|${r.targetId}|${r.conditionSetId}|${r.conditionIndex}`;

/** Ranges closer than this are the same figure (rounding of a recomputation). */
const RANGE_TOLERANCE_M = 0.5;

function resultChanges(before: readonly PlanResultRow[], after: readonly PlanResultRow[]): ResultChange[] {
  const a = new Map(before.map((r) => [resultKey(r), r]));
  const b = new Map(after.map((r) => [resultKey(r), r]));
  const out: ResultChange[] = [];
  const line = (key: string, r: PlanResultRow, change: ResultChange['change'], old?: PlanResultRow, next?: PlanResultRow) => {
    const zoneNames = [...new Set([...(old?.zones ?? []), ...(next?.zones ?? [])].map((z) => z.name))];
    return {
      key,
      postName: r.postName,
      targetName: r.targetName,
      conditionSetName: r.conditionSetName,
      conditionIndex: r.conditionIndex,
      change,
      detectionRangeM: { before: old?.result.detectionRangeM ?? null, after: next?.result.detectionRangeM ?? null },
      limitedBy: { before: old?.result.limitedBy ?? null, after: next?.result.limitedBy ?? null },
      zones: zoneNames
        .map((name) => ({
          name,
          before: old?.zones.find((z) => z.name === name)?.reach ?? null,
          after: next?.zones.find((z) => z.name === name)?.reach ?? null,
        }))
        .filter((z) => z.before !== z.after),
    };
  };
  for (const [key, old] of a) {
    const next = b.get(key);
    if (!next) {
      out.push(line(key, old, 'removed', old));
      continue;
    }
    const r0 = old.result.detectionRangeM;
    const r1 = next.result.detectionRangeM;
    const rangeMoved = (r0 === null) !== (r1 === null) || (r0 !== null && r1 !== null && Math.abs(r0 - r1) > RANGE_TOLERANCE_M);
    const candidate = line(key, next, 'changed', old, next);
    if (rangeMoved || old.result.limitedBy !== next.result.limitedBy || candidate.zones.length > 0) out.push(candidate);
  }
  for (const [key, next] of b) if (!a.has(key)) out.push(line(key, next, 'added', undefined, next));
  return out;
}

/**
 * Compares two frozen revisions of a coverage plan: the plan's own fields,
 * the site, every post, target and condition set (by id), the assumptions,
 * and every result line (post × target × condition) whose detection range
 * moved by more than 0.5 m, whose limiting factor changed, or whose reach of
 * a priority zone changed. Pure; neither snapshot is modified.
 *
 * Source: none needed — a comparison of Kenning's own records.
 *
 * @param before the older revision's snapshot
 * @param after the newer revision's snapshot
 * @returns the differences, grouped; `same` when there are none
 * @example
 * const d = diffSnapshots(rev1.snapshot, rev2.snapshot);
 * d.posts; // [{ name: 'Blackmoss Tower', change: 'added', fields: [] }]
 */
export function diffSnapshots(before: PlanSnapshot, after: PlanSnapshot): SnapshotDiff {
  const plan = fieldChanges(before.inputs.plan as Entity, after.inputs.plan as Entity);
  const site = fieldChanges(before.inputs.site, after.inputs.site);
  const posts = entityChanges(before.inputs.posts, after.inputs.posts);
  const targets = entityChanges(before.inputs.targets, after.inputs.targets);
  const conditionSets = entityChanges(before.inputs.conditionSets, after.inputs.conditionSets);
  const results = resultChanges(before.results, after.results);
  const assumptions = {
    added: after.assumptions.filter((x) => !before.assumptions.includes(x)),
    removed: before.assumptions.filter((x) => !after.assumptions.includes(x)),
  };
  const same =
    plan.length + site.length + posts.length + targets.length + conditionSets.length + results.length === 0 &&
    assumptions.added.length + assumptions.removed.length === 0;
  return { plan, site, posts, targets, conditionSets, results, assumptions, same };
}
