import { erf as mathjsErf } from 'mathjs';
import { SweepWidthRequestSchema } from '@/shared/schemas/sweep-width';
import { definiteRangeParallelSweepPod } from '@/shared/sightline/definite-range-law';
import { erf } from '@/shared/sightline/erf';
import { evaluateSweep, SWEEP_CAUTION } from '@/shared/sightline/evaluate-sweep';
import { inverseCubeLateralRange, inverseCubeParallelSweepPod, inverseCubeSweepWidth } from '@/shared/sightline/inverse-cube-law';
import { lateralRangeAt, type LateralRangePoint } from '@/shared/sightline/lateral-range-curve';
import { MAX_TRACKS_EACH_SIDE, parallelSweepPod } from '@/shared/sightline/parallel-sweep-pod';
import { randomSearchPod } from '@/shared/sightline/random-search-pod';
import { SweepInputError } from '@/shared/sightline/sweep-input-error';
import { sweepWidthFromCurve } from '@/shared/sightline/sweep-width-from-curve';
import { deepFreeze, expectRelative, expectWithin } from '@/tests/unit/sightline/tolerance';

/** The inverse-cube curve for sweep width W, tabulated from 0 out to `reach` (geometric spacing past W/100). */
const tabulatedInverseCube = (W: number, reach: number, points = 400): LateralRangePoint[] => {
  const curve: LateralRangePoint[] = [{ rangeM: 0, pod: 1 }];
  const first = W / 100;
  for (let i = 0; i < points; i++) {
    const x = first * (reach / first) ** (i / (points - 1));
    curve.push({ rangeM: x, pod: inverseCubeLateralRange(x, W) });
  }
  return curve;
};

/** A definite-range ("cookie cutter") curve of range R: 1 out to R, 0 a millimetre further. */
const cookieCutter = (R: number): LateralRangePoint[] => [
  { rangeM: 0, pod: 1 },
  { rangeM: R, pod: 1 },
  { rangeM: R + 0.001, pod: 0 },
];

const thrown = (f: () => unknown): SweepInputError => {
  try {
    f();
  } catch (e) {
    if (e instanceof SweepInputError) return e;
    throw e;
  }
  throw new Error('expected a SweepInputError');
};

describe('erf (Abramowitz & Stegun 7.1.26)', () => {
  it('agrees with mathjs within the published error bound over −4 … 4', () => {
    // Source: A&S 7.1.26 states |ε(x)| ≤ 1.5 × 10⁻⁷; reference values from mathjs's erf (a dev dependency).
    for (let x = -4; x <= 4; x += 0.01) expectWithin(erf(x), mathjsErf(x), 1.5e-7);
  });

  it('matches table values and is odd', () => {
    // Source: A&S Table 7.1 (erf 0.5 = 0.520 499 878, erf 1 = 0.842 700 793, erf 2 = 0.995 322 265) — from memory,
    // and the same in mathjs above.
    expectWithin(erf(0.5), 0.520499878, 2e-7);
    expectWithin(erf(1), 0.842700793, 2e-7);
    expectWithin(erf(2), 0.995322265, 2e-7);
    expect(erf(-0.7)).toBe(-erf(0.7));
    expect(erf(Infinity)).toBe(1);
    expect(Number.isNaN(erf(Number.NaN))).toBe(true);
  });
});

describe('POD against the coverage factor', () => {
  it('random search: C = 1 gives 1 − 1/e ≈ 0.632', () => {
    // Source: Koopman, Search and Screening, random-search formula POD = 1 − e^(−C) — from memory; 1 − e⁻¹ = 0.632 12.
    expectWithin(randomSearchPod(1), 0.63212, 1e-5);
    expectWithin(randomSearchPod(2), 0.86466, 1e-5);
    expect(randomSearchPod(0)).toBe(0);
  });

  it('inverse-cube parallel sweep: C = 1 gives ≈ 0.79, C = 0.5 ≈ 0.47, C = 2 ≈ 0.99', () => {
    // Source: Koopman, Search and Screening, POD = erf((√π/2)·C) for the inverse-cube law on parallel sweeps, and its
    // "≈ 0.79 at C = 1" — from memory; the four-figure values are that relation evaluated with mathjs's erf
    // (erf(0.886 23) = 0.789 91). Its independent check is the sum over tracks below.
    expectWithin(inverseCubeParallelSweepPod(1), mathjsErf(Math.sqrt(Math.PI) / 2), 2e-7);
    expectWithin(inverseCubeParallelSweepPod(1), 0.7899, 1e-4);
    expectWithin(inverseCubeParallelSweepPod(0.5), 0.4691, 1e-4);
    expectWithin(inverseCubeParallelSweepPod(2), 0.9878, 1e-4);
  });

  it('the three laws keep their order at every coverage: random ≤ inverse-cube ≤ definite range', () => {
    // Source: common practice, no source — the random search is the pessimistic and the definite range the
    // optimistic bound of the POD–coverage graphs.
    for (const C of [0.1, 0.3, 0.7, 1, 1.5, 2.5]) {
      expect(randomSearchPod(C)).toBeLessThan(inverseCubeParallelSweepPod(C));
      expect(inverseCubeParallelSweepPod(C)).toBeLessThan(definiteRangeParallelSweepPod(C) + 1e-12);
    }
  });

  it('refuses a negative coverage factor', () => {
    expect(thrown(() => randomSearchPod(-1)).field).toBe('coverageFactor');
    expect(thrown(() => inverseCubeParallelSweepPod(Number.NaN)).field).toBe('coverageFactor');
  });
});

