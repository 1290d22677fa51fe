import type { CoordinateFormat } from '@/shared/geo/types';
import type { StandardVerdict } from '@/shared/plans/standard-verdict';
import type { CoverageLayerName } from '@/shared/schemas/coverage';
import type { Plan, PlanSnapshot } from '@/shared/schemas/plan';
import type { Site } from '@/shared/schemas/site';
import type { GridProjection } from '@/shared/terrain/grid-projection';
import type { TerrainRecord } from '@/server/data/repositories/terrain-repository';
import type { ClassLayer, Hillshade } from './map-picture';
import type { Paper } from './pdf-layout';

export interface PrintOptions {
  paper: Paper;
  /** The person's coordinate format for positions on paper. */
  coordinateFormat: CoordinateFormat;
}

/** Everything the plan package prints, gathered and checked before the first page is drawn. */
export interface PlanPackageData {
  plan: Plan;
  organizationName: string;
  site: Site;
  /** The frozen revision, or null for the preview of a plan that can still change. */
  revision: {
    number: number;
    submittedAt: string;
    submittedBy: string;
    exceptionNote: string | null;
    approved: boolean;
  } | null;
  snapshot: PlanSnapshot;
  /** The revision's content hash, or for a preview the hash it would be frozen with now. */
  contentHash: string;
  verdict: StandardVerdict;
  /** Reviewers' justifications for approving this revision as an exception. */
  justifications: { reviewer: string; at: string; text: string }[];
  signatures: { step: string; name: string; role: string; at: string; revision: number | null }[];
  terrain: TerrainRecord | null;
  hillshade: Hillshade | null;
  /** The grid CRS the maps are drawn in. */
  projection: GridProjection;
  /** One stored layer of the coverage run, decoded and checked against the hash the revision froze. */
  layer: (caseKey: string, layer: Exclude<CoverageLayerName, 'post-visibility'>) => Promise<ClassLayer | null>;
  options: PrintOptions;
  generatedAt: Date;
}
