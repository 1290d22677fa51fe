/**
 * Thrown by the sightline core on input it cannot work with: a value that is
 * not a finite number, or one outside its physical domain (a negative height,
 * a non-positive radius, a pressure of zero…). Conditions that are physically
 * possible but have no answer (ducting, a target past the effective quarter
 * circle) are *not* errors: they come back as `Derived` values with a reason.
 *
 * `field` names the offending argument; `code` is stable.
 */
export class SightlineInputError extends Error {
  override readonly name = 'SightlineInputError';

  constructor(
    readonly code: 'not-finite' | 'out-of-range',
    readonly field: string,
    message: string,
  ) {
    super(message);
  }
}
