/**
 * Reads the EPSG code of a projected or geographic CRS from its well-known
 * text (WKT1 as in ESRI `.prj` files, or WKT2): the authority code of the
 * outermost CRS (`AUTHORITY["EPSG","32633"]` / `ID["EPSG",32633]` as the last
 * one in the text), or, for ESRI-style WGS 84 UTM names without an authority
 * (`WGS_1984_UTM_Zone_33N`), 32600 + zone (north) or 32700 + zone (south).
 *
 * Source: OGC 01-009 (WKT1) and ISO 19162 (WKT2) authority clauses; EPSG
 * numbering of WGS 84 / UTM zones, 326zz north and 327zz south.
 *
 * @param wkt well-known text
 * @returns the EPSG code, or null when none can be found
 * @example
 * epsgFromWkt('PROJCS["WGS_1984_UTM_Zone_33N",GEOGCS[...]]'); // 32633
 */
export function epsgFromWkt(wkt: string): number | null {
  const authority = /(?:AUTHORITY\s*\[\s*"EPSG"\s*,\s*"?|ID\s*\[\s*"EPSG"\s*,\s*)(\d+)/gi;
  let last: number | null = null;
  let depthOfLast = Infinity;
  for (let match = authority.exec(wkt); match; match = authority.exec(wkt)) {
    // The outermost authority has the smallest bracket depth.
    const depth = bracketDepth(wkt, match.index);
    if (depth <= depthOfLast) {
      depthOfLast = depth;
      last = Number(match[1]);
    }
  }
  if (last !== null) return last;
  const utm = /WGS[_ ]?(?:19)?84[_ /]*UTM[_ ]zone[_ ](\d{1,2})([NS])/i.exec(wkt);
  if (utm) {
    const zone = Number(utm[1]);
    if (zone >= 1 && zone <= 60) return ((utm[2] as string).toUpperCase() === 'N' ? 32600 : 32700) + zone;
  }
  return null;
}

function bracketDepth(text: string, end: number): number {
  let depth = 0;
  for (let i = 0; i < end; i++) {
    const c = text[i];
    if (c === '[' || c === '(') depth++;
    else if (c === ']' || c === ')') depth--;
  }
  return depth;
}
