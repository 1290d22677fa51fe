/**
 * Tolerance assertions for the sightline tests: every check states its own
 * absolute or relative tolerance; floats are never compared exactly.
 */

/** Asserts `actual` is a finite number within `tolerance` (absolute) of `expected`. */
export function expectWithin(actual: number | null | undefined, expected: number, tolerance: number): void {
  expect(typeof actual).toBe('number');
  const value = actual as number;
  expect(Number.isFinite(value)).toBe(true);
  if (Math.abs(value - expected) > tolerance) {
    throw new Error(`expected ${value} to be within ${tolerance} of ${expected} (off by ${Math.abs(value - expected)})`);
  }
}

/** Asserts `actual` is within `relative` (a fraction, e.g. 0.005 = 0.5 %) of `expected`. */
export function expectRelative(actual: number | null | undefined, expected: number, relative: number): void {
  expectWithin(actual, expected, Math.abs(expected) * relative);
}

/** Deep-freezes a plain value so that any mutation by the code under test throws (strict mode). */
export function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object') {
    for (const key of Object.keys(value)) deepFreeze((value as Record<string, unknown>)[key]);
    Object.freeze(value);
  }
  return value;
}

/** Every number anywhere inside `value` (depth-first). */
export function numbersIn(value: unknown): number[] {
  if (typeof value === 'number') return [value];
  if (Array.isArray(value)) return value.flatMap(numbersIn);
  if (value !== null && typeof value === 'object') return Object.values(value).flatMap(numbersIn);
  return [];
}
