import { METRES_PER_LENGTH_UNIT } from '@/shared/units/length';
import type { UnitSystem } from '@/shared/units/unit-systems';

/** Unit systems a site or a person can choose: the one list in `@/shared/units`. */
export type ScaleUnits = UnitSystem;

/** A scale bar: a round length and how long it is drawn. */
export interface ScaleBar {
  /** Ground length the bar stands for, metres. */
  readonly metres: number;
  /** Its drawn length, pixels (≤ the maximum asked for). */
  readonly px: number;
  /** For people: "500 m", "2 km", "0.5 NM", "1000 ft", "2 mi". */
  readonly label: string;
}

// Exact by definition (`METRES_PER_LENGTH_UNIT`): 1 international nautical mile = 1852 m; 1 foot = 0.3048 m; 1 mile = 1609.344 m.
const NAUTICAL_MILE_M = METRES_PER_LENGTH_UNIT.nmi;
const FOOT_M = METRES_PER_LENGTH_UNIT.ft;
const MILE_M = METRES_PER_LENGTH_UNIT.mi;

/** The largest 1, 2 or 5 × 10ⁿ not above `value` (value > 0). */
function roundDown125(value: number): number {
  const power = 10 ** Math.floor(Math.log10(value));
  const lead = value / power;
  // A hair of slack, so 5 × 10ⁿ computed as 4.999… still counts as 5.
  const step = lead >= 5 - 1e-9 ? 5 : lead >= 2 - 1e-9 ? 2 : 1;
  return step * power;
}

const trim = (n: number) => String(Number(n.toPrecision(6)));

/**
 * A scale bar for a north-up map: the longest round length (1, 2 or 5 × 10ⁿ
 * of the unit) that fits in `maxPx` pixels at `metresPerPx`. Metric writes
 * metres below 1 km and kilometres from 1 km; nautical writes nautical miles
 * (metres below 0.1 NM); imperial writes feet below a quarter mile and miles
 * from there.
 *
 * @param metresPerPx ground metres per screen pixel (> 0)
 * @param maxPx longest bar allowed, pixels (> 0)
 * @param units the site's unit system; default metric
 * @example
 * scaleBar(12.3, 120); // { metres: 1000, px: 81.3…, label: '1 km' }
 */
export function scaleBar(metresPerPx: number, maxPx: number, units: ScaleUnits = 'metric'): ScaleBar {
  if (!(metresPerPx > 0) || !(maxPx > 0) || !Number.isFinite(metresPerPx) || !Number.isFinite(maxPx)) {
    throw new RangeError(`Scale bar needs positive numbers, got ${metresPerPx} m/px and ${maxPx} px.`);
  }
  const maxMetres = metresPerPx * maxPx;
  let metres: number;
  let label: string;
  if (units === 'nautical' && maxMetres >= 0.1 * NAUTICAL_MILE_M) {
    const nm = roundDown125(maxMetres / NAUTICAL_MILE_M);
    metres = nm * NAUTICAL_MILE_M;
    label = `${trim(nm)} NM`;
  } else if (units === 'imperial' && maxMetres >= MILE_M / 4) {
    const mi = roundDown125(maxMetres / MILE_M);
    metres = mi * MILE_M;
    label = `${trim(mi)} mi`;
  } else if (units === 'imperial') {
    const ft = roundDown125(maxMetres / FOOT_M);
    metres = ft * FOOT_M;
    label = `${trim(ft)} ft`;
  } else {
    metres = roundDown125(maxMetres);
    label = metres >= 1000 ? `${trim(metres / 1000)} km` : `${trim(metres)} m`;
  }
  return { metres, px: metres / metresPerPx, label };
}
