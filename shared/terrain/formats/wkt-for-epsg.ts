/**
 * Well-known text (WKT1, the form ESRI `.prj` files and GDAL read) for a
 * WGS 84 / UTM zone CRS: EPSG 32601–32660 (north) and 32701–32760 (south).
 * Other codes give null — the caller then writes no `.prj` and says so.
 *
 * Source: EPSG Geodetic Parameter Dataset definitions of WGS 84 / UTM zones
 * (Transverse Mercator, central meridian 6·zone − 183°, scale 0.9996, false
 * easting 500 000 m, false northing 0 m north / 10 000 000 m south).
 *
 * @param epsg EPSG code
 * @returns WKT1 text, or null for codes outside WGS 84 / UTM
 * @example
 * wktForEpsg(32633)?.startsWith('PROJCS["WGS 84 / UTM zone 33N"'); // true
 */
export function wktForEpsg(epsg: number): string | null {
  const north = epsg >= 32601 && epsg <= 32660;
  const south = epsg >= 32701 && epsg <= 32760;
  if (!north && !south) return null;
  const zone = epsg % 100;
  const name = `WGS 84 / UTM zone ${zone}${north ? 'N' : 'S'}`;
  return (
    `PROJCS["${name}",GEOGCS["WGS 84",DATUM["WGS_1984",SPHEROID["WGS 84",6378137,298.257223563,` +
    `AUTHORITY["EPSG","7030"]],AUTHORITY["EPSG","6326"]],PRIMEM["Greenwich",0,AUTHORITY["EPSG","8901"]],` +
    `UNIT["degree",0.0174532925199433,AUTHORITY["EPSG","9122"]],AUTHORITY["EPSG","4326"]],` +
    `PROJECTION["Transverse_Mercator"],PARAMETER["latitude_of_origin",0],` +
    `PARAMETER["central_meridian",${6 * zone - 183}],PARAMETER["scale_factor",0.9996],` +
    `PARAMETER["false_easting",500000],PARAMETER["false_northing",${north ? 0 : 10000000}],` +
    `UNIT["metre",1,AUTHORITY["EPSG","9001"]],AXIS["Easting",EAST],AXIS["Northing",NORTH],` +
    `AUTHORITY["EPSG","${epsg}"]]`
  );
}
