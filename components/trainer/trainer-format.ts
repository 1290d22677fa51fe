import type { Qualification } from '@/shared/schemas/course';
import type { DrillKind, DrillScoring } from '@/shared/schemas/drill';
import { convertLength, type LengthUnit } from '@/shared/units';

/** Names of the kinds of question, in Kenning's words. */
export const DRILL_KIND_LABELS: Record<DrillKind, string> = {
  'horizon-distance': 'Horizon distance',
  'hidden-height': 'Hidden height',
  'target-visible': 'Top or base visible?',
  'detection-range': 'Detection range',
  'landmark-range': 'Range to a landmark',
  'bearing-fix': 'Smoke from two bearings',
  'refraction-effect': 'Another refraction',
};

/** The cautions every trainer screen keeps in view. */
export const TRAINER_CAUTIONS = [
  'These are estimates only.',
  'Refraction near the horizon varies widely from hour to hour.',
  'Visible is not detected: a target in view can still be missed.',
  'Defer to your agency’s procedures, local regulations and licensed practice.',
] as const;

/** A person's standing on the roster, from their qualifications (every course assigned to them). */
export function qualificationSummary(items: readonly Qualification[], userId: string): { text: string; ok: boolean } | null {
  const mine = items.filter((q) => q.user.id === userId);
  if (mine.length === 0) return null;
  const due = mine.filter((q) => !q.qualified);
  if (due.length > 0) {
    return { text: `not qualified: ${due.map((q) => q.course.name).join(', ')}`, ok: false };
  }
  const until = mine
    .map((q) => q.qualifiedUntil)
    .filter((d): d is string => d !== null)
    .sort()[0];
  return { text: until ? `qualified until ${until.slice(0, 10)}` : 'qualified', ok: true };
}

/** Which band a score fell in, and what that band means (from the drill's stated scoring). */
export function scoreBand(score: number, scoring: DrillScoring): { band: 'full' | 'partial' | 'none'; text: string } {
  if (score >= 1) {
    return {
      band: 'full',
      text: `Full credit: within ±${scoring.fullCreditWithinPct} % (or ±${scoring.fullCreditFloor}) of the value.`,
    };
  }
  if (score > 0) {
    return {
      band: 'partial',
      text: `Partial credit (${scoring.partialCredit}): within ±${scoring.partialCreditWithinPct} % (or ±${scoring.partialCreditFloor}), but not within ±${scoring.fullCreditWithinPct} %.`,
    };
  }
  return {
    band: 'none',
    text: `No credit: more than ±${scoring.partialCreditWithinPct} % (and ±${scoring.partialCreditFloor}) off.`,
  };
}

/** An answer or correct value as shown: yes/no, or the number to a sensible precision with its unit. */
export function showAnswer(value: number | boolean, unit: string): string {
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  const digits = Math.abs(value) >= 100 ? 0 : Math.abs(value) >= 10 ? 1 : 2;
  return `${value.toFixed(digits)} ${unit}`;
}

/** Words for the side view's numbers. */
const SIDE_VIEW_LABELS: Record<string, string> = {
  eyeHeightM: 'Height of eye',
  landmarkName: 'Landmark',
  landmarkHeightM: 'Landmark height',
  k: 'Refraction coefficient k',
  otherK: 'Other k',
  effectiveRadiusM: 'Effective earth radius',
  otherEffectiveRadiusM: 'Effective radius (other k)',
  horizonDistanceM: 'Horizon distance',
  otherHorizonDistanceM: 'Horizon distance (other k)',
  distanceM: 'Distance to the target',
  targetHeightM: 'Target height',
  hiddenHeightM: 'Hidden height',
  visibleHeightM: 'Visible height',
  geographicRangeM: 'Geographic range',
  visibilityLimitM: 'Visibility limit',
  angularSizeLimitM: 'Angular-size limit',
  luminousRangeM: 'Luminous range',
  waveScreenM: 'Wave screening range',
  detectionRangeM: 'Detection range',
  limitedBy: 'Limited by',
  dipDeg: 'Dip of the horizon',
  otherDipDeg: 'Dip (other k)',
  baselineM: 'Between the posts',
  bearingDeg: 'Bearing from the post',
  otherBearingDeg: 'Bearing from the other post',
  eyeElevationM: 'Eye elevation',
  observerGroundM: 'Ground at the post',
  targetGroundM: 'Ground at the target',
  firstObstructionDistanceM: 'First obstruction at',
  firstObstructionGroundM: 'Ground at the obstruction',
  part: 'Part asked about',
  visible: 'Visible',
};

