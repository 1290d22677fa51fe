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
