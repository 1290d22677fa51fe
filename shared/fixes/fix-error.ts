/** Why a fix cannot be computed. */
export type FixErrorCode =
  | 'too-few-bearings'
  | 'bad-input'
  | 'parallel'
  | 'diverging'
  | 'same-position'
  | 'too-far'
  | 'at-post'
  | 'no-convergence'
  | 'error-area-unbounded'
  | 'no-ground';

/**
 * Thrown by the bearing-fix core on bearings it cannot fix. `code` is stable;
 * `bearingIndexes` are the bearings at fault (indexes into the caller's list),
 * so the API can put the message under the right fields.
 */
export class FixError extends Error {
  override readonly name = 'FixError';

  constructor(
    readonly code: FixErrorCode,
    message: string,
    readonly bearingIndexes: readonly number[] = [],
  ) {
    super(message);
  }
}
