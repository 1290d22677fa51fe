import type { SightlineRequest, SightlineResult } from '@/shared/schemas/sightline';
import { evaluateSightline } from '@/shared/sightline/evaluate-sightline';
import type { DetectionLimit } from '@/shared/sightline/types';

/** The k values every band covers: no refraction to a strong daytime value, step 0.05. */
export const SENSITIVITY_BAND_K: readonly number[] = Object.freeze([0, 0.05, 0.1, 0.15, 0.2, 0.25, 0.3]);

/** A quantity's least and greatest value over the band, with the k where each occurs. */
export interface BandSpan {
  readonly min: number;
  readonly kAtMin: number;
  readonly max: number;
  readonly kAtMax: number;
}

/** How much a detection answer moves with refraction (see {@link detectionSensitivity}). */
export interface DetectionSensitivity {
  /** Every k evaluated, ascending: the band's and the caller's own (below 1). */
  readonly ks: readonly number[];
  /** Detection range over those k; null when no k gave one. */
  readonly detectionRangeM: BandSpan | null;
  /** Geographic range over those k; null when no k gave one. */
  readonly geographicRangeM: BandSpan | null;
  /** Every limit that decided the detection range somewhere in the band, in order of first k. */
  readonly limitedBy: readonly DetectionLimit[];
  /** (max − min) / max of the detection range, percent; null without one. */
  readonly spreadPct: number | null;
}

/**
 * Sensitivity of a detection answer to refraction: evaluates the same
 * question (eye, target, visibility, light, sea) for k = 0, 0.05 … 0.3 and
 * the caller's own k values (e.g. a plan's conditions), and reports the least
 * and greatest detection and geographic range, every limit that decided it
 * and the spread. k ≥ 1 (a duct: no horizon) is left out; a non-finite k is
 * ignored.
 *
 * Pure: evaluates with {@link evaluateSightline}; the request is not modified.
 *
 * Source: sensitivity sweep over k (no published formula; 0…0.3 spans the
 * daytime optical k usually met over land and sea — common practice, no source).
 *
 * @param request a parsed sightline request; its own conditions are ignored
 * @param ownK further k values to include, e.g. the plan's
 * @returns the band (plain data)
 * @example
 * detectionSensitivity({ observerHeightM: 20, targetHeightM: 2, … }, [0.13]).detectionRangeM;
 * // { min: ≈ 21.6 km at k 0, max: ≈ 25.8 km at k 0.3 } (the horizon decides)
 */
export function detectionSensitivity(request: SightlineRequest, ownK: readonly number[] = []): DetectionSensitivity {
  const ks = [...new Set([...SENSITIVITY_BAND_K, ...ownK.filter((k) => Number.isFinite(k) && k < 1)])].sort((a, b) => a - b);
  const results = evaluateSightline({ ...request, conditions: ks.map((k) => ({ k })) }).results;
  const detectionRangeM = spanOf(ks, results, (r) => r.detectionRangeM);
  const limitedBy: DetectionLimit[] = [];
  for (const r of results) if (r.limitedBy !== null && !limitedBy.includes(r.limitedBy)) limitedBy.push(r.limitedBy);
  return {
    ks,
    detectionRangeM,
    geographicRangeM: spanOf(ks, results, (r) => r.geographicRangeM),
    limitedBy,
    spreadPct:
      detectionRangeM === null || detectionRangeM.max === 0
        ? null
        : (100 * (detectionRangeM.max - detectionRangeM.min)) / detectionRangeM.max,
  };
}

function spanOf(
  ks: readonly number[],
  results: readonly SightlineResult[],
  pick: (r: SightlineResult) => number | null,
): BandSpan | null {
  let span: { min: number; kAtMin: number; max: number; kAtMax: number } | null = null;
  results.forEach((r, i) => {
    const v = pick(r);
    if (v === null || !Number.isFinite(v)) return;
    const k = ks[i]!;
    if (span === null) span = { min: v, kAtMin: k, max: v, kAtMax: k };
    else {
      if (v < span.min) Object.assign(span, { min: v, kAtMin: k });
      if (v > span.max) Object.assign(span, { max: v, kAtMax: k });
    }
  });
  return span;
}
