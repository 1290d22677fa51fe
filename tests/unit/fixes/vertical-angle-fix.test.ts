import { Geodesic } from 'geographiclib-geodesic';
import { horizonDipRad, smoothEarthRangeM } from '@/shared/fixes/depression-range';
import { FixError } from '@/shared/fixes/fix-error';
import { rayTerrainHit } from '@/shared/fixes/ray-terrain-hit';
import { evaluateVerticalAngleFix } from '@/shared/fixes/vertical-angle-fix';
import type { ResolvedFixBearing } from '@/shared/fixes/evaluate-fix';
import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';
import { elevationAt } from '@/shared/terrain/terrain-elevation';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';

const RAD = Math.PI / 180;
const FT = 0.3048;
const NM = 1852;
/** Bowditch's Table 14 constants: r₀ = 3440.1 NM, β₀ = 0.8321 (so k = 1 − β₀). */
const BOWDITCH_R = 3440.1 * NM;
const BOWDITCH_K = 1 - 0.8321;
/** Bowditch Table 14: dip of the sea short of the horizon, arc minutes, for h feet at d nautical miles. */
const bowditchDipShortArcmin = (hFt: number, dNm: number) => 60 * (Math.atan(hFt / (6076.1 * dNm) + dNm / 8268) / RAD);

describe('smoothEarthRangeM: distance off by the depression of the waterline (no terrain)', () => {
  it.each([
    [10, 0.5],
    [5, 0.1],
    [50, 1.5],
    [100, 3],
  ])('inverts Bowditch’s dip short of the horizon: %s ft at %s NM', (hFt, dNm) => {
    // Source: N. Bowditch, The American Practical Navigator (NGA Pub. 9), Table 14 "Dip of the Sea Short of the
    // Horizon", Ds = 60·tan⁻¹(h/(6076.1 d) + d/8268), with r₀ = 3440.1 NM and β₀ = 0.8321 (as described by the
    // table's explanation, read at windjammertech.com/dipShort.html). The table's formula is a small-angle form, so 0.1 %.
    const dipRad = (bowditchDipShortArcmin(hFt, dNm) / 60) * RAD;
    const got = smoothEarthRangeM(hFt * FT, dipRad, BOWDITCH_K, BOWDITCH_R)!;
    expect(Math.abs(got - dNm * NM) / (dNm * NM)).toBeLessThan(1e-3);
  });

  it('has no answer at or above the horizon, and the horizon dip is the limit', () => {
    // Source: dip of the sea horizon ≈ 1.76′·√(h m) for standard navigational refraction
    // (Nautical Almanac dip table, from memory); here checked against the effective-radius form √(2h(1 − k)/R).
    const h = 20;
    const dip = horizonDipRad(h, 0.13);
    expect(dip).toBeCloseTo(Math.sqrt((2 * h * (1 - 0.13)) / MEAN_EARTH_RADIUS_M), 6);
    expect(smoothEarthRangeM(h, dip * 0.999, 0.13)).toBeNull();
    expect(smoothEarthRangeM(h, -0.01, 0.13)).toBeNull();
    expect(smoothEarthRangeM(h, dip * 1.2, 0.13)).not.toBeNull();
  });

  it('matches plain trigonometry close in (the earth flat over a few hundred metres)', () => {
    // Common practice, no source: d = h / tan θ when curvature is negligible.
    expect(smoothEarthRangeM(30, 10 * RAD, 0.13)!).toBeCloseTo(30 / Math.tan(10 * RAD), 0);
  });

  it('rejects k ≥ 1 and a non-positive eye height', () => {
    expect(() => smoothEarthRangeM(10, 0.01, 1)).toThrow(RangeError);
    expect(() => smoothEarthRangeM(0, 0.01, 0.13)).toThrow(RangeError);
  });
});

