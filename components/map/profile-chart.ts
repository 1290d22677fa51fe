import type { TerrainProfileResponse } from '@/shared/schemas/terrain';
import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';

/**
 * Geometry of the profile side view, pure. Drawn in the **true-earth frame**:
 * x is the distance along the line, y the elevation minus the earth's fall
 * below the observer's level, d²/2R — so the ground bends down with the
 * earth and each condition's sight line is the curved path of a ray bent by
 * refraction (an arc of radius R/k). In the API's frame for a condition
 * (ground lowered by (1 − k)·d²/2R) that ray is the straight line from the eye
 * to the target's top; adding back −k·d²/2R puts it in the true frame:
 *
 *   S(d) = eye + (top_k − eye)·d/D − k·d²/(2R)
 *
 * where top_k is the target's top in the condition's frame. k = 0 stays
 * straight; k > 0 bows up by k·D²/(8R) at mid-line (the sagitta of the arc).
 */

/** A point of the chart in metres: distance along the line, elevation in the true-earth frame. */
export interface ChartPoint {
  readonly d: number;
  readonly y: number;
}

/** One condition's curve and marks. */
export interface ChartCondition {
  readonly k: number;
  /** The sight line from the eye to the target's top. */
  readonly sightLine: readonly ChartPoint[];
  /** The first ground above that line, or null when the target's top is seen. */
  readonly obstruction: ChartPoint | null;
  /** Hidden height at the target, metres above its ground. */
  readonly hiddenHeightM: number;
  readonly groundSeen: boolean;
  readonly targetTopSeen: boolean;
}

/** The chart in metres; the view scales it to pixels. */
export interface ProfileChart {
  readonly distanceM: number;
  readonly earthRadiusM: number;
  /** Ground in the true-earth frame, split where the terrain has no data. */
  readonly ground: readonly (readonly ChartPoint[])[];
  readonly eye: ChartPoint;
  /** The target's foot and top (true frame). */
  readonly targetGround: ChartPoint;
  readonly targetTop: ChartPoint;
  readonly conditions: readonly ChartCondition[];
  /** Elevation range to show, metres (true frame). */
  readonly yMin: number;
  readonly yMax: number;
}

/** The earth's fall below the observer's level at distance d, metres: d²/2R. */
export const fall = (d: number, earthRadiusM: number) => (d * d) / (2 * earthRadiusM);

/**
 * Builds the side view of a terrain profile in the true-earth frame.
 *
 * Source: the refracted ray as a circular arc of radius R/k and the
 * effective-earth-radius model (standard surveying and radio-propagation
 * texts, common practice, no source); its sagitta over a chord D is D²/(8ρ).
 *
 * @param profile the API's answer (distances and elevations in metres)
 * @param earthRadiusM the earth radius the profile was computed with (default the IUGG mean)
 * @param steps points per sight line
 */
export function profileChart(profile: TerrainProfileResponse, earthRadiusM = MEAN_EARTH_RADIUS_M, steps = 64): ProfileChart {
  const D = profile.distanceM;
  const R = earthRadiusM;
  const ground: ChartPoint[][] = [];
  let run: ChartPoint[] = [];
  for (const s of profile.samples) {
    if (s.groundElevationM === null) {
      if (run.length > 0) ground.push(run);
      run = [];
      continue;
    }
    run.push({ d: s.distanceM, y: s.groundElevationM - fall(s.distanceM, R) });
  }
  if (run.length > 0) ground.push(run);

  const eye = { d: 0, y: profile.observer.eyeElevationM };
  const targetGround = { d: D, y: profile.target.groundElevationM - fall(D, R) };
  const targetTop = { d: D, y: targetGround.y + profile.target.heightM };
  const conditions = profile.results.map((r): ChartCondition => {
    const topK = r.sightLine.targetTopElevationM;
    const sightLine = Array.from({ length: steps + 1 }, (_, i) => {
      const d = (D * i) / steps;
      return { d, y: eye.y + ((topK - eye.y) * d) / D - (r.k * d * d) / (2 * R) };
    });
    const o = r.firstObstruction;
    return {
      k: r.k,
      sightLine,
      obstruction: o ? { d: o.distanceM, y: o.groundElevationM - fall(o.distanceM, R) } : null,
      hiddenHeightM: r.hiddenHeightM,
      groundSeen: r.groundSeen,
      targetTopSeen: r.targetTopSeen,
    };
  });

  let yMin = Math.min(eye.y, targetGround.y);
  let yMax = Math.max(eye.y, targetTop.y);
  for (const part of ground) {
    for (const p of part) {
      if (p.y < yMin) yMin = p.y;
      if (p.y > yMax) yMax = p.y;
    }
  }
  for (const c of conditions) for (const p of c.sightLine) yMax = Math.max(yMax, p.y);
  // Show the hidden heights at the point too, unless they would squash the ground (then the view clips them).
  const span = Math.max(yMax - yMin, 1);
  for (const c of conditions) {
    const top = targetGround.y + c.hiddenHeightM;
    if (top > yMax && top - yMin <= 1.6 * span) yMax = top;
  }
  const pad = Math.max((yMax - yMin) * 0.08, 5);
  return { distanceM: D, earthRadiusM: R, ground, eye, targetGround, targetTop, conditions, yMin: yMin - pad, yMax: yMax + pad };
}

/** Pixel scales of a chart drawn in a `width × height` box with margins. */
export interface ChartScale {
  sx(d: number): number;
  sy(y: number): number;
  /** Vertical exaggeration: metres per pixel across ÷ metres per pixel up. */
  readonly exaggeration: number;
}

/** Scales the chart into a pixel box (left, top, width, height of the plot area). */
export function chartScale(chart: ProfileChart, box: { left: number; top: number; width: number; height: number }): ChartScale {
  const spanY = Math.max(chart.yMax - chart.yMin, 1e-6);
  const spanD = Math.max(chart.distanceM, 1e-6);
  return {
    sx: (d) => box.left + (d / spanD) * box.width,
    sy: (y) => box.top + ((chart.yMax - y) / spanY) * box.height,
    exaggeration: spanD / box.width / (spanY / box.height),
  };
}

/** A round exaggeration for people: ×1 below 1.5, else two significant figures (×37, ×240, ×1 200). */
export function roundExaggeration(value: number): number {
  if (value < 1.5) return 1;
  return Number(value.toPrecision(2));
}
