import { Geodesic } from 'geographiclib-geodesic';
import type { LatLon } from '@/shared/geo/types';
import {
  errorQuadrilateral,
  evaluateFix,
  FixError,
  intersectBearings,
  leastSquaresFix,
  trueBearingDeg,
  type BearingLine,
  type ResolvedFixBearing,
} from '@/shared/fixes';
import { deepFreeze, expectWithin } from '@/tests/unit/geo/expect-close';

/*
 * The bearing-fix core against the reference library: bearings are computed
 * with geographiclib-geodesic's own Inverse/Direct from invented posts to an
 * invented smoke, and the core must give the smoke back.
 */

const RAD = Math.PI / 180;
const WGS84 = Geodesic.WGS84;

/** Geodesic distance (m) between two positions, by the reference library. */
const distanceM = (a: LatLon, b: LatLon) => WGS84.Inverse(a.latDeg, a.lonDeg, b.latDeg, b.lonDeg).s12!;
/** True bearing (degrees, 0…360) from a to b, by the reference library. */
const azimuthDeg = (a: LatLon, b: LatLon) => {
  const azi = WGS84.Inverse(a.latDeg, a.lonDeg, b.latDeg, b.lonDeg).azi1!;
  return azi < 0 ? azi + 360 : azi;
};
/** The point `s` metres from `a` on azimuth `aziDeg`, by the reference library. */
const direct = (a: LatLon, aziDeg: number, s: number): LatLon => {
  const r = WGS84.Direct(a.latDeg, a.lonDeg, aziDeg, s);
  return { latDeg: r.lat2!, lonDeg: r.lon2! };
};
/** The line of bearing from `post` that passes exactly through `target`. */
const lineTo = (post: LatLon, target: LatLon, sigmaDeg = 0.5, offsetDeg = 0): BearingLine => ({
  from: post,
  bearingRad: (azimuthDeg(post, target) + offsetDeg) * RAD,
  sigmaRad: sigmaDeg * RAD,
});
const angleDiffDeg = (a: number, b: number) => Math.abs(((((a - b) % 360) + 540) % 360) - 180);

// Invented smokes; posts placed 30 km from each on chosen bearings (the reference library's direct problem).
const SMOKES: [string, LatLon][] = [
  ['a mid-latitude forest', { latDeg: 51.73, lonDeg: 15.31 }],
  ['a northern valley', { latDeg: 66.41, lonDeg: 24.87 }],
  ['a southern range', { latDeg: -41.2, lonDeg: 172.6 }],
  ['astride the antimeridian', { latDeg: -16.9, lonDeg: 179.99 }],
  ['near the equator', { latDeg: 0.02, lonDeg: -60.4 }],
];

