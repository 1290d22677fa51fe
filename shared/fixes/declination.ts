import { magvar, MODEL_EPOCH, MODEL_VALID_UNTIL } from 'magvar';

/** The magnetic model the declinations come from, as shown to people and frozen with reports. */
export const MAGNETIC_MODEL = 'World Magnetic Model 2025 (WMM2025, valid 2025.0–2030.0)';

/** A declination from the model, with its validity. */
export interface ModelDeclination {
  /** Degrees, east positive (true = magnetic + declination), to 0.01°. */
  readonly declinationDeg: number;
  readonly model: string;
  /** False outside the model's years: the figure is extrapolated and may be a degree or more off. */
  readonly withinModelYears: boolean;
}

/**
 * The magnetic declination at a place and time from the World Magnetic
 * Model (through the `magvar` package), for turning a compass bearing into a
 * true one. The WMM's declination is typically good to about half a degree
 * (NOAA NCEI, WMM2025 technical report: global RMS error); local magnetic
 * disturbances are not in it.
 *
 * @param latDeg geodetic latitude, degrees
 * @param lonDeg longitude, degrees
 * @param when the time of the bearing
 * @param heightM height above sea level, metres (default 0)
 * @example
 * modelDeclination(80, 0, new Date('2025-01-01T00:00:00Z')).declinationDeg; // 1.28
 */
export function modelDeclination(latDeg: number, lonDeg: number, when: Date, heightM = 0): ModelDeclination {
  const year = decimalYear(when);
  return {
    declinationDeg: magvar(latDeg, lonDeg, heightM / 1000, year),
    model: MAGNETIC_MODEL,
    withinModelYears: year >= MODEL_EPOCH && year < MODEL_VALID_UNTIL,
  };
}

/** A UTC instant as a decimal year (2025.0 = 1 January 2025, 00:00 UTC). */
function decimalYear(when: Date): number {
  const y = when.getUTCFullYear();
  const start = Date.UTC(y, 0, 1);
  return y + (when.getTime() - start) / (Date.UTC(y + 1, 0, 1) - start);
}
