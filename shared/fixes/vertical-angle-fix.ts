import { Geodesic } from 'geographiclib-geodesic';
import type { LatLon } from '@/shared/geo/types';
import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';
import {
  DEFAULT_VERTICAL_SIGMA_DEG,
  type FixCaution,
  type FixRange,
  type FixResult,
  type VerticalAngleReference,
} from '@/shared/schemas/fix';
import { RAD_PER_DEG, wrap360Deg } from './angles';
import { horizonDipRad, smoothEarthRangeM } from './depression-range';
import { FIX_CAUTIONS, reportedBearing, type ResolvedFixBearing } from './evaluate-fix';
import { FixError } from './fix-error';
import { rayTerrainHit } from './ray-terrain-hit';
import { geodesicRing } from './ring-area';
import { trueBearingDeg } from './true-bearing';

/** The ground along the bearing, when the post's site has terrain. */
export interface TerrainAlongBearing {
  /** Ground height at a distance along the true bearing from the post, metres (null off the terrain or on nodata). */
  readonly groundAtM: (distanceM: number) => number | null;
  /** Ground height at the post, metres. */
  readonly groundAtPostM: number;
  /** March step, metres (half a terrain cell). */
  readonly stepM: number;
  /** The farthest distance searched (to the terrain's edge at most), metres. */
  readonly maxRangeM: number;
}

/** What the vertical-angle fix needs beside the bearing. */
export interface VerticalAngleOptions {
  /** Refraction coefficient of the ray (the plan's or site's condition; standard optical 0.13). */
  readonly k: number;
  /** The ground along the bearing, or null: then a smooth earth at the post's foot. */
  readonly terrain: TerrainAlongBearing | null;
  readonly earthRadiusM?: number;
}

/** The standing caution of a range from a vertical angle. */
export const VERTICAL_ANGLE_CAUTION: FixCaution = {
  code: 'vertical-angle',
  message:
    'A range from a vertical angle is an estimate only: refraction near the horizon varies widely from the value used, ' +
    'and a tenth of a degree moves a point seen just below the horizon a long way. Read the angle to the base of the smoke, ' +
    'not its top, and confirm by a bearing from a second post.',
};

const DEG = 1 / RAD_PER_DEG;
/** Points on each arc of the error wedge. */
const ARC_POINTS = 5;

function pointAt(from: LatLon, azimuthDeg: number, distanceM: number): LatLon {
  const r = Geodesic.WGS84.Direct(from.latDeg, from.lonDeg, azimuthDeg, distanceM, Geodesic.LATITUDE | Geodesic.LONGITUDE);
  return { latDeg: r.lat2 ?? from.latDeg, lonDeg: r.lon2 ?? from.lonDeg };
}

/**
 * A fix from one post: the bearing and the vertical angle of the sight to
 * the base of a smoke (or the waterline of a vessel). With terrain, the
 * refracted ray from the eye is marched along the bearing until it meets the
 * ground ({@link rayTerrainHit}); without terrain the ray meets a smooth
 * earth at the post's foot ({@link smoothEarthRangeM}, Bowditch's dip short of
 * the horizon inverted) and the fix says so. The range interval is where the
 * rays at the angle ∓ its uncertainty meet the ground (a steeper ray always
 * lands nearer, so the two ends bound every ray between; with terrain the
 * ground between them need not all be seen). The error area is the wedge
 * from the near to the far end, bearing ± its uncertainty (an open-ended far
 * end is drawn to the search range, or the horizon).
 *
 * A `horizon` reading is below the visible sea horizon: the dip (with the
 * same k, from the eye's height above the datum) is added to make it a
 * reading from the horizontal.
 *
 * @param observedAt echoed (ISO 8601)
 * @param bearing the resolved bearing, with `verticalAngleDeg` (degrees, − below)
 * @param options k and the terrain along the bearing, or null
 * @throws {FixError} `no-ground` when the ray meets no ground (above the horizon, off the terrain, beyond range)
 * @example
 * evaluateVerticalAngleFix('2026-07-01T12:00:00Z',
 *   { from: { latDeg: 51.7, lonDeg: 15.2 }, bearingDeg: 90, bearingReference: 'true', bearingSigmaDeg: 0.5,
 *     verticalAngleDeg: -0.5, postName: null, eyeHeightM: 30 }, { k: 0.13, terrain: null }).fix.range.distanceM; // ≈ 3 250 m
 */