describe('rayTerrainHit: where a refracted sight line meets the terrain', () => {
  it('on a uniform slope equals the closed-form crossing of the ray and the slope', () => {
    // Common practice, no source: z_eye + d·tan α − d²(1 − k)/(2R) = z₀ + g·d is a quadratic in d.
    const k = 0.13;
    const g = 0.05; // ground rising 5 %
    const z0 = 200;
    const eye = 230;
    const alpha = -0.5 * RAD;
    const a = (1 - k) / (2 * MEAN_EARTH_RADIUS_M);
    const b = g - Math.tan(alpha);
    // a·d² + b·d − (eye − z0) = 0
    const expected = (-b + Math.sqrt(b * b + 4 * a * (eye - z0))) / (2 * a);
    const hit = rayTerrainHit({
      groundAtM: (d) => z0 + g * d,
      eyeAltitudeM: eye,
      angleRad: alpha,
      k,
      stepM: 12.5,
      maxRangeM: 30_000,
    });
    expect(hit.reason).toBeNull();
    expect(hit.distanceM!).toBeCloseTo(expected, 2);
  });

  it('on synthetic terrain equals the first crossing found by an exact fine march', () => {
    // Common practice, no source: the reference marches the same ray at 20 cm steps and takes the first sample at
    // or below the ground; the coarse march with bisection must land within one reference step of it.
    const terrain = generateSyntheticTerrain({ seed: 7 });
    const x0 = terrain.xll + terrain.cellSize * 5.5;
    const y0 = terrain.yll + (terrain.height * terrain.cellSize) / 2;
    const along = (d: number) => {
      try {
        return elevationAt(terrain, x0 + d, y0);
      } catch {
        return null;
      }
    };
    const eye = along(0)! + 25;
    const k = 0.13;
    for (const angleDeg of [-0.4, -1, -2.5]) {
      const angleRad = angleDeg * RAD;
      const maxRangeM = terrain.width * terrain.cellSize - terrain.cellSize * 6;
      const hit = rayTerrainHit({ groundAtM: along, eyeAltitudeM: eye, angleRad, k, stepM: terrain.cellSize / 2, maxRangeM });
      let reference: number | null = null;
      const ray = (d: number) => eye + d * Math.tan(angleRad) - (d * d * (1 - k)) / (2 * MEAN_EARTH_RADIUS_M);
      for (let d = 0.2; d <= maxRangeM; d += 0.2) {
        if (ray(d) <= along(d)!) {
          reference = d;
          break;
        }
      }
      if (reference === null) expect(hit.distanceM).toBeNull();
      else expect(Math.abs(hit.distanceM! - reference)).toBeLessThan(0.21);
    }
  });

  it('says when the ray leaves the terrain or passes beyond the range', () => {
    expect(
      rayTerrainHit({
        groundAtM: (d) => (d > 500 ? null : 0),
        eyeAltitudeM: 50,
        angleRad: -0.001,
        k: 0.13,
        stepM: 10,
        maxRangeM: 5000,
      }).reason,
    ).toBe('off-terrain');
    expect(
      rayTerrainHit({ groundAtM: () => 0, eyeAltitudeM: 50, angleRad: 0.01, k: 0.13, stepM: 10, maxRangeM: 5000 }).reason,
    ).toBe('beyond-range');
  });
});

