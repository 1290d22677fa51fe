// Over 300 lines: site, zone and blind-area statistics come from one labelling pass over the grid.
import { checkLayer } from '@/shared/terrain/check-layer';
import { checkSameGrid } from '@/shared/terrain/check-same-grid';
import { CROSS_BEARING_CLASS, type CrossBearingRaster } from '@/shared/terrain/cross-bearing-quality';
import type { PostsPerCellRaster } from '@/shared/terrain/posts-per-cell';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { squaredEdgeDistances } from '@/shared/terrain/patch-interior-point';

/** A share of an area: cells, square metres and percent of the area's cells. */
export interface CoverageMeasure {
  /** Number of cells. */
  readonly cells: number;
  /** Area, m² (cells × cell size²). */
  readonly area: number;
  /** Percent (0–100) of all cells of the area, no-data cells included; 0 for an empty area. */
  readonly pct: number;
}

/** Coverage of one area (the site or a zone). Every share is of all its cells, no-data cells included. */
export interface AreaCoverage {
  /** The whole area (pct 100, or 0 when it has no cells on the grid). */
  readonly total: CoverageMeasure;
  /** Cells without terrain data: not seen as far as anyone can tell. */
  readonly noData: CoverageMeasure;
  /** Cells with data that no post sees. */
  readonly unseen: CoverageMeasure;
  /** Seen by at least one post. */
  readonly seenBy1: CoverageMeasure;
  /** Seen by at least two posts (a cross-bearing is possible). */
  readonly seenBy2: CoverageMeasure;
  /** Seen by at least three posts. */
  readonly seenBy3: CoverageMeasure;
  /** Seen by two or more posts with a pair of bearings crossing within the usable band. */
  readonly goodCrossBearing: CoverageMeasure;
}

/** A named, weighted zone (e.g. a priority zone) as a mask on the grid. */
export interface CoverageZone {
  readonly name: string;
  /** Relative importance, > 0 (the site schema uses 1–10). */
  readonly weight: number;
  /** 1 inside the zone, 0 outside; row 0 = north (e.g. from `rasterizePolygon`). */
  readonly mask: Uint8Array;
}

/** Coverage of one zone. */
export interface ZoneCoverage extends AreaCoverage {
  readonly name: string;
  readonly weight: number;
}

/** A connected patch of the site that no post sees. */
export interface BlindArea {
  /** Number of cells. */
  readonly cells: number;
  /** Area, m². */
  readonly area: number;
  /**
   * Centre of mass of the cells: `x`, `y` in the grid's CRS (metres), `col`,
   * `row` in fractional cells (a cell's centre is at its integer index).
   */
  readonly centroid: { readonly x: number; readonly y: number; readonly col: number; readonly row: number };
  /**
   * A point surely inside the patch, for links and labels: the centre of its
   * cell farthest from the patch's edge (`patchInteriorPoint`); `x`, `y` in
   * metres, `col`, `row` whole cells, `edgeDistance` metres to the nearest
   * cell outside. (The centroid of a C- or U-shaped patch lies outside it.)
   */
  readonly interior: {
    readonly x: number;
    readonly y: number;
    readonly col: number;
    readonly row: number;
    readonly edgeDistance: number;
  };
  /**
   * Bounding box: first and last column and row (inclusive), and the outer
   * edges of those cells in metres (west < east, south < north).
   */
  readonly bounds: {
    readonly minCol: number;
    readonly maxCol: number;
    readonly minRow: number;
    readonly maxRow: number;
    readonly west: number;
    readonly east: number;
    readonly south: number;
    readonly north: number;
  };
}

/** Settings of {@link computeCoverageStatistics}. */
export interface CoverageStatisticsOptions {
  /** Blind areas smaller than this are counted but not listed, m²; default 10 000 (1 ha). */
  readonly blindAreaMinArea?: number;
  /** At most this many blind areas are listed (the largest); default 100. */
  readonly maxBlindAreas?: number;
}

