/**
 * Coordinate reference system of a raster, as far as Kenning needs it.
 * `epsg` is the EPSG code when known (e.g. 32633 for WGS 84 / UTM zone 33N);
 * `wkt` is the well-known text when the source supplied one (an ESRI `.prj`).
 */
export interface TerrainCrs {
  readonly epsg: number | null;
  readonly wkt: string | null;
}

/**
 * The one descriptor of a Kenning grid: every raster (terrain, hidden height,
 * visibility classes, coverage layers) and every grid the server stores or
 * sends is one of these.
 *
 * Row order: cells are stored row-major; row 0 is the northernmost (top)
 * row, column 0 the westernmost. The value of cell (col, row) is at index
 * `row * width + col` and stands for the cell's centre, whose coordinates are
 * `x = xll + (col + 0.5) * cellSize`, `y = yll + (height - row - 0.5) * cellSize`.
 * Cells are square. Coordinates are projected metres in `crs` (e.g. UTM).
 *
 * Inside the computational core the fields carry the ESRI ASCII grid's names
 * (`cellsize`, `xllcorner`, `yllcorner`); the API, the database and the 3D
 * scene name the same numbers with their unit ({@link GridSpecM}). Convert
 * only with {@link gridSpecFromM} and {@link gridSpecToM}.
 */
export interface GridSpec {
  /** Number of columns (cells west → east). */
  readonly width: number;
  /** Number of rows (cells north → south). */
  readonly height: number;
  /** Side of a square cell, metres. */
  readonly cellSize: number;
  /** Easting of the lower-left (south-west) corner of the grid, metres (ESRI `xllcorner`). */
  readonly xll: number;
  /** Northing of the lower-left (south-west) corner of the grid, metres (ESRI `yllcorner`). */
  readonly yll: number;
  /** Coordinate reference system, or null when unknown. */
  readonly crs: TerrainCrs | null;
}

/**
 * A {@link GridSpec}'s size and placement as the API, the database and the 3D
 * scene name them (units in the names; JSON field names are contracts).
 * Same orientation: row 0 = north, cell centres at
 * `xllM + (col + 0.5)·cellSizeM`, `yllM + (height − row − 0.5)·cellSizeM`.
 */
export interface GridSpecM {
  readonly width: number;
  readonly height: number;
  /** Side of a square cell, metres. */
  readonly cellSizeM: number;
  /** Lower-left (south-west) corner of the grid, metres in its CRS. */
  readonly xllM: number;
  readonly yllM: number;
}

/**
 * The core's grid from its API / database form.
 *
 * @example
 * gridSpecFromM({ width: 2, height: 3, cellSizeM: 25, xllM: 500_000, yllM: 6_000_000 }, null);
 * // { width: 2, height: 3, cellSize: 25, xll: 500000, yll: 6000000, crs: null }
 */
export function gridSpecFromM(grid: GridSpecM, crs: TerrainCrs | null): GridSpec {
  return { width: grid.width, height: grid.height, cellSize: grid.cellSizeM, xll: grid.xllM, yll: grid.yllM, crs };
}

/**
 * The grid alone, copied from a raster that carries one (its cells left behind).
 *
 * @example
 * gridSpecOf({ width: 2, height: 1, cellSize: 25, xll: 0, yll: 0, crs: null, heights: new Float32Array(2) });
 * // { width: 2, height: 1, cellSize: 25, xll: 0, yll: 0, crs: null }
 */
export function gridSpecOf(grid: GridSpec): GridSpec {
  return { width: grid.width, height: grid.height, cellSize: grid.cellSize, xll: grid.xll, yll: grid.yll, crs: grid.crs };
}

/**
 * A core grid's size and placement in its API / database form (the CRS is
 * carried separately: each API shape names it its own way).
 *
 * @example
 * gridSpecToM({ width: 2, height: 3, cellSize: 25, xll: 500_000, yll: 6_000_000, crs: null });
 * // { width: 2, height: 3, cellSizeM: 25, xllM: 500000, yllM: 6000000 }
 */
export function gridSpecToM(grid: Omit<GridSpec, 'crs'>): GridSpecM {
  return { width: grid.width, height: grid.height, cellSizeM: grid.cellSize, xllM: grid.xll, yllM: grid.yll };
}

/**
 * The rectangle a grid covers (its outer cell edges), metres in its CRS.
 *
 * @example
 * gridBoundsM({ width: 2, height: 3, cellSizeM: 25, xllM: 0, yllM: 100 });
 * // { west: 0, south: 100, east: 50, north: 175 }
 */
export function gridBoundsM(grid: GridSpecM): { west: number; south: number; east: number; north: number } {
  return {
    west: grid.xllM,
    south: grid.yllM,
    east: grid.xllM + grid.width * grid.cellSizeM,
    north: grid.yllM + grid.height * grid.cellSizeM,
  };
}
