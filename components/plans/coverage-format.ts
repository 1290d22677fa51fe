// Over 300 lines: pure formatting of coverage figures for people; one module so every screen words them alike.
import type { CoverageCase, CoverageComparison, CoverageRun, PlanCoverage, CoverageSnapshot } from '@/shared/schemas/coverage';
import type { LengthUnit } from '@/shared/units/length';
import { distanceIn, formatLength, LIMIT_LABELS } from '@/components/check/format';

/**
 * Pure helpers for the coverage screens: words and numbers for people
 * (areas arrive in m², shown in km²; shares in percent; heights and ranges
 * in the person's units, metric by default), the state of a plan's
 * coverage, and the figures of a comparison.
 *
 * Areas stay in km² whatever the person's units: the agencies' cover
 * standards and the site figures they are checked against are written in
 * km² and percent of the site, and a reviewer compares plans by those
 * figures — one unit of area across every screen and export keeps the
 * comparison honest (a length unit switch changes how a height reads, not
 * which standard a plan meets).
 */

/** The standing cautions every coverage figure carries (shown with `CautionsPanel`). */
export const COVERAGE_CAUTIONS: readonly { code: string; message: string }[] = [
  {
    code: 'estimates-only',
    message: 'Estimates only, from the terrain grid: trees, buildings, haze and the grid’s own errors are not in these figures.',
  },
  {
    code: 'refraction-varies',
    message:
      'Refraction near the horizon varies widely and quickly; a cell seen under one condition can be hidden under another.',
  },
  {
    code: 'visibility-not-detection',
    message: 'Seen is not detected: a smoke or a person in view can still be missed by the lookout.',
  },
  {
    code: 'follow-procedures',
    message: 'Use these figures to support, not replace, your agency’s procedures and standards for lookout cover.',
  },
];

/** Square metres per square kilometre. */
const M2_PER_KM2 = 1_000_000;

/** An area for people, in km²: "31.2 km²", "0.42 km²", "< 0.01 km²", "0 km²". */
export function formatArea(m2: number): string {
  const km2 = m2 / M2_PER_KM2;
  if (km2 === 0) return '0 km²';
  if (Math.abs(km2) < 0.005) return `< 0.01 km²`;
  const digits = Math.abs(km2) >= 100 ? 0 : Math.abs(km2) >= 10 ? 1 : 2;
  return `${km2.toFixed(digits)} km²`;
}

/** A signed change of area: "+1.23 km²", "−0.40 km²" (a true minus sign), "±0 km²". */
export function formatAreaChange(m2: number): string {
  if (Math.abs(m2) / M2_PER_KM2 < 0.005) return m2 === 0 ? '±0 km²' : `${m2 > 0 ? '+' : '−'}< 0.01 km²`;
  return `${m2 > 0 ? '+' : '−'}${formatArea(Math.abs(m2))}`;
}

/** A share in percent, one decimal: "72.4 %". */
export const formatPct = (pct: number): string => `${pct.toFixed(1)} %`;

/** A case for people: "Early smoke column · Refraction spread: standard optical (k 0.13)". */
export function caseLabel(c: Pick<CoverageCase, 'targetName' | 'conditionSetName' | 'conditionLabel'>): string {
  return `${c.targetName} · ${c.conditionSetName}: ${c.conditionLabel}`;
}

/** The case with this key, else the first one (a run's cases are in target × condition order). */
export function pickCase<C extends Pick<CoverageCase, 'key'>>(cases: readonly C[], key: string | null | undefined): C | null {
  return cases.find((c) => c.key === key) ?? cases[0] ?? null;
}

/** The standard's rules with the failing ones first (in their own order), then the passed ones. */
export function rulesFailingFirst<R extends { passed: boolean }>(rules: readonly R[]): R[] {
  return [...rules.filter((r) => !r.passed), ...rules.filter((r) => r.passed)];
}

