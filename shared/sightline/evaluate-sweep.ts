import type { SweepWidthRequest, SweepWidthResult } from '@/shared/schemas/sweep-width';
import { definiteRangeParallelSweepPod } from '@/shared/sightline/definite-range-law';
import { inverseCubeParallelSweepPod, inverseCubeSweepWidth } from '@/shared/sightline/inverse-cube-law';
import { parallelSweepPod } from '@/shared/sightline/parallel-sweep-pod';
import { randomSearchPod } from '@/shared/sightline/random-search-pod';
import { sweepWidthFromCurve } from '@/shared/sightline/sweep-width-from-curve';

/** The standing caution of every sweep-width answer. */
export const SWEEP_CAUTION =
  'POD is an estimate for planning, not a promise: it holds only if the sweep width fits this search object, ' +
  'visibility, sea, light and these searchers, and the tracks are followed as planned. Visibility is not detection — ' +
  'a target within range can still be missed. Follow your agency’s search-planning procedures.';

const KOOPMAN = 'B. O. Koopman, Search and Screening (1946; 2nd ed. 1980)';
const EAGLE = 'J. N. Eagle, Lateral Range Curves and Sweepwidth (NPS OA3602 notes, 2012, after Washburn, Search and Detection)';

/**
 * Sweep width, coverage factor and probability of detection of one
 * parallel-sweep search (see {@link SweepWidthRequestSchema} for the ways to
 * give W). Pure; runs on the server and, offline, on the device.
 *
 * @param request - a request parsed by `SweepWidthRequestSchema`
 * @returns W, C = W/S, the model's POD, the random-search POD, the method and source in words, warnings and the caution
 * @throws {SweepInputError} with the request field at fault (a curve whose ranges do not increase,
 *   a spacing that needs more than 2000 tracks a side)
 *
 * @example
 * evaluateSweep({ sweepWidthM: 1000, trackSpacingM: 1000 }).pod; // ≈ 0.79 (inverse-cube, C = 1)
 */
export function evaluateSweep(request: SweepWidthRequest): SweepWidthResult {
  const S = request.trackSpacingM;
  const warnings: string[] = [];
  if (request.lateralRangeCurve) {
    const curve = request.lateralRangeCurve;
    const W = sweepWidthFromCurve(curve);
    const { pod, tracksEachSide } = parallelSweepPod(curve, S);
    const last = curve[curve.length - 1]!;
    if (last.pod > 0) {
      warnings.push(
        `The curve ends at ${last.rangeM} m with a POD of ${last.pod}; beyond it the POD is taken as 0, ` +
          'so the sweep width may be too small.',
      );
    }
    const C = W / S;
    return {
      model: 'lateral-range-curve',
      sweepWidthM: W,
      trackSpacingM: S,
      coverageFactor: C,
      pod,
      podRandomSearch: randomSearchPod(C),
      tracksEachSide,
      method:
        'W is the area under the curve (trapezoid rule, both sides of the track); the POD is the chance that at least ' +
        'one track detects the target, averaged over its position between tracks.',
      source: EAGLE,
      warnings,
      caution: SWEEP_CAUTION,
    };
  }
  const model = request.model ?? 'inverse-cube';
  let W: number;
  if (request.sweepWidthM !== undefined) W = request.sweepWidthM;
  else if (model === 'inverse-cube') W = inverseCubeSweepWidth(request.inverseCubeKM2!);
  else W = 2 * request.definiteRangeM!;
  const C = W / S;
  if (C > 3) warnings.push('A coverage factor above 3 buys little more POD for the effort; check the track spacing.');
  const inverseCube = model === 'inverse-cube';
  return {
    model,
    sweepWidthM: W,
    trackSpacingM: S,
    coverageFactor: C,
    pod: inverseCube ? inverseCubeParallelSweepPod(C) : definiteRangeParallelSweepPod(C),
    podRandomSearch: randomSearchPod(C),
    tracksEachSide: null,
    method: inverseCube
      ? 'Inverse-cube law on parallel tracks: POD = erf((√π/2)·C), C = W/S' +
        (request.inverseCubeKM2 !== undefined ? '; W = 2·√(π·K) from p(x) = 1 − exp(−K/x²).' : '.')
      : 'Definite range on parallel tracks: POD = min(1, C), C = W/S, W = 2R.',
    source: inverseCube ? `${KOOPMAN}; ${EAGLE}` : KOOPMAN,
    warnings,
    caution: SWEEP_CAUTION,
  };
}
