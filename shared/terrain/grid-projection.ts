import proj4 from 'proj4';
import type { LatLon } from '@/shared/geo/types';
import { utmProjection } from '@/shared/geo/utm-projection';
import type { TerrainCrs } from '@/shared/terrain/grid-spec';

/** Converts between WGS84 latitude/longitude and one terrain grid's projected coordinates. */
export interface GridProjection {
  /** For people, e.g. "WGS 84 / UTM zone 33N (EPSG:32633)". */
  readonly label: string;
  /** EPSG code when known. */
  readonly epsg: number | null;
  /** WGS84 degrees → grid easting and northing, metres. */
  toGrid(point: LatLon): { x: number; y: number };
  /** Grid easting and northing, metres → WGS84 degrees. */
  toLatLon(x: number, y: number): LatLon;
}

/** Why a terrain's CRS cannot be used. */
export type TerrainCrsErrorCode = 'missing' | 'geographic' | 'not-metric' | 'unsupported' | 'unknown';

/** A terrain CRS Kenning cannot compute in: absent, in degrees, not in metres, distorted, or unknown. */
export class TerrainCrsError extends Error {
  readonly code: TerrainCrsErrorCode;
  constructor(code: TerrainCrsErrorCode, message: string) {
    super(message);
    this.name = 'TerrainCrsError';
    this.code = code;
  }
}

const REPROJECT =
  'Reproject the terrain to UTM first, e.g. `gdalwarp -t_srs EPSG:326xx in.tif out.tif` (xx = UTM zone; 327xx south of the equator).';

const cache = new Map<string, GridProjection>();

/**
 * The coordinate conversion of a terrain grid — the one place Kenning turns
 * latitude/longitude into grid metres and back.
 *
 * Accepted: projected CRSs in metres. WGS 84 / UTM zones (EPSG 32601–32660
 * north, 32701–32760 south) go through `@/shared/geo`'s UTM projection; ETRS89
 * / UTM (EPSG 25828–25838) and NAD83 / UTM (EPSG 26901–26923) through proj4's
 * UTM on the GRS 80 ellipsoid (datum shift to WGS84 taken as zero, below
 * 2 m); any other CRS through proj4 from its well-known text (a `.prj`).
 * Refused: no CRS, a geographic CRS (degrees), a CRS not in metres, and Web
 * Mercator (EPSG:3857, whose scale grows as 1/cos latitude, so its "metres"
 * are not ground metres).
 *
 * Source: EPSG Geodetic Parameter Dataset code ranges of the WGS 84, ETRS89
 * and NAD83 UTM series (from memory); proj4 (npm) for the projections and
 * WKT parsing.
 *
 * Converters are built once per CRS and kept (the same CRS always gives the
 * same conversion).
 *
 * @param crs the terrain's CRS (EPSG code and/or WKT), or null
 * @returns the conversion
 * @throws TerrainCrsError `missing`, `geographic`, `not-metric`, `unsupported`, `unknown`
 * @example
 * const grid = gridProjection({ epsg: 32633, wkt: null });
 * grid.toGrid({ latDeg: 51.8, lonDeg: 15.3 }); // { x: 520706.5…, y: 5739101.1… }
 */
export function gridProjection(crs: TerrainCrs | null): GridProjection {
  if (!crs || (crs.epsg === null && !crs.wkt)) {
    throw new TerrainCrsError(
      'missing',
      'The terrain does not say which coordinate system it is in. Give its EPSG code (e.g. 32633 for WGS 84 / UTM zone 33N) or add its .prj file.',
    );
  }
  const key = `${crs.epsg ?? ''}|${crs.wkt ?? ''}`;
  const known = cache.get(key);
  if (known) return known;
  const projection = build(crs);
  cache.set(key, projection);
  return projection;
}

