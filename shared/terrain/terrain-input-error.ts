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

  constructor(code: TerrainInputErrorCode, message: string) {
    super(message);
    this.name = 'TerrainInputError';
    this.code = code;
  }
}

/** Reasons a terrain-core input can be rejected. */
export type TerrainInputErrorCode =
  | 'invalid-raster'
  | 'invalid-post'
  | 'post-outside-raster'
  | 'post-on-nodata'
  | 'point-outside-raster'
  | 'point-on-nodata'
  | 'invalid-option'
  | 'invalid-condition';