describe('intersectBearings: geodesic round trips at 30 km', () => {
  it.each(SMOKES)('gives back the smoke in %s within 1 m', (_name, smoke) => {
    // Posts 30 km from the smoke, seeing it on bearings 70° apart at the smoke.
    const postA = direct(smoke, 200, 30_000);
    const postB = direct(smoke, 270, 30_000);
    const a = lineTo(postA, smoke);
    const b = lineTo(postB, smoke);
    const x = intersectBearings(deepFreeze(a), deepFreeze(b));
    // Source: geographiclib-geodesic Inverse/Direct (Karney 2013); the brief's tolerance: 1 m at 30 km.
    expect(distanceM(x.position, smoke)).toBeLessThan(1);
    // The fix's bearings from both posts (by the reference library) match the bearings taken within 1e-6°.
    expect(angleDiffDeg(azimuthDeg(postA, x.position), a.bearingRad / RAD)).toBeLessThan(1e-6);
    expect(angleDiffDeg(azimuthDeg(postB, x.position), b.bearingRad / RAD)).toBeLessThan(1e-6);
    expect(x.misclosureRad / RAD).toBeLessThan(1e-6);
  });

  it('gives the cut angle as the angle between the geodesics at the fix', () => {
    const [, smoke] = SMOKES[1]!;
    const postA = direct(smoke, 200, 30_000);
    const postB = direct(smoke, 270, 30_000);
    const x = intersectBearings(lineTo(postA, smoke), lineTo(postB, smoke));
    // Source: the reference library's arrival azimuths azi2 of the two geodesics at the smoke.
    const arrive = (p: LatLon) => WGS84.Inverse(p.latDeg, p.lonDeg, smoke.latDeg, smoke.lonDeg).azi2!;
    const expected = angleDiffDeg(arrive(postA), arrive(postB));
    expectWithin(x.cutAngleRad / RAD, expected, 1e-6);
    // Leaving the smoke on 200° and 270°, the geodesics meet it at 70° (common practice, no source).
    expectWithin(x.cutAngleRad / RAD, 70, 1e-6);
  });

  it('works for long bearings where the flat-plane guess alone is metres off', () => {
    const smoke = { latDeg: 62.5, lonDeg: 11.2 };
    const postA = direct(smoke, 135, 90_000);
    const postB = direct(smoke, 225, 90_000);
    const x = intersectBearings(lineTo(postA, smoke), lineTo(postB, smoke));
    // Source: geographiclib-geodesic round trip (as above), 90 km legs.
    expect(distanceM(x.position, smoke)).toBeLessThan(1);
  });

  it('refuses parallel and diverging bearings with a clear error, never NaN', () => {
    const postA = { latDeg: 51.7, lonDeg: 15.3 };
    const postB = direct(postA, 90, 10_000);
    const run = (aDeg: number, bDeg: number) => () =>
      intersectBearings(
        { from: postA, bearingRad: aDeg * RAD, sigmaRad: 0.01 },
        { from: postB, bearingRad: bDeg * RAD, sigmaRad: 0.01 },
      );
    expect(run(0, 0)).toThrow(FixError);
    expect(run(0, 0)).toThrow(/parallel/);
    // Both point away from each other: the lines cross behind the posts.
    expect(run(315, 45)).toThrow(/do not cross ahead/);
    // Nearly parallel, crossing thousands of kilometres away.
    expect(run(0, 359.9)).toThrow(FixError);
    let code: string | null = null;
    try {
      run(315, 45)();
    } catch (error) {
      code = (error as FixError).code;
    }
    expect(code).toBe('diverging');
    // Two bearings from one place fix nothing.
    expect(() =>
      intersectBearings({ from: postA, bearingRad: 0, sigmaRad: 0.01 }, { from: postA, bearingRad: RAD * 90, sigmaRad: 0.01 }),
    ).toThrow(/same place/);
  });
});

describe('errorQuadrilateral', () => {
  const smoke = { latDeg: 51.73, lonDeg: 15.31 };
  const postA = direct(smoke, 180, 30_000);
  /** Area (m²) of the error quadrilateral with B 30 km from the smoke and the given cut angle. */
  const areaAtCut = (cutDeg: number) =>
    errorQuadrilateral(lineTo(postA, smoke, 1), lineTo(direct(smoke, 180 + cutDeg, 30_000), smoke, 1));

  it('grows as the cut angle narrows', () => {
    const areas = [90, 60, 45, 30, 20, 10].map((cut) => areaAtCut(cut).areaM2);
    for (let i = 1; i < areas.length; i++) expect(areas[i]!).toBeGreaterThan(areas[i - 1]!);
    // Common practice, no source: from 90° to 30° the area at least doubles (≈ 1/sin θ).
    expect(areas[3]! / areas[0]!).toBeGreaterThan(1.9);
  });

  it('matches the flat parallelogram (2σ₁d₁)(2σ₂d₂)/sin θ for small uncertainties', () => {
    // Plane geometry (common practice, no source): two strips of widths 2σd cross in a parallelogram of
    // area w₁w₂/sin θ; with σ = 1° at 30 km the quadrilateral departs from it by about (σ/sin θ)².
    for (const cut of [90, 60, 30]) {
      const expected = (2 * RAD * 30_000) ** 2 / Math.sin(cut * RAD);
      const { areaM2 } = areaAtCut(cut);
      expect(Math.abs(areaM2 - expected) / expected).toBeLessThan(0.02);
    }
  });

  it('is a closed counter-clockwise ring around the fix', () => {
    const { ring, areaM2 } = areaAtCut(60);
    expect(ring).toHaveLength(5);
    expect(ring[4]).toEqual(ring[0]);
    // Source: geographiclib PolygonArea, signed area positive for counter-clockwise rings (Karney 2013, §6).
    const polygon = WGS84.Polygon(false);
    for (const [lon, lat] of ring.slice(0, 4)) polygon.AddPoint(lat!, lon!);
    const signed = polygon.Compute(false, true).area!;
    expect(signed).toBeGreaterThan(0);
    expectWithin(signed, areaM2, 1e-3);
    // The fix lies inside: each corner is within the strip widths of the smoke.
    for (const [lon, lat] of ring) expect(distanceM({ latDeg: lat!, lonDeg: lon! }, smoke)).toBeLessThan(2 * 30_000 * RAD * 2);
  });

  it('says when the uncertainty makes the bearings possibly parallel', () => {
    expect(() => errorQuadrilateral(lineTo(postA, smoke, 5), lineTo(direct(smoke, 186, 30_000), smoke, 5))).toThrow(
      /error area has no bound/,
    );
  });
});

