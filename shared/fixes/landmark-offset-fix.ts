import type { LatLon } from '@/shared/geo/types';
import { geodesicDirect } from '@/shared/geo/geodesic-direct';
import type { Fix } from '@/shared/schemas/fix';
import { geodesicRing } from './ring-area';

/** Default uncertainty of a bearing from a landmark estimated by eye, degrees (as the "estimated" instrument). */
export const LANDMARK_BEARING_SIGMA_DEG = 5;
/** Default uncertainty of a distance from a landmark: a tenth of it, at least this, metres (common practice, from memory). */
export const LANDMARK_DISTANCE_SIGMA_MIN_M = 50;

/** A named landmark and a position given from it. */
export interface LandmarkOffsetInput {
  readonly landmark: LatLon & { readonly id: string; readonly name: string };
  /** Ground distance from the landmark, metres. */
  readonly distanceM: number;
  /** True bearing from the landmark, degrees. */
  readonly bearingDeg: number;
  readonly distanceSigmaM?: number;
  readonly bearingSigmaDeg?: number;
}

const ARC_POINTS = 7;

/**
 * A fix given as "1.2 km at 040° from Crag Hut": the direct geodesic problem
 * from the landmark; the error area is the wedge of distance ± its
 * uncertainty across bearing ± its uncertainty (1σ; defaults a tenth of the
 * distance, at least 50 m, and 5°).
 *
 * Source: Karney (2013) direct problem (`geographiclib-geodesic`); the wedge is
 * common practice, no source.
 *
 * @param input the landmark, the distance (m) and true bearing (°) from it
 * @returns the fix (method `landmark-offset`)
 * @example
 * landmarkOffsetFix({ landmark: { id, name: 'Crag Hut', latDeg: 51.64, lonDeg: 15.27 }, distanceM: 1200, bearingDeg: 40 });
 */
export function landmarkOffsetFix(input: LandmarkOffsetInput): Fix {
  const { landmark, distanceM, bearingDeg } = input;
  const distanceSigmaM = input.distanceSigmaM ?? Math.max(LANDMARK_DISTANCE_SIGMA_MIN_M, distanceM / 10);
  const bearingSigmaDeg = input.bearingSigmaDeg ?? LANDMARK_BEARING_SIGMA_DEG;
  const at = geodesicDirect(landmark, bearingDeg, distanceM);
  const near = Math.max(1, distanceM - distanceSigmaM);
  const far = distanceM + distanceSigmaM;
  const vertices: LatLon[] = [];
  const az = (i: number) => bearingDeg - bearingSigmaDeg + (2 * bearingSigmaDeg * i) / (ARC_POINTS - 1);
  for (let i = 0; i < ARC_POINTS; i++) vertices.push(geodesicDirect(landmark, az(i), near));
  for (let i = ARC_POINTS - 1; i >= 0; i--) vertices.push(geodesicDirect(landmark, az(i), far));
  const area = geodesicRing(vertices);
  return {
    latDeg: at.latDeg,
    lonDeg: at.lonDeg,
    errorArea: { type: 'Polygon', coordinates: [area.ring] },
    errorAreaM2: area.areaM2,
    errorAreaMethod:
      `Wedge of the distance ± ${Math.round(distanceSigmaM)} m across the bearing ± ${bearingSigmaDeg}° from ${landmark.name} (1σ); ` +
      'common practice, no source.',
    method: 'landmark-offset',
    fromLandmark: { landmarkId: landmark.id, name: landmark.name, distanceM, bearingDeg, distanceSigmaM, bearingSigmaDeg },
    warnings: [
      `Given from ${landmark.name}: only as good as the landmark’s stored position and the distance and bearing estimated from it.`,
    ],
  };
}