describe('sweep width from a lateral-range curve (trapezoid)', () => {
  it('definite range R: W = 2R', () => {
    // Source: definite-range law, W = 2R (Koopman, Search and Screening — from memory); the area of a rectangle.
    expectRelative(sweepWidthFromCurve(cookieCutter(500)), 1000, 1e-5);
  });

  it('a triangle 1 − x/R: W = R; a trapezoid: W = R₁ + R₂', () => {
    // Source: common practice, no source — areas of a triangle and a trapezoid, both sides of the track.
    expectRelative(
      sweepWidthFromCurve([
        { rangeM: 0, pod: 1 },
        { rangeM: 800, pod: 0 },
      ]),
      800,
      1e-12,
    );
    expectRelative(
      sweepWidthFromCurve([
        { rangeM: 0, pod: 0.8 },
        { rangeM: 300, pod: 0.8 },
        { rangeM: 900, pod: 0 },
      ]),
      0.8 * 1200,
      1e-12,
    );
    // The first POD holds from the track to the first point.
    expectRelative(
      sweepWidthFromCurve([
        { rangeM: 200, pod: 0.5 },
        { rangeM: 600, pod: 0 },
      ]),
      2 * (100 + 100),
      1e-12,
    );
  });

  it('inverse-cube: the integral of 1 − exp(−K/x²) is 2√(πK)', () => {
    // Source: lateral-range curve 1 − exp(−K/x²) (Eagle, NPS OA3602 notes, 2012, after Washburn §2.4); its integral
    // 2√(πK) is derived (∫₀^∞ (1 − e^(−K/x²)) dx = √(πK)) and checked here by quadrature: the tabulated curve to
    // 10⁴·√K plus the tail ∫ K/x² dx = K/X beyond it.
    const K = 250_000 / Math.PI; // W = 1000 m
    const W = inverseCubeSweepWidth(K);
    expectRelative(W, 1000, 1e-12);
    const reach = 1e4 * Math.sqrt(K);
    const curve = tabulatedInverseCube(W, reach, 499);
    expectRelative(sweepWidthFromCurve(curve) + 2 * (K / reach), W, 2e-4);
    expect(thrown(() => inverseCubeSweepWidth(0)).field).toBe('inverseCubeKM2');
  });

  it('names the bad point of a curve and does not change its input', () => {
    expect(
      thrown(() =>
        sweepWidthFromCurve([
          { rangeM: 0, pod: 1 },
          { rangeM: 10, pod: 0.5 },
          { rangeM: 10, pod: 0 },
        ]),
      ).field,
    ).toBe('lateralRangeCurve.2.rangeM');
    expect(
      thrown(() =>
        sweepWidthFromCurve([
          { rangeM: 0, pod: 1.2 },
          { rangeM: 10, pod: 0 },
        ]),
      ).field,
    ).toBe('lateralRangeCurve.0.pod');
    const frozen = deepFreeze(cookieCutter(100));
    expect(() => sweepWidthFromCurve(frozen)).not.toThrow();
    expect(() => parallelSweepPod(frozen, 50)).not.toThrow();
    expect(lateralRangeAt(frozen, -50)).toBe(1);
  });
});

