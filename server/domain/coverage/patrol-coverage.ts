import type { PatrolFigures } from '@/shared/schemas/coverage';
import { patrolSampleSpacing, samplePatrol, type PatrolSamples } from '@/shared/patrol/patrol-samples';
import { geographicRange } from '@/shared/sightline/geographic-range';
import { randomSearchPod } from '@/shared/sightline/random-search-pod';
import type { GridProjection } from '@/shared/terrain/grid-projection';
import type { HiddenHeightRaster, LookoutPost, SightConditions } from '@/shared/terrain/hidden-height-raster';
import { locatePostCell } from '@/shared/terrain/locate-post-cell';
import { PatrolSweep, patrolFractionCodes, type PatrolSweepResult, type PatrolTarget } from '@/shared/terrain/patrol-sweep';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';
import type { CoverageRunInputs } from './coverage-inputs';

/** Computes viewsheds as the run does (`ComputeViewsheds` of compute-coverage, restated here to keep the import one-way). */
type ComputeViewsheds = (
  terrain: TerrainRaster,
  jobs: readonly { readonly post: LookoutPost; readonly conditions: SightConditions }[],
  onDone: () => void,
) => Promise<HiddenHeightRaster[]>;

/** Most places one patrol's view is computed from per condition; a longer route gets a wider spacing (reported). */
export const MAX_PATROL_SAMPLES = 240;
/** Viewsheds sent to the pool at once: bounds the memory to this many rasters per patrol. */
const BATCH = 16;

/** A patrol post placed on the run's grid. */
export interface PlacedPatrol {
  readonly input: CoverageRunInputs['posts'][number] & { patrol: NonNullable<CoverageRunInputs['posts'][number]['patrol']> };
  /** The route in grid metres. */
  readonly route: { x: number; y: number }[];
  /** Eye height above the surface under the craft, metres. */
  readonly eyeHeight: number;
  readonly cycleS: number;
}

/** One patrol swept under one condition. */
export interface SweptPatrol {
  readonly placed: PlacedPatrol;
  readonly samples: PatrolSamples;
  readonly sweep: PatrolSweep;
  /** The first sample's raster: the grid, condition and reference cell the network sees the patrol by. */
  readonly first: HiddenHeightRaster;
}

/**
 * The run's patrol posts on its grid: the route in grid metres, the eye
 * height above the surface the craft is over (structure/deck or altitude +
 * eye; on the flat datum the recorded ground elevation is added, as for fixed
 * posts), the cycle in seconds. A waypoint off the grid is refused by name.
 */
export function placePatrols(inputs: CoverageRunInputs, terrain: TerrainRaster, projection: GridProjection): PlacedPatrol[] {
  const flat = inputs.terrain === null;
  return inputs.posts.flatMap((p) => {
    if (!p.patrol) return [];
    const route = p.patrol.route.map((w, i) => {
      const { x, y } = projection.toGrid(w);
      try {
        locatePostCell(terrain, x, y);
      } catch (error) {
        if (error instanceof TerrainInputError)
          throw new TerrainInputError(error.code, `Waypoint ${i + 1} of “${p.name}”'s route lies outside the grid.`, 'postIds');
        throw error;
      }
      return { x, y };
    });
    const input = p as PlacedPatrol['input'];
    return [{ input, route, eyeHeight: p.aboveGroundM + (flat ? p.groundElevationM : 0), cycleS: p.patrol.cycleMinutes * 60 }];
  });
}

/**
 * The range the samples' spacing is made for: the nearest of the targets'
 * ranges from the craft — each the lesser of its detection range limit and
 * its geographic range over the sea from the craft's eye — at least one cell.
 */
function spacingRange(patrol: PlacedPatrol, targets: readonly PatrolTarget[], conditions: SightConditions, cellSize: number) {
  let nearest = Infinity;
  for (const t of targets) {
    const geographic = geographicRange(patrol.eyeHeight, t.countsFromM, {
      k: conditions.refractionCoefficient,
      earthRadiusM: conditions.earthRadius,
    }).value;
    nearest = Math.min(nearest, t.rangeM ?? Infinity, geographic ?? Infinity);
  }
  return Math.max(Number.isFinite(nearest) ? nearest : cellSize, cellSize);
}

/**
 * Sweeps every patrol under one condition: samples along its route at the
 * justified spacing (`patrolSampleSpacing`; at most {@link MAX_PATROL_SAMPLES}),
 * the viewshed of each sample through `computeViewsheds` in batches, each
 * judged for every target as it comes (`PatrolSweep`). `checkpoint` runs
 * after each batch and may throw to stop (a cancel).
 */
