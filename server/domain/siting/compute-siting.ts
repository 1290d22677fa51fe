// Over 300 lines: one siting run — candidates from posts, points or the terrain, their viewsheds, the choice and its map — in one flow.
import type { SitingCandidate, SitingStep } from '@/shared/schemas/siting';
import { SITING_ADDED } from '@/shared/schemas/siting';
import type { CoverageGrid } from '@/shared/schemas/coverage';
import { rangeLimitsOf } from '@/shared/sightline/detection-inputs';
import { chooseTowerSites, type SitingOption } from '@/shared/terrain/choose-tower-sites';
import { encodeClassRaster } from '@/shared/terrain/encode-class-raster';
import type { EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';
import { gridProjection, type GridProjection } from '@/shared/terrain/grid-projection';
import { gridSpecToM } from '@/shared/terrain/grid-spec';
import type { SightConditions } from '@/shared/terrain/hidden-height-raster';
import { pickTerrainCandidates } from '@/shared/terrain/pick-terrain-candidates';
import { countPostsPerCell } from '@/shared/terrain/posts-per-cell';
import { coveragePostOf } from '@/shared/terrain/network-coverage';
import { bitsetWords, SitingState, type SitingObjective, type SitingView } from '@/shared/terrain/siting-objective';
import { elevationAt } from '@/shared/terrain/terrain-elevation';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { classifyVisibility } from '@/shared/terrain/visibility-classes';
import {
  coverageAreas,
  networkOf,
  placePosts,
  viewshedRange,
  type ComputeViewsheds,
  type ReportProgress,
} from '../coverage/compute-coverage';
import { caseKeyOf, type CoverageRunInputs } from '../coverage/coverage-inputs';
import { describeCandidate, type FrozenCandidate, type SitingRunInputs } from './siting-inputs';

/** What a finished run stores (the `result` column). */
export interface SitingResult {
  method: 'exact' | 'greedy' | 'greedy-swap';
  candidates: SitingCandidate[];
  /** Ground elevation at each candidate (its cell, bilinear), metres: the draft plan's new posts get it. */
  candidateGroundM: (number | null)[];
  siteAreaM2: number;
  keptSeenM2: number;
  keptSeenPct: number;
  steps: SitingStep[];
  chosen: { candidate: SitingCandidate; heightM: number }[];
  addedLayer: EncodedClassRaster;
  grid: CoverageGrid;
  evaluations: number;
  swaps: number;
}

/** Posts computed in one batch: memory stays at this many hidden-height rasters. */
const BATCH = 16;

/**
 * A siting run: the candidates (given, or picked from the terrain), the
 * viewshed of every kept post and every candidate × height under every
 * condition of the set (the coverage run's own placement, range limits and
 * counting, so the figures match a coverage run of the plan made from the
 * result), the objective's cells and weights, the choice
 * (`chooseTowerSites`), then the curve's figures and the added-area layer.
 *
 * Cells: those of the site (its sea part for a target on the water, as
 * coverage runs count), with terrain data. Weights: 1, or with `zoneWeights`
 * the largest weight of the priority zones a cell lies in (at least 1). The
 * objective adds up the set's conditions (each counts once); areas
 * reported are their mean, unweighted, as coverage runs count.
 */
export async function computeSiting(
  inputs: SitingRunInputs,
  terrain: TerrainRaster,
  computeViewsheds: ComputeViewsheds,
  report: ReportProgress,
): Promise<SitingResult> {
  const projection = gridProjection(terrain.crs);
  const N = terrain.width * terrain.height;
  const C = inputs.conditions.length;
  const coverageLike = {
    site: inputs.site,
    terrain: inputs.terrain,
  } as CoverageRunInputs;
  const areas = coverageAreas({ ...coverageLike, posts: [] } as CoverageRunInputs, terrain, projection);
  const area = inputs.target.onWater && areas.sea !== null ? areas.sea : areas.land;
  const inSite = (g: number) => area.siteMask === null || area.siteMask[g] === 1;

  const candidates = inputs.candidates ?? terrainCandidates(inputs, terrain, projection, area.siteMask);
  const options = candidates.flatMap((c) =>
    inputs.heightsM.map((heightM, h) => ({ candidate: c.index, heightM, cost: inputs.costs?.[h] ?? 0 })),
  );
  const posts: CoverageRunInputs['posts'] = [
    ...inputs.kept,
    ...options.map((o) => {
      const c = candidates[o.candidate]!;
      return {
        id: `candidate-${c.index}-${o.heightM}`,
        name: c.name,
        latDeg: c.latDeg,
        lonDeg: c.lonDeg,
        groundElevationM: 0,
        aboveGroundM: o.heightM + c.eyeHeightM,
        sector: c.sector,
      };
    }),
  ];
  const placed = placePosts({ ...coverageLike, posts } as CoverageRunInputs, terrain, projection);

  // The objective's cells: condition c, grid cell g → c·N + g.
  const weights = new Float32Array(C * N);
  const unit = new Float32Array(C * N);
  const zoneWeightAt = (g: number) => {
    let w = 1;
    if (inputs.zoneWeights) for (const z of area.zones) if (z.mask[g] === 1 && z.weight > w) w = z.weight;
    return w;
  };
  let siteCells = 0;
  for (let g = 0; g < N; g++) {
    if (!inSite(g)) continue;
    siteCells++;
    if (!Number.isFinite(terrain.heights[g]!)) continue;
    const w = zoneWeightAt(g);
    for (let c = 0; c < C; c++) {
      weights[c * N + g] = w;
      unit[c * N + g] = 1;
    }
  }

  const seen = posts.map(() => new Uint32Array(bitsetWords(C * N)));
  const progress = { done: 0, total: posts.length * C };
  for (let c = 0; c < C; c++) {
    const condition = inputs.conditions[c]!;
    const detection = rangeLimitsOf(inputs.target, condition, inputs.resolutionArcmin);
    const maxDistance = viewshedRange([detection], terrain.cellSize);
    const conditions: SightConditions = {
      refractionCoefficient: condition.k,
      earthRadius: inputs.earthRadiusM,
      ...(maxDistance !== null && { maxDistance }),
    };
    const rangeLimit = detection.rangeLimit.rangeM;
    for (let from = 0; from < placed.length; from += BATCH) {
      const batch = placed.slice(from, from + BATCH);
      const network = await networkOf(batch, terrain, conditions, computeViewsheds, report, progress);
      network.forEach((entry, b) => {
        const { post, hidden } = entry;
        const classes = classifyVisibility(hidden, inputs.target.countsFromM, {
          rangeLimit: rangeLimit === null ? null : { col: post.col, row: post.row, maxDistance: rangeLimit },
        }).classes;
        // One post counted alone: exactly the cells a coverage run counts for it (sector, range, no data).
        const counts = countPostsPerCell(terrain, [coveragePostOf(entry, classes)]).counts;
        const bits = seen[from + b]!;
        for (let g = 0; g < N; g++) {
          const i = c * N + g;
          if (counts[g]! > 0 && unit[i] === 1) bits[i >>> 5]! |= 1 << (i & 31);
        }
      });
    }
  }
  await report(0.92, 'Choosing');

  const view = (p: number): SitingView => ({ seen: seen[p]!, col: placed[p]!.post.col, row: placed[p]!.post.row });
  const kept = inputs.kept.map((_, p) => view(p));
  const sitingOptions: SitingOption[] = options.map((o, k) => ({
    ...view(inputs.kept.length + k),
    location: o.candidate,
    heightM: o.heightM,
    cost: o.cost,
  }));
  const objective: SitingObjective = {
    cellCount: C * N,
    width: terrain.width,
    height: terrain.height,
    weights,
    minPosts: inputs.minPosts,
  };
  const totalWeight = weights.reduce((s, w) => s + w, 0);
  const choice = chooseTowerSites({
    objective,
    kept,
    options: sitingOptions,
    count: inputs.count,
    budget: inputs.budget,
    goal: inputs.goalPct === null ? null : (inputs.goalPct / 100) * totalWeight,
  });
  await report(0.97, 'Summing up');

  // The curve in plain area, condition by condition, and what each step adds on the first condition's map.
  const cellArea = terrain.cellSize * terrain.cellSize;
  const plain = new SitingState({ ...objective, weights: unit });
  const perCondition = () => {
    const out = new Array<number>(C).fill(0);
    for (let c = 0; c < C; c++) {
      let n = 0;
      for (let g = 0; g < N; g++) {
        const i = c * N + g;
        n += (plain.covered[i >>> 5]! >>> (i & 31)) & 1;
      }
      out[c] = n;
    }
    return out;
  };
  const layer = new Uint8Array(N);
  const markNew = (code: number) => {
    for (let g = 0; g < N; g++) {
      if (!inSite(g)) layer[g] = SITING_ADDED.outside;
      else if (layer[g] === 0 || layer[g] === SITING_ADDED.unseen)
        layer[g] = (plain.covered[g >>> 5]! >>> (g & 31)) & 1 ? code : SITING_ADDED.unseen;
    }
  };
  for (const k of kept) plain.add(k);
  markNew(SITING_ADDED.kept);
  const mean = (xs: number[]) => xs.reduce((s, x) => s + x, 0) / Math.max(1, xs.length);
  const pct = (cells: number) => (siteCells === 0 ? 0 : (100 * cells) / siteCells);
  let before = perCondition();
  const keptCells = before;
  const steps: SitingStep[] = choice.steps.map((step, s) => {
    const option = sitingOptions[step.option]!;
    plain.add(option);
    markNew(Math.min(255, SITING_ADDED.firstStep + s));
    const after = perCondition();
    const gainCells = mean(after.map((a, c) => a - before[c]!));
    before = after;
    return {
      candidate: describeCandidate(candidates[option.location]!),
      heightM: option.heightM,
      cost: inputs.costs === null ? null : option.cost,
      gainM2: gainCells * cellArea,
      gainPct: pct(gainCells),
      totalSeenM2: mean(after) * cellArea,
      totalSeenPct: pct(mean(after)),
      byCondition: inputs.conditions.map((cond, c) => ({
        caseKey: caseKeyOf(inputs.target.id, cond.conditionSetId, cond.conditionIndex),
        label: cond.label,
        seenM2: after[c]! * cellArea,
        seenPct: pct(after[c]!),
      })),
      weightedGain: step.gain * cellArea,
    };
  });
  const grid: CoverageGrid = { ...gridSpecToM(terrain), epsg: terrain.crs?.epsg ?? null };
  return {
    method: choice.method,
    candidates: candidates.map(describeCandidate),
    candidateGroundM: candidates.map((c) => {
      const { x, y } = projection.toGrid({ latDeg: c.latDeg, lonDeg: c.lonDeg });
      return elevationAt(terrain, x, y);
    }),
    siteAreaM2: siteCells * cellArea,
    keptSeenM2: mean(keptCells) * cellArea,
    keptSeenPct: pct(mean(keptCells)),
    steps,
    chosen: steps.map((s) => ({ candidate: s.candidate, heightM: s.heightM })),
    addedLayer: encodeClassRaster(terrain, layer),
    grid,
    evaluations: choice.evaluations,
    swaps: choice.swaps,
  };
}

/** Summits and ridge cells of the site (near the access line, when given), as candidates. */
function terrainCandidates(
  inputs: SitingRunInputs,
  terrain: TerrainRaster,
  projection: GridProjection,
  siteMask: Uint8Array | null,
): FrozenCandidate[] {
  const spec = inputs.fromTerrain!;
  let allowed = siteMask;
  if (spec.accessLine) {
    const line = spec.accessLine.line.map(([lonDeg, latDeg]) => projection.toGrid({ latDeg, lonDeg }));
    allowed = nearLine(terrain, line, spec.accessLine.withinM, siteMask);
  }
  const picked = pickTerrainCandidates(terrain, { spacingM: spec.spacingM, maxCandidates: spec.maxCandidates, allowed });
  return picked.map((p, index) => {
    const x = terrain.xll + (p.col + 0.5) * terrain.cellSize;
    const y = terrain.yll + (terrain.height - p.row - 0.5) * terrain.cellSize;
    const { latDeg, lonDeg } = projection.toLatLon(x, y);
    return {
      index,
      name: `${p.summit ? 'Summit' : 'Ridge'} ${index + 1} (${Math.round(p.elevationM)} m)`,
      postId: null,
      latDeg,
      lonDeg,
      source: 'terrain' as const,
      eyeHeightM: inputs.eyeHeightM,
      sector: null,
      post: null,
    };
  });
}

/** Cells whose centre lies within `withinM` of the polyline (grid metres), and inside the mask when given. */
function nearLine(
  terrain: TerrainRaster,
  line: { x: number; y: number }[],
  withinM: number,
  mask: Uint8Array | null,
): Uint8Array {
  const out = new Uint8Array(terrain.width * terrain.height);
  const top = terrain.yll + terrain.height * terrain.cellSize;
  for (let row = 0; row < terrain.height; row++) {
    const y = top - (row + 0.5) * terrain.cellSize;
    for (let col = 0; col < terrain.width; col++) {
      const i = row * terrain.width + col;
      if (mask !== null && mask[i] !== 1) continue;
      const x = terrain.xll + (col + 0.5) * terrain.cellSize;
      for (let s = 0; s + 1 < line.length; s++) {
        if (segmentDistance(x, y, line[s]!, line[s + 1]!) <= withinM) {
          out[i] = 1;
          break;
        }
      }
    }
  }
  return out;
}

function segmentDistance(x: number, y: number, a: { x: number; y: number }, b: { x: number; y: number }): number {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((x - a.x) * dx + (y - a.y) * dy) / len2));
  return Math.hypot(x - (a.x + t * dx), y - (a.y + t * dy));
}
