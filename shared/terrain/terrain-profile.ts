// Over 300 lines: one exact profile on the bilinear surface; the grid-crossing walk and the horizon maxima share state.
import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { bilinearSample } from '@/shared/terrain/bilinear-sample';

/** Default largest number of samples a profile returns. */
export const DEFAULT_PROFILE_MAX_SAMPLES = 2001;

/** What a terrain profile is asked for. Positions are in the terrain's CRS (metres). */
export interface TerrainProfileInput {
  /** The eye: position, and height of the eye above the ground there, metres (tower, cab and eye). */
  readonly observer: { readonly x: number; readonly y: number; readonly eyeHeight: number };
  /** The target: position of its foot, and its height above the ground there, metres. */
  readonly target: { readonly x: number; readonly y: number; readonly height: number };
  /** Refraction conditions: k (dimensionless) and optionally R, metres (default 6 371 008.8). */
  readonly conditions: readonly { readonly refractionCoefficient: number; readonly earthRadius?: number }[];
  /** Largest number of samples returned, ≥ 2; default 2001. */
  readonly maxSamples?: number;
}

/** A point of the ground along the profile. */
export interface ProfilePoint {
  /** Horizontal distance from the observer, metres. */
  readonly distance: number;
  /** Ground elevation there, metres above the datum. */
  readonly ground: number;
  /** The same, lowered by the curvature drop of this condition, metres. */
  readonly lowered: number;
}

/** The profile under one refraction condition. */
export interface ProfileCondition {
  readonly refractionCoefficient: number;
  readonly earthRadius: number;
  /** Ground at each sample lowered by (1 − k)·d²/(2R), metres; NaN where the ground has no data. */
  readonly loweredGround: Float64Array;
  /** Top of the target in the lowered frame, metres (the straight sight line runs from the eye to here). */
  readonly targetTopLowered: number;
  /** Height above the target's ground its top must reach to be seen, metres; 0 when the ground there is seen. */
  readonly hiddenHeight: number;
  /** The ground that sets the eye's horizon toward the target (highest elevation angle); null when nothing hides the target's foot. */
  readonly horizon: ProfilePoint | null;
  /** The first ground that rises above the sight line to the target's top; null when the top is seen. */
  readonly firstObstruction: ProfilePoint | null;
  /** Whether the ground at the target is seen. */
  readonly groundSeen: boolean;
  /** Whether the target's top is seen (hidden height ≤ target height). */
  readonly targetTopSeen: boolean;
}

/** A terrain profile between an observer and a target. */
export interface TerrainProfile {
  /** Horizontal distance observer → target, metres (grid metres of the terrain's CRS). */
  readonly distance: number;
  /** Distance between samples, metres (the last step may be shorter). */
  readonly spacing: number;
  /** Ground under the observer, metres. */
  readonly observerGround: number;
  /** Eye elevation, metres (observer ground + eye height). */
  readonly eyeElevation: number;
  /** Ground under the target, metres. */
  readonly targetGround: number;
  /** Sample distances from the observer, metres (first 0, last `distance`). */
  readonly sampleDistances: Float64Array;
  /** Ground elevation at each sample, metres; NaN where the ground has no data. */
  readonly sampleGround: Float64Array;
  /** One entry per condition, in order. */
  readonly conditions: ProfileCondition[];
}

/** Hidden heights below this are reported as 0 (rounding noise of the arithmetic), metres. */
const ZERO = 1e-6;

