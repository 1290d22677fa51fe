import { chartScale, fall, profileChart, roundExaggeration } from '@/components/map/profile-chart';
import type { TerrainProfileResponse } from '@/shared/schemas/terrain';

const R = 6_371_008.8;
const D = 20_000;

/** An invented profile over flat ground at 100 m with a 40 m gap of nodata, eye 30 m up, target 10 m tall. */
function profile(ks: number[]): TerrainProfileResponse {
  const samples = Array.from({ length: 41 }, (_, i) => ({ distanceM: i * 500, groundElevationM: i === 20 ? null : 100 }));
  return {
    terrainId: '00000000-0000-4000-8000-000000000001',
    observer: {
      latDeg: 51.8,
      lonDeg: 15.2,
      postId: null,
      groundElevationM: 100,
      recordedGroundElevationM: null,
      eyeHeightM: 30,
      eyeElevationM: 130,
    },
    target: { latDeg: 51.9, lonDeg: 15.3, groundElevationM: 100, heightM: 10 },
    distanceM: D,
    gridBearingDeg: 45,
    spacingM: 500,
    samples,
    results: ks.map((k) => ({
      k,
      effectiveRadiusM: R / (1 - k),
      loweredGroundM: samples.map((s) =>
        s.groundElevationM === null ? null : s.groundElevationM - ((1 - k) * s.distanceM ** 2) / (2 * R),
      ),
      sightLine: { eyeElevationM: 130, targetTopElevationM: 110 - ((1 - k) * D * D) / (2 * R) },
      hiddenHeightM: 0,
      horizon: null,
      firstObstruction:
        k === 0 ? { distanceM: 15_000, groundElevationM: 100, loweredElevationM: 100 - 15_000 ** 2 / (2 * R) } : null,
      groundSeen: true,
      targetTopSeen: k !== 0,
    })),
    cautions: [],
  };
}

describe('profileChart (true-earth frame)', () => {
  test('the ground falls by d²/2R and breaks where the terrain has no data', () => {
    // Source: height of the sphere below the tangent plane, d²/(2R) (common practice, no source).
    const chart = profileChart(profile([0.13]), R);
    expect(chart.ground).toHaveLength(2);
    const last = chart.ground[1]!.at(-1)!;
    expect(last.d).toBe(D);
    expect(last.y).toBeCloseTo(100 - (D * D) / (2 * R), 9);
    expect(fall(D, R)).toBeCloseTo(31.39, 2);
  });

  test('every sight line runs from the eye to the target’s top', () => {
    const chart = profileChart(profile([0, 0.13, -0.5, 0.6]), R);
    for (const c of chart.conditions) {
      expect(c.sightLine[0]!.y).toBeCloseTo(130, 9);
      expect(c.sightLine.at(-1)!.y).toBeCloseTo(110 - (D * D) / (2 * R), 9);
    }
    expect(chart.targetTop.y - chart.targetGround.y).toBeCloseTo(10, 9);
  });

  test('k = 0 is straight; k > 0 bows up by the sagitta kD²/8R at mid-line, k < 0 bows down', () => {
    // Source: a refracted ray is an arc of radius R/k; the sagitta of an arc of radius ρ over a
    // chord D is D²/(8ρ) (common practice, no source).
    const chart = profileChart(profile([0, 0.13, -0.5]), R);
    const mid = (i: number) => {
      const line = chart.conditions[i]!.sightLine;
      const chord = (line[0]!.y + line.at(-1)!.y) / 2;
      return line[32]!.y - chord;
    };
    expect(mid(0)).toBeCloseTo(0, 9);
    expect(mid(1)).toBeCloseTo((0.13 * D * D) / (8 * R), 9);
    expect(mid(2)).toBeCloseTo((-0.5 * D * D) / (8 * R), 9);
  });

  test('the obstruction is placed on the ground in the true frame', () => {
    const chart = profileChart(profile([0]), R);
    expect(chart.conditions[0]!.obstruction!.d).toBe(15_000);
    expect(chart.conditions[0]!.obstruction!.y).toBeCloseTo(100 - 15_000 ** 2 / (2 * R), 9);
    expect(chart.conditions[0]!.targetTopSeen).toBe(false);
  });

  test('the scale maps the range into the box and states the vertical exaggeration', () => {
    const chart = profileChart(profile([0.13]), R);
    const scale = chartScale(chart, { left: 40, top: 10, width: 300, height: 150 });
    expect(scale.sx(0)).toBe(40);
    expect(scale.sx(D)).toBe(340);
    expect(scale.sy(chart.yMax)).toBe(10);
    expect(scale.sy(chart.yMin)).toBeCloseTo(160, 9);
    // (20 000 m / 300 px) ÷ ((yMax − yMin) m / 150 px)
    expect(scale.exaggeration).toBeCloseTo(D / 300 / ((chart.yMax - chart.yMin) / 150), 9);
    expect(roundExaggeration(1234.5)).toBe(1200);
    expect(roundExaggeration(1.2)).toBe(1);
  });
});
