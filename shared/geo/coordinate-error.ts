/** Stable reasons a coordinate cannot be read, converted or written. */
export type CoordinateErrorCode =
  | 'empty'
  | 'too-long'
  | 'unexpected-character'
  | 'bad-number'
  | 'cannot-split'
  | 'too-many-separators'
  | 'missing-number'
  | 'hemisphere-placement'
  | 'hemisphere-conflict'
  | 'sign-and-hemisphere'
  | 'misplaced-sign'
  | 'too-many-parts'
  | 'mark-order'
  | 'fraction-not-last'
  | 'minutes-out-of-range'
  | 'seconds-out-of-range'
  | 'latitude-out-of-range'
  | 'longitude-out-of-range'
  | 'mixed-formats'
  | 'format-mismatch'
  | 'not-utm'
  | 'unknown-zone'
  | 'missing-zone-letter'
  | 'unknown-zone-letter'
  | 'polar-zone'
  | 'unused-zone'
  | 'band-mismatch'
  | 'easting-out-of-range'
  | 'northing-out-of-range'
  | 'outside-utm-area'
  | 'outside-zone'
  | 'not-finite'
  | 'unknown-format'
  | 'invalid-option';

/** Which part of the coordinate the error is about. */
export type CoordinatePart = 'text' | 'latitude' | 'longitude' | 'zone' | 'easting' | 'northing' | 'options';

/**
 * Thrown by `@/shared/geo` on a coordinate it cannot read, convert or write:
 * text that is not a position, a value outside its range (latitude beyond
 * 90°, minutes of 60 or more, a UTM zone outside 1–60…), or a position
 * outside the UTM area.
 *
 * `code` is stable and safe to branch on; `part` names the offending part;
 * `message` is a sentence for the person who typed the coordinate.
 */
export class CoordinateError extends Error {
  override readonly name = 'CoordinateError';

  constructor(
    readonly code: CoordinateErrorCode,
    readonly part: CoordinatePart,
    message: string,
  ) {
    super(message);
  }
}
