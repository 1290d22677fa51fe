import type { SitingRun, SitingRunInput } from '@/shared/schemas/siting';
import { SITING_ADDED } from '@/shared/schemas/siting';

/** One point of the coverage curve: towers added (0 = the kept ones alone) against area seen, m², and share, %. */
export interface CurvePoint {
  towers: number;
  seenM2: number;
  seenPct: number;
  label: string;
}

/** The coverage curve of a finished run: the kept posts, then each chosen tower in order. */
export function coverageCurve(run: Pick<SitingRun, 'keptSeenM2' | 'keptSeenPct' | 'steps'>): CurvePoint[] {
  if (run.keptSeenM2 === null || run.keptSeenPct === null) return [];
  return [
    { towers: 0, seenM2: run.keptSeenM2, seenPct: run.keptSeenPct, label: 'Kept posts' },
    ...run.steps.map((s, i) => ({
      towers: i + 1,
      seenM2: s.totalSeenM2,
      seenPct: s.totalSeenPct,
      label: s.candidate.name,
    })),
  ];
}

/** Colours of the added-area map: the kept posts' ground, then one per chosen tower (cycling). */
export const STEP_COLOURS = ['#B8461B', '#2F5C44', '#3B6FD9', '#8A4FB0', '#C98A16', '#0F7F86'] as const;
export const KEPT_COLOUR = '#C9C0AC';
export const UNSEEN_COLOUR = '#EFEBE1';

/** The colour of an added-area code (null: not drawn). */
export function addedColour(code: number): string | null {
  if (code === SITING_ADDED.outside) return null;
  if (code === SITING_ADDED.unseen) return UNSEEN_COLOUR;
  if (code === SITING_ADDED.kept) return KEPT_COLOUR;
  return STEP_COLOURS[(code - SITING_ADDED.firstStep) % STEP_COLOURS.length]!;
}

/** A candidate typed as "lat, lon" (decimal degrees, comma or space between); null when it does not read. */
export function parseLatLon(text: string): { latDeg: number; lonDeg: number } | null {
  const parts = text
    .trim()
    .split(/[\s,;]+/)
    .filter(Boolean)
    .map(Number);
  if (parts.length !== 2 || parts.some((n) => !Number.isFinite(n))) return null;
  const [latDeg, lonDeg] = parts as [number, number];
  if (Math.abs(latDeg) > 90 || Math.abs(lonDeg) > 180) return null;
  return { latDeg, lonDeg };
}

/** Heights typed as "0, 10, 20" (metres, or the person's height unit converted by `toM`); null when one does not read. */
export function parseHeights(text: string, toM: (value: number) => number = (v) => v): number[] | null {
  const parts = text
    .split(/[\s,;]+/)
    .filter(Boolean)
    .map(Number);
  if (parts.length === 0 || parts.some((n) => !Number.isFinite(n))) return null;
  return parts.map((v) => Math.round(toM(v) * 100) / 100);
}

/** Candidates of a request as people would name them, for the run's summary line. */
export function candidatesSummary(candidates: SitingRunInput['candidates']): string {
  if (!Array.isArray(candidates)) return 'from the terrain';
  return `${candidates.length} ${candidates.length === 1 ? 'candidate' : 'candidates'}`;
}

/** What the form holds for the optional limits of a run, as typed. */
export interface SitingLimitsText {
  /** Cost of each height, in the order of the heights, separated by commas; blank = no costs. */
  costs: string;
  /** Most to spend, in the costs' unit; blank = no budget. */
  budget: string;
  /** Stop once this share of the site is seen, %; blank = choose every tower asked for. */
  goalPct: string;
}

/**
 * The optional limits of a run read from the form: costs per height, budget
 * and coverage goal, with an error per field (keyed as the API names them)
 * for what does not read or does not fit — the same rules the API applies,
 * so most mistakes are shown before anything is sent.
 */
export function readSitingLimits(
  text: SitingLimitsText,
  heightCount: number | null,
): { costs: number[] | null; budget: number | null; goalPct: number | null; errors: Record<string, string> } {
  const errors: Record<string, string> = {};
  const numbers = (s: string) =>
    s
      .split(/[\s,;]+/)
      .filter(Boolean)
      .map(Number);
  let costs: number[] | null = null;
  if (text.costs.trim() !== '') {
    costs = numbers(text.costs);
    if (costs.some((c) => !Number.isFinite(c))) errors.costs = 'Type the costs as numbers, e.g. 0, 40, 90.';
    else if (costs.some((c) => c < 0)) errors.costs = 'Costs cannot be negative.';
    else if (heightCount !== null && costs.length !== heightCount) {
      errors.costs = `Give one cost per tower height (${heightCount}).`;
    }
  }
  let budget: number | null = null;
  if (text.budget.trim() !== '') {
    budget = Number(text.budget.trim());
    if (!Number.isFinite(budget) || budget <= 0) errors.budget = 'A budget is a number more than 0.';
    else if (costs === null) errors.budget = 'A budget needs the costs of the heights.';
  }
  let goalPct: number | null = null;
  if (text.goalPct.trim() !== '') {
    goalPct = Number(text.goalPct.trim().replace(/%$/, ''));
    if (!Number.isFinite(goalPct) || goalPct <= 0 || goalPct > 100)
      errors.goalPct = 'A share of the site, more than 0 and at most 100 %.';
  }
  return { costs, budget, goalPct, errors };
}

/** The access line as the form holds it: points tapped on the map, and the distance from it, as typed. */
export function readAccessLine(
  points: readonly { latDeg: number; lonDeg: number }[],
  withinText: string,
): { accessLine: { line: [number, number][]; withinM: number } | null; errors: Record<string, string> } {
  const errors: Record<string, string> = {};
  if (points.length < 2) errors['candidates.fromTerrain.accessLine.line'] = 'Tap at least two points of the line on the map.';
  const withinM = Number(withinText.trim());
  if (withinText.trim() === '' || !Number.isFinite(withinM) || withinM <= 0 || withinM > 50_000) {
    errors['candidates.fromTerrain.accessLine.withinM'] = 'A distance in metres, more than 0 and at most 50 000.';
  }
  if (Object.keys(errors).length > 0) return { accessLine: null, errors };
  return { accessLine: { line: points.map((p) => [p.lonDeg, p.latDeg]), withinM }, errors };
}
