/**
 * How far, in degrees of latitude, a position read from UTM text may lie
 * outside the latitude band its letter names and still be accepted: one
 * minute of arc (about 1.85 km). It forgives positions read off a map at a
 * band edge or shifted by a datum change, and still catches a band letter
 * or northing that is wrong by a band (8°).
 */
export const BAND_MARGIN_DEG = 1 / 60;
