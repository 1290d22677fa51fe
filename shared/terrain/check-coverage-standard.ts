// Over 300 lines: one documented pure function with its rule types and the people-facing reasons it writes.
import type { AreaCoverage, BlindArea, CoverageStatistics } from '@/shared/terrain/coverage-statistics';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';

/** A plan's coverage standard (the shape of `PlanStandardSchema` in `shared/schemas/plan.ts`). */
export interface CoverageStandard {
  /** Least share of the site seen by at least one post, percent (0–100). */
  readonly minSeenPct: number;
  /** Posts that must see each priority zone, 1–3. */
  readonly priorityMinPosts: number;
  /** Least share of each priority zone with good cross-bearings, percent; null or absent = no such rule. */
  readonly crossBearingMinPct?: number | null;
  /**
   * Rules for the target being checked (the caller passes only the rules of
   * this case's target): the share of the site, or of each priority zone,
   * seen by at least `minPosts` posts.
   */
  readonly targetRules?: readonly {
    readonly targetName: string;
    readonly area: 'site' | 'priority-zones';
    readonly minPosts: number;
    readonly minPct: number;
  }[];
}

/**
 * How Kenning reads a {@link CoverageStandard}, as data: show it in the
 * review screen and freeze it with a plan revision (the `version` names this
 * reading; change it whenever a rule changes).
 */
export const COVERAGE_STANDARD_RULES = {
  version: 'kenning-coverage-standard/2',
  rules: [
    {
      id: 'site-seen',
      appliesTo: 'site',
      minPosts: '1',
      minPct: 'minSeenPct',
      text: 'At least {minPct} % of the site is seen by at least one post.',
    },
    {
      id: 'priority-zone-seen',
      appliesTo: 'each priority zone',
      minPosts: 'priorityMinPosts',
      minPct: 'minSeenPct',
      text: 'At least {minPct} % of priority zone “{zone}” is seen by at least {minPosts} posts.',
    },
    {
      id: 'priority-zone-cross-bearing',
      appliesTo: 'each priority zone',
      minPosts: '2',
      minPct: 'crossBearingMinPct',
      text: 'At least {minPct} % of priority zone “{zone}” has good cross-bearings.',
    },
    {
      id: 'target-site-seen',
      appliesTo: 'site, one target',
      minPosts: 'targetRules[].minPosts',
      minPct: 'targetRules[].minPct',
      text: '{target}: at least {minPct} % of the site is seen by at least {minPosts} posts.',
    },
    {
      id: 'target-zone-seen',
      appliesTo: 'each priority zone, one target',
      minPosts: 'targetRules[].minPosts',
      minPct: 'targetRules[].minPct',
      text: '{target}: at least {minPct} % of priority zone “{zone}” is seen by at least {minPosts} posts.',
    },
  ],
  notes: [
    'A cell counts as seen by a post when the target of the chosen height is seen there (ground seen or target only) and the cell lies in the post’s viewing sector.',
    'Shares are of all cells of the area on the terrain grid; cells without terrain data count as not seen.',
    'A site or zone with no cells on the terrain grid fails: nothing of it can be judged.',
    'The check is made for one target and one set of conditions at a time; a cell counts only where the target is detectable (in view, and within the visibility, angular-size or luminous range, and above the wave crests).',
    'A target rule applies only in that target’s cases.',
  ],
} as const;

/** Identifier of a rule of {@link COVERAGE_STANDARD_RULES}. */
export type CoverageRuleId = (typeof COVERAGE_STANDARD_RULES)['rules'][number]['id'];

/** One rule applied to the site or one zone. */
export interface CoverageRuleCheck {
  readonly id: CoverageRuleId;
  /** The zone's name for zone rules, null for the site rule. */
  readonly zoneName: string | null;
  /** Posts that must see a cell for it to count. */
  readonly minPosts: number;
  /** Least share, percent. */
  readonly minPct: number;
  /** The rule in words, numbers filled in. */
  readonly text: string;
  /** Share of the area's cells seen by at least `minPosts` posts, percent. */
  readonly actualPct: number;
  readonly passed: boolean;
  /** Percentage points below `minPct`; 0 when passed. */
  readonly shortfallPct: number;
  /** Area that would have to be seen in addition, m²; 0 when passed. */
  readonly shortfallArea: number;
  /** Why it passes or fails, for people: where, by how much. */
  readonly reasons: readonly string[];
}