describe('evaluateVerticalAngleFix: a fix from one post', () => {
  const post = { latDeg: 51.62, lonDeg: 15.31 };
  const bearing = (over: Partial<ResolvedFixBearing> = {}): ResolvedFixBearing => ({
    bearingDeg: 60,
    bearingReference: 'true',
    bearingSigmaDeg: 0.5,
    verticalAngleDeg: -0.6,
    from: post,
    postName: 'Test Post',
    eyeHeightM: 40,
    ...over,
  });

  it('without terrain: the smooth-earth range along the bearing, said so, with the ± angle interval', () => {
    const result = evaluateVerticalAngleFix('2026-07-01T12:00:00Z', bearing(), { k: 0.13, terrain: null });
    const range = result.fix.range!;
    expect(result.fix.method).toBe('vertical-angle');
    expect(range.basis).toBe('smooth-earth');
    expect(result.fix.warnings.join(' ')).toMatch(/No terrain: smooth-earth estimate/);
    expect(range.distanceM).toBeCloseTo(smoothEarthRangeM(40, 0.6 * RAD, 0.13)!, 0);
    expect(range.minM).toBeCloseTo(smoothEarthRangeM(40, 0.7 * RAD, 0.13)!, 0);
    expect(range.maxM!).toBeCloseTo(smoothEarthRangeM(40, 0.5 * RAD, 0.13)!, 0);
    expect(range.minM).toBeLessThan(range.distanceM);
    expect(range.maxM!).toBeGreaterThan(range.distanceM);
    // Source: Karney (2013) inverse problem via geographiclib-geodesic: the fix lies on the bearing at the range.
    const inv = Geodesic.WGS84.Inverse(post.latDeg, post.lonDeg, result.fix.latDeg, result.fix.lonDeg);
    expect(inv.azi1!).toBeCloseTo(60, 6);
    expect(inv.s12!).toBeCloseTo(range.distanceM, 0);
    expect(result.cautions.map((c) => c.code)).toContain('vertical-angle');
  });

  it('a horizon reading adds the dip', () => {
    const fromHorizon = evaluateVerticalAngleFix(
      '2026-07-01T12:00:00Z',
      bearing({ verticalAngleDeg: -0.2, verticalAngleReference: 'horizon' }),
      {
        k: 0.13,
        terrain: null,
      },
    );
    const dipDeg = horizonDipRad(40, 0.13) / RAD;
    expect(fromHorizon.fix.range!.angleFromHorizontalDeg).toBeCloseTo(-0.2 - dipDeg, 4);
  });

  it('with terrain: the ray march on the ground along the bearing; an open-ended far end says so', () => {
    // Ground falling away: 300 m at the post, then flat 100 m beyond 2 km (invented).
    const groundAtM = (d: number) => (d < 2000 ? 300 - 0.1 * d : 100);
    const result = evaluateVerticalAngleFix(
      '2026-07-01T12:00:00Z',
      bearing({ verticalAngleDeg: -3, verticalAngleSigmaDeg: 0.2, eyeHeightM: 20 }),
      {
        k: 0.13,
        terrain: { groundAtM, groundAtPostM: 300, stepM: 10, maxRangeM: 20_000 },
      },
    );
    const r = result.fix.range!;
    const expected = rayTerrainHit({ groundAtM, eyeAltitudeM: 320, angleRad: -3 * RAD, k: 0.13, stepM: 10, maxRangeM: 20_000 });
    expect(r.basis).toBe('terrain');
    expect(r.distanceM).toBeCloseTo(expected.distanceM!, 0);
    expect(result.fix.warnings.join(' ')).not.toMatch(/smooth-earth/);
    const shallow = evaluateVerticalAngleFix('2026-07-01T12:00:00Z', bearing({ verticalAngleDeg: -0.05, eyeHeightM: 20 }), {
      k: 0.13,
      terrain: { groundAtM: () => 300, groundAtPostM: 300, stepM: 10, maxRangeM: 15_000 },
    });
    expect(shallow.fix.range!.maxM).toBeNull();
    expect(shallow.fix.warnings.join(' ')).toMatch(/Open-ended/);
  });

  it('a sight above the horizon over a smooth earth is no fix', () => {
    expect(() =>
      evaluateVerticalAngleFix('2026-07-01T12:00:00Z', bearing({ verticalAngleDeg: 0.5 }), { k: 0.13, terrain: null }),
    ).toThrow(FixError);
  });

  it('does not modify its input', () => {
    const b = bearing();
    const copy = structuredClone(b);
    evaluateVerticalAngleFix('2026-07-01T12:00:00Z', b, { k: 0.13, terrain: null });
    expect(b).toEqual(copy);
  });
});