/** What the plan's coverage card has to show. */
export type CoverageCardState =
  | { kind: 'none' }
  | { kind: 'active'; run: CoverageRun }
  | { kind: 'done'; run: CoverageRun }
  /** Inputs changed since the newest finished run: its figures, marked as out of date. */
  | { kind: 'stale'; run: CoverageRun }
  | { kind: 'failed'; run: CoverageRun }
  | { kind: 'cancelled'; run: CoverageRun };

/**
 * The state of a plan's coverage from `GET /plans/:id/coverage`: the current
 * run (today's inputs) wins; without one, the newest run says why (failed,
 * cancelled, or done for older inputs: stale).
 */
export function coverageCardState(coverage: Pick<PlanCoverage, 'current' | 'latest'>): CoverageCardState {
  const { current, latest } = coverage;
  if (current) {
    if (current.status === 'queued' || current.status === 'running') return { kind: 'active', run: current };
    if (current.status === 'done') return { kind: 'done', run: current };
  }
  if (!latest) return { kind: 'none' };
  if (latest.status === 'queued' || latest.status === 'running') return { kind: 'active', run: latest };
  if (latest.status === 'failed') return { kind: 'failed', run: latest };
  if (latest.status === 'cancelled') return { kind: 'cancelled', run: latest };
  return { kind: 'stale', run: latest };
}

/** Progress for people: "42 % · Viewsheds: post 2 of 3" (the stage alone when it has none yet). */
export function progressText(run: Pick<CoverageRun, 'status' | 'progress' | 'stage'>): string {
  if (run.status === 'queued') return run.stage || 'Waiting to start';
  const pct = Math.round(Math.min(1, Math.max(0, run.progress)) * 100);
  return run.stage ? `${pct} % · ${run.stage}` : `${pct} %`;
}

/** The run a plan can be compared by: a frozen plan's revision run, else today's finished run; or why there is none. */
export type ComparableRun = { runId: string; reason: null } | { runId: null; reason: string };

export function comparableRun(
  editable: boolean,
  coverage: Pick<PlanCoverage, 'current' | 'latest'> | undefined,
  frozen: Pick<CoverageSnapshot, 'runId'> | null | undefined,
): ComparableRun {
  if (!editable) {
    return frozen
      ? { runId: frozen.runId, reason: null }
      : { runId: null, reason: 'No coverage run was frozen with this plan’s revision.' };
  }
  const state = coverage ? coverageCardState(coverage) : { kind: 'none' as const };
  switch (state.kind) {
    case 'done':
      return { runId: state.run.id, reason: null };
    case 'active':
      return { runId: null, reason: 'Its coverage is still being computed.' };
    case 'stale':
      return { runId: null, reason: 'Its inputs changed since coverage was computed; compute it again.' };
    case 'failed':
      return { runId: null, reason: 'Its last coverage run failed.' };
    default:
      return { runId: null, reason: 'Its coverage has not been computed yet.' };
  }
}

/** One line of a comparison: what was gained and lost, and the net change. */
export interface ChangeLine {
  readonly label: string;
  readonly gained: string;
  readonly lost: string;
  readonly net: string;
  /** Sign of the net change: 1 more cover, −1 less, 0 none. */
  readonly sign: -1 | 0 | 1;
}

/** The comparison's figures for people: area seen by ≥ 1 and by ≥ 2 posts, gained, lost and net (after − before). */
export function compareLines(statistics: CoverageComparison['statistics']): ChangeLine[] {
  const line = (label: string, gained: number, lost: number, net: number): ChangeLine => ({
    label,
    gained: gained === 0 ? '0 km²' : formatAreaChange(gained),
    lost: lost === 0 ? '0 km²' : formatAreaChange(-lost),
    net: formatAreaChange(net),
    sign: Math.abs(net) / M2_PER_KM2 < 0.005 ? 0 : net > 0 ? 1 : -1,
  });
  return [
    line('Seen by 1 post or more', statistics.gainedSeenBy1.area, statistics.lostSeenBy1.area, statistics.netSeenBy1Area),
    line('Seen by 2 posts or more', statistics.gainedSeenBy2.area, statistics.lostSeenBy2.area, statistics.netSeenBy2Area),
  ];
}

