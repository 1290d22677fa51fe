/**
 * Kenning's one home for physical constants and conventional coefficients:
 * earth radius, ellipsoid, refraction defaults, standard atmosphere, units
 * fixed by definition. All SI: metres, radians, kelvin, hectopascals where
 * stated. The sightline core, the terrain core, the server and the scenes all
 * import them from here.
 */

/**
 * IUGG mean Earth radius R₁ = (2a + b)/3 = 6 371 008.7714 m on the GRS 80
 * ellipsoid, rounded to 0.1 m. Source: Geodetic Reference System 1980
 * (GRS 80), table of derived geometric constants.
 */
export const MEAN_EARTH_RADIUS_M = 6_371_008.8;

/** WGS 84 semi-major axis a, metres. Source: NIMA TR8350.2 (2000), WGS 84 defining parameters. */
export const WGS84_SEMI_MAJOR_AXIS_M = 6_378_137;

/** WGS 84 flattening f = 1/298.257223563. Source: NIMA TR8350.2 (2000), WGS 84 defining parameters. */
export const WGS84_FLATTENING = 1 / 298.257_223_563;

/**
 * Conventional optical refraction coefficient for terrestrial sightlines,
 * k = 0.13: the long-standing default of geodetic surveying (common
 * practice; individual sightlines near the ground range from below 0 to
 * above 1).
 */
export const STANDARD_OPTICAL_K = 0.13;

/**
 * Radio "4/3 earth": k = 1 − 3/4 = 0.25. Source: IEC 60050-705 (705-05-41)
 * and Federal Standard 1037C "effective Earth radius": for the standard
 * radio atmosphere the effective radius is 4/3 of the actual radius.
 */
export const RADIO_FOUR_THIRDS_K = 0.25;

/** Standard sea-level pressure, hPa (ISO 2533 / ICAO standard atmosphere). */
export const STANDARD_PRESSURE_HPA = 1013.25;

/** Standard sea-level temperature, K (ISO 2533 / ICAO standard atmosphere). */
export const STANDARD_TEMPERATURE_K = 288.15;

/** Standard tropospheric temperature gradient dT/dh, K/m (ISO 2533: −6.5 K/km). */
export const STANDARD_TEMPERATURE_GRADIENT_K_PER_M = -0.0065;

/** One minute of arc in radians: the resolving angle of 20/20 (6/6) vision. */
export const ONE_ARCMINUTE_RAD = Math.PI / (180 * 60);

/** The international nautical mile, metres (exact by definition). */
export const NAUTICAL_MILE_M = 1852;
