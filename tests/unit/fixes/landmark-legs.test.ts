/**
 * A fix told from the site's landmarks: "1.2 km at 040° true from the hut".
 * Source: GeographicLib (geographiclib-geodesic, C. F. F. Karney, "Algorithms
 * for geodesics", 2013) — a place put at a distance and azimuth from a mark by
 * the direct problem must come back with that distance and azimuth from the
 * inverse. The landmarks are invented test data.
 */
import { geodesicDirect } from '@/shared/geo/geodesic-direct';
import { nearestLandmarkLegs } from '@/components/incidents/landmark-legs';

const hut = { id: 'hut', name: 'Test hut', latDeg: 61.2, lonDeg: 11.4 };
const place = geodesicDirect(hut, 40, 1200);
const cairn = { id: 'cairn', name: 'Test cairn', ...geodesicDirect(place, 250, 3400) };
const mast = { id: 'mast', name: 'Test mast', ...geodesicDirect(place, 130, 800) };

describe('nearestLandmarkLegs', () => {
  it('gives the distance and the true bearing from each landmark to the place', () => {
    const [leg] = nearestLandmarkLegs([hut], place);
    expect(leg!.distanceM).toBeCloseTo(1200, 6);
    expect(leg!.bearingDeg).toBeCloseTo(40, 6);
  });

  it('lists the nearest first and at most the number asked for', () => {
    const legs = nearestLandmarkLegs([cairn, hut, mast], place, 2);
    expect(legs.map((l) => l.id)).toEqual(['mast', 'hut']);
    // The bearing from the mast back to the place is the reverse of 130° there, give or take the meridians' convergence.
    expect(legs[0]!.distanceM).toBeCloseTo(800, 6);
    expect(Math.abs(legs[0]!.bearingDeg - 310)).toBeLessThan(0.1);
  });

  it('is empty without landmarks', () => {
    expect(nearestLandmarkLegs([], place)).toEqual([]);
  });
});
