import { createHash } from 'node:crypto';
import { canonicalJson } from '@/shared/plans/canonical-json';
import type { Plan } from '@/shared/schemas/plan';
import type { SitingCandidate } from '@/shared/schemas/siting';
import type { CoverageRunInputs } from '../coverage/coverage-inputs';

/** A candidate as frozen: where it stands and how it would be built. */
export interface FrozenCandidate extends SitingCandidate {
  /** Eye height above the tower's platform, metres. */
  eyeHeightM: number;
  /** Viewing sector of the post it stands for, degrees true; null = all round. */
  sector: { fromDeg: number; toDeg: number } | null;
  /** The post's kind and structure height, when a post (a plan reuses the post when the height is its own). */
  post: { kind: string; structureHeightM: number; groundElevationM: number } | null;
}

/** A frozen candidate as the API shows it (where it stands, without how it would be built). */
export function describeCandidate(c: FrozenCandidate): SitingCandidate {
  return { index: c.index, name: c.name, postId: c.postId, latDeg: c.latDeg, lonDeg: c.lonDeg, source: c.source };
}

/**
 * Everything a siting run computes from, resolved and frozen when it is asked
 * for: the same inputs give the same choice (the hash says whether two runs
 * had the same).
 */
export interface SitingRunInputs {
  terrain: { id: string; sha256: string };
  site: CoverageRunInputs['site'];
  /** The one target, as coverage runs freeze targets. */
  target: CoverageRunInputs['targets'][number];
  /** The condition set's conditions (ducts left out, as coverage runs do). */
  conditions: CoverageRunInputs['conditions'];
  skippedConditions: CoverageRunInputs['skippedConditions'];
  earthRadiusM: number;
  resolutionArcmin: number;
  detectionModel: string;
  blindAreaMinAreaM2: number;
  /** Kept posts, as coverage runs freeze posts. */
  kept: CoverageRunInputs['posts'];
  keepPostIds: string[];
  /** Given candidates, or null when they are picked from the terrain (`fromTerrain`). */
  candidates: FrozenCandidate[] | null;
  fromTerrain: {
    spacingM: number;
    maxCandidates: number;
    accessLine: { line: [number, number][]; withinM: number } | null;
  } | null;
  heightsM: number[];
  costs: number[] | null;
  budget: number | null;
  goalPct: number | null;
  eyeHeightM: number;
  count: number;
  minPosts: 1 | 2;
  zoneWeights: boolean;
  targetId: string;
  targetName: string;
  conditionSetId: string;
  conditionSetName: string;
  /** Standard and lookout the draft plan gets (the site's approved plan's, else the defaults), frozen with the run. */
  standard: Plan['standard'];
  lookout: Plan['lookout'];
}

/** sha256 of the canonical JSON of the inputs, hex. */
export const sitingInputsHash = (inputs: SitingRunInputs) => createHash('sha256').update(canonicalJson(inputs)).digest('hex');
