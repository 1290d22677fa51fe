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

// The numeric position lives in its own module so that schemas needing only it (sites, terrain) do not
// pull the text parser and proj4 into the web app's first bundle.
export { LatLonSchema, type LatLonValue } from './lat-lon';