/** Statistics of a network's coverage of a site. */
export interface CoverageStatistics {
  /** Area of one cell, m². */
  readonly cellArea: number;
  /** The site (the whole grid when no site mask was given). */
  readonly site: AreaCoverage;
  /** One entry per zone, in the given order. */
  readonly zones: readonly ZoneCoverage[];
  /**
   * Weighted means over the zones of their percentages (weights = zone
   * weights), or null without zones.
   */
  readonly zonesWeighted: {
    readonly seenBy1Pct: number;
    readonly seenBy2Pct: number;
    readonly seenBy3Pct: number;
    readonly goodCrossBearingPct: number;
    readonly totalWeight: number;
  } | null;
  /** Listed blind areas: at least `blindAreaMinArea`, largest first, at most `maxBlindAreas`. */
  readonly blindAreas: readonly BlindArea[];
  /** All blind areas of the site, listed or not. */
  readonly blindSummary: {
    /** Number of blind areas (8-connected patches of unseen site cells with data). */
    readonly count: number;
    /** Their total area, m² (= site.unseen.area). */
    readonly area: number;
    /** The threshold used, m². */
    readonly minArea: number;
    /** Patches under the threshold. */
    readonly belowThreshold: { readonly count: number; readonly area: number };
    /** Patches over the threshold left off the list by `maxBlindAreas`. */
    readonly notListed: { readonly count: number; readonly area: number };
  };
}

/**
 * Sums up what a network of posts sees of a site and its zones, and finds
 * the blind areas.
 *
 * For the site and for each zone: cells, area (m²) and percent seen by at
 * least 1, 2 and 3 posts, with good cross-bearings, unseen, and without
 * data. Percentages are of all the area's cells on the grid, no-data cells
 * included: a cell without terrain data is never counted as seen (the safe
 * side), and its share is reported so a reviewer sees how much is unknown.
 * Parts of a site or zone outside the grid are not counted at all — check
 * that the terrain covers the site before trusting a percentage.
 *
 * Blind areas: the 8-connected components (cells touching at an edge or a
 * corner belong together) of site cells with data that no post sees. Those
 * of at least `blindAreaMinArea` are listed with area, centroid and bounding
 * box, largest first (ties: the one whose first cell comes first in row-major
 * order); the rest are counted.
 *
 * Areas are cells × cellSize² in m² (the grid's projected metres; on UTM the
 * scale factor, within 0.04 % of 1 inside a zone, is ignored). Complexity
 * O(cells × (1 + zones)); the component search visits each blind cell once.
 *
 * Source: 8-connected component labelling (flood fill) of digital image
 * processing — common practice, no source.
 *
 * @param postsPerCell counts and no-data mask from `countPostsPerCell` (not modified)
 * @param crossBearings classes from `crossBearingQuality` on the same grid (not modified)
 * @param siteMask 1 inside the site, 0 outside, or null for the whole grid (not modified)
 * @param zones named, weighted zone masks (not modified)
 * @param options blind-area threshold, m² (default 10 000), and list length (default 100)
 * @returns new statistics (plain data, JSON-safe)
 * @throws TerrainInputError `grid-mismatch`, `invalid-layer` (with `field`),
 *   `invalid-option` for a negative threshold, a bad list length, a zone
 *   without a name or with a weight ≤ 0
 * @example
 * const stats = computeCoverageStatistics(counts, cross, siteMask, [{ name: 'Old-growth stand', weight: 9, mask }]);
 * stats.site.seenBy1.pct; // % of the site a 30 m smoke is seen from by at least one post
 * stats.blindAreas[0]?.area; // m² of the largest blind patch
 */
