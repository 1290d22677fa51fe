/**
 * A refraction coefficient for people: three significant decimals, but never
 * rounded across a regime edge — 0.9996 stays "0.9996", not "1" (which would
 * read as a duct), and −0.0004 stays below 0. Trailing zeros dropped.
 *
 * @param k - refraction coefficient, dimensionless, finite
 * @returns the number as text (no "k =")
 *
 * Source: none — display rule of Kenning (regime edges 0, 0.5 and 1, see
 * `classifyRefraction`).
 *
 * @example
 * formatK(0.13); // '0.13'
 * formatK(0.9996); // '0.9996'
 */
export function formatK(k: number): string {
  const edges = [0, 0.5, 1];
  for (let decimals = 3; decimals <= 12; decimals++) {
    const rounded = Number(k.toFixed(decimals));
    const crosses = edges.some((edge) => k < edge !== rounded < edge);
    if (!crosses) return String(rounded);
  }
  return String(k);
}