/**
 * The terrain profile between an observer and a target, with what each
 * refraction condition hides.
 *
 * Terrain model — the same as the viewshed engine's: heights stand for cell
 * centres, the surface between them is bilinear (flat beyond the outermost
 * centres), and curvature with refraction lowers the ground at distance d by
 * (1 − k)·d²/(2R), after which sight lines are straight. Nodata ground does
 * not block.
 *
 * Exact on that model: along the line, between two crossings of the grid's
 * centre lines the surface is a quadratic q(t) of the fraction t of the way
 * to the target. The hidden height at the target is
 *
 *   max(0, max over 0 < t < 1 of  E + (q(t) − E)/t − q(1))
 *
 * (E the eye), and on each stretch (q(t) − E)/t peaks at its ends or where
 * t² = (q₀ − E)/q₂, so the maximum is found in closed form, not by sampling.
 * The first obstruction is the first root of q(t) − L(t) with L the straight
 * line from the eye to the target's top. Samples for drawing are taken every
 * half cell (fewer, evenly spaced, on long lines so at most `maxSamples`).
 *
 * Source: curvature-and-refraction correction (1 − k)·d²/(2R) of
 * trigonometric levelling (see `curvature-drop.ts`); line of sight over a
 * bilinear grid surface (common practice, no source). With k ≥ 1 the same
 * formula bends the ground upwards (ducting; no effective radius exists).
 *
 * Distances are grid distances of the projected CRS (within the UTM scale
 * factor, 0.9996 … 1.0010, of ground distances).
 *
 * @param terrain ground heights, metres (not modified)
 * @param input observer and target positions (metres, terrain CRS) and
 *   heights above ground (metres), refraction conditions, sample limit
 * @returns the profile
 * @throws TerrainInputError `point-outside-raster` (observer or target
 *   outside the grid), `point-on-nodata` (no ground under either),
 *   `invalid-option` (same point, negative heights, bad sample limit, no
 *   condition), `invalid-condition` (non-finite k, non-positive R)
 * @example
 * const profile = terrainProfile(terrain, {
 *   observer: { x: 516200, y: 5741300, eyeHeight: 23.6 },
 *   target: { x: 521000, y: 5736000, height: 30 },
 *   conditions: [{ refractionCoefficient: 0.13 }],
 * });
 * profile.conditions[0].hiddenHeight; // metres a smoke column there must rise to be seen
 */