/** The verdict on a standard. */
export interface CoverageStandardCheck {
  /** {@link COVERAGE_STANDARD_RULES}.version. */
  readonly interpretation: string;
  readonly standard: CoverageStandard;
  /** True when every rule passes. */
  readonly passed: boolean;
  /** The site rule first, then one rule per zone in the statistics' order. */
  readonly rules: readonly CoverageRuleCheck[];
  /** Failing rules' reasons first, then the passing ones', for a summary. */
  readonly reasons: readonly string[];
}

/**
 * Checks coverage statistics against a plan's standard
 * `{ minSeenPct, priorityMinPosts }`, read as (see
 * {@link COVERAGE_STANDARD_RULES}):
 *
 *   site passes            ⇔ share of site cells seen by ≥ 1 post ≥ minSeenPct
 *   a priority zone passes ⇔ share of its cells seen by ≥ priorityMinPosts posts ≥ minSeenPct
 *
 * and the standard passes when the site and every zone pass (no zones: the
 * site rule alone). Shares count no-data cells as not seen. Each rule comes
 * back as data with the numbers and human-readable reasons that say where it
 * fails and by how much (points and km² short, the largest blind areas with
 * their position, the share without terrain data).
 *
 * Source: Kenning's reading of the plan standard (shared/schemas/plan.ts) —
 * no external source.
 *
 * @param statistics from `computeCoverageStatistics` (not modified); its
 *   zones are taken as the priority zones
 * @param standard minSeenPct in percent (0–100), priorityMinPosts 1–3
 * @returns a new verdict (plain data, JSON-safe)
 * @throws TerrainInputError `invalid-standard` for values out of range
 * @example
 * const verdict = checkCoverageStandard(stats, { minSeenPct: 70, priorityMinPosts: 2 });
 * verdict.passed; // false
 * verdict.reasons[0]; // 'Priority zone “Old-growth stand”: 48.0 % seen by at least 2 posts, 22.0 points short of 70 % …'
 */
export function checkCoverageStandard(statistics: CoverageStatistics, standard: CoverageStandard): CoverageStandardCheck {
  const { minSeenPct, priorityMinPosts } = standard;
  if (typeof minSeenPct !== 'number' || !(minSeenPct >= 0 && minSeenPct <= 100)) {
    throw new TerrainInputError('invalid-standard', `minSeenPct must be 0 to 100 %, got ${minSeenPct}.`, 'standard.minSeenPct');
  }
  if (!Number.isInteger(priorityMinPosts) || priorityMinPosts < 1 || priorityMinPosts > 3) {
    throw new TerrainInputError(
      'invalid-standard',
      `priorityMinPosts must be 1, 2 or 3, got ${priorityMinPosts}.`,
      'standard.priorityMinPosts',
    );
  }
  const [siteRule, zoneRule, crossRule, targetSiteRule, targetZoneRule] = COVERAGE_STANDARD_RULES.rules;
  const crossBearingMinPct = standard.crossBearingMinPct ?? null;
  if (crossBearingMinPct !== null && !(crossBearingMinPct >= 0 && crossBearingMinPct <= 100)) {
    throw new TerrainInputError(
      'invalid-standard',
      `crossBearingMinPct must be 0 to 100 %, got ${crossBearingMinPct}.`,
      'standard.crossBearingMinPct',
    );
  }
  const targetRules = standard.targetRules ?? [];
  const zoneLabel = (name: string) => `Priority zone “${name}”`;
  const rules: CoverageRuleCheck[] = [
    applyRule({
      id: siteRule.id,
      zoneName: null,
      label: 'The site',
      text: fill(siteRule.text, minSeenPct, 1, ''),
      area: statistics.site,
      minPosts: 1,
      minPct: minSeenPct,
      blindAreas: statistics.blindAreas,
    }),
    ...statistics.zones.map((zone) =>
      applyRule({
        id: zoneRule.id,
        zoneName: zone.name,
        label: zoneLabel(zone.name),
        text: fill(zoneRule.text, minSeenPct, priorityMinPosts, zone.name),
        area: zone,
        minPosts: priorityMinPosts,
        minPct: minSeenPct,
        blindAreas: [],
      }),
    ),
    ...(crossBearingMinPct === null
      ? []
      : statistics.zones.map((zone) =>
          applyRule({
            id: crossRule.id,
            zoneName: zone.name,
            label: zoneLabel(zone.name),
            text: fill(crossRule.text, crossBearingMinPct, 2, zone.name),
            area: zone,
            minPosts: 2,
            minPct: crossBearingMinPct,
            blindAreas: [],
            measure: 'goodCrossBearing',
          }),
        )),
    ...targetRules.flatMap((rule, r) => {
      if (!(rule.minPct >= 0 && rule.minPct <= 100) || ![1, 2, 3].includes(rule.minPosts)) {
        throw new TerrainInputError('invalid-standard', `Target rule ${r}: 1–3 posts and 0–100 %.`, `standard.targetRules.${r}`);
      }
      return rule.area === 'site'
        ? [
            applyRule({
              id: targetSiteRule.id,
              zoneName: null,
              label: `${rule.targetName}, the site`,
              text: fill(targetSiteRule.text, rule.minPct, rule.minPosts, '', rule.targetName),
              area: statistics.site,
              minPosts: rule.minPosts,
              minPct: rule.minPct,
              blindAreas: statistics.blindAreas,
            }),
          ]
        : statistics.zones.map((zone) =>
            applyRule({
              id: targetZoneRule.id,
              zoneName: zone.name,
              label: `${rule.targetName}, ${zoneLabel(zone.name).toLowerCase()}`,
              text: fill(targetZoneRule.text, rule.minPct, rule.minPosts, zone.name, rule.targetName),
              area: zone,
              minPosts: rule.minPosts,
              minPct: rule.minPct,
              blindAreas: [],
            }),
          );
    }),
  ];
  return {
    interpretation: COVERAGE_STANDARD_RULES.version,
    standard: { minSeenPct, priorityMinPosts, crossBearingMinPct, targetRules: targetRules.map((r) => ({ ...r })) },
    passed: rules.every((r) => r.passed),
    rules,
    reasons: [...rules.filter((r) => !r.passed), ...rules.filter((r) => r.passed)].flatMap((r) => r.reasons),
  };
}

