import { checkInput } from '@/shared/sightline/check-input';
import { resolveSphere } from '@/shared/sightline/resolve-sphere';
import type { Derived, SphereOptions } from '@/shared/sightline/types';

/**
 * The hand-calculation form of the horizon distance, d ≈ √(2R'h) — the
 * formula behind the navigator's "D = 1.17 √h(ft) nmi" and the radar
 * "1.23 √h(ft) nmi". Use it where a quick figure is shown; see
 * `horizonApproxRelativeError` for how far it is from the exact arc.
 *
 * @param heightM - height of eye above the surface, metres, ≥ 0
 * @param options - `k` (default 0.13), `earthRadiusM` (default 6 371 008.8 m)
 * @returns metres; `null` with reason `ducting` when k ≥ 1
 * @throws {SightlineInputError} on a negative or non-finite height
 *
 * Source: The American Practical Navigator (Bowditch, NGA Pub. 9), Table 12,
 * D = √(2 r₀ h / β₀).
 *
 * @example
 * horizonDistanceApprox(2, { k: 0 }); // { value: 5048.2, reason: null }
 */
export function horizonDistanceApprox(heightM: number, options: SphereOptions = {}): Derived {
  checkInput('heightM', heightM, { min: 0 });
  const { effectiveRadiusM: r } = resolveSphere(options);
  if (r === null) return { value: null, reason: 'ducting' };
  return { value: Math.sqrt(2 * r * heightM), reason: null };
}
