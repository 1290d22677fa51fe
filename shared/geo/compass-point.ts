/** The 16 points of the compass, clockwise from north. */
export const COMPASS_POINTS = [
  'N',
  'NNE',
  'NE',
  'ENE',
  'E',
  'ESE',
  'SE',
  'SSE',
  'S',
  'SSW',
  'SW',
  'WSW',
  'W',
  'WNW',
  'NW',
  'NNW',
] as const;
export type CompassPoint = (typeof COMPASS_POINTS)[number];

/**
 * The nearest of the 16 compass points to a bearing: each point covers
 * 22.5°, centred on its own direction (N is 348.75° up to 11.25°). Boundaries
 * go clockwise: 11.25° is NNE.
 *
 * @param bearingDeg - degrees clockwise from north; any finite value (wrapped to one turn)
 * @returns the point's abbreviation, e.g. `NE`
 * @throws {RangeError} for NaN or ±Infinity
 *
 * Source: the 32-point compass rose and its 16 principal points, each 22.5°
 * apart (common practice, no source).
 *
 * @example
 * compassPoint(44);  // 'NE'
 * compassPoint(350); // 'N'
 */
export function compassPoint(bearingDeg: number): CompassPoint {
  if (!Number.isFinite(bearingDeg)) throw new RangeError(`A bearing must be a finite number of degrees (got ${bearingDeg}).`);
  const turn = ((bearingDeg % 360) + 360) % 360;
  return COMPASS_POINTS[Math.floor((turn + 11.25) / 22.5) % 16]!;
}