interface RuleInput {
  readonly id: CoverageRuleId;
  readonly zoneName: string | null;
  readonly label: string;
  readonly text: string;
  readonly area: AreaCoverage;
  readonly minPosts: number;
  readonly minPct: number;
  readonly blindAreas: readonly BlindArea[];
  /** What counts: seen by `minPosts` (default) or good cross-bearings. */
  readonly measure?: 'seen' | 'goodCrossBearing';
}

function applyRule(input: RuleInput): CoverageRuleCheck {
  const { area, minPosts, minPct, label } = input;
  const crossing = input.measure === 'goodCrossBearing';
  const seen = crossing ? area.goodCrossBearing : minPosts === 1 ? area.seenBy1 : minPosts === 2 ? area.seenBy2 : area.seenBy3;
  const total = area.total.cells;
  const cellArea = total === 0 ? 0 : area.total.area / total;
  const byWhom = crossing
    ? 'two or more posts with good cross-bearings'
    : minPosts === 1
      ? 'at least one post'
      : `at least ${minPosts} posts`;
  const base = { id: input.id, zoneName: input.zoneName, minPosts, minPct, text: input.text };
  if (total === 0) {
    return {
      ...base,
      actualPct: 0,
      passed: false,
      shortfallPct: minPct,
      shortfallArea: 0,
      reasons: [`${label} has no cells on the terrain grid, so its coverage cannot be judged; it fails the standard.`],
    };
  }
  // Integer-safe comparison: seen/total ≥ minPct/100.
  const passed = seen.cells * 100 >= minPct * total - 1e-9 * total;
  const neededCells = passed ? 0 : Math.max(0, Math.ceil((minPct * total) / 100 - 1e-9) - seen.cells);
  const shortfallPct = passed ? 0 : minPct - seen.pct;
  const reasons: string[] = [];
  if (passed) {
    reasons.push(`${label}: ${pct(seen.pct)} seen by ${byWhom}; the standard asks ${pct(minPct)} — passes.`);
  } else {
    reasons.push(
      `${label}: ${pct(seen.pct)} seen by ${byWhom}, ${points(shortfallPct)} short of the ${pct(minPct)} the standard asks ` +
        `(about ${km2(neededCells * cellArea)} more would have to be seen).`,
    );
    const largest = input.blindAreas.slice(0, 3);
    if (largest.length > 0) {
      reasons.push(`${label}: largest blind areas ${largest.map(describeBlindArea).join('; ')}.`);
    }
  }
  if (area.noData.cells > 0) {
    reasons.push(`${label}: ${km2(area.noData.area)} (${pct(area.noData.pct)}) has no terrain data and counts as not seen.`);
  }
  return { ...base, actualPct: seen.pct, passed, shortfallPct, shortfallArea: neededCells * cellArea, reasons };
}

function fill(template: string, minPct: number, minPosts: number, zone: string, target = ''): string {
  return template
    .replace('{minPct}', String(minPct))
    .replace('{minPosts}', String(minPosts))
    .replace('{zone}', zone)
    .replace('{target}', target);
}

function pct(value: number): string {
  return `${value.toFixed(1)} %`;
}

function points(value: number): string {
  return value < 0.05 ? 'less than 0.1 points' : `${value.toFixed(1)} points`;
}