export function terrainProfile(terrain: TerrainRaster, input: TerrainProfileInput): TerrainProfile {
  const { width: W, height: H, cellSize, xll, yll, heights } = terrain;
  const { observer, target, conditions } = input;
  const maxSamples = input.maxSamples ?? DEFAULT_PROFILE_MAX_SAMPLES;
  if (!Number.isInteger(maxSamples) || maxSamples < 2) {
    throw new TerrainInputError('invalid-option', `The sample limit must be a whole number ≥ 2, got ${maxSamples}.`);
  }
  if (!(observer.eyeHeight >= 0) || !Number.isFinite(observer.eyeHeight)) {
    throw new TerrainInputError('invalid-option', `Eye height must be ≥ 0 m, got ${observer.eyeHeight}.`);
  }
  if (!(target.height >= 0) || !Number.isFinite(target.height)) {
    throw new TerrainInputError('invalid-option', `Target height must be ≥ 0 m, got ${target.height}.`);
  }
  if (conditions.length === 0) throw new TerrainInputError('invalid-option', 'Give at least one refraction condition.');
  for (const c of conditions) {
    if (!Number.isFinite(c.refractionCoefficient)) {
      throw new TerrainInputError('invalid-condition', `Refraction coefficient must be finite, got ${c.refractionCoefficient}.`);
    }
    const R = c.earthRadius ?? MEAN_EARTH_RADIUS_M;
    if (!(R > 0) || !Number.isFinite(R)) {
      throw new TerrainInputError('invalid-condition', `Earth radius must be a positive number of metres, got ${R}.`);
    }
  }

  const yTop = yll + H * cellSize;
  const gridPosition = (x: number, y: number, what: string): [number, number] => {
    if (!(x >= xll && x <= xll + W * cellSize && y >= yll && y <= yTop)) {
      throw new TerrainInputError(
        'point-outside-raster',
        `The ${what} (${x.toFixed(1)}, ${y.toFixed(1)}) is outside the terrain, which spans x ${xll} … ${xll + W * cellSize} and y ${yll} … ${yTop}.`,
      );
    }
    return [(x - xll) / cellSize - 0.5, (yTop - y) / cellSize - 0.5];
  };
  const [u0, v0] = gridPosition(observer.x, observer.y, 'observer');
  const [u1, v1] = gridPosition(target.x, target.y, 'target');
  const du = u1 - u0;
  const dv = v1 - v0;
  const D = Math.hypot(du, dv) * cellSize;
  if (!(D > 0)) throw new TerrainInputError('invalid-option', 'The target is at the observer: give two different points.');

  const marker = terrain.nodata;
  const isNodata = (v: number): boolean => v !== v || v === marker;
  const clampU = (u: number): number => (u < 0 ? 0 : u > W - 1 ? W - 1 : u);
  const clampV = (v: number): number => (v < 0 ? 0 : v > H - 1 ? H - 1 : v);
  /** Bilinear surface at grid position (u, v); NaN when a node it uses is nodata. */
  const surface = (u: number, v: number): number => bilinearSample(heights, W, H, marker, u, v);

  const observerGround = surface(u0, v0);
  if (Number.isNaN(observerGround)) {
    throw new TerrainInputError('point-on-nodata', 'The terrain has no ground height under the observer.');
  }
  const targetGround = surface(u1, v1);
  if (Number.isNaN(targetGround)) {
    throw new TerrainInputError('point-on-nodata', 'The terrain has no ground height under the target.');
  }
  const eye = observerGround + observer.eyeHeight;

  // Stretches between crossings of the centre lines (integer u or v).
  const breaks: number[] = [0, 1];
  const addCrossings = (a: number, d: number): void => {
    if (d === 0) return;
    const lo = Math.min(a, a + d);
    const hi = Math.max(a, a + d);
    for (let m = Math.floor(lo) + 1; m < hi; m++) breaks.push((m - a) / d);
  };
  addCrossings(u0, du);
  addCrossings(v0, dv);
  breaks.sort((a, b) => a - b);

  // Raw surface along each stretch as z(t) = p0 + p1·t + p2·t² (global t).
  const pieces: { ta: number; tb: number; p0: number; p1: number; p2: number }[] = [];
  for (let i = 0; i + 1 < breaks.length; i++) {
    const ta = breaks[i] as number;
    const tb = breaks[i + 1] as number;
    if (!(tb - ta > 1e-12)) continue;
    const tm = (ta + tb) / 2;
    const um = u0 + tm * du;
    const vm = v0 + tm * dv;
    const c = Math.min(Math.floor(clampU(um)), Math.max(0, W - 2));
    const r = Math.min(Math.floor(clampV(vm)), Math.max(0, H - 2));
    const c1 = Math.min(c + 1, W - 1);
    const r1 = Math.min(r + 1, H - 1);
    const z00 = heights[r * W + c] as number;
    const z10 = heights[r * W + c1] as number;
    const z01 = heights[r1 * W + c] as number;
    const z11 = heights[r1 * W + c1] as number;
    if (isNodata(z00) || isNodata(z10) || isNodata(z01) || isNodata(z11)) continue; // nodata does not block
    // fx = px + qx·t (or constant where the line runs outside the outermost centres).
    const inU = um >= 0 && um <= W - 1;
    const inV = vm >= 0 && vm <= H - 1;
    const px = inU ? u0 - c : clampU(um) - c;
    const qx = inU ? du : 0;
    const py = inV ? v0 - r : clampV(vm) - r;
    const qy = inV ? dv : 0;
    const B = z10 - z00;
    const C = z01 - z00;
    const E4 = z00 - z10 - z01 + z11;
    pieces.push({
      ta,
      tb,
      p0: z00 + B * px + C * py + E4 * px * py,
      p1: B * qx + C * qy + E4 * (px * qy + py * qx),
      p2: E4 * qx * qy,
    });
  }

  // Samples for drawing.
  const spacing = Math.max(cellSize / 2, D / (maxSamples - 1));
  const steps = Math.min(maxSamples - 1, Math.ceil(D / spacing - 1e-9));
  const sampleDistances = new Float64Array(steps + 1);
  const sampleGround = new Float64Array(steps + 1);
  for (let s = 0; s <= steps; s++) {
    const d = s === steps ? D : s * spacing;
    const t = d / D;
    sampleDistances[s] = d;
    sampleGround[s] = surface(u0 + t * du, v0 + t * dv);
  }

  const results: ProfileCondition[] = conditions.map((condition) => {
    const k = condition.refractionCoefficient;
    const R = condition.earthRadius ?? MEAN_EARTH_RADIUS_M;
    const a = (1 - k) / (2 * R); // drop per squared metre
    const dropAt = (t: number): number => a * D * D * t * t;
    const targetLowered = targetGround - dropAt(1);
    const targetTop = targetLowered + target.height;

    // Hidden height: maximise f(t) = (q(t) − E)/t over every stretch.
    let best = -Infinity;
    let bestT = -1;
    const consider = (t: number, value: number): void => {
      if (value > best) {
        best = value;
        bestT = t;
      }
    };
    for (const p of pieces) {
      const q0 = p.p0;
      const q1 = p.p1;
      const q2 = p.p2 - a * D * D;
      const at = (t: number): number => (q0 + t * (q1 + t * q2) - eye) / t;
      if (p.ta > 0) consider(p.ta, at(p.ta));
      else if (Math.abs(q0 - eye) < 1e-9) consider(0, q1); // eye on the ground: the limit t → 0 is the slope
      if (p.tb < 1) consider(p.tb, at(p.tb));
      const ratio = (q0 - eye) / q2;
      if (q2 !== 0 && ratio > 0) {
        const ts = Math.sqrt(ratio);
        if (ts > p.ta && ts < p.tb && ts < 1) consider(ts, at(ts));
      }
    }
    let hidden = best === -Infinity ? 0 : eye + best - targetLowered;
    if (!(hidden > ZERO)) hidden = 0;
    const point = (t: number): ProfilePoint => {
      const ground = surface(u0 + t * du, v0 + t * dv);
      return { distance: t * D, ground, lowered: ground - dropAt(t) };
    };
    const horizon = hidden > 0 && bestT >= 0 ? point(bestT) : null;
    const targetTopSeen = hidden <= target.height + ZERO;

    // First obstruction: first t where q(t) rises above L(t) = E + t·(top − E).
    let firstObstruction: ProfilePoint | null = null;
    if (!targetTopSeen) {
      const slope = targetTop - eye;
      for (const p of pieces) {
        const g0 = p.p0 - eye;
        const g1 = p.p1 - slope;
        const g2 = p.p2 - a * D * D;
        const g = (t: number): number => g0 + t * (g1 + t * g2);
        const lo = Math.max(p.ta, 1e-12);
        const hi = Math.min(p.tb, 1 - 1e-12);
        if (!(hi > lo)) continue;
        let found: number | null = g(lo) > ZERO ? lo : null;
        if (found === null) {
          // Roots of g2·t² + g1·t + g0, in the form that avoids cancellation when g2 is tiny.
          const roots: number[] = [];
          const disc = g1 * g1 - 4 * g2 * g0;
          if (disc >= 0) {
            const q = -0.5 * (g1 + (g1 >= 0 ? 1 : -1) * Math.sqrt(disc));
            if (q !== 0) roots.push(g0 / q);
            if (g2 !== 0) roots.push(q / g2);
          }
          roots.sort((x, y) => x - y);
          for (const root of roots) {
            if (root >= lo && root < hi && g(Math.min(hi, root + Math.max(1e-9, (hi - root) / 2))) > 0) {
              found = root;
              break;
            }
          }
        }
        if (found !== null) {
          firstObstruction = point(found);
          break;
        }
      }
      firstObstruction ??= horizon;
    }

    const loweredGround = new Float64Array(sampleDistances.length);
    for (let s = 0; s < loweredGround.length; s++) {
      const d = sampleDistances[s] as number;
      loweredGround[s] = (sampleGround[s] as number) - a * d * d;
    }
    return {
      refractionCoefficient: k,
      earthRadius: R,
      loweredGround,
      targetTopLowered: targetTop,
      hiddenHeight: hidden,
      horizon,
      firstObstruction,
      groundSeen: hidden === 0,
      targetTopSeen,
    };
  });

  return {
    distance: D,
    spacing,
    observerGround,
    eyeElevation: eye,
    targetGround,
    sampleDistances,
    sampleGround,
    conditions: results,
  };
}
