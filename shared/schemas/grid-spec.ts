import { z } from 'zod';
import type { GridSpecM } from '@/shared/terrain/grid-spec';

/**
 * A grid's size and placement in the API (see `GridSpec` in
 * `@/shared/terrain/grid-spec` for orientation): row 0 = north, cell centres
 * at `xllM + (col + 0.5)·cellSizeM`, `yllM + (height − row − 0.5)·cellSizeM`.
 * Spread into every response that describes a grid, so the names cannot drift.
 */
export const GridSpecMSchema = z.object({
  /** Columns (west → east). */
  width: z.number().int(),
  /** Rows (north → south). */
  height: z.number().int(),
  /** Side of a square cell, metres. */
  cellSizeM: z.number(),
  /** Lower-left (south-west) corner of the grid, metres in its CRS. */
  xllM: z.number(),
  yllM: z.number(),
}) satisfies z.ZodType<GridSpecM>;
