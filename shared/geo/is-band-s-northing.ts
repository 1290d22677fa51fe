import { BAND_MARGIN_DEG } from '@/shared/geo/band-margin';
import { utmProjection } from '@/shared/geo/utm-projection';

/**
 * Whether UTM text written with the single letter `S` (e.g. `33S 500000
 * 3600000`) reads as latitude band S — 32°N to 40°N, within the band margin
 * — rather than the southern hemisphere. The letter means both in common
 * use; the northing decides: read in the northern hemisphere, does it land
 * in band S? If it does, Kenning takes band S (the reading used by MGRS and
 * by mid-latitude northern grids). A southern-hemisphere position with such
 * a northing lies between about 50°S and 58°S: write it with its band letter
 * (E or F) or as `33 south`.
 *
 * @param zone - UTM zone, integer 1–60
 * @param easting - metres
 * @param northing - metres
 * @returns true when the northing reads as band S
 *
 * Source: band S spans 32°N–40°N (DMA TM 8358.1, chapter 3); the rule is
 * Kenning's own.
 *
 * @example
 * isBandSNorthing(38, 444140.54, 3684706.36); // true  (33.3°N)
 * isBandSNorthing(56, 334873.2, 6252266.09);  // false (33.9°S)
 */
export function isBandSNorthing(zone: number, easting: number, northing: number): boolean {
  const [, latDeg] = utmProjection(zone, 'N').inverse([easting, northing]);
  return latDeg >= 32 - BAND_MARGIN_DEG && latDeg <= 40 + BAND_MARGIN_DEG;
}
