import type { LatLon } from '@/shared/geo/types';
import type { Fix, FixBearing, FixCaution, FixReport, FixResult } from '@/shared/schemas/fix';
import { RAD_PER_DEG, wrap360Deg, wrapPi } from './angles';
import { errorEllipse, ERROR_ELLIPSE_METHOD } from './error-ellipse';
import { errorQuadrilateral, ERROR_QUADRILATERAL_METHOD } from './error-quadrilateral';
import { FixError } from './fix-error';
import { intersectBearings } from './intersect-bearings';
import { DISAGREEMENT_SIGMAS, leastSquaresFix } from './least-squares-fix';
import { sightToPoint } from './sight-to-point';
import { trueBearingDeg } from './true-bearing';
import type { BearingLine } from './types';

/** Cut angles outside this band give a weak fix (common practice for cross-bearings, no source), degrees. */
export const GOOD_CUT_ANGLE_DEG = { min: 30, max: 150 } as const;

/** The standing cautions of every fix. */
export const FIX_CAUTIONS: readonly FixCaution[] = [
  {
    code: 'estimates-only',
    message: 'A fix is an estimate: it is only as good as the bearings, the positions of the posts and the declination used.',
  },
  {
    code: 'bearing-error',
    message:
      'Every bearing from a lookout has its own error (the instrument, its alignment, the reading, a smoke leaning in the wind); ' +
      'the error area shows only the uncertainties entered.',
  },
  { code: 'follow-procedures', message: 'Follow your agency’s procedures for confirming a fix and sending anyone to it.' },
];

/** A bearing of the request with where it was taken from (the post's location, or the typed observer). */
export type ResolvedFixBearing = FixBearing & {
  /** Where the bearing was taken, WGS84 degrees. */
  readonly from: LatLon;
  readonly postName: string | null;
  /** Eye above the ground, metres, when known. */
  readonly eyeHeightM: number | null;
};

const DEG = 1 / RAD_PER_DEG;

/** Where a fix lies and the area around it that holds the smoke, with how that area was drawn. */
const fixWithArea = (
  position: LatLon,
  area: { ring: Fix['errorArea']['coordinates'][number]; areaM2: number },
  errorAreaMethod: string,
) => ({
  latDeg: position.latDeg,
  lonDeg: position.lonDeg,
  errorArea: { type: 'Polygon' as const, coordinates: [area.ring] },
  errorAreaM2: area.areaM2,
  errorAreaMethod,
});

/**
 * What a fix's report repeats of one bearing: where and by whom it was taken,
 * what was read and the true bearing it stands for (degrees).
 */
export function reportedBearing(b: ResolvedFixBearing, index: number, trueBearingDeg: number) {
  return {
    index,
    postId: b.postId ?? null,
    postName: b.postName,
    from: { latDeg: b.from.latDeg, lonDeg: b.from.lonDeg },
    eyeHeightM: b.eyeHeightM,
    bearingDeg: b.bearingDeg,
    bearingReference: b.bearingReference,
    declinationDeg: b.bearingReference === 'magnetic' ? b.declinationDeg! : 0,
    trueBearingDeg,
    bearingSigmaDeg: b.bearingSigmaDeg,
  };
}
const round = (x: number, digits: number) => Number(x.toFixed(digits));

/**
 * The fix from two or more bearings, its error area, warnings and one report
 * per bearing — the same answer on the server and, offline, on a device.
 * Degrees in and out (this is the edge); radians inside. Two bearings: their
 * geodesic intersection, cut angle and error quadrilateral. Three or more:
 * the weighted least-squares position, residuals, the standard error ellipse
 * and a flag on any bearing beyond 3σ.
 *
 * @param observedAt when the bearings were taken (ISO 8601), echoed
 * @param bearings resolved bearings, at least two (not modified)
 * @throws {FixError} with the bearings at fault (parallel, diverging, too far, unbounded error area …)
 * @example
 * evaluateFix('2026-07-01T12:00:00Z', [
 *   { from: { latDeg: 51.7, lonDeg: 15.2 }, bearingDeg: 90, bearingReference: 'true', bearingSigmaDeg: 0.5, postName: null, eyeHeightM: null },
 *   { from: { latDeg: 51.6, lonDeg: 15.3 }, bearingDeg: 0, bearingReference: 'true', bearingSigmaDeg: 0.5, postName: null, eyeHeightM: null },
 * ]).fix; // ≈ 51.7° N, 15.3° E
 */
