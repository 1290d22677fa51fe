import type { CoverageCase } from '@/shared/schemas/coverage';
import type { DetectionRange } from '@/shared/sightline/detection-range';
import type { GridSpec } from '@/shared/terrain/grid-spec';
import type { GridProjection } from '@/shared/terrain/grid-projection';
import { coveragePostOf, type LimitShares, type NetworkCoverage, type NetworkPost } from '@/shared/terrain/network-coverage';
import { countPostsPerCell } from '@/shared/terrain/posts-per-cell';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';
import type { CoverageRunInputs } from './coverage-inputs';

/* One case of a coverage run (a target under a condition): the core's figures in the stored/API shape. */

const SEEN = VISIBILITY_CLASS.seen;
const TARGET_ONLY = VISIBILITY_CLASS.targetOnly;
const round = (value: number, digits: number) => Math.round(value * 10 ** digits) / 10 ** digits;

/**
 * Site cells where a post sees the target: from its posts-per-cell counts
 * (`kind` 1: count > 0) or straight from its visibility classes (`kind` 0:
 * seen or target only). A plain loop: this runs on every cell for every post
 * and case.
 */
function countSeen(values: Uint8Array, kind: 0 | 1, siteMask: Uint8Array | null): number {
  // "Sees" is a range of byte values, low … low + span: counts 1 … 255, or the classes seen and
  // target only (consecutive codes). (v − low) as unsigned ≤ span tests it without a branch, and
  // the test is summed rather than branched on, since it flips often between neighbouring cells.
  const low = kind === 1 ? 1 : SEEN;
  const span = kind === 1 ? 254 : TARGET_ONLY - SEEN;
  let seen = 0;
  if (siteMask === null) {
    for (let j = 0; j < values.length; j++) seen += +((values[j]! - low) >>> 0 <= span);
  } else {
    for (let j = 0; j < values.length; j++) seen += +((values[j]! - low) >>> 0 <= span) & +(siteMask[j] === 1);
  }
  return seen;
}

/**
 * Each post's share of the site (or its sea part) where it sees the target, %:
 * its visibility classes, cut to its sector when it has one.
 */
export function postSeenShares(
  grid: GridSpec,
  network: readonly NetworkPost[],
  postClasses: readonly Uint8Array[],
  siteMask: Uint8Array | null,
  posts: readonly { id: string; name: string }[],
): CoverageCase['posts'] {
  const siteCells = siteMask ? siteMask.reduce((n, v) => n + v, 0) : grid.width * grid.height;
  return network.map((entry, i) => {
    const classes = postClasses[i]!;
    // Cells where the post sees the target: its classes, and its sector when it has one.
    const seen = entry.sector
      ? countSeen(countPostsPerCell(grid, [coveragePostOf(entry, classes)]).counts, 1, siteMask)
      : countSeen(classes, 0, siteMask);
    return { postId: posts[i]!.id, postName: posts[i]!.name, seenPct: siteCells ? round((100 * seen) / siteCells, 2) : 0 };
  });
}

/**
 * What limits detection in one case: the target's range limit (visibility,
 * angular size, luminous range or wave screen) and which limit decided most
 * of the undetected area — the view (terrain, horizon, sectors) or that range.
 */
function detectionOfCase(detection: DetectionRange, limits: LimitShares, seaOnly: boolean): CoverageCase['detection'] {
  const rangeLimitedBy = detection.rangeLimit.limitedBy;
  const { viewCells, rangeCells, cellArea } = limits;
  const decidedBy =
    viewCells + rangeCells === 0 ? null : rangeLimitedBy !== null && rangeCells > viewCells ? rangeLimitedBy : 'view';
  return {
    rangeLimitM: detection.rangeLimit.rangeM,
    rangeLimitedBy,
    waveScreenM: detection.limits.waveScreenM,
    reason: detection.reason === 'screened-by-waves' || detection.reason === 'unlit-at-night' ? detection.reason : null,
    decidedBy,
    areaM2: {
      detected: limits.detectedCells * cellArea,
      noData: limits.noDataCells * cellArea,
      view: viewCells * cellArea,
      range: rangeCells * cellArea,
    },
    seaOnly,
  };
}

/** The stored case of one target under one condition. */
export function coverageCaseOf(args: {
  key: string;
  target: CoverageRunInputs['targets'][number];
  condition: CoverageRunInputs['conditions'][number];
  coverage: NetworkCoverage;
  perPost: CoverageCase['posts'];
  detection: DetectionRange;
  seaOnly: boolean;
  projection: GridProjection;
  detectionModel: string;
  tideLevelM?: number | null;
}): CoverageCase {
  const { key, target, condition, coverage, projection } = args;
  const { statistics, check } = coverage;
  return {
    key,
    targetId: target.id,
    targetName: target.name,
    targetHeightM: target.heightM,
    conditionSetId: condition.conditionSetId,
    conditionSetName: condition.conditionSetName,
    conditionIndex: condition.conditionIndex,
    conditionLabel: condition.label,
    refractionCoefficient: condition.k,
    site: statistics.site,
    zones: statistics.zones.map((z) => ({ ...z })),
    blindAreas: statistics.blindAreas.map((b) => ({
      cells: b.cells,
      area: b.area,
      centroid: { x: b.centroid.x, y: b.centroid.y, ...projection.toLatLon(b.centroid.x, b.centroid.y) },
      interior: { x: b.interior.x, y: b.interior.y, ...projection.toLatLon(b.interior.x, b.interior.y) },
    })),
    blindSummary: {
      count: statistics.blindSummary.count,
      area: statistics.blindSummary.area,
      minArea: statistics.blindSummary.minArea,
    },
    check: {
      interpretation: check.interpretation,
      passed: check.passed,
      rules: check.rules.map((r) => ({ ...r, reasons: [...r.reasons] })),
      reasons: [...check.reasons],
    },
    posts: args.perPost,
    detection: detectionOfCase(args.detection, coverage.limits, args.seaOnly),
    detectionModel: args.detectionModel,
    tideLevelM: args.tideLevelM ?? null,
    shore: null,
    bands: [],
    gaps: [],
    hourly: null,
  };
}