export function computeCoverageStatistics(
  postsPerCell: PostsPerCellRaster,
  crossBearings: CrossBearingRaster,
  siteMask: Uint8Array | null,
  zones: readonly CoverageZone[] = [],
  options: CoverageStatisticsOptions = {},
): CoverageStatistics {
  const minArea = options.blindAreaMinArea ?? 10_000;
  const maxListed = options.maxBlindAreas ?? 100;
  if (!(minArea >= 0) || !Number.isFinite(minArea)) {
    throw new TerrainInputError('invalid-option', `The blind-area threshold must be ≥ 0 m², got ${minArea}.`, 'blindAreaMinArea');
  }
  if (!Number.isInteger(maxListed) || maxListed < 0) {
    throw new TerrainInputError(
      'invalid-option',
      `The blind-area list length must be a whole number ≥ 0, got ${maxListed}.`,
      'maxBlindAreas',
    );
  }
  checkLayer(postsPerCell, postsPerCell.counts, 'Uint8Array', 'postsPerCell.counts');
  checkLayer(postsPerCell, postsPerCell.noData, 'Uint8Array', 'postsPerCell.noData');
  checkSameGrid(postsPerCell, crossBearings, 'crossBearings');
  checkLayer(postsPerCell, crossBearings.classes, 'Uint8Array', 'crossBearings.classes');
  if (siteMask !== null) checkLayer(postsPerCell, siteMask, 'Uint8Array', 'siteMask');
  zones.forEach((zone, z) => {
    if (typeof zone.name !== 'string' || zone.name.trim() === '') {
      throw new TerrainInputError('invalid-option', `Zone ${z} needs a name.`, `zones.${z}.name`);
    }
    if (!(zone.weight > 0) || !Number.isFinite(zone.weight)) {
      throw new TerrainInputError(
        'invalid-option',
        `Zone “${zone.name}”: the weight must be > 0, got ${zone.weight}.`,
        `zones.${z}.weight`,
      );
    }
    checkLayer(postsPerCell, zone.mask, 'Uint8Array', `zones.${z}.mask`);
  });

  const cellArea = postsPerCell.cellSize * postsPerCell.cellSize;
  const layers = { counts: postsPerCell.counts, noData: postsPerCell.noData, cross: crossBearings.classes };
  const site = areaCoverage(siteMask, layers, cellArea);
  const zoneResults = zones.map((zone) => ({
    name: zone.name,
    weight: zone.weight,
    ...areaCoverage(zone.mask, layers, cellArea),
  }));
  let zonesWeighted: CoverageStatistics['zonesWeighted'] = null;
  if (zoneResults.length > 0) {
    const totalWeight = zoneResults.reduce((sum, z) => sum + z.weight, 0);
    const mean = (pick: (z: ZoneCoverage) => number) => zoneResults.reduce((sum, z) => sum + z.weight * pick(z), 0) / totalWeight;
    zonesWeighted = {
      seenBy1Pct: mean((z) => z.seenBy1.pct),
      seenBy2Pct: mean((z) => z.seenBy2.pct),
      seenBy3Pct: mean((z) => z.seenBy3.pct),
      goodCrossBearingPct: mean((z) => z.goodCrossBearing.pct),
      totalWeight,
    };
  }

  const { patches, labels } = findBlindAreas(postsPerCell, siteMask);
  const minCells = minArea / cellArea;
  const large = patches.filter((p) => p.cells >= minCells - 1e-9);
  large.sort((a, b) => b.cells - a.cells || a.first - b.first);
  const listed = large.slice(0, maxListed);
  const small = patches.filter((p) => p.cells < minCells - 1e-9);
  const sumCells = (list: readonly { cells: number }[]) => list.reduce((sum, p) => sum + p.cells, 0);
  const { cellSize, xll, yll, height: H } = postsPerCell;
  const yTop = yll + H * cellSize;
  // One distance transform of all blind cells serves every listed patch (see squaredEdgeDistances).
  const edge = listed.length > 0 ? squaredEdgeDistances(labels, postsPerCell.width, H) : null;

  return {
    cellArea,
    site,
    zones: zoneResults,
    zonesWeighted,
    blindAreas: listed.map((p) => {
      const inside = interiorCell(p, labels, edge!, postsPerCell.width);
      return {
        cells: p.cells,
        area: p.cells * cellArea,
        centroid: {
          x: xll + (p.sumCol / p.cells + 0.5) * cellSize,
          y: yTop - (p.sumRow / p.cells + 0.5) * cellSize,
          col: p.sumCol / p.cells,
          row: p.sumRow / p.cells,
        },
        interior: {
          x: xll + (inside.col + 0.5) * cellSize,
          y: yTop - (inside.row + 0.5) * cellSize,
          col: inside.col,
          row: inside.row,
          edgeDistance: inside.edgeDistanceCells * cellSize,
        },
        bounds: {
          minCol: p.minCol,
          maxCol: p.maxCol,
          minRow: p.minRow,
          maxRow: p.maxRow,
          west: xll + p.minCol * cellSize,
          east: xll + (p.maxCol + 1) * cellSize,
          south: yTop - (p.maxRow + 1) * cellSize,
          north: yTop - p.minRow * cellSize,
        },
      };
    }),
    blindSummary: {
      count: patches.length,
      area: sumCells(patches) * cellArea,
      minArea,
      belowThreshold: { count: small.length, area: sumCells(small) * cellArea },
      notListed: { count: large.length - listed.length, area: sumCells(large.slice(maxListed)) * cellArea },
    },
  };
}

interface Layers {
  readonly counts: Uint8Array;
  readonly noData: Uint8Array;
  readonly cross: Uint8Array;
}

function areaCoverage(mask: Uint8Array | null, { counts, noData, cross }: Layers, cellArea: number): AreaCoverage {
  let total = 0;
  let missing = 0;
  let unseen = 0;
  let by1 = 0;
  let by2 = 0;
  let by3 = 0;
  let good = 0;
  for (let i = 0; i < counts.length; i++) {
    if (mask !== null && mask[i] === 0) continue;
    total++;
    if (noData[i] === 1) {
      missing++;
      continue;
    }
    const c = counts[i] as number;
    if (c === 0) unseen++;
    else {
      by1++;
      if (c >= 2) {
        by2++;
        if (c >= 3) by3++;
        if (cross[i] === CROSS_BEARING_CLASS.good) good++;
      }
    }
  }
  const measure = (cells: number): CoverageMeasure => ({
    cells,
    area: cells * cellArea,
    pct: total === 0 ? 0 : (100 * cells) / total,
  });
  return {
    total: measure(total),
    noData: measure(missing),
    unseen: measure(unseen),
    seenBy1: measure(by1),
    seenBy2: measure(by2),
    seenBy3: measure(by3),
    goodCrossBearing: measure(good),
  };
}

