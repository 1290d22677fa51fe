import { geodesicInverse } from '@/shared/geo/geodesic-inverse';
import type { LatLon } from '@/shared/geo/types';

/** A named landmark's distance (metres) and true bearing (degrees) to a place, along the WGS 84 geodesic. */
export interface LandmarkLeg {
  id: string;
  name: string;
  distanceM: number;
  bearingDeg: number;
}

/** The `count` nearest landmarks to `place`, nearest first, each with the distance and bearing from it. */
export function nearestLandmarkLegs(
  landmarks: readonly ({ id: string; name: string } & LatLon)[],
  place: LatLon,
  count = 5,
): LandmarkLeg[] {
  return landmarks
    .map((l) => {
      const leg = geodesicInverse({ latDeg: l.latDeg, lonDeg: l.lonDeg }, place);
      return { id: l.id, name: l.name, distanceM: leg.distanceM, bearingDeg: leg.azimuthDeg };
    })
    .sort((a, b) => a.distanceM - b.distanceM)
    .slice(0, count);
}
