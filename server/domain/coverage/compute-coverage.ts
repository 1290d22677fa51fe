// Over 300 lines: one coverage run from inputs to stored layers; the case loop shares terrain, tide, sea mask and progress with its helpers.
import { createHash } from 'node:crypto';
import type { CoverageCase, CoverageLayerName } from '@/shared/schemas/coverage';
import { encodeClassRaster } from '@/shared/terrain/encode-class-raster';
import type { EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';
import { gridConvergence } from '@/shared/terrain/grid-convergence';
import { gridProjection, type GridProjection } from '@/shared/terrain/grid-projection';
import type { HiddenHeightRaster, LookoutPost, SightConditions } from '@/shared/terrain/hidden-height-raster';
import { locatePostCell } from '@/shared/terrain/locate-post-cell';
import { evaluateNetworkCoverage, type NetworkPost } from '@/shared/terrain/network-coverage';
import { rasterizePolygon, type PolygonRing } from '@/shared/terrain/rasterize-polygon';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { createTerrainRaster, type TerrainRaster } from '@/shared/terrain/terrain-raster';
import { rangeLimitsOf } from '@/shared/sightline/detection-inputs';
import type { DetectionRange } from '@/shared/sightline/detection-range';
import type { CoverageGrid as CoverageRunGrid } from '@/shared/schemas/coverage';
import { coverageCaseOf, postSeenShares } from './coverage-case';
import { caseKeyOf, type CoverageRunInputs } from './coverage-inputs';
import { gridSpecFromM, gridSpecToM } from '@/shared/terrain/grid-spec';
import { eyeAboveWaterM, type TideLevel } from '@/shared/terrain/tide-levels';
import { shoreContextOf, shoreFiguresOf, type RunRoster } from './shore-coverage';
import { patrolFigures, patrolLayer, patrolSamplesOf, placePatrols, sweepPatrols, type SweptPatrol } from './patrol-coverage';
import type { PatrolTarget } from '@/shared/terrain/patrol-sweep';

/** One viewshed the run needs: a post under one condition. */
export interface CoverageViewshedJob {
  readonly post: LookoutPost;
  readonly conditions: SightConditions;
}

/**
 * Computes hidden-height rasters for jobs on a terrain (the worker pool on
 * the server, the same core on one thread elsewhere), calling `onDone` as
 * each finishes.
 */
export type ComputeViewsheds = (
  terrain: TerrainRaster,
  jobs: readonly CoverageViewshedJob[],
  onDone: () => void,
) => Promise<HiddenHeightRaster[]>;

/** Reports progress (0 … 1) and what is being done; may throw to stop the run (a cancel). */
export type ReportProgress = (progress: number, stage: string) => Promise<void>;

/** A layer ready to store. */
export interface ComputedLayer {
  caseKey: string;
  layer: CoverageLayerName;
  /** '' for whole-network layers. */
  postId: string;
  encoded: EncodedClassRaster;
  sha256: string;
}

export interface ComputedCoverage {
  grid: CoverageRunGrid;
  cases: CoverageCase[];
  layers: ComputedLayer[];
}

/** A flat terrain at the datum (0 m everywhere) on the run's flat grid. */
export function flatTerrain(grid: CoverageRunGrid): TerrainRaster {
  return createTerrainRaster({
    heights: new Float32Array(grid.width * grid.height),
    ...gridSpecFromM(grid, { epsg: grid.epsg, wkt: null }),
  });
}

/** A WGS84 ring (`[lon, lat]` pairs, as sites store them) in a grid's projected metres. */
export function ringOnGrid(projection: GridProjection, ring: readonly (readonly [number, number])[]): PolygonRing {
  return ring.map(([lonDeg, latDeg]) => {
    const { x, y } = projection.toGrid({ latDeg, lonDeg });
    return [x, y] as const;
  });
}

/**
 * How far the viewsheds of one condition must reach: the farthest of its
 * targets' range limits (a target nothing but the geometry limits: no
 * limit), at least one cell.
 */
export function viewshedRange(detections: readonly DetectionRange[], cellSizeM: number): number | null {
  let farthest = 0;
  for (const d of detections) {
    if (d.rangeLimit.rangeM === null) return null;
    farthest = Math.max(farthest, d.rangeLimit.rangeM);
  }
  return Math.max(farthest, cellSizeM);
}

/** The plan's standard as the core reads it for one target: its own target rules only, with its name. */
function standardFor(standard: CoverageRunInputs['standard'], target: CoverageRunInputs['targets'][number]) {
  return {
    minSeenPct: standard.minSeenPct,
    priorityMinPosts: standard.priorityMinPosts,
    crossBearingMinPct: standard.crossBearingMinPct ?? null,
    targetRules: (standard.targetRules ?? [])
      .filter((r) => r.targetId === target.id)
      .map((r) => ({ targetName: target.name, area: r.area, minPosts: r.minPosts, minPct: r.minPct })),
  };
}

/**
 * The land/sea mask of a site that states one: cells inside its sea area
 * (when drawn) and at or below its sea level (when stated; the flat datum is
 * at 0 m). Null when the site states neither.
 */
export function seaMaskOf(
  inputs: Pick<CoverageRunInputs, 'site'>,
  terrain: TerrainRaster,
  toRing: (ring: [number, number][]) => PolygonRing,
): Uint8Array | null {
  const { seaArea, seaLevelMaxM } = inputs.site;
  if (seaArea === null && seaLevelMaxM === null) return null;
  const mask = seaArea ? rasterizePolygon(terrain, [toRing(seaArea)]) : new Uint8Array(terrain.width * terrain.height).fill(1);
  if (seaLevelMaxM !== null) {
    const heights = terrain.heights;
    for (let i = 0; i < mask.length; i++) if (!(heights[i]! <= seaLevelMaxM)) mask[i] = 0;
  }
  return mask;
}

/** Cells in both masks (a null mask is the whole grid). */
function intersect(mask: Uint8Array | null, other: Uint8Array): Uint8Array {
  if (mask === null) return other;
  const out = new Uint8Array(mask.length);
  for (let i = 0; i < mask.length; i++) out[i] = mask[i]! & other[i]!;
  return out;
}

const sha256 = (encoded: EncodedClassRaster) => createHash('sha256').update(encoded.data).digest('hex');
const DEG = Math.PI / 180;

/**
 * A plan's terrain coverage: the hidden-height raster of every post under
 * every condition (through `computeViewsheds`, one condition at a time so
 * memory stays at one raster per post), then per target × condition the
 * network's posts per cell, cross-bearings, statistics and the standard's
 * check (`evaluateNetworkCoverage`), and the layers for the map.
 *
 * Eye heights: on terrain the post's height above the ground of its cell
 * (structure + eye); on the flat datum the recorded ground elevation is added,
 * the ground being sea level. A target counts as detected where the part of
 * it that must show is in view (the classes are made for its height less that
 * part, `countsFromM`) and within the limits that do not depend on the
 * ground — visibility at the 5 % threshold and the angular size by day, the
 * luminous range at night, the wave screen on the water (`rangeLimitsOf`,
 * the same model as the plan's results). Viewsheds are computed once per
 * condition out to the farthest of its targets' ranges; each target is then
 * cut at its own. A target on the water counts on the sea part of the site
 * only, when the site states one (`seaMaskOf`).
 *
 * @throws TerrainInputError `post-outside-raster` (with the post's name) and
 *   whatever the core throws; and whatever `report` throws (a cancel)
 */
export async function computeCoverage(
  inputs: CoverageRunInputs,
  terrain: TerrainRaster,
  computeViewsheds: ComputeViewsheds,
  report: ReportProgress,
  options: { roster?: RunRoster | null } = {},
): Promise<ComputedCoverage> {
  const projection = gridProjection(terrain.crs);
  const areas = coverageAreas(inputs, terrain, projection);
  const placed = placePosts(inputs, terrain, projection);
  const patrols = placePatrols(inputs, terrain, projection);
  const grid: CoverageRunGrid = { ...gridSpecToM(terrain), epsg: terrain.crs?.epsg ?? null };
  const tides: (TideLevel | null)[] = inputs.site.tideLevels?.length ? inputs.site.tideLevels : [null];
  const plannedConditions = inputs.conditions.map((condition) => {
    const detections = inputs.targets.map((target) => rangeLimitsOf(target, condition, inputs.resolutionArcmin));
    const maxDistance = viewshedRange(detections, terrain.cellSize);
    const conditions: SightConditions = {
      refractionCoefficient: condition.k,
      earthRadius: inputs.earthRadiusM,
      ...(maxDistance !== null && { maxDistance }),
    };
    const patrolTargets: PatrolTarget[] = inputs.targets.map((target, t) => ({
      countsFromM: target.countsFromM,
      rangeM: detections[t]!.rangeLimit.rangeM,
    }));
    return { condition, detections, conditions, patrolTargets };
  });
  const patrolSamples = plannedConditions.reduce(
    (n, c) =>
      n + patrols.reduce((m, p) => m + patrolSamplesOf(p, c.patrolTargets, c.conditions, terrain.cellSize).samples.length, 0),
    0,
  );
  const progress = { done: 0, total: (placed.length * inputs.conditions.length + patrolSamples) * tides.length };
  const seaMask = seaMaskOf(inputs, terrain, (ring) => ringOnGrid(projection, ring));
  const shore = shoreContextOf(
    inputs,
    terrain,
    projection,
    seaMask,
    inputs.posts.map((p) => placed.find((x) => x.input.id === p.id)?.xy ?? null),
  );
  const cases: CoverageCase[] = [];
  const layers: ComputedLayer[] = [];
  const addLayer = (caseKey: string, layer: CoverageLayerName, postId: string, values: Uint8Array) => {
    const encoded = encodeClassRaster(terrain, values);
    layers.push({ caseKey, layer, postId, encoded, sha256: sha256(encoded) });
  };

  // One condition (and tide) at a time, to bound memory. Computing the next one's viewsheds while this one is
  // evaluated was tried and measured: no faster on 2 cores (the workers already use both), and twice the rasters.
  const batches = plannedConditions.flatMap((planned) => tides.map((tide) => ({ ...planned, tide })));
  const load = async ({ condition, conditions, patrolTargets, tide }: (typeof batches)[number]) => {
    const posts = tide
      ? placed.map((p) => ({ ...p, post: { ...p.post, eyeHeight: eyeAt(inputs, p.input, tide, p.post.eyeHeight) } }))
      : placed;
    const ground = tide ? raisedTerrain(terrain, seaMask, tide.levelM, inputs.terrain === null) : terrain;
    await report(
      (0.9 * progress.done) / progress.total,
      `Viewsheds: ${condition.conditionSetName}, ${condition.label}${tide ? `, ${tide.label}` : ''}`,
    );
    const fixedNetwork = posts.length > 0 ? await networkOf(posts, ground, conditions, computeViewsheds, report, progress) : [];
    // A patrol craft rides the tide: its eye above the water is the same at every level; the ground is the tide's.
    const swept = await sweepPatrolsWithProgress(patrols, ground, conditions, patrolTargets, computeViewsheds, report, progress);
    return { posts, fixedNetwork, swept };
  };
  for (const batch of batches) {
    const { condition, detections, conditions, patrolTargets, tide } = batch;
    const { posts, fixedNetwork, swept } = await load(batch);
    inputs.targets.forEach((target, t) => {
      const detection = detections[t]!;
      const key = caseKeyOf(target.id, condition.conditionSetId, condition.conditionIndex, tide);
      const seaOnly = target.onWater && areas.sea !== null;
      const area = seaOnly ? areas.sea! : areas.land;
      // The plan's posts in its order: fixed posts as they are, patrols by their view over the cycle.
      const results = swept.map((p) => p.sweep.result(t));
      const network: NetworkPost[] = inputs.posts.map((p) => {
        const f = posts.findIndex((x) => x.input.id === p.id);
        if (f >= 0) return fixedNetwork[f]!;
        const s = swept.findIndex((x) => x.placed.input.id === p.id);
        const first = swept[s]!.first;
        return { post: first.post, hidden: first, classes: results[s]!.classes };
      });
      const coverage = evaluateNetworkCoverage({
        posts: network,
        targetHeight: target.countsFromM,
        siteMask: area.siteMask,
        zones: area.zones,
        standard: standardFor(inputs.standard, target),
        blindAreaMinArea: inputs.blindAreaMinAreaM2,
        maxBlindAreas: 20,
        rangeLimit: detection.rangeLimit.rangeM,
      });
      addLayer(key, 'posts-per-cell', '', coverage.postsPerCell.layer);
      addLayer(key, 'cross-bearing', '', coverage.crossBearings.classes);
      coverage.postClasses.forEach((classes, i) => addLayer(key, 'post-visibility', inputs.posts[i]!.id, classes));
      const patrolFigs = swept.map((p, s) => {
        addLayer(key, 'patrol-fraction', p.placed.input.id, patrolLayer(p, results[s]!, area.siteMask));
        return patrolFigures({
          swept: p,
          result: results[s]!,
          target: patrolTargets[t]!,
          conditions,
          mask: area.siteMask,
          cellSize: terrain.cellSize,
        });
      });
      const perPost = postSeenShares(terrain, network, coverage.postClasses, area.siteMask, inputs.posts);
      const stored = coverageCaseOf({
        key,
        target,
        condition: tide ? { ...condition, label: `${condition.label} · ${tideText(tide, inputs.site.heightDatum)}` } : condition,
        coverage,
        perPost,
        detection,
        seaOnly,
        projection,
        detectionModel: inputs.detectionModel,
        tideLevelM: tide?.levelM ?? null,
      });
      if (shore) {
        Object.assign(
          stored,
          shoreFiguresOf({
            context: shore,
            grid: terrain,
            projection,
            // Every post, patrols included (watched when in view at least once in the cycle).
            network,
            postClasses: coverage.postClasses,
            posts: inputs.posts,
            // What could close a gap: the fixed posts, raised.
            candidates: posts.map((p) => ({
              x: p.xy.x,
              y: p.xy.y,
              eyeAboveWaterM:
                inputs.terrain === null
                  ? p.post.eyeHeight
                  : p.post.eyeHeight + Math.max(0, p.input.groundElevationM - (tide?.levelM ?? 0)),
              sector: p.input.sector,
              gridConvergence: p.gridConvergence,
            })),
            target: { countsFromM: target.countsFromM, rangeLimitM: detection.rangeLimit.rangeM },
            sphere: { k: condition.k, earthRadiusM: inputs.earthRadiusM },
            roster: options.roster ?? null,
            standard: inputs.standard,
            check: stored.check,
          }),
        );
      }
      cases.push(patrolFigs.length > 0 ? { ...stored, patrols: patrolFigs } : stored);
    });
  }
  // Target × condition (× tide) order, as the plan lists them.
  const order = (k: CoverageCase) =>
    (inputs.targets.findIndex((t) => t.id === k.targetId) * inputs.conditions.length +
      inputs.conditions.findIndex((c) => c.conditionSetId === k.conditionSetId && c.conditionIndex === k.conditionIndex)) *
      tides.length +
    tides.findIndex((tide) => (tide?.levelM ?? null) === k.tideLevelM);
  cases.sort((a, b) => order(a) - order(b));
  await report(0.99, 'Saving the layers');
  return { grid, cases, layers };
}

/** The site, its zones and (for targets on water) their sea parts as masks on the terrain grid. */
export function coverageAreas(inputs: CoverageRunInputs, terrain: TerrainRaster, projection: GridProjection) {
  const toRing = (ring: [number, number][]) => ringOnGrid(projection, ring);
  const siteMask = inputs.site.boundary ? rasterizePolygon(terrain, [toRing(inputs.site.boundary)]) : null;
  const zones = inputs.site.zones.map((z) => ({
    name: z.name,
    weight: z.weight,
    mask: rasterizePolygon(terrain, [toRing(z.ring)]),
  }));
  const seaMask = seaMaskOf(inputs, terrain, toRing);
  const onSea = (mask: Uint8Array | null) => (seaMask === null ? mask : intersect(mask, seaMask));
  return {
    land: { siteMask, zones },
    sea: seaMask && { siteMask: onSea(siteMask), zones: zones.map((z) => ({ ...z, mask: onSea(z.mask)! })) },
  };
}

/**
 * A post's eye height at a tide level: on the flat datum its height above the
 * water (`eyeAboveWaterM`: a shore post's heights are above the datum, a
 * vessel rides the tide); on terrain its height above the ground of its cell
 * is kept and the sea is raised instead (`raisedTerrain`).
 */
function eyeAt(inputs: CoverageRunInputs, post: CoverageRunInputs['posts'][number], tide: TideLevel, onTerrain: number): number {
  if (inputs.terrain !== null) return onTerrain;
  return eyeAboveWaterM(
    { groundElevationM: post.groundElevationM, aboveGroundM: post.aboveGroundM, floats: post.floats === true },
    tide.levelM,
  );
}

/**
 * The ground at a tide level. Terrain: sea cells (the site's land/sea mask)
 * stand at least at the water level; without a mask the terrain is used as it
 * is. The flat datum stays at 0 (the tide is in the posts' eye heights).
 */
function raisedTerrain(terrain: TerrainRaster, seaMask: Uint8Array | null, levelM: number, flat: boolean): TerrainRaster {
  if (flat || seaMask === null) return terrain;
  const heights = Float32Array.from(terrain.heights);
  for (let i = 0; i < heights.length; i++) if (seaMask[i] === 1 && heights[i]! < levelM) heights[i] = levelM;
  return createTerrainRaster({ ...gridSpecFromM(gridSpecToM(terrain), terrain.crs), heights, nodata: terrain.nodata });
}

/** "high water (1.8 m above mean sea level)". */
function tideText(tide: TideLevel, datum: CoverageRunInputs['site']['heightDatum']) {
  return `${tide.label} (${tide.levelM.toFixed(1)} m above ${datum === 'chart-datum' ? 'chart datum' : 'mean sea level'})`;
}

/**
 * Each fixed post's cell, eye height, sector (radians) and grid convergence; a
 * post off the grid is refused by name. Patrols are placed by their routes
 * (`placePatrols`).
 */
export function placePosts(inputs: CoverageRunInputs, terrain: TerrainRaster, projection: GridProjection) {
  const flat = inputs.terrain === null;
  return inputs.posts
    .filter((p) => !p.patrol)
    .map((p) => {
      const { x, y } = projection.toGrid({ latDeg: p.latDeg, lonDeg: p.lonDeg });
      let cell;
      try {
        cell = locatePostCell(terrain, x, y);
      } catch (error) {
        if (error instanceof TerrainInputError)
          throw new TerrainInputError(error.code, `Post “${p.name}” stands outside the terrain grid.`, 'postIds');
        throw error;
      }
      return {
        input: p,
        xy: { x, y },
        post: { ...cell, eyeHeight: p.aboveGroundM + (flat ? p.groundElevationM : 0) },
        sector: p.sector && { from: p.sector.fromDeg * DEG, to: p.sector.toDeg * DEG },
        gridConvergence: gridConvergence(projection, { latDeg: p.latDeg, lonDeg: p.lonDeg }),
      };
    });
}

/**
 * Every post's viewshed under one condition, as the network the coverage core
 * evaluates. Progress is reported as viewsheds finish; the first report that
 * throws (a cancel) stops the run after the batch.
 */
export async function networkOf(
  posts: ReturnType<typeof placePosts>,
  terrain: TerrainRaster,
  conditions: SightConditions,
  computeViewsheds: ComputeViewsheds,
  report: ReportProgress,
  progress: { done: number; total: number },
): Promise<NetworkPost[]> {
  const pending: Promise<void>[] = [];
  let stopped: { reason: unknown } | null = null;
  const rasters = await computeViewsheds(
    terrain,
    posts.map((p) => ({ post: p.post, conditions })),
    () => {
      progress.done += 1;
      pending.push(
        report((0.9 * progress.done) / progress.total, `Viewsheds: ${progress.done} of ${progress.total}`).catch(
          (reason: unknown) => {
            stopped ??= { reason };
          },
        ),
      );
    },
  );
  await Promise.all(pending);
  if (stopped) throw (stopped as { reason: unknown }).reason;
  return posts.map((p, i) => ({ post: p.post, hidden: rasters[i]!, sector: p.sector, gridConvergence: p.gridConvergence }));
}

/** Every patrol swept under one condition, reporting progress as its viewsheds finish (a cancel stops it, as for posts). */
async function sweepPatrolsWithProgress(
  patrols: ReturnType<typeof placePatrols>,
  terrain: TerrainRaster,
  conditions: SightConditions,
  targets: readonly PatrolTarget[],
  computeViewsheds: ComputeViewsheds,
  report: ReportProgress,
  progress: { done: number; total: number },
): Promise<SweptPatrol[]> {
  if (patrols.length === 0) return [];
  const pending: Promise<void>[] = [];
  let stopped: { reason: unknown } | null = null;
  const checkpoint = async () => {
    await Promise.all(pending);
    if (stopped) throw (stopped as { reason: unknown }).reason;
  };
  const swept = await sweepPatrols(
    patrols,
    terrain,
    conditions,
    targets,
    computeViewsheds,
    () => {
      progress.done += 1;
      pending.push(
        report((0.9 * progress.done) / progress.total, `Patrol views: ${progress.done} of ${progress.total}`).catch(
          (reason: unknown) => {
            stopped ??= { reason };
          },
        ),
      );
    },
    checkpoint,
  );
  await checkpoint();
  return swept;
}
