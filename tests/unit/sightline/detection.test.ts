import {
  convertVisibility,
  detectionRange,
  extinctionFromVisibility,
  firstSightingRange,
  isTargetVisible,
  ONE_ARCMINUTE_RAD,
  resolutionRange,
  SightlineInputError,
  visualRange,
} from '@/shared/sightline';
import { convertAngle, convertLength } from '@/shared/units';
import { deepFreeze, expectRelative, expectWithin } from '@/tests/unit/sightline/tolerance';

describe('visibility and extinction (Koschmieder)', () => {
  it('meteorological range: V = 3.912/σ at a 2 % threshold', () => {
    // Source: AMS Glossary of Meteorology, "meteorological range" (threshold contrast 0.02, V = 3.912/σ; 2000–2012 text). Tolerance 0.001.
    expectWithin(extinctionFromVisibility(10_000, 'meteorological-range-2pct') * 10_000, 3.912, 0.001);
    expectWithin(visualRange(1e-3, 0.02) * 1e-3, 3.912, 0.001);
  });

  it('meteorological optical range: V ≈ 2.996/σ at a 5 % threshold', () => {
    // Source: CIE S 017 term 17-31-018 / WMO-No. 8, meteorological optical range (95 % attenuation). Tolerance 0.001.
    expectWithin(extinctionFromVisibility(10_000, 'mor-5pct') * 10_000, 2.996, 0.001);
    expectWithin(visualRange(1e-3) * 1e-3, 2.996, 0.001);
  });

  it('converts between the two kinds and back', () => {
    const metRange = convertVisibility(10_000, 'mor-5pct', 'meteorological-range-2pct');
    // Source: ratio of the two definitions, 3.912/2.996 (AMS Glossary; CIE/WMO). Tolerance 0.1 %.
    expectRelative(metRange / 10_000, 3.912 / 2.996, 0.001);
    // Source: none — round trip. Tolerance 1e-9 m.
    expectWithin(convertVisibility(metRange, 'meteorological-range-2pct', 'mor-5pct'), 10_000, 1e-9);
    expectWithin(convertVisibility(7000, 'mor-5pct', 'mor-5pct'), 7000, 1e-12);
  });

  it('rejects a non-positive visibility and a threshold outside (0, 1)', () => {
    // Source: none — input contract.
    expect(() => extinctionFromVisibility(0)).toThrow(SightlineInputError);
    expect(() => visualRange(1e-3, 1)).toThrow(SightlineInputError);
  });
});

describe('angular-size limit', () => {
  it('a target at its resolution range subtends one minute of arc', () => {
    for (const size of [0.3, 1, 5, 40]) {
      const d = resolutionRange(size);
      const subtended = 2 * Math.atan(size / 2 / d);
      // Source: 20/20 (6/6) vision resolves one minute of arc (Snellen convention; optometry references). Tolerance 1e-9 relative.
      expectRelative(convertAngle(subtended, 'rad', 'arcmin'), 1, 1e-9);
    }
  });

  it('a 20/20 Snellen letter (8.87 mm, 5′) is read at 20 ft', () => {
    // Source: optician certification reference: the 20/20 letter is 8.87 mm tall and subtends 5′ at 20 ft. Tolerance 0.5 %.
    expectRelative(resolutionRange(0.00887, 5 * ONE_ARCMINUTE_RAD), convertLength(20, 'ft', 'm'), 0.005);
  });

  it('scales inversely with the resolving angle (lookout detection threshold)', () => {
    // Source: none — small-angle proportionality. Tolerance 1e-6 relative.
    expectRelative(resolutionRange(2, 3 * ONE_ARCMINUTE_RAD), resolutionRange(2) / 3, 1e-6);
  });
});

