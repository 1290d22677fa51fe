/**
 * Error thrown by the terrain core when a caller passes an input that breaks a
 * documented precondition (a raster whose array length does not match its
 * size, a post outside the grid, a negative eye height, …).
 *
 * `code` is stable and meant for programs; `message` is meant for people.
 *
 * @example
 * try {
 *   computeHiddenHeightRaster(terrain, { col: -1, row: 0, eyeHeight: 10 });
 * } catch (error) {
 *   if (error instanceof TerrainInputError && error.code === 'post-outside-raster') {
 *     // tell the user to pick a post inside the terrain
 *   }
 * }
 */
export class TerrainInputError extends Error {
  /** Stable machine-readable reason. */
  readonly code: TerrainInputErrorCode;
  /**
   * Dot-joined path of the offending input when known (`posts.2.sector`,
   * `zones.0.mask`), for the API's `fields`; null otherwise.
   */
  readonly field: string | null;

  constructor(code: TerrainInputErrorCode, message: string, field: string | null = null) {
    super(message);
    this.name = 'TerrainInputError';
    this.code = code;
    this.field = field;
  }
}

/** Reasons a terrain-core input can be rejected. */
export type TerrainInputErrorCode =
  | 'invalid-raster'
  | 'invalid-post'
  | 'post-outside-raster'
  | 'post-on-nodata'
  | 'invalid-option'
  | 'invalid-condition'
  /** A layer (mask, class or count raster) of the wrong type or length. */
  | 'invalid-layer'
  /** Two rasters that must share one grid do not. */
  | 'grid-mismatch'
  /** A polygon ring with too few corners or a non-finite coordinate. */
  | 'invalid-polygon'
  /** A viewing sector with a non-finite or zero-width span. */
  | 'invalid-sector'
  /** A coverage standard outside its documented range. */
  | 'invalid-standard'
  /** An encoded class raster that cannot be decoded. */
  | 'invalid-encoding'
  | 'point-outside-raster'
  | 'point-on-nodata';