export function evaluateFix(observedAt: string, bearings: readonly ResolvedFixBearing[]): FixResult {
  if (bearings.length < 2) throw new FixError('too-few-bearings', 'A fix needs at least two bearings.');
  const trueDeg = bearings.map((b) => {
    try {
      return trueBearingDeg(b.bearingDeg, b.bearingReference, b.declinationDeg);
    } catch (error) {
      if (!(error instanceof RangeError)) throw error;
      throw new FixError('bad-input', error.message, [bearings.indexOf(b)]);
    }
  });
  const lines: BearingLine[] = bearings.map((b, i) => ({
    from: b.from,
    bearingRad: trueDeg[i]! * RAD_PER_DEG,
    sigmaRad: b.bearingSigmaDeg * RAD_PER_DEG,
  }));
  const warnings: string[] = [];
  let fix: Fix;
  let flagged: readonly number[] = [];
  const label = (i: number) => `Bearing ${i + 1}${bearings[i]!.postName ? ` (${bearings[i]!.postName})` : ''}`;

  if (lines.length === 2) {
    const [a, b] = lines as [BearingLine, BearingLine];
    const crossing = intersectBearings(a, b);
    const area = errorQuadrilateral(a, b);
    const cutAngleDeg = crossing.cutAngleRad * DEG;
    if (cutAngleDeg < GOOD_CUT_ANGLE_DEG.min || cutAngleDeg > GOOD_CUT_ANGLE_DEG.max) {
      warnings.push(
        `The bearings cross at ${cutAngleDeg.toFixed(0)}°, outside ${GOOD_CUT_ANGLE_DEG.min}°–${GOOD_CUT_ANGLE_DEG.max}°: ` +
          'a small error in either bearing moves the fix a long way along the lines. A bearing from a third post would help.',
      );
    }
    fix = {
      ...fixWithArea(crossing.position, area, ERROR_QUADRILATERAL_METHOD),
      cutAngleDeg: round(cutAngleDeg, 3),
      method: 'two-bearing-intersection',
      warnings,
    };
  } else {
    const ls = leastSquaresFix(lines);
    const ellipse = errorEllipse(ls.position, ls.covarianceM2);
    flagged = ls.disagreeing === null ? [] : [ls.disagreeing];
    for (const i of flagged) {
      warnings.push(
        `${label(i)} is ${(Math.abs(ls.residualsRad[i]!) * DEG).toFixed(1)}° off the fix — more than ` +
          `${DISAGREEMENT_SIGMAS} times its uncertainty — and disagrees with the others: check it ` +
          '(a misreading, another smoke, a magnetic bearing taken as true). The fix would move without it.',
      );
    }
    const others = ls.flagged.filter((i) => !flagged.includes(i));
    if (others.length > 0) {
      warnings.push(
        `${others.map(label).join(', ')} also ${others.length === 1 ? 'lies' : 'lie'} beyond ${DISAGREEMENT_SIGMAS}σ of the fix: ` +
          'the bearings do not agree within their uncertainties.',
      );
    }
    fix = {
      ...fixWithArea(ls.position, ellipse, ERROR_ELLIPSE_METHOD),
      residualsDeg: ls.residualsRad.map((r) => round(r * DEG, 6)),
      errorEllipse: {
        semiMajorM: ellipse.semiMajorM,
        semiMinorM: ellipse.semiMinorM,
        majorAxisDeg: round(ellipse.majorAzimuthRad * DEG, 3),
      },
      method: 'least-squares',
      warnings,
    };
  }
  if (bearings.some((b) => b.verticalAngleDeg !== undefined)) {
    warnings.push('Vertical angles are kept with the reports but not used to place this fix.');
  }

  const position = { latDeg: fix.latDeg, lonDeg: fix.lonDeg };
  const reports: FixReport[] = bearings.map((b, i) => {
    const sight = sightToPoint(b.from, position);
    const residualRad = wrapPi(lines[i]!.bearingRad - sight.azimuthAtFromRad);
    return {
      ...reportedBearing(b, i, trueDeg[i]!),
      verticalAngleDeg: b.verticalAngleDeg ?? null,
      distanceM: sight.distanceM,
      bearingToFixDeg: wrap360Deg(sight.azimuthAtFromRad * DEG),
      residualDeg: residualRad * DEG,
      flagged: flagged.includes(i),
    };
  });
  return { observedAt, fix, reports, cautions: FIX_CAUTIONS.map((c) => ({ ...c })) };
}