/** Keys of the cases two runs share, in run a's order. */
export function sharedCaseKeys(a: readonly Pick<CoverageCase, 'key'>[], b: readonly Pick<CoverageCase, 'key'>[]): string[] {
  const inB = new Set(b.map((c) => c.key));
  return a.filter((c) => inB.has(c.key)).map((c) => c.key);
}

/**
 * Run b's case that answers run a's case when the keys differ: the same
 * target name and condition label, else the same target, else b's first.
 */
export function matchingCase<C extends Pick<CoverageCase, 'key' | 'targetName' | 'conditionLabel'>>(
  from: Pick<CoverageCase, 'key' | 'targetName' | 'conditionLabel'>,
  cases: readonly C[],
): C | null {
  return (
    cases.find((c) => c.key === from.key) ??
    cases.find((c) => c.targetName === from.targetName && c.conditionLabel === from.conditionLabel) ??
    cases.find((c) => c.targetName === from.targetName) ??
    cases[0] ??
    null
  );
}

/** A post as a snapshot freezes it (fields typed loosely there). */
type SnapshotPost = Record<string, unknown>;

/** One post across two plans: its eye height above the ground in each (null: not in that plan), and the change. */
export interface PostComparison {
  readonly id: string;
  readonly name: string;
  /** Structure + eye above the ground, metres; null when the plan does not have the post. */
  readonly a: number | null;
  readonly b: number | null;
  /** For people, in the unit asked for: "+10 m" ("+32.8 ft"), "new in B", "only in A", or "" when nothing changed. */
  readonly change: string;
}

const num = (v: unknown) => (typeof v === 'number' ? v : Number(v));

/** Structure + eye height of a snapshot's post, metres. */
export const eyeAboveGround = (p: SnapshotPost): number => num(p.structureHeightM) + num(p.eyeHeightM);

/**
 * A height in metres for people, in `unit` (default metres): "12 m", "1.7 m";
 * in feet rounded like `formatLength` ("39.4 ft").
 */
export const formatMetres = (m: number, unit: LengthUnit = 'm'): string =>
  unit === 'm' ? `${Number.isInteger(m) ? m : m.toFixed(1)} m` : formatLength(m, unit);

/**
 * The posts of two plans side by side (a's order, then b's new ones), with
 * what changed in their height: "what raising a tower by 10 m adds" starts
 * from this line.
 */
export function comparePosts(a: readonly SnapshotPost[], b: readonly SnapshotPost[], unit: LengthUnit = 'm'): PostComparison[] {
  const byId = (list: readonly SnapshotPost[]) => new Map(list.map((p) => [String(p.id), p]));
  const inA = byId(a);
  const inB = byId(b);
  const ids = [...inA.keys(), ...[...inB.keys()].filter((id) => !inA.has(id))];
  return ids.map((id) => {
    const pa = inA.get(id);
    const pb = inB.get(id);
    const ha = pa ? eyeAboveGround(pa) : null;
    const hb = pb ? eyeAboveGround(pb) : null;
    const d = ha !== null && hb !== null ? Math.round((hb - ha) * 10) / 10 : null;
    // Metres to the decimetre as always; other units from the exact difference (no 10 ft → 9.84 ft).
    const shown = unit === 'm' || ha === null || hb === null ? d : hb - ha;
    const change =
      ha === null
        ? 'new in B'
        : hb === null
          ? 'only in A'
          : d && shown
            ? `${d > 0 ? '+' : '−'}${formatMetres(Math.abs(shown), unit)}`
            : '';
    return { id, name: String((pb ?? pa)?.name ?? id), a: ha, b: hb, change };
  });
}

