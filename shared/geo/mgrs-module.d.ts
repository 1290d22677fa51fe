/** Types of the `mgrs` package (proj4js/mgrs 1.x), which ships none. */
declare module 'mgrs' {
  /** [lon, lat] WGS 84 degrees → MGRS reference without spaces; accuracy 1–5 digits per axis (5 = 1 m). */
  export function forward(lonLat: [number, number], accuracy?: number): string;
  /** MGRS reference → bounding box [west, south, east, north] degrees. */
  export function inverse(mgrs: string): [number, number, number, number];
  /** MGRS reference → the middle of its square, [lon, lat] degrees. */
  export function toPoint(mgrs: string): [number, number];
}
