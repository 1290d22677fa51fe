/**
 * Longitude of a UTM zone's central meridian: 6·zone − 183 degrees east
 * (zone 1: 177°W, zone 31: 3°E, zone 60: 177°E). The widened Norway and
 * Svalbard zones keep their standard central meridian.
 *
 * @param zone - UTM zone, integer 1–60 (not checked here)
 * @returns degrees east, −177…177
 *
 * Source: Lantmäteriet (Swedish mapping authority), "UTM" page: central
 * meridian = zone number · 6 − 183; the 6° zones numbered eastward from
 * 180° are the DMA TM 8358.2 definition (from memory).
 *
 * @example
 * utmCentralMeridian(33); // 15
 */
export function utmCentralMeridian(zone: number): number {
  return zone * 6 - 183;
}
