import { checkLayer } from '@/shared/terrain/check-layer';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { GridSpec } from '@/shared/terrain/grid-spec';

/**
 * The part of the horizon a post watches, as true bearings: clockwise from
 * `from` to `to`, both in radians clockwise from true north. `from = 0`,
 * `to = 2π` is all round (so is no sector at all); a sector whose ends are
 * the same number is refused (zero width).
 */
export interface ViewingSector {
  /** Bearing where the sector starts, radians clockwise from true north. */
  readonly from: number;
  /** Bearing where it ends (reached clockwise from `from`), radians clockwise from true north. */
  readonly to: number;
}

/**
 * One post of a network, for the coverage functions: where it stands, what it
 * sees of the target (the visibility classes for one target height, from
 * `classifyVisibility`) and what it watches.
 */
export interface CoveragePost {
  /** Column of the post's cell (0 = west). */
  readonly col: number;
  /** Row of the post's cell (0 = north). */
  readonly row: number;
  /** One `VISIBILITY_CLASS` code per cell, row 0 = north; seen and target-only count as "the target is seen". */
  readonly classes: Uint8Array;
  /** Viewing sector in true bearings; null or absent = all round. */
  readonly sector?: ViewingSector | null;
  /**
   * Grid convergence at the post, radians: the angle from true north
   * clockwise to grid north (positive east of the central meridian in the
   * northern hemisphere, see `utmGridConvergence`). Used only to turn the
   * sector's true bearings into grid bearings; default 0.
   */
  readonly gridConvergence?: number;
  /**
   * Range limit the classes were computed with, metres (the hidden-height
   * raster's `maxDistance`); default unlimited. Inside it a `none` class means
   * the terrain has no data; beyond it, only that the post does not see.
   */
  readonly maxDistance?: number;
}

/** How a prepared post's sector is tested (see {@link PreparedCoveragePost.kind}). */
export const SECTOR_KIND = {
  /** No sector: every direction. */
  allRound: 0,
  /** Width ≤ 180°: inside both half-planes of its edges. */
  narrow: 1,
  /** Width > 180°: outside the narrow complement. */
  wide: 2,
} as const;

/**
 * A checked post with its sector as grid unit vectors, made by
 * {@link prepareCoveragePosts}. Plain data, so hot loops read the fields
 * directly; `insideSector` tests a direction against it.
 */
export interface PreparedCoveragePost {
  /** Column of the post's cell. */
  readonly col: number;
  /** Row of the post's cell. */
  readonly row: number;
  /** The post's visibility classes (the caller's array, not copied). */
  readonly classes: Uint8Array;
  /** Squared range limit, cells² (Infinity when unlimited). */
  readonly range2: number;
  /** A {@link SECTOR_KIND} code. */
  readonly kind: number;
  /** Grid unit vector (east, north) of the sector's start (`fx`, `fy`) and end (`tx`, `ty`). */
  readonly fx: number;
  readonly fy: number;
  readonly tx: number;
  readonly ty: number;
}

/**
 * Checks the posts of a coverage computation and prepares their sectors:
 * true bearings become grid bearings by subtracting the grid convergence at
 * the post (β_grid = β_true − γ), and are kept as unit vectors so the sector
 * test needs no trigonometry per cell. Bearings to a cell are measured in
 * the grid, from the post's cell centre to the cell's centre.
 *
 * Source: grid bearing = true bearing − convergence (e.g. the NWCG and
 * military map-reading practice of converting azimuths between true, grid
 * and magnetic north) — common practice, no source.
 *
 * @param grid the grid every class raster must fit
 * @param posts the posts (not modified; their class arrays are used, not copied)
 * @returns one prepared post per input post, same order
 * @throws TerrainInputError `invalid-post` (also for an empty list), `post-outside-raster`, `invalid-layer`,
 *   `invalid-sector` (with `field` = `posts.N…`)
 * @example
 * const [prepared] = prepareCoveragePosts(grid, [{ col: 10, row: 10, classes }]);
 * insideSector(prepared, 2, 0); // is the cell 2 east of the post inside its sector?
 */
export function prepareCoveragePosts(grid: GridSpec, posts: readonly CoveragePost[]): PreparedCoveragePost[] {
  if (!Array.isArray(posts) || posts.length === 0) {
    throw new TerrainInputError('invalid-post', 'At least one post is needed.', 'posts');
  }
  return posts.map((post, p) => {
    const field = `posts.${p}`;
    const { col, row } = post;
    if (!Number.isInteger(col) || !Number.isInteger(row)) {
      throw new TerrainInputError('invalid-post', `Post ${p}: the cell must be whole numbers, got (${col}, ${row}).`, field);
    }
    if (col < 0 || row < 0 || col >= grid.width || row >= grid.height) {
      throw new TerrainInputError(
        'post-outside-raster',
        `Post ${p}: cell (col ${col}, row ${row}) is outside the ${grid.width} × ${grid.height} grid.`,
        field,
      );
    }
    checkLayer(grid, post.classes, 'Uint8Array', `${field}.classes`);
    const maxDistance = post.maxDistance ?? Infinity;
    if (!(maxDistance > 0)) {
      throw new TerrainInputError(
        'invalid-post',
        `Post ${p}: the range limit must be > 0 m, got ${maxDistance}.`,
        `${field}.maxDistance`,
      );
    }
    const rangeCells = maxDistance / grid.cellSize;
    const range2 = rangeCells * rangeCells;
    const convergence = post.gridConvergence ?? 0;
    if (!Number.isFinite(convergence) || Math.abs(convergence) >= Math.PI / 2) {
      throw new TerrainInputError(
        'invalid-sector',
        `Post ${p}: the grid convergence must be a finite angle under 90°, got ${convergence} rad.`,
        `${field}.gridConvergence`,
      );
    }
    const sector = post.sector ?? null;
    if (sector === null) return prepared(col, row, post.classes, range2, SECTOR_KIND.allRound, 0, 0);
    const { from, to } = sector;
    if (!Number.isFinite(from) || !Number.isFinite(to)) {
      throw new TerrainInputError('invalid-sector', `Post ${p}: sector bearings must be finite radians.`, `${field}.sector`);
    }
    const TAU = 2 * Math.PI;
    const width = (((to - from) % TAU) + TAU) % TAU;
    if (width === 0) {
      if (from === to) {
        throw new TerrainInputError(
          'invalid-sector',
          `Post ${p}: the sector starts and ends at the same bearing (zero width); leave it out for all round.`,
          `${field}.sector`,
        );
      }
      return prepared(col, row, post.classes, range2, SECTOR_KIND.allRound, 0, 0);
    }
    return prepared(
      col,
      row,
      post.classes,
      range2,
      width <= Math.PI ? SECTOR_KIND.narrow : SECTOR_KIND.wide,
      from - convergence,
      to - convergence,
    );
  });
}

function prepared(
  col: number,
  row: number,
  classes: Uint8Array,
  range2: number,
  kind: number,
  fromGrid: number,
  toGrid: number,
): PreparedCoveragePost {
  return {
    col,
    row,
    classes,
    range2,
    kind,
    fx: Math.sin(fromGrid),
    fy: Math.cos(fromGrid),
    tx: Math.sin(toGrid),
    ty: Math.cos(toGrid),
  };
}
