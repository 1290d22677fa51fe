/**
 * Types of Kenning's coordinate entry and display. Positions are WGS84
 * (EPSG:4326) latitude and longitude in degrees at this edge; UTM eastings
 * and northings are metres.
 */

/** A WGS84 position: latitude in degrees north (−90…90), longitude in degrees east (−180…180). */
export interface LatLon {
  readonly latDeg: number;
  readonly lonDeg: number;
}

/**
 * Ways of writing a position: decimal degrees (DD), degrees and decimal
 * minutes (DDM), degrees, minutes and seconds (DMS), or UTM zone, easting
 * and northing.
 */
export type CoordinateFormat = 'dd' | 'ddm' | 'dms' | 'utm' | 'mgrs';

/** A parsed position and the format it was written in. */
export interface ParsedCoordinate extends LatLon {
  readonly format: CoordinateFormat;
}

/** UTM hemisphere: `N` has false northing 0 m, `S` has 10 000 000 m at the equator. */
export type Hemisphere = 'N' | 'S';

/** A UTM grid position: zone 1–60, hemisphere, easting and northing in metres. */
export interface UtmCoordinate {
  readonly zone: number;
  readonly hemisphere: Hemisphere;
  /** Metres; 500 000 m on the zone's central meridian. */
  readonly easting: number;
  /** Metres from the equator (north), or 10 000 000 m minus the distance south of it (south). */
  readonly northing: number;
}

/** A UTM grid position with its latitude band letter and EPSG code. */
export interface UtmPosition extends UtmCoordinate {
  /** MGRS latitude band letter, C–X without I and O. */
  readonly band: string;
  /** EPSG code of the zone's grid on WGS84: 326zz (north) or 327zz (south). */
  readonly epsg: number;
}
