/**
 * Thrown by the unit converters in `@/shared/units` when a value is not a
 * finite number, a unit name is not known, or a value is physically
 * impossible (a temperature below absolute zero).
 *
 * `code` is stable and safe to branch on; `message` is for people.
 */
export class UnitError extends Error {
  override readonly name = 'UnitError';

  constructor(
    readonly code: 'not-finite' | 'unknown-unit' | 'below-absolute-zero',
    message: string,
  ) {
    super(message);
  }
}