describe('parallel-sweep POD summed over tracks', () => {
  it('definite range: POD = min(1, C)', () => {
    // Source: definite-range law on parallel tracks (Koopman — from memory): a strip of width W out of every S.
    for (const [S, expected] of [
      [2000, 0.5],
      [1000, 1],
      [500, 1],
      [4000, 0.25],
    ] as const) {
      expectWithin(parallelSweepPod(cookieCutter(500), S).pod, expected, 2e-3);
    }
  });

  it('a triangle curve with tracks wider than its reach: POD = W/S', () => {
    // Source: common practice, no source — with no overlap between tracks the mean POD is the area under one curve
    // over the spacing.
    expectWithin(
      parallelSweepPod(
        [
          { rangeM: 0, pod: 1 },
          { rangeM: 500, pod: 0 },
        ],
        2000,
      ).pod,
      500 / 2000,
      1e-4,
    );
  });

  it('the tabulated inverse-cube curve reproduces erf((√π/2)·C)', () => {
    // Source: the product over parallel tracks (Eagle, NPS OA3602 notes, 2012) against Koopman's closed form; the
    // curve is cut at 100·W, which loses ≈ 0.2 % of W, hence the tolerance.
    const W = 1000;
    const curve = tabulatedInverseCube(W, 100 * W);
    for (const S of [500, 1000, 2000]) {
      const { pod } = parallelSweepPod(curve, S);
      expectWithin(pod, inverseCubeParallelSweepPod(W / S), 3e-3);
    }
  });

  it(`caps the work at ${MAX_TRACKS_EACH_SIDE} tracks each side, as a field error on trackSpacingM`, () => {
    const curve = [
      { rangeM: 0, pod: 0.9 },
      { rangeM: 10_000, pod: 0 },
    ];
    expect(parallelSweepPod(curve, 5).tracksEachSide).toBe(2000);
    const error = thrown(() => parallelSweepPod(curve, 4.99));
    expect(error.code).toBe('too-many-tracks');
    expect(error.field).toBe('trackSpacingM');
    expect(error.message).toMatch(/at least 5\.00 m/);
    expect(thrown(() => parallelSweepPod(curve, 0)).field).toBe('trackSpacingM');
  });
});

describe('evaluateSweep', () => {
  it('a sweep width alone is read with the inverse-cube law', () => {
    const r = evaluateSweep(SweepWidthRequestSchema.parse({ sweepWidthM: 1500, trackSpacingM: 1500 }));
    expect(r.model).toBe('inverse-cube');
    expectWithin(r.coverageFactor, 1, 1e-12);
    expectWithin(r.pod, 0.7899, 1e-4);
    expectWithin(r.podRandomSearch, 0.6321, 1e-4);
    expect(r.caution).toBe(SWEEP_CAUTION);
    expect(r.source).toMatch(/Koopman/);
  });

  it('derives W from K or from the definite range', () => {
    const k = evaluateSweep(SweepWidthRequestSchema.parse({ inverseCubeKM2: 1e6 / Math.PI, trackSpacingM: 4000 }));
    expectRelative(k.sweepWidthM, 2000, 1e-12);
    expectWithin(k.coverageFactor, 0.5, 1e-12);
    const d = evaluateSweep(SweepWidthRequestSchema.parse({ model: 'definite-range', definiteRangeM: 300, trackSpacingM: 1200 }));
    expect(d).toMatchObject({ model: 'definite-range', sweepWidthM: 600, coverageFactor: 0.5, pod: 0.5 });
  });

  it('a curve gives W by the trapezoid rule and the POD over tracks, and warns when it ends above 0', () => {
    const r = evaluateSweep(
      SweepWidthRequestSchema.parse({
        lateralRangeCurve: [
          { rangeM: 0, pod: 1 },
          { rangeM: 500, pod: 0.2 },
        ],
        trackSpacingM: 2000,
      }),
    );
    expect(r.model).toBe('lateral-range-curve');
    expectRelative(r.sweepWidthM, 600, 1e-12);
    expectWithin(r.pod, 600 / 2000, 1e-3);
    expect(r.tracksEachSide).toBe(1);
    expect(r.warnings.join(' ')).toMatch(/ends at 500 m/);
  });

  it('the schema names the field at fault', () => {
    const issues = (body: unknown) => SweepWidthRequestSchema.safeParse(body).error?.issues.map((i) => i.path.join('.')) ?? [];
    expect(issues({ trackSpacingM: 100 })).toEqual(['sweepWidthM']);
    expect(issues({ sweepWidthM: 10 })).toEqual(['trackSpacingM']);
    expect(issues({ lateralRangeCurve: cookieCutter(10), model: 'inverse-cube', trackSpacingM: 10 })).toEqual(['model']);
    expect(issues({ model: 'definite-range', sweepWidthM: 10, definiteRangeM: 5, trackSpacingM: 10 })).toEqual([
      'definiteRangeM',
    ]);
    expect(
      issues({
        lateralRangeCurve: [
          { rangeM: -1, pod: 2 },
          { rangeM: 1, pod: 0 },
        ],
        trackSpacingM: 10,
      }),
    ).toEqual(['lateralRangeCurve.0.rangeM', 'lateralRangeCurve.0.pod']);
  });
});