/**
 * The patch's cell farthest from its edge (`patchInteriorPoint`'s rule: ties go to the cell nearest the patch's
 * centroid, then the first in row order), read from the squared edge distances of all blind cells.
 */
function interiorCell(p: Patch, labels: Int32Array, edge: Float64Array, W: number) {
  const w = p.maxCol - p.minCol + 1;
  const h = p.maxRow - p.minRow + 1;
  // The centroid in the patch's own box, from integer sums, as patchInteriorPoint computes it.
  const meanCol = (p.sumCol - p.cells * p.minCol) / p.cells;
  const meanRow = (p.sumRow - p.cells * p.minRow) / p.cells;
  let best = -1;
  let bestD = -1;
  let bestTie = Infinity;
  for (let r = 0; r < h; r++) {
    const at = (p.minRow + r) * W + p.minCol;
    const padded = (p.minRow + r + 1) * (W + 2) + p.minCol + 1;
    for (let c = 0; c < w; c++) {
      if (labels[at + c] !== p.label) continue;
      const dist = edge[padded + c] as number;
      const tie = (c - meanCol) ** 2 + (r - meanRow) ** 2;
      if (dist > bestD || (dist === bestD && tie < bestTie)) {
        best = r * w + c;
        bestD = dist;
        bestTie = tie;
      }
    }
  }
  return { col: p.minCol + (best % w), row: p.minRow + Math.floor(best / w), edgeDistanceCells: Math.sqrt(bestD) };
}

interface Patch {
  /** 1-based label of the patch's cells in `labels`. */
  label: number;
  cells: number;
  first: number;
  sumCol: number;
  sumRow: number;
  minCol: number;
  maxCol: number;
  minRow: number;
  maxRow: number;
}

/** 8-connected patches of site cells with data that no post sees (iterative flood fill). */
function findBlindAreas(postsPerCell: PostsPerCellRaster, siteMask: Uint8Array | null): { patches: Patch[]; labels: Int32Array } {
  const { width: W, height: H, counts, noData } = postsPerCell;
  // 1 = blind and not yet visited.
  const open = new Uint8Array(W * H);
  for (let i = 0; i < open.length; i++) {
    if ((siteMask === null || siteMask[i] !== 0) && counts[i] === 0 && noData[i] === 0) open[i] = 1;
  }
  const stack = new Int32Array(W * H);
  // The row of each stacked cell, kept beside it so that no cell needs a division.
  const stackRows = new Int32Array(W * H);
  const labels = new Int32Array(W * H);
  const patches: Patch[] = [];
  for (let start = 0; start < open.length; start++) {
    if (open[start] === 0) continue;
    open[start] = 0;
    let top = 0;
    stackRows[top] = Math.floor(start / W);
    stack[top++] = start;
    const patch: Patch = {
      label: patches.length + 1,
      cells: 0,
      first: start,
      sumCol: 0,
      sumRow: 0,
      minCol: W,
      maxCol: -1,
      minRow: H,
      maxRow: -1,
    };
    while (top > 0) {
      const i = stack[--top] as number;
      const row = stackRows[top] as number;
      const col = i - row * W;
      patch.cells++;
      labels[i] = patch.label;
      patch.sumCol += col;
      patch.sumRow += row;
      if (col < patch.minCol) patch.minCol = col;
      if (col > patch.maxCol) patch.maxCol = col;
      if (row < patch.minRow) patch.minRow = row;
      if (row > patch.maxRow) patch.maxRow = row;
      const r0 = row > 0 ? row - 1 : 0;
      const r1 = row < H - 1 ? row + 1 : H - 1;
      const c0 = col > 0 ? col - 1 : 0;
      const c1 = col < W - 1 ? col + 1 : W - 1;
      for (let r = r0; r <= r1; r++) {
        for (let c = c0; c <= c1; c++) {
          const j = r * W + c;
          if (open[j] === 1) {
            open[j] = 0;
            stackRows[top] = r;
            stack[top++] = j;
          }
        }
      }
    }
    patches.push(patch);
  }
  return { patches, labels };
}
