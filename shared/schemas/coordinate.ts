import { z } from 'zod';

import { CoordinateError } from '@/shared/geo/coordinate-error';
import { parseCoordinate } from '@/shared/geo/parse-coordinate';

/*
 * Coordinates at the API and form edges: a position as typed (any format
 * `parseCoordinate` reads) and a position as numbers. WGS84, degrees.
 */

/**
 * A coordinate as a person typed it: DD, DDM, DMS or UTM (see
 * `parseCoordinate`). Trimmed; a text that cannot be read fails with the
 * `CoordinateError` message, which says which part is wrong and why, and
 * carries its code in the issue's `params.code`.
 */
export const CoordinateTextSchema = z
  .string({ error: 'Enter a coordinate as text.' })
  .trim()
  .superRefine((text, ctx) => {
    try {
      parseCoordinate(text);
    } catch (error) {
      if (!(error instanceof CoordinateError)) throw error;
      ctx.addIssue({ code: 'custom', message: error.message, params: { code: error.code } });
    }
  });
export type CoordinateText = z.infer<typeof CoordinateTextSchema>;

/** A WGS84 position as numbers. */
export const LatLonSchema = z.strictObject({
  /** Latitude, degrees north, −90…90. */
  latDeg: z
    .number({ error: 'Latitude must be a number of degrees.' })
    .min(-90, 'Latitude must be at least −90° (90°S).')
    .max(90, 'Latitude must be at most 90° (90°N).'),
  /** Longitude, degrees east, −180…180. */
  lonDeg: z
    .number({ error: 'Longitude must be a number of degrees.' })
    .min(-180, 'Longitude must be at least −180° (180°W).')
    .max(180, 'Longitude must be at most 180° (180°E).'),
});
export type LatLonValue = z.infer<typeof LatLonSchema>;
