/** A point on a grid, metres (easting x, northing y). */
export interface GridPoint {
  readonly x: number;
  readonly y: number;
}

/** One place a patrol's view is computed from, and how long the cycle spends there. */
export interface PatrolSample extends GridPoint {
  /** Seconds of the cycle this sample stands for. */
  readonly weightS: number;
}

/** A patrol cycle cut into samples. */
export interface PatrolSamples {
  readonly samples: readonly PatrolSample[];
  /** Length of the route, metres (in the grid's plane). */
  readonly lengthM: number;
  /** Time to run the route once, seconds. */
  readonly transitS: number;
  /** Time held at the last waypoint, seconds (cycle − transit, ≥ 0). */
  readonly holdS: number;
  /** Greatest distance between neighbouring samples along the route, metres. */
  readonly spacingM: number;
}

/**
 * Cuts a patrol cycle into samples: each leg into the fewest equal pieces no
 * longer than `spacingM`, a sample at both ends of every piece standing for
 * half the time the craft spends on each piece beside it (piece ÷ speed; the
 * trapezoid rule, so the views reach the waypoints themselves), and the hold
 * at the last waypoint (cycle − transit), if any, added to that waypoint's
 * sample. Samples at one place are merged. The weights sum to the cycle. The route is run once per cycle, first waypoint to last;
 * an out-and-back patrol repeats its start as its last waypoint.
 *
 * Source: trapezoid-rule quadrature of the time a cell is in view over the
 * cycle — common practice, no source.
 *
 * @param route - waypoints in grid metres, ≥ 2 (not modified)
 * @param speedMps - speed along the route, m/s, > 0
 * @param cycleS - the cycle, seconds, ≥ transit time (a shorter one is taken as the transit time)
 * @param spacingM - longest piece, metres, > 0
 * @throws {RangeError} on fewer than two waypoints or a speed or spacing ≤ 0
 * @example
 * samplePatrol([{ x: 0, y: 0 }, { x: 1000, y: 0 }], 5, 400, 250).samples.length; // 5 (200 s of travel, 200 s held at the end)
 */
export function samplePatrol(route: readonly GridPoint[], speedMps: number, cycleS: number, spacingM: number): PatrolSamples {
  if (route.length < 2) throw new RangeError('A route needs at least two waypoints.');
  if (!(speedMps > 0) || !(spacingM > 0)) throw new RangeError('Speed and spacing must be more than 0.');
  const samples: { x: number; y: number; weightS: number }[] = [];
  // A sample at the same place as the last one (a waypoint shared by two legs, the hold) adds to its weight.
  const put = (x: number, y: number, weightS: number) => {
    const last = samples[samples.length - 1];
    if (last && last.x === x && last.y === y) last.weightS += weightS;
    else samples.push({ x, y, weightS });
  };
  let lengthM = 0;
  let longest = 0;
  for (let i = 1; i < route.length; i++) {
    const a = route[i - 1]!;
    const b = route[i]!;
    const legM = Math.hypot(b.x - a.x, b.y - a.y);
    if (legM === 0) continue;
    const pieces = Math.ceil(legM / spacingM);
    const pieceS = legM / pieces / speedMps;
    longest = Math.max(longest, legM / pieces);
    for (let p = 0; p <= pieces; p++) {
      const f = p / pieces;
      const x = p === pieces ? b.x : a.x + f * (b.x - a.x);
      const y = p === pieces ? b.y : a.y + f * (b.y - a.y);
      put(x, y, p === 0 || p === pieces ? pieceS / 2 : pieceS);
    }
    lengthM += legM;
  }
  const transitS = lengthM / speedMps;
  const holdS = Math.max(0, cycleS - transitS);
  const last = route[route.length - 1]!;
  if (holdS > 0) put(last.x, last.y, holdS);
  return { samples, lengthM, transitS, holdS, spacingM: longest };
}

/** Fewest samples per detection diameter: spacing at most a quarter of the range. */
export const SAMPLES_PER_RANGE = 4;

/**
 * Spacing of a patrol's samples along its route, metres: the largest s with
 *
 *   s²/(8R) ≤ c   (the union of the views, discs of radius R centred s
 *                  apart, dips between two centres by the sagitta
 *                  R − √(R² − s²/4) ≈ s²/(8R): at most one cell c), and
 *   s ≤ R/4       (a cell is seen from at least ~8 samples per pass across
 *                  its view, so its time in view is off by at most s/v at
 *                  each edge of the view: ≤ 1/8 of the longest stay),
 *
 * never below one cell (views from two points of one cell are the same
 * view). `tests/unit/patrol/patrol-sweep.test.ts` shows the union and the
 * fraction of the cycle converging as s shrinks.
 *
 * Source: sagitta of a circular arc, h = R − √(R² − (s/2)²) — plane geometry, common practice, no source.
 *
 * @param rangeM - the detection range the views reach, metres (> 0)
 * @param cellSizeM - the grid's cell, metres (> 0)
 * @example
 * patrolSampleSpacing(10_000, 30); // 1549 → min(1549, 2500) = 1549 m
 */
export function patrolSampleSpacing(rangeM: number, cellSizeM: number): number {
  if (!(rangeM > 0) || !(cellSizeM > 0)) throw new RangeError('Range and cell size must be more than 0.');
  return Math.max(cellSizeM, Math.min(Math.sqrt(8 * rangeM * cellSizeM), rangeM / SAMPLES_PER_RANGE));
}