type CaseLike = Pick<
  CoverageCase,
  'key' | 'targetId' | 'targetName' | 'conditionSetId' | 'conditionSetName' | 'conditionIndex' | 'conditionLabel'
>;

/** The choices of a case picker: targets, then per condition set its conditions for the chosen target. */
export interface CaseChoices {
  readonly targets: readonly { id: string; name: string; key: string; on: boolean }[];
  readonly sets: readonly { id: string; name: string; conditions: readonly { key: string; label: string; on: boolean }[] }[];
}

/**
 * A run's cases as two short choices instead of one long list: the target,
 * and the condition (grouped by condition set) for that target. Picking
 * another target keeps the same condition when that target has it.
 */
export function caseChoices(cases: readonly CaseLike[], key: string | null): CaseChoices {
  const chosen = pickCase(cases, key);
  if (!chosen) return { targets: [], sets: [] };
  const sameCondition = (c: CaseLike) => c.conditionSetId === chosen.conditionSetId && c.conditionIndex === chosen.conditionIndex;
  const targets = new Map<string, { id: string; name: string; key: string; on: boolean }>();
  for (const c of cases) {
    const seen = targets.get(c.targetId);
    if (!seen) targets.set(c.targetId, { id: c.targetId, name: c.targetName, key: c.key, on: c.targetId === chosen.targetId });
    else if (sameCondition(c) && !seen.on) seen.key = c.key;
  }
  const sets = new Map<string, { id: string; name: string; conditions: { key: string; label: string; on: boolean }[] }>();
  for (const c of cases.filter((x) => x.targetId === chosen.targetId)) {
    const set = sets.get(c.conditionSetId) ?? { id: c.conditionSetId, name: c.conditionSetName, conditions: [] };
    set.conditions.push({ key: c.key, label: c.conditionLabel, on: c.key === chosen.key });
    sets.set(c.conditionSetId, set);
  }
  return { targets: [...targets.values()], sets: [...sets.values()] };
}

/** What decided a case's undetected area, in words. */
export const DECIDED_BY_WORDS = {
  view: 'the view: terrain, the horizon or a post’s sector hides it from every post within range',
  visibility: 'the visibility: the haze hides the target beyond every post’s reach',
  'angular-size': 'the target’s size: it is too small to make out beyond every post’s reach',
  'luminous-range': 'the light: it is too faint beyond every post’s reach at night',
  'sea-state': 'the sea: wave crests hide the part of the target that must show',
} as const;

/** One case's detection limits as lines for people (see {@link CoverageCase.detection}). */
export interface DetectionLines {
  /** "Detected out to 0.69 km from a post (angular size)" (in the person's distance unit), or why never. */
  readonly range: string;
  /** "Most of the undetected area: …", or null when all is detected. */
  readonly decided: string | null;
  /** Areas by what decided them. */
  readonly areas: readonly { label: string; area: string }[];
  /** "Counted over the sea only.", or null. */
  readonly sea: string | null;
  /** "Waves hide the lowest 0.63 m." (in the person's height unit), or null. */
  readonly waves: string | null;
}

/** The units a person reads heights and distances in (`useLengthUnits`); metric when not given. */
export interface ReadingUnits {
  readonly height: LengthUnit;
  readonly distance: LengthUnit;
}

const METRIC: ReadingUnits = { height: 'm', distance: 'km' };

/**
 * Describes a case's detection limits, ranges in `units.distance` and wave
 * heights in `units.height` (metric by default), or returns null for runs
 * made before the detection model (their figures count the view and
 * visibility only).
 */
