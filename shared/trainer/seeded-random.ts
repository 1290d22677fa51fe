/** A reproducible stream of numbers from one seed (see {@link seededRandom}). */
export interface SeededRandom {
  /** The next number in [0, 1). */
  next(): number;
  /** A whole number in [min, max], both included. */
  int(min: number, max: number): number;
  /** A number in [min, max). */
  between(min: number, max: number): number;
  /** One element of a non-empty list. */
  pick<T>(items: readonly T[]): T;
}

/**
 * A small seeded pseudo-random generator (mulberry32): the same seed always
 * gives the same stream, on the server and in the browser, so a drill can be
 * set again from its seed. Not for anything secret.
 *
 * @param seed - any whole number (taken modulo 2³²)
 * @returns the generator
 *
 * Source: mulberry32, a 32-bit generator by Tommy Ettinger (public domain),
 * as widely reproduced (from memory).
 *
 * @example
 * const r = seededRandom(42); r.next(); // 0.6011…, the same every time
 */
export function seededRandom(seed: number): SeededRandom {
  let state = seed >>> 0;
  const next = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4_294_967_296;
  };
  return {
    next,
    int: (min, max) => min + Math.floor(next() * (max - min + 1)),
    between: (min, max) => min + next() * (max - min),
    pick<T>(items: readonly T[]): T {
      if (items.length === 0) throw new Error('pick from an empty list');
      return items[Math.floor(next() * items.length)] as T;
    },
  };
}