function km2(areaM2: number): string {
  const value = areaM2 / 1e6;
  if (value > 0 && value < 0.005) return 'less than 0.01 km²';
  return `${value.toFixed(2)} km²`;
}

function describeBlindArea(blind: BlindArea): string {
  const { x, y, col, row } = blind.centroid;
  return `${km2(blind.area)} around E ${Math.round(x)} m, N ${Math.round(y)} m (col ${Math.round(col)}, row ${Math.round(row)})`;
}

/** A band rule of the plan's standard (see `ShoreBandRuleSchema` in shared/schemas/plan.ts). */
export interface ShoreBandRule {
  readonly band: string;
  readonly minPosts: number;
  readonly minPct: number;
  /** Local hours, from (inclusive) to (exclusive). */
  readonly fromHour: number;
  readonly toHour: number;
}

/** A band rule's verdict, in the shape of the other rules (lengths along the shore in `shortfallArea`'s place: 0). */
export interface ShoreBandRuleCheck extends Omit<CoverageRuleCheck, 'id' | 'zoneName' | 'shortfallArea' | 'reasons'> {
  readonly id: string;
  readonly zoneName: null;
  readonly shortfallArea: 0;
  readonly reasons: string[];
}

const hh = (h: number) => `${String(h).padStart(2, '0')}:00`;

/**
 * Checks the band rules of a standard against a case's band figures:
 *
 *   a band rule passes ⇔ in every hour of the window (local hours fromHour ≤ h < toHour of the
 *   series' days) the share of the shore watched in the band by ≥ minPosts posts on watch ≥ minPct
 *
 * With no hourly series (no roster read), every post of the plan counts as on watch and the
 * band's own figures are used. The rule's `actualPct` is the lowest hourly share in the window.
 * A rule naming a band the site does not have fails, saying so.
 *
 * Source: Kenning's reading of the plan standard (shared/schemas/plan.ts) — no external source.
 */
export function checkShoreBandRules(
  rules: readonly ShoreBandRule[],
  bands: readonly { name: string; watched1: { pct: number }; watched2: { pct: number } }[],
  hourly: {
    hours: readonly {
      local: string;
      hour: number;
      bands: readonly { name: string; watched1Pct: number; watched2Pct: number }[];
    }[];
  } | null,
): ShoreBandRuleCheck[] {
  return rules.map((rule, i) => {
    const window = `${hh(rule.fromHour)}–${hh(rule.toHour)}`;
    const text = `${rule.band}: ${rule.minPct} % of the shore watched by ≥ ${rule.minPosts} post${rule.minPosts > 1 ? 's' : ''}, ${window}`;
    const base = {
      id: `band-${i}`,
      zoneName: null,
      minPosts: rule.minPosts,
      minPct: rule.minPct,
      text,
      shortfallArea: 0 as const,
    };
    const band = bands.find((b) => b.name.toLowerCase() === rule.band.trim().toLowerCase());
    if (!band) {
      return {
        ...base,
        actualPct: 0,
        passed: false,
        shortfallPct: rule.minPct,
        reasons: [`${text}: the site has no band “${rule.band}”.`],
      };
    }
    const pick = (p: { watched1Pct: number; watched2Pct: number }) => (rule.minPosts >= 2 ? p.watched2Pct : p.watched1Pct);
    const inWindow = hourly ? hourly.hours.filter((h) => h.hour >= rule.fromHour && h.hour < rule.toHour) : [];
    const samples = hourly
      ? inWindow.map((h) => {
          const b = h.bands.find((x) => x.name === band.name);
          return { local: h.local, pct: b ? pick(b) : 0 };
        })
      : [{ local: 'every post on watch', pct: rule.minPosts >= 2 ? band.watched2.pct : band.watched1.pct }];
    const actualPct = samples.length ? Math.min(...samples.map((s) => s.pct)) : 0;
    const short = samples.filter((s) => s.pct < rule.minPct);
    const passed = samples.length > 0 && short.length === 0;
    const reasons = passed
      ? [`${text}: met (lowest ${actualPct.toFixed(1)} %).`]
      : short.length
        ? [
            `${text}: short in ${short.length} hour${short.length > 1 ? 's' : ''} — ${short
              .slice(0, 6)
              .map((s) => `${s.local} ${s.pct.toFixed(1)} %`)
              .join(', ')}${short.length > 6 ? ', …' : ''}.`,
          ]
        : [`${text}: no hour of the window in the series.`];
    return { ...base, actualPct, passed, shortfallPct: passed ? 0 : Math.max(0, rule.minPct - actualPct), reasons };
  });
}
