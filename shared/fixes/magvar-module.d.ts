/** Types of the `magvar` package (World Magnetic Model 2025–2030), which ships none. */
declare module 'magvar' {
  /** Declination, degrees east positive, rounded to 0.01°; altitude in kilometres; `when` a decimal year or Date. */
  export function magvar(latDeg: number, lonDeg: number, altitudeKm?: number, when?: number | Date): number;
  /** First year the model covers (2025.0). */
  export const MODEL_EPOCH: number;
  /** The model is meant for years before this one (2030.0). */
  export const MODEL_VALID_UNTIL: number;
}
