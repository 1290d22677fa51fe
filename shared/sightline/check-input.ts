import { SightlineInputError } from '@/shared/sightline/sightline-error';

/** Bounds for {@link checkInput}; each is inclusive unless marked exclusive. */
export interface InputBounds {
  readonly min?: number;
  readonly max?: number;
  /** Reject `value === min` too (e.g. radii must be > 0). */
  readonly minExclusive?: boolean;
  /** Reject `value === max` too. */
  readonly maxExclusive?: boolean;
}

/**
 * Guards one numeric argument of a core function: it must be finite and
 * within the bounds. Returns the value so calls can be inlined.
 *
 * @param field - argument name, reported in the error
 * @param value - the value to check
 * @param bounds - optional inclusive/exclusive bounds
 * @returns `value`, unchanged
 * @throws {SightlineInputError} `not-finite` or `out-of-range`
 *
 * @example
 * checkInput('observerHeightM', 12, { min: 0 }); // 12
 * checkInput('observerHeightM', -1, { min: 0 }); // throws
 */
export function checkInput(field: string, value: number, bounds: InputBounds = {}): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new SightlineInputError('not-finite', field, `${field} must be a finite number, got ${String(value)}`);
  }
  const { min, max, minExclusive = false, maxExclusive = false } = bounds;
  if (min !== undefined && (value < min || (minExclusive && value === min))) {
    throw new SightlineInputError('out-of-range', field, `${field} must be ${minExclusive ? '>' : '≥'} ${min}, got ${value}`);
  }
  if (max !== undefined && (value > max || (maxExclusive && value === max))) {
    throw new SightlineInputError('out-of-range', field, `${field} must be ${maxExclusive ? '<' : '≤'} ${max}, got ${value}`);
  }
  return value;
}
