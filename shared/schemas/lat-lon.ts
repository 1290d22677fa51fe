import { z } from 'zod';

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