function build(crs: TerrainCrs): GridProjection {
  const epsg = crs.epsg;
  if (epsg !== null && ((epsg >= 32601 && epsg <= 32660) || (epsg >= 32701 && epsg <= 32760))) {
    const zone = epsg % 100;
    const hemisphere = epsg >= 32701 ? 'S' : 'N';
    const utm = utmProjection(zone, hemisphere);
    return {
      label: `WGS 84 / UTM zone ${zone}${hemisphere} (EPSG:${epsg})`,
      epsg,
      toGrid: ({ latDeg, lonDeg }) => {
        const [x, y] = utm.forward([lonDeg, latDeg]);
        return { x, y };
      },
      toLatLon: (x, y) => {
        const [lonDeg, latDeg] = utm.inverse([x, y]);
        return { latDeg, lonDeg };
      },
    };
  }
  if (
    epsg === 3857 ||
    epsg === 900913 ||
    epsg === 102100 ||
    (crs.wkt && /pseudo[-_ ]?mercator|auxiliary_sphere/i.test(crs.wkt))
  ) {
    throw new TerrainCrsError(
      'unsupported',
      `Web Mercator (EPSG:3857) stretches distances by 1/cos(latitude), so its metres are not ground metres. ${REPROJECT}`,
    );
  }
  if (epsg !== null && !crs.wkt) {
    const utm = gridUtmOnGrs80(epsg);
    if (utm) return fromProj4(utm.definition, utm.label, epsg);
    if (epsg === 4326 || epsg === 4269 || epsg === 4258 || (epsg >= 4000 && epsg < 5000)) {
      throw new TerrainCrsError('geographic', `EPSG:${epsg} is a geographic CRS in degrees. ${REPROJECT}`);
    }
    throw new TerrainCrsError(
      'unknown',
      `Kenning knows the UTM codes (WGS 84 326xx/327xx, ETRS89 258xx, NAD83 269xx) but not EPSG:${epsg}. Add the terrain's .prj file, or ${REPROJECT.charAt(0).toLowerCase()}${REPROJECT.slice(1)}`,
    );
  }
  const wkt = crs.wkt as string;
  if (/^\s*GEOG(CS|CRS)\b/i.test(wkt)) {
    throw new TerrainCrsError('geographic', `The .prj describes a geographic CRS in degrees. ${REPROJECT}`);
  }
  let parsed: { projName?: string; units?: string; to_meter?: number };
  try {
    parsed = proj4.Proj(wkt) as unknown as { projName?: string; units?: string; to_meter?: number };
  } catch {
    throw new TerrainCrsError('unknown', `The coordinate system text (.prj) cannot be read. ${REPROJECT}`);
  }
  if (parsed.projName === 'longlat') {
    throw new TerrainCrsError('geographic', `The .prj describes a geographic CRS in degrees. ${REPROJECT}`);
  }
  const toMeter = parsed.to_meter ?? (parsed.units && /^(m|meters?|metres?)$/i.test(parsed.units) ? 1 : undefined);
  if (toMeter === undefined || Math.abs(toMeter - 1) > 1e-12) {
    throw new TerrainCrsError(
      'not-metric',
      `The terrain's coordinates are in ${parsed.units ?? 'an unknown unit'}, not metres. ${REPROJECT}`,
    );
  }
  const name = /^\s*PROJ(?:CS|CRS)\s*\[\s*"([^"]*)"/i.exec(wkt)?.[1];
  return fromProj4(wkt, `${name ?? 'Projected CRS'}${epsg !== null ? ` (EPSG:${epsg})` : ''}`, epsg);
}

function gridUtmOnGrs80(epsg: number): { definition: string; label: string } | null {
  let zone: number | null = null;
  let datum = '';
  if (epsg >= 25828 && epsg <= 25838) {
    zone = epsg - 25800;
    datum = 'ETRS89';
  } else if (epsg >= 26901 && epsg <= 26923) {
    zone = epsg - 26900;
    datum = 'NAD83';
  }
  if (zone === null) return null;
  return {
    definition: `+proj=utm +zone=${zone} +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +units=m +no_defs`,
    label: `${datum} / UTM zone ${zone}N (EPSG:${epsg})`,
  };
}

function fromProj4(definition: string, label: string, epsg: number | null): GridProjection {
  let converter: proj4.Converter;
  try {
    converter = proj4('WGS84', definition);
  } catch {
    throw new TerrainCrsError('unknown', `The coordinate system cannot be used for conversion. ${REPROJECT}`);
  }
  return {
    label,
    epsg,
    toGrid: ({ latDeg, lonDeg }) => {
      const [x, y] = converter.forward([lonDeg, latDeg]);
      return { x: x ?? Number.NaN, y: y ?? Number.NaN };
    },
    toLatLon: (x, y) => {
      const [lonDeg, latDeg] = converter.inverse([x, y]);
      return { latDeg: latDeg ?? Number.NaN, lonDeg: lonDeg ?? Number.NaN };
    },
  };
}
