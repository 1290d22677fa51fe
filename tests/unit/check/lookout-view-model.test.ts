import { ARCMIN_PER_RAD, lookoutScene, placeLabels, rangeMarks } from '@/components/check/lookout-view-model';
import { SightlineRequestSchema } from '@/shared/schemas/sightline';
import { evaluateSightline } from '@/shared/sightline/evaluate-sightline';

const ask = (over: Record<string, unknown>) =>
  evaluateSightline(
    SightlineRequestSchema.parse({
      observerHeightM: 30,
      targetHeightM: 10,
      distanceM: 25_000,
      conditions: [{ k: 0.13 }],
      ...over,
    }),
  ).results[0]!;

describe('lookoutScene', () => {
  test('the horizon lies at the dip below eye level', () => {
    // Source: dip of the horizon √(2h/R′) for small angles — common practice, no source.
    const r = ask({});
    const scene = lookoutScene(r, 30, { heightM: 10, distanceM: 25_000 });
    expect(scene.horizonArcmin).toBeCloseTo(-r.dipDeg! * 60, 9);
    expect(Math.abs(-scene.horizonArcmin! / (Math.sqrt((2 * 30) / r.effectiveRadiusM!) * ARCMIN_PER_RAD) - 1)).toBeLessThan(1e-3);
  });

  test('beyond the horizon, the hidden part seen from the eye is the engine’s hidden height over the distance', () => {
    // Hidden height 10 m target at 25 km from 30 m (k = 0.13): the part under the horizon's angle.
    const r = ask({ targetHeightM: 30 });
    const d = 25_000;
    const scene = lookoutScene(r, 30, { heightM: 30, distanceM: d, sizeM: 5 });
    const hiddenArcmin = scene.lowestSeenArcmin! - scene.baseArcmin!;
    expect(r.hiddenHeightM!).toBeGreaterThan(0);
    expect(Math.abs(hiddenArcmin / ((r.hiddenHeightM! / d) * ARCMIN_PER_RAD) - 1)).toBeLessThan(0.01);
    expect(scene.hidden).toBe(false);
    // Source: apparent size, atan(width / distance) (plane geometry).
    expect(scene.widthArcmin).toBeCloseTo(Math.atan(5 / d) * ARCMIN_PER_RAD, 9);
  });

  test('a target lower than its hidden height is wholly hidden; one inside the horizon shows from its base', () => {
    const far = ask({ targetHeightM: 2, distanceM: 40_000 });
    expect(far.hiddenHeightM!).toBeGreaterThan(2);
    expect(lookoutScene(far, 30, { heightM: 2, distanceM: 40_000 }).hidden).toBe(true);
    const near = ask({ distanceM: 5_000 });
    const scene = lookoutScene(near, 30, { heightM: 10, distanceM: 5_000 });
    expect(scene.hidden).toBe(false);
    expect(scene.lowestSeenArcmin).toBe(scene.baseArcmin);
  });

  test('without a target only the horizon is drawn; a duct has none', () => {
    const r = ask({});
    expect(lookoutScene(r, 30, {})).toMatchObject({ topArcmin: null, baseArcmin: null, hidden: false });
    const duct = ask({ conditions: [{ k: 1.2 }] });
    expect(lookoutScene(duct, 30, { heightM: 10, distanceM: 25_000 }).horizonArcmin).toBeNull();
  });
});

describe('rangeMarks', () => {
  test('puts the target, the horizon, the geographic range and each limit on one scale, nearest first', () => {
    const r = ask({ visibilityM: 20_000, targetSizeM: 3 });
    const marks = rangeMarks(r, 25_000);
    expect(marks.map((m) => m.distanceM)).toEqual([...marks.map((m) => m.distanceM)].sort((a, b) => a - b));
    expect(marks.map((m) => m.key)).toEqual(
      expect.arrayContaining(['target', 'horizon', 'geographic', 'visibility', 'angular-size', 'detection']),
    );
    const detection = marks.find((m) => m.key === 'detection')!;
    expect(detection.distanceM).toBe(r.detectionRangeM);
    expect(rangeMarks(r).some((m) => m.key === 'target')).toBe(false);
  });
});

describe('placeLabels', () => {
  test('labels on one row never overlap, and none leaves the strip', () => {
    // common practice, no source: labels that overlap cannot be read.
    const marks = [3.4, 19.6, 20, 25, 30.8, 31].map((km) => ({ text: `mark ${km} km`, x: km * 10 }));
    const placed = placeLabels(marks, 320);
    const spans = placed.map((p, i) => ({ y: p.y, x0: p.x, x1: p.x + marks[i]!.text.length * 5.6 }));
    for (let i = 0; i < spans.length; i++) {
      expect(spans[i]!.x0).toBeGreaterThanOrEqual(0);
      expect(spans[i]!.x1).toBeLessThanOrEqual(320 + 1e-9);
      for (let j = i + 1; j < spans.length; j++) {
        if (spans[i]!.y !== spans[j]!.y) continue;
        expect(spans[i]!.x1 < spans[j]!.x0 || spans[j]!.x1 < spans[i]!.x0).toBe(true);
      }
    }
    expect(new Set(placed.map((p) => p.y)).size).toBeGreaterThan(1);
  });
});