export async function sweepPatrols(
  patrols: readonly PlacedPatrol[],
  terrain: TerrainRaster,
  conditions: SightConditions,
  targets: readonly PatrolTarget[],
  computeViewsheds: ComputeViewsheds,
  onDone: () => void,
  checkpoint: () => Promise<void> = async () => {},
): Promise<SweptPatrol[]> {
  const swept: SweptPatrol[] = [];
  for (const placed of patrols) {
    const samples = patrolSamplesOf(placed, targets, conditions, terrain.cellSize);
    const sweep = new PatrolSweep(terrain, targets);
    let first: HiddenHeightRaster | null = null;
    for (let start = 0; start < samples.samples.length; start += BATCH) {
      const batch = samples.samples.slice(start, start + BATCH);
      const jobs = batch.map((s) => {
        const post: LookoutPost = { ...locatePostCell(terrain, s.x, s.y), eyeHeight: placed.eyeHeight };
        return { post, conditions };
      });
      const rasters = await computeViewsheds(terrain, jobs, onDone);
      rasters.forEach((raster, i) => sweep.add(raster, batch[i]!.weightS));
      first ??= rasters[0]!;
      await checkpoint();
    }
    swept.push({ placed, samples, sweep, first: first! });
  }
  return swept;
}

/**
 * A patrol's samples under a condition: at the justified spacing, widened on a
 * route so long that it would take more than {@link MAX_PATROL_SAMPLES}.
 */
export function patrolSamplesOf(
  patrol: PlacedPatrol,
  targets: readonly PatrolTarget[],
  conditions: SightConditions,
  cellSize: number,
): PatrolSamples {
  const spacing = patrolSampleSpacing(spacingRange(patrol, targets, conditions, cellSize), cellSize);
  const lengthM = patrol.route
    .slice(1)
    .reduce((m, w, i) => m + Math.hypot(w.x - patrol.route[i]!.x, w.y - patrol.route[i]!.y), 0);
  const capped = Math.max(spacing, lengthM / MAX_PATROL_SAMPLES);
  return samplePatrol(patrol.route, patrol.input.patrol.speedMps, patrol.cycleS, capped);
}

const round = (value: number, digits: number) => Math.round(value * 10 ** digits) / 10 ** digits;

/**
 * One patrol's figures for one target: the area it watches at least once
 * within the judged area, the mean share of the cycle those cells are in
 * view, and the probability of detection along its track.
 *
 * POD model (stated on screen): the definite-range law — a target within the
 * detection range R of the craft is detected, beyond it not — gives the
 * sweep width W = 2R (Koopman, Search and Screening, 1946/1980; IAMSAR
 * Manual Vol. II, sweep width and coverage, from memory); R is the lesser of
 * the target's detection range limit and its geographic range over the sea
 * from the craft's eye. The coverage factor of one cycle is C = W·L/A (L the
 * track run per cycle, A the judged area) and the POD of a search whose
 * tracks are not laid out to cover A evenly is POD = 1 − e^(−C) (random
 * search; `randomSearchPod`). Terrain that hides the sea from the craft is not
 * in W: `sweptPct` (the judged area watched at least once) is the figure the
 * terrain limits.
 */
export function patrolFigures(args: {
  swept: SweptPatrol;
  result: PatrolSweepResult;
  target: PatrolTarget;
  conditions: SightConditions;
  mask: Uint8Array | null;
  cellSize: number;
}): PatrolFigures {
  const { swept, result, target, mask, cellSize } = args;
  const { placed, samples } = swept;
  const cellArea = cellSize * cellSize;
  let judged = 0;
  let watched = 0;
  let fractionSum = 0;
  for (let i = 0; i < result.classes.length; i++) {
    if (mask !== null && mask[i] !== 1) continue;
    judged++;
    const c = result.classes[i];
    if (c === VISIBILITY_CLASS.seen || c === VISIBILITY_CLASS.targetOnly) {
      watched++;
      fractionSum += result.timeInViewS[i]! / placed.cycleS;
    }
  }
  const searchAreaM2 = judged * cellArea;
  const geographic = geographicRange(placed.eyeHeight, target.countsFromM, {
    k: args.conditions.refractionCoefficient,
    earthRadiusM: args.conditions.earthRadius,
  }).value;
  const rangeM = Math.min(target.rangeM ?? Infinity, geographic ?? Infinity);
  const sweepWidthM = Number.isFinite(rangeM) && rangeM > 0 ? 2 * rangeM : null;
  const coverageFactor = sweepWidthM !== null && searchAreaM2 > 0 ? (sweepWidthM * samples.lengthM) / searchAreaM2 : null;
  return {
    postId: placed.input.id,
    postName: placed.input.name,
    routeLengthM: round(samples.lengthM, 1),
    cycleMinutes: placed.input.patrol.cycleMinutes,
    transitMinutes: round(samples.transitS / 60, 2),
    samples: samples.samples.length,
    sampleSpacingM: round(samples.spacingM, 1),
    searchAreaM2,
    sweptAreaM2: watched * cellArea,
    sweptPct: judged ? round((100 * watched) / judged, 2) : 0,
    meanFractionInView: watched ? round(fractionSum / watched, 4) : 0,
    sweepWidthM: sweepWidthM === null ? null : round(sweepWidthM, 1),
    coverageFactor: coverageFactor === null ? null : round(coverageFactor, 4),
    pod: coverageFactor === null ? null : round(randomSearchPod(coverageFactor), 4),
  };
}

/** The patrol's fraction-of-cycle layer, cut to the judged area. */
export const patrolLayer = (swept: SweptPatrol, result: PatrolSweepResult, mask: Uint8Array | null) =>
  patrolFractionCodes(result, swept.placed.cycleS, mask);