describe('leastSquaresFix', () => {
  const smoke = { latDeg: 51.73, lonDeg: 15.31 };
  // Four posts around the smoke, no two on one line through it (opposite posts could not tell which of them is wrong).
  const posts = [15, 100, 215, 290].map((azi, i) => direct(smoke, azi, 20_000 + 5_000 * i));

  it('gives the smoke back from four exact bearings with zero residuals', () => {
    const fix = leastSquaresFix(deepFreeze(posts.map((p) => lineTo(p, smoke))));
    // Source: geographiclib-geodesic round trip (bearings from the reference library's inverse problem).
    expect(distanceM(fix.position, smoke)).toBeLessThan(1);
    for (const r of fix.residualsRad) expect(Math.abs(r / RAD)).toBeLessThan(1e-6);
    expect(fix.flagged).toEqual([]);
    expect(fix.disagreeing).toBeNull();
    // Within their uncertainties (1° off at σ 0.5°): nothing flagged.
    const near = leastSquaresFix(posts.map((p, i) => lineTo(p, smoke, 0.5, i === 1 ? 1 : 0)));
    expect(near.disagreeing).toBeNull();
  });

  it.each([0, 1, 2, 3])('flags bearing %i when it is 4° off (σ 0.5°)', (wrong) => {
    const lines = posts.map((p, i) => lineTo(p, smoke, 0.5, i === wrong ? 4 : 0));
    const fix = leastSquaresFix(lines);
    // Least squares spreads a gross error over every residual (the wrong bearing's own may even look small),
    // so the disagreeing bearing is the one whose removal leaves the others most consistent (common practice, no source).
    expect(fix.flagged.length).toBeGreaterThan(0);
    expect(fix.disagreeing).toBe(wrong);
  });

  it('flags the wrong one of three bearings', () => {
    const three = [0, 120, 240].map((azi) => direct(smoke, azi, 25_000));
    const lines = three.map((p, i) => lineTo(p, smoke, 0.5, i === 1 ? 5 : 0));
    const fix = leastSquaresFix(lines);
    expect(fix.disagreeing).toBe(1);
  });

  it('gives the error circle σd/√2 for four posts at N, E, S, W', () => {
    // Plane least squares (common practice, no source): each bearing constrains the position across its line
    // with σ·d; two pairs at right angles give a covariance (σd)²/2 · I, a circle of radius σd/√2.
    const around = [0, 90, 180, 270].map((azi) => direct(smoke, azi, 30_000));
    const fix = leastSquaresFix(around.map((p) => lineTo(p, smoke, 1)));
    const radius = (RAD * 30_000) / Math.SQRT2;
    expectWithin(Math.sqrt(fix.covarianceM2[0]), radius, radius * 0.01);
    expectWithin(Math.sqrt(fix.covarianceM2[2]), radius, radius * 0.01);
    expectWithin(fix.covarianceM2[1], 0, radius * radius * 0.01);
  });

  it('refuses bearings that are all parallel', () => {
    const a = { latDeg: 51.7, lonDeg: 15.3 };
    const lines = [0, 5_000, 10_000].map((s) => ({ from: direct(a, 90, s), bearingRad: 0, sigmaRad: 0.01 }));
    expect(() => leastSquaresFix(lines)).toThrow(FixError);
  });
});

