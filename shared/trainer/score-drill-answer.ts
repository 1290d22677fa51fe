import type { DrillAnswerUnit, DrillScoring } from '@/shared/schemas/drill';
import { convertLength } from '@/shared/units/length';

/** Full credit within ±5 %, half credit within ±15 %, none beyond. */
const FULL_PCT = 5;
const PARTIAL_PCT = 15;
const PARTIAL_CREDIT = 0.5;

/**
 * Why the bands are what they are (returned with every drill):
 * - ±5 %: the spread of the accepted rules themselves — k = 0.13, 1/7 or
 *   0.17 moves a horizon distance by about 2 %, and the rounded rules of
 *   thumb (3.57 √h km, 1.17 √h(ft) nmi, 1.76′ √h) by another 1 % — so any
 *   sound method worked with rounded numbers earns full credit;
 * - ±15 %: the right method with one slip — leaving refraction out changes a
 *   horizon by ≈ 7 % (√(1/0.87)), mixing feet and metres does not fit — earns
 *   half credit;
 * - beyond 15 %: the method was wrong, no credit.
 * Small answers (a hidden height of half a metre) get a floor instead of a
 * percentage: ±0.5 m (full) / ±1.5 m (partial) for heights, ±0.1 km /
 * ±0.3 km for distances, converted to the answer's unit.
 */
const WHY =
  'Full credit within ±5 %: the accepted refraction coefficients (0.13, 1/7, 0.17) and the rounded rules of thumb differ by about that much, ' +
  'so any sound method earns it. Half credit within ±15 %: the right method with one slip (leaving refraction out alone moves a horizon by about 7 %). ' +
  'Beyond that the method was wrong. Small answers get a floor instead: ±0.5 m / ±1.5 m for heights, ±0.1 km / ±0.3 km for distances.';

const FLOORS_M = { height: { full: 0.5, partial: 1.5 }, distance: { full: 100, partial: 300 } } as const;

/**
 * The scoring bands of a question answered in `unit`.
 *
 * @param unit - the answer's unit
 * @returns the bands (floors in `unit`; 0 for yes-no, which is right or wrong)
 *
 * Source: none — Kenning's own bands, reasoned above.
 *
 * @example
 * drillScoring('km').fullCreditFloor; // 0.1
 */
export function drillScoring(unit: DrillAnswerUnit): DrillScoring {
  if (unit === 'yes-no') {
    return {
      fullCreditWithinPct: 0,
      partialCreditWithinPct: 0,
      partialCredit: 0,
      fullCreditFloor: 0,
      partialCreditFloor: 0,
      why: 'A yes-no question is right (1) or wrong (0).',
    };
  }
  const floors = unit === 'm' || unit === 'ft' ? FLOORS_M.height : FLOORS_M.distance;
  return {
    fullCreditWithinPct: FULL_PCT,
    partialCreditWithinPct: PARTIAL_PCT,
    partialCredit: PARTIAL_CREDIT,
    fullCreditFloor: convertLength(floors.full, 'm', unit),
    partialCreditFloor: convertLength(floors.partial, 'm', unit),
    why: WHY,
  };
}

/**
 * The score of one answer: 1, the partial credit, or 0 by the bands of
 * {@link drillScoring}; a yes-no answer scores 1 when it matches.
 *
 * @param correct - the correct value, in the answer's unit (or a boolean)
 * @param given - the answer, in the same unit (or a boolean)
 * @param unit - the answer's unit
 * @returns the score, 0 … 1
 *
 * Source: none — Kenning's own bands.
 *
 * @example
 * scoreDrillAnswer(12.5, 12.0, 'km'); // 1 (4 % off)
 * scoreDrillAnswer(12.5, 11.2, 'km'); // 0.5 (10.4 % off)
 */
export function scoreDrillAnswer(correct: number | boolean, given: number | boolean, unit: DrillAnswerUnit): number {
  if (typeof correct === 'boolean' || typeof given === 'boolean') return correct === given ? 1 : 0;
  const bands = drillScoring(unit);
  const off = Math.abs(given - correct);
  const size = Math.abs(correct);
  if (off <= Math.max((size * bands.fullCreditWithinPct) / 100, bands.fullCreditFloor)) return 1;
  if (off <= Math.max((size * bands.partialCreditWithinPct) / 100, bands.partialCreditFloor)) return bands.partialCredit;
  return 0;
}