export function describeDetection(
  c: Pick<CoverageCase, 'detection' | 'targetName'>,
  units: ReadingUnits = METRIC,
): DetectionLines | null {
  const d = c.detection;
  if (!d) return null;
  const limit = (by: NonNullable<typeof d.rangeLimitedBy>) => LIMIT_LABELS[by];
  const range =
    d.reason === 'unlit-at-night'
      ? `${c.targetName} has no light: at night it is not detected anywhere.`
      : d.reason === 'screened-by-waves'
        ? `Wave crests hide ${c.targetName}: it is not detected anywhere in this sea.`
        : d.rangeLimitM === null
          ? `${c.targetName}: only the view limits detection (no stated visibility, size or light limit).`
          : `${c.targetName} is detected out to ${distanceIn(d.rangeLimitM, units.distance, formatKm)} from a post at most (${limit(d.rangeLimitedBy!)}).`;
  const total = d.areaM2.detected + d.areaM2.noData + d.areaM2.view + d.areaM2.range;
  const areas = [
    { label: 'Detected', area: d.areaM2.detected },
    { label: 'Hidden from posts in range', area: d.areaM2.view },
    { label: 'Beyond every post’s range', area: d.areaM2.range },
    { label: 'Without terrain data', area: d.areaM2.noData },
  ]
    .filter((a) => a.area > 0 || a.label === 'Detected')
    .map((a) => ({ label: a.label, area: `${formatArea(a.area)}${total > 0 ? ` (${formatPct((100 * a.area) / total)})` : ''}` }));
  return {
    range,
    decided: d.decidedBy === null ? null : `Most of the undetected area is decided by ${DECIDED_BY_WORDS[d.decidedBy]}.`,
    areas,
    sea: d.seaOnly ? 'A target on the water: counted over the site’s sea only, not its land.' : null,
    waves:
      d.waveScreenM > 0
        ? `Waves hide the lowest ${units.height === 'm' ? formatMetres(Math.round(d.waveScreenM * 100) / 100) : formatMetres(d.waveScreenM, units.height)} of the target.`
        : null,
  };
}

const formatKm = (m: number) =>
  m >= 10_000 ? `${(m / 1000).toFixed(0)} km` : m >= 1000 ? `${(m / 1000).toFixed(1)} km` : `${Math.round(m)} m`;

/** One target's figures across every condition of a run (its sensitivity to refraction and weather). */
export interface ConditionSpread {
  readonly rows: readonly {
    key: string;
    label: string;
    k: number;
    seenPct: number;
    passed: boolean;
  }[];
  /** Least and greatest share of the site seen by ≥ 1 post. */
  readonly minPct: number;
  readonly maxPct: number;
  /** Conditions under which the standard passes, of all. */
  readonly passes: number;
  /** "Passes under 2 of 3 conditions" etc. */
  readonly verdict: string;
}

/**
 * The shown case's target across all the run's conditions, ordered by k:
 * the share seen and the verdict under each, and how many pass. Null when
 * the target has a single case (nothing to compare).
 */
export function conditionSpread(
  cases: readonly Pick<
    CoverageCase,
    'key' | 'targetId' | 'conditionSetName' | 'conditionLabel' | 'refractionCoefficient' | 'site' | 'check'
  >[],
  targetId: string,
): ConditionSpread | null {
  const mine = cases.filter((c) => c.targetId === targetId);
  if (mine.length < 2) return null;
  const rows = mine
    .map((c) => ({
      key: c.key,
      label: `${c.conditionSetName}: ${c.conditionLabel}`,
      k: c.refractionCoefficient,
      seenPct: c.site.seenBy1.pct,
      passed: c.check.passed,
    }))
    .sort((a, b) => a.k - b.k || a.label.localeCompare(b.label));
  const passes = rows.filter((r) => r.passed).length;
  const shares = rows.map((r) => r.seenPct);
  return {
    rows,
    minPct: Math.min(...shares),
    maxPct: Math.max(...shares),
    passes,
    verdict:
      passes === rows.length
        ? `Meets the standard under all ${rows.length} conditions.`
        : passes === 0
          ? `Fails the standard under all ${rows.length} conditions.`
          : `Meets the standard under ${passes} of ${rows.length} conditions only: the verdict depends on the refraction and the weather.`,
  };
}