/** A length in metres shown in the person's unit: distances over 2 km in the distance unit, the rest in the height unit. */
export function showLength(metres: number, units: { height: LengthUnit; distance: LengthUnit }, asDistance: boolean): string {
  const unit = asDistance ? units.distance : units.height;
  const v = convertLength(metres, 'm', unit);
  const digits = Math.abs(v) >= 100 ? 0 : Math.abs(v) >= 10 ? 1 : 2;
  return `${v.toFixed(digits)} ${unit}`;
}

/** The side view's (or a question's) numbers as label and text, in the person's units; unknown keys are shown as they are. */
export function sideViewRows(
  values: Record<string, number | string | boolean | null | undefined>,
  units: { height: LengthUnit; distance: LengthUnit },
): { key: string; label: string; text: string }[] {
  const rows: { key: string; label: string; text: string }[] = [];
  for (const [key, value] of Object.entries(values)) {
    if (value === null || value === undefined) continue;
    const label = SIDE_VIEW_LABELS[key] ?? key;
    let text: string;
    if (typeof value === 'boolean') text = value ? 'yes' : 'no';
    else if (typeof value === 'string') text = value;
    else if (key.endsWith('Deg')) text = `${value.toFixed(3)}°`;
    else if (key === 'k' || key === 'otherK') text = value.toFixed(3);
    else if (key.endsWith('M')) {
      const distance = /distance|range|radius|limit|baseline|screen/i.test(key);
      text = showLength(value, units, distance);
    } else text = String(value);
    rows.push({ key, label, text });
  }
  return rows;
}

/**
 * Geometry of the schematic side view (SVG units, width × height): the sea
 * surface drops as d²/(2R′) from the eye's foot; heights are exaggerated so
 * the eye and target fill the drawing. Returns null without a horizon or a
 * distance to draw to.
 */
export function sideViewGeometry(
  view: Record<string, number | string | boolean | null>,
  width = 320,
  height = 140,
): {
  surface: string;
  eye: { x: number; y: number; baseY: number };
  horizonX: number | null;
  target: { x: number; baseY: number; topY: number; hiddenTopY: number } | null;
  ray: { x2: number; y2: number };
} | null {
  const num = (k: string) => (typeof view[k] === 'number' && Number.isFinite(view[k]) ? (view[k] as number) : null);
  const eyeH = num('eyeHeightM');
  const radius = num('effectiveRadiusM') ?? 6_371_000 / (1 - (num('k') ?? 0.13));
  const horizon = num('horizonDistanceM');
  const dist = num('distanceM');
  const span = Math.max(dist ?? 0, horizon ?? 0) * 1.15;
  if (eyeH === null || span <= 0 || radius <= 0) return null;
  const drop = (d: number) => (d * d) / (2 * radius);
  const targetH = num('targetHeightM') ?? 0;
  const top = Math.max(eyeH, targetH + (dist !== null ? -drop(dist) : 0), 1);
  const bottom = -drop(span);
  const pad = 10;
  const x = (d: number) => pad + (d / span) * (width - 2 * pad);
  const y = (h: number) => pad + ((top - h) / (top - bottom)) * (height - 2 * pad);
  const points: string[] = [];
  for (let i = 0; i <= 40; i += 1) {
    const d = (span * i) / 40;
    points.push(`${x(d).toFixed(1)},${y(-drop(d)).toFixed(1)}`);
  }
  const hidden = num('hiddenHeightM');
  const target =
    dist !== null
      ? {
          x: x(dist),
          baseY: y(-drop(dist)),
          topY: y(-drop(dist) + targetH),
          hiddenTopY: y(-drop(dist) + Math.min(Math.max(hidden ?? 0, 0), targetH)),
        }
      : null;
  const rayEnd =
    horizon !== null ? { x2: x(span), y2: y(eyeH + ((-drop(horizon) - eyeH) / horizon) * span) } : { x2: x(span), y2: y(eyeH) };
  return {
    surface: points.join(' '),
    eye: { x: x(0), y: y(eyeH), baseY: y(0) },
    horizonX: horizon !== null ? x(horizon) : null,
    target,
    ray: rayEnd,
  };
}