describe('trueBearingDeg', () => {
  // Source: NOAA NCEI, magnetic declination — true = magnetic + declination, east positive (from memory).
  it.each([
    [350, 12, 2],
    [10, -15, 355],
    [90, 3.5, 93.5],
  ])('magnetic %d° with declination %d° is %d° true', (magnetic, declination, expected) => {
    expectWithin(trueBearingDeg(magnetic, 'magnetic', declination), expected, 1e-12);
  });
  it('passes a true bearing through and needs a declination for a magnetic one', () => {
    expect(trueBearingDeg(360, 'true')).toBe(0);
    expect(() => trueBearingDeg(10, 'magnetic')).toThrow(/declination/);
  });
});

describe('evaluateFix', () => {
  const smoke = { latDeg: 51.73, lonDeg: 15.31 };
  const postA = direct(smoke, 200, 30_000);
  const postB = direct(smoke, 280, 24_000);
  const bearing = (post: LatLon, extra: Partial<ResolvedFixBearing> = {}): ResolvedFixBearing => ({
    from: post,
    bearingDeg: azimuthDeg(post, smoke),
    bearingReference: 'true',
    bearingSigmaDeg: 0.5,
    postName: null,
    eyeHeightM: null,
    ...extra,
  });

  it('fixes magnetic bearings with the declination the same as true ones', () => {
    const declination = -4.2;
    const magnetic = [postA, postB].map((p) =>
      bearing(p, {
        bearingDeg: (azimuthDeg(p, smoke) - declination + 360) % 360,
        bearingReference: 'magnetic',
        declinationDeg: declination,
      }),
    );
    const result = evaluateFix('2026-07-01T12:00:00Z', deepFreeze(magnetic));
    expect(distanceM(result.fix, smoke)).toBeLessThan(1);
    expect(result.reports[0]!.declinationDeg).toBe(declination);
    expectWithin(result.reports[0]!.trueBearingDeg, azimuthDeg(postA, smoke), 1e-9);
    expectWithin(result.reports[1]!.distanceM, 24_000, 1);
    expect(result.fix.method).toBe('two-bearing-intersection');
    expect(result.fix.errorArea.coordinates[0]).toHaveLength(5);
    expect(result.cautions.map((c) => c.message).join(' ')).toMatch(/estimate/);
  });

  it('warns on a cut angle below 30° and above 150°, not at 80°', () => {
    const at = (cut: number) =>
      evaluateFix('2026-07-01T12:00:00Z', [bearing(postA), bearing(direct(smoke, 200 + cut, 30_000))]).fix;
    expect(at(80).warnings).toEqual([]);
    expect(at(25).warnings.join(' ')).toMatch(/cross at 25°/);
    expect(at(155).warnings.join(' ')).toMatch(/cross at 155°/);
    expectWithin(at(25).cutAngleDeg!, 25, 1e-3);
  });

  it('names the disagreeing bearing of a least-squares fix', () => {
    const posts = [15, 100, 215, 290].map((azi, i) => direct(smoke, azi, 20_000 + 4_000 * i));
    const bearings = posts.map((p, i) =>
      bearing(p, { postName: `Post ${i}`, bearingDeg: azimuthDeg(p, smoke) + (i === 2 ? 5 : 0) }),
    );
    const result = evaluateFix('2026-07-01T12:00:00Z', bearings);
    expect(result.fix.method).toBe('least-squares');
    expect(result.fix.residualsDeg).toHaveLength(4);
    expect(result.reports.map((r) => r.flagged)).toEqual([false, false, true, false]);
    expect(result.fix.warnings.join(' ')).toMatch(/Bearing 3 \(Post 2\)/);
    expect(result.fix.errorAreaM2).toBeGreaterThan(0);
    expect(result.fix.errorEllipse!.semiMajorM).toBeGreaterThanOrEqual(result.fix.errorEllipse!.semiMinorM);
  });
});
