/**
 * Thrown by the sweep-width core on input it cannot work with. `field` names
 * the offending request field (a dot path such as `lateralRangeCurve.2.pod`
 * or `trackSpacingM`), so the API can answer with a field error; `code` is
 * stable.
 */
export class SweepInputError extends Error {
  override readonly name = 'SweepInputError';

  constructor(
    readonly code: 'not-finite' | 'out-of-range' | 'not-increasing' | 'too-many-tracks',
    readonly field: string,
    message: string,
  ) {
    super(message);
  }
}