export function evaluateVerticalAngleFix(
  observedAt: string,
  bearing: ResolvedFixBearing,
  options: VerticalAngleOptions,
): FixResult {
  const angleDeg = bearing.verticalAngleDeg;
  if (angleDeg === undefined) throw new FixError('too-few-bearings', 'One bearing gives a fix only with a vertical angle.', [0]);
  const sigmaDeg = bearing.verticalAngleSigmaDeg ?? DEFAULT_VERTICAL_SIGMA_DEG;
  const reference: VerticalAngleReference = bearing.verticalAngleReference ?? 'horizontal';
  const radiusM = options.earthRadiusM ?? MEAN_EARTH_RADIUS_M;
  const { k, terrain } = options;
  const eyeAboveGroundM = bearing.eyeHeightM ?? 0;
  const eyeAltitudeM = terrain ? terrain.groundAtPostM + eyeAboveGroundM : eyeAboveGroundM;
  if (!terrain && !(eyeAltitudeM > 0)) {
    throw new FixError('bad-input', 'Without terrain a vertical-angle fix needs the eye’s height above the ground.', [0]);
  }
  let trueDeg: number;
  try {
    trueDeg = trueBearingDeg(bearing.bearingDeg, bearing.bearingReference, bearing.declinationDeg);
  } catch (error) {
    if (!(error instanceof RangeError)) throw error;
    throw new FixError('bad-input', error.message, [0]);
  }
  const dipRad = reference === 'horizon' ? horizonDipRad(Math.max(0, eyeAltitudeM), k, radiusM) : 0;
  const angleRad = angleDeg * RAD_PER_DEG - dipRad;
  const sigmaRad = sigmaDeg * RAD_PER_DEG;

  const rangeAt = (a: number): { distanceM: number | null; why: string } => {
    if (terrain) {
      const hit = rayTerrainHit({
        groundAtM: terrain.groundAtM,
        eyeAltitudeM,
        angleRad: a,
        k,
        stepM: terrain.stepM,
        maxRangeM: terrain.maxRangeM,
        earthRadiusM: radiusM,
      });
      const why =
        hit.reason === 'off-terrain'
          ? 'the ray leaves the site’s terrain before it meets the ground'
          : `the ray meets no ground within ${(terrain.maxRangeM / 1000).toFixed(1)} km`;
      return { distanceM: hit.distanceM, why };
    }
    return {
      distanceM: smoothEarthRangeM(eyeAltitudeM, -a, k, radiusM),
      why: 'the sight is at or above the horizon, where it meets no smooth earth',
    };
  };
  const centre = rangeAt(angleRad);
  if (centre.distanceM === null) {
    throw new FixError(
      'no-ground',
      `This vertical angle gives no fix: ${centre.why}. Check the angle’s sign (below the horizontal is negative) and its reference.`,
      [0],
    );
  }
  const near = rangeAt(angleRad - sigmaRad).distanceM ?? centre.distanceM;
  const far = rangeAt(angleRad + sigmaRad).distanceM;
  const horizonM = terrain ? terrain.maxRangeM : horizonDistance(eyeAltitudeM, k, radiusM);
  const farDrawnM = far ?? Math.max(horizonM, centre.distanceM * 1.5);

  const warnings: string[] = [];
  if (!terrain) {
    warnings.push(
      'No terrain: smooth-earth estimate. The ray is taken to meet a level sea or plain at the height of the post’s ground; ' +
        'any rise or hollow along the bearing moves the point.',
    );
  }
  if (far === null) {
    warnings.push(
      `Open-ended: at the angle + ${sigmaDeg}° the ray meets no ground (${rangeAt(angleRad + sigmaRad).why}); ` +
        'the point may be much farther than the fix. A bearing from a second post is needed.',
    );
  }
  const dipNowRad = horizonDipRad(Math.max(0, eyeAltitudeM), k, radiusM);
  if (-angleRad < dipNowRad + 3 * sigmaRad) {
    warnings.push(
      'The sight is close to the horizon: refraction there varies widely and the range is very sensitive to the angle.',
    );
  }

  const vertices: LatLon[] = [];
  for (let i = 0; i < ARC_POINTS; i++) {
    vertices.push(
      pointAt(
        bearing.from,
        trueDeg - bearing.bearingSigmaDeg + (2 * bearing.bearingSigmaDeg * i) / (ARC_POINTS - 1),
        Math.max(1, near),
      ),
    );
  }
  for (let i = ARC_POINTS - 1; i >= 0; i--) {
    vertices.push(
      pointAt(bearing.from, trueDeg - bearing.bearingSigmaDeg + (2 * bearing.bearingSigmaDeg * i) / (ARC_POINTS - 1), farDrawnM),
    );
  }
  const area = geodesicRing(vertices);
  const position = pointAt(bearing.from, trueDeg, centre.distanceM);
  const round = (x: number) => Math.round(x * 10) / 10;
  const range: FixRange = {
    basis: terrain ? 'terrain' : 'smooth-earth',
    distanceM: round(centre.distanceM),
    minM: round(near),
    maxM: far === null ? null : round(far),
    angleFromHorizontalDeg: Number((angleRad * DEG).toFixed(4)),
    verticalAngleSigmaDeg: sigmaDeg,
    verticalAngleReference: reference,
    refractionK: k,
    eyeAltitudeM: round(eyeAltitudeM),
    message: terrain
      ? `Where the sight line meets the terrain (k ${k}), ${(near / 1000).toFixed(2)}–${far === null ? 'open' : (far / 1000).toFixed(2)} km for ± ${sigmaDeg}°.`
      : `No terrain: smooth-earth estimate (k ${k}), ${(near / 1000).toFixed(2)}–${far === null ? 'open' : (far / 1000).toFixed(2)} km for ± ${sigmaDeg}°.`,
  };
  return {
    observedAt,
    fix: {
      latDeg: position.latDeg,
      lonDeg: position.lonDeg,
      errorArea: { type: 'Polygon', coordinates: [area.ring] },
      errorAreaM2: area.areaM2,
      errorAreaMethod:
        'Range wedge: from where the ray at the angle − its uncertainty meets the ground to where the ray at + its ' +
        'uncertainty does, across the bearing ± its uncertainty (1σ); common practice, no source.',
      method: 'vertical-angle',
      range,
      warnings,
    },
    reports: [
      {
        ...reportedBearing(bearing, 0, trueDeg),
        verticalAngleDeg: angleDeg,
        distanceM: centre.distanceM,
        bearingToFixDeg: wrap360Deg(trueDeg),
        residualDeg: 0,
        flagged: false,
      },
    ],
    cautions: [...FIX_CAUTIONS.map((c) => ({ ...c })), { ...VERTICAL_ANGLE_CAUTION }],
  };
}

/** Distance to the sea horizon along the effective sphere, metres. */
function horizonDistance(eyeM: number, k: number, radiusM: number): number {
  const re = radiusM / (1 - k);
  return re * Math.acos(re / (re + eyeM));
}
