/**
 * Tolerance assertions for the coordinate tests: every check states its own
 * absolute tolerance; floats are never compared exactly.
 */
import { CoordinateError, type CoordinateErrorCode, type CoordinatePart } from '@/shared/geo/coordinate-error';

/** Asserts `actual` is a finite number within `tolerance` (absolute) of `expected`. */
export function expectWithin(actual: number | undefined, expected: number, tolerance: number): void {
  expect(typeof actual).toBe('number');
  const value = actual as number;
  expect(Number.isFinite(value)).toBe(true);
  if (!(Math.abs(value - expected) <= tolerance)) {
    throw new Error(`expected ${value} to be within ${tolerance} of ${expected} (off by ${Math.abs(value - expected)})`);
  }
}

/** Runs `run`, asserts it throws a CoordinateError with `code` (and `part`), and returns the error for message checks. */
export function expectCoordinateError(run: () => unknown, code: CoordinateErrorCode, part?: CoordinatePart): CoordinateError {
  let thrown: unknown = null;
  try {
    run();
  } catch (error) {
    thrown = error;
  }
  expect(thrown).toBeInstanceOf(CoordinateError);
  const error = thrown as CoordinateError;
  expect(error.code).toBe(code);
  if (part !== undefined) expect(error.part).toBe(part);
  expect(error.name).toBe('CoordinateError');
  return error;
}

/** Deep-freezes a plain value so that any mutation by the code under test throws (strict mode). */
export function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object') {
    for (const key of Object.keys(value)) deepFreeze((value as Record<string, unknown>)[key]);
    Object.freeze(value);
  }
  return value;
}
