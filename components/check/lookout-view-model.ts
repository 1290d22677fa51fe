import type { SightlineResult } from '@/shared/schemas/sightline';

/** Minutes of arc in one radian. */
export const ARCMIN_PER_RAD = (180 * 60) / Math.PI;

/**
 * What one lookout sees of one target under one condition, as angles from
 * eye level (arcminutes, up positive): the horizon, and the target's top and
 * base with the part below the horizon hidden. Null angles where the
 * quantity does not exist (a duct has no horizon).
 */
export interface LookoutScene {
  /** Angle of the sea (or plain) horizon, arcmin; negative (below eye level). Null in a duct. */
  readonly horizonArcmin: number | null;
  /** Angle of the target's top, arcmin; null without a target. */
  readonly topArcmin: number | null;
  /** Angle of the target's base (where it would be without the earth in the way), arcmin. */
  readonly baseArcmin: number | null;
  /** Lowest angle of the target that can be seen (its base, or the horizon when the base is beyond it), arcmin. */
  readonly lowestSeenArcmin: number | null;
  /** Apparent width of the target, arcmin; null without a size. */
  readonly widthArcmin: number | null;
  /** True when the horizon hides the whole target. */
  readonly hidden: boolean;
}

/**
 * The angles of the lookout's view for one result, on the effective earth of
 * radius R′ = R/(1 − k) (the result's `effectiveRadiusM`): a point at height
 * H above the datum at distance d is seen at
 *
 *   α(H, d) = (H − h)/d − d/(2R′)   (radians, up positive; small angles)
 *
 * and the horizon at −dip = −√(2h/R′). The target's base is α(0, d), its top
 * α(T, d); beyond the horizon the part below the horizon's angle is hidden
 * (it is the hidden height seen from the eye: (hiddenHeight)/d).
 *
 * Source: the small-angle forms of dip and of the drop below the tangent,
 * d²/(2R′) — common practice, no source (e.g. surveying texts on curvature
 * and refraction, from memory).
 */
export function lookoutScene(
  result: Pick<SightlineResult, 'effectiveRadiusM' | 'dipDeg' | 'horizonDistanceM'>,
  observerHeightM: number,
  target: { heightM?: number; distanceM?: number; sizeM?: number },
): LookoutScene {
  const R = result.effectiveRadiusM;
  const h = observerHeightM;
  const horizon = result.dipDeg === null ? null : -result.dipDeg * 60;
  const d = target.distanceM;
  if (d === undefined || d <= 0 || target.heightM === undefined) {
    return {
      horizonArcmin: horizon,
      topArcmin: null,
      baseArcmin: null,
      lowestSeenArcmin: null,
      widthArcmin: null,
      hidden: false,
    };
  }
  const angle = (H: number) => ((H - h) / d - (R === null ? 0 : d / (2 * R))) * ARCMIN_PER_RAD;
  const top = angle(target.heightM);
  const base = angle(0);
  const beyond = result.horizonDistanceM !== null && horizon !== null && d > result.horizonDistanceM;
  const lowest = beyond ? Math.max(base, horizon!) : base;
  return {
    horizonArcmin: horizon,
    topArcmin: top,
    baseArcmin: base,
    lowestSeenArcmin: Math.min(lowest, top),
    widthArcmin: target.sizeM === undefined ? null : Math.atan(target.sizeM / d) * ARCMIN_PER_RAD,
    hidden: beyond && top <= horizon!,
  };
}

/** One mark on the range strip. */
export interface RangeMark {
  readonly key: 'target' | 'horizon' | 'geographic' | 'visibility' | 'angular-size' | 'luminous-range' | 'detection';
  readonly label: string;
  readonly distanceM: number;
}

/**
 * The distances one result puts on a single scale: the target's distance,
 * the horizon, the geographic range, each limit of detection that exists,
 * and the detection range itself; sorted nearest first.
 */
export function rangeMarks(
  result: Pick<
    SightlineResult,
    'horizonDistanceM' | 'geographicRangeM' | 'visibilityLimitM' | 'angularSizeLimitM' | 'luminousRangeM' | 'detectionRangeM'
  >,
  targetDistanceM?: number,
): RangeMark[] {
  const marks: (RangeMark | null)[] = [
    targetDistanceM === undefined ? null : { key: 'target', label: 'target', distanceM: targetDistanceM },
    result.horizonDistanceM === null ? null : { key: 'horizon', label: 'horizon', distanceM: result.horizonDistanceM },
    result.geographicRangeM === null ? null : { key: 'geographic', label: 'geographic', distanceM: result.geographicRangeM },
    result.visibilityLimitM === null ? null : { key: 'visibility', label: 'visibility', distanceM: result.visibilityLimitM },
    result.angularSizeLimitM === null ? null : { key: 'angular-size', label: 'size', distanceM: result.angularSizeLimitM },
    result.luminousRangeM === null ? null : { key: 'luminous-range', label: 'light', distanceM: result.luminousRangeM },
    result.detectionRangeM === null ? null : { key: 'detection', label: 'detected', distanceM: result.detectionRangeM },
  ];
  return marks
    .filter((m): m is RangeMark => m !== null && Number.isFinite(m.distanceM))
    .sort((a, b) => a.distanceM - b.distanceM);
}

/** Label rows of the range strip, nearest the line first: y of the text baseline. */
export const LABEL_ROWS = [24, 54, 11, 67] as const;
export const LINE_Y = 34;

/**
 * Places each mark's label on the first row where it does not overlap the
 * labels already there (labels about 5.6 px a character at 10.5 px).
 */
export function placeLabels(marks: { text: string; x: number }[], width: number): { x: number; y: number }[] {
  const ends: number[] = LABEL_ROWS.map(() => -Infinity);
  return marks.map((m) => {
    const w = m.text.length * 5.6;
    const x0 = Math.min(Math.max(0, m.x - w / 2), Math.max(0, width - w));
    let row = ends.findIndex((end) => x0 > end + 6);
    if (row < 0) row = ends.indexOf(Math.min(...ends));
    ends[row] = x0 + w;
    return { x: x0, y: LABEL_ROWS[row]! };
  });
}