describe('detection range', () => {
  it('is limited by the horizon when the air is clear and the target large', () => {
    const r = detectionRange({ observerHeightM: 2, targetHeightM: 10, targetSizeM: 20, visibilityM: 50_000 });
    // Source: none — least of the limits; horizon limit is horizon(2) + horizon(10).
    expect(r.limitedBy).toBe('horizon');
    expectWithin(r.rangeM, firstSightingRange(2, 10).value ?? NaN, 1e-9);
  });

  it('is limited by visibility in haze', () => {
    const r = detectionRange({ observerHeightM: 300, targetHeightM: 50, visibilityM: 4000 });
    // Source: none — least of the limits; MOR passes through at the default 5 % threshold. Tolerance 1e-9 m.
    expect(r.limitedBy).toBe('visibility');
    expectWithin(r.rangeM, 4000, 1e-9);
  });

  it('converts a 2 % meteorological range to the 5 % detection threshold', () => {
    const r = detectionRange({
      observerHeightM: 300,
      targetHeightM: 50,
      visibilityM: 10_000,
      visibilityKind: 'meteorological-range-2pct',
    });
    // Source: AMS Glossary (3.912/σ) and CIE/WMO MOR (2.996/σ). Tolerance 0.1 %.
    expectRelative(r.limits.visibilityM, (10_000 * 2.996) / 3.912, 0.001);
  });

  it('is limited by angular size for a small target', () => {
    const r = detectionRange({ observerHeightM: 300, targetHeightM: 2, targetSizeM: 0.5, visibilityM: 20_000 });
    // Source: none — least of the limits; 0.5 m at 1′ ≈ 1 719 m.
    expect(r.limitedBy).toBe('angular-size');
    expectWithin(r.rangeM, resolutionRange(0.5), 1e-9);
  });

  it('under ducting falls back to the other limits, or is unbounded', () => {
    // Source: none — Kenning's contract for k ≥ 1.
    const withVisibility = detectionRange({ observerHeightM: 5, targetHeightM: 5, visibilityM: 9000, k: 1.4 });
    expect(withVisibility.limitedBy).toBe('visibility');
    expect(withVisibility.limits.horizon).toEqual({ value: null, reason: 'ducting' });
    const nothing = detectionRange({ observerHeightM: 5, targetHeightM: 5, k: 1.4 });
    expect(nothing).toMatchObject({ rangeM: null, limitedBy: null, reason: 'unbounded' });
  });

  it('has no range when more must show than the target has', () => {
    // Source: none — contract.
    expect(detectionRange({ observerHeightM: 5, targetHeightM: 5, requiredVisibleM: 6 })).toMatchObject({
      rangeM: null,
      reason: 'required-part-exceeds-target',
    });
  });

  it('does not mutate its input', () => {
    const input = deepFreeze({ observerHeightM: 20, targetHeightM: 5, visibilityM: 8000, targetSizeM: 2, k: 0.13 });
    detectionRange(input);
    isTargetVisible({ ...input, distanceM: 1000 });
    // Source: none — purity contract.
    expect(input).toEqual({ observerHeightM: 20, targetHeightM: 5, visibilityM: 8000, targetSizeM: 2, k: 0.13 });
  });
});

describe('target visible at a distance', () => {
  const input = { observerHeightM: 15, targetHeightM: 25, requiredVisibleM: 5, visibilityM: 30_000, targetSizeM: 12 };

  it('agrees with the detection range on either side of it', () => {
    const range = detectionRange(input).rangeM ?? NaN;
    // Source: none — consistency of the two functions.
    expect(isTargetVisible({ ...input, distanceM: range * (1 - 1e-9) }).visible).toBe(true);
    const beyond = isTargetVisible({ ...input, distanceM: range * (1 + 1e-6) });
    expect(beyond.visible).toBe(false);
    expect(beyond.blockedBy).toContain(detectionRange(input).limitedBy);
  });

  it('lists every limit exceeded', () => {
    // Source: none — contract.
    expect(isTargetVisible({ ...input, distanceM: 1_000_000 }).blockedBy).toEqual(['horizon', 'visibility', 'angular-size']);
    expect(isTargetVisible({ ...input, requiredVisibleM: 30, distanceM: 10 })).toEqual({
      visible: false,
      blockedBy: [],
      requiredPartExceedsTarget: true,
    });
  });
});
