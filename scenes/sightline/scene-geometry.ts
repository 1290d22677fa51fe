/**
 * Pure data → geometry for the 3D sightline scene. Scene units: 1 = 1 km
 * horizontally; heights are multiplied by `exaggeration` so metres-high
 * targets show over tens of kilometres.
 */
export interface SceneScale {
  /** Horizontal extent shown, metres. */
  xMaxM: number;
  /** Vertical exaggeration factor (dimensionless). */
  exaggeration: number;
  /** Earth radius, metres. */
  earthRadiusM: number;
}

const KM = 1000;

/** Height of the true surface below the observer's tangent plane, scene units. */
export function surfaceY(xM: number, zM: number, s: SceneScale): number {
  const r2 = xM * xM + zM * zM;
  return (-(r2 / (2 * s.earthRadiusM)) * s.exaggeration) / KM;
}

/** Vertex positions (x, y, z triples) of a square surface patch centred on the sightline, `n` × `n` cells. */
export function surfacePatch(s: SceneScale, n = 48): Float32Array {
  const half = s.xMaxM * 0.35;
  const out = new Float32Array((n + 1) * (n + 1) * 3);
  let o = 0;
  for (let j = 0; j <= n; j++) {
    const zM = -half + (2 * half * j) / n;
    for (let i = 0; i <= n; i++) {
      const xM = (s.xMaxM * i) / n;
      out[o++] = xM / KM;
      out[o++] = surfaceY(xM, zM, s);
      out[o++] = zM / KM;
    }
  }
  return out;
}

/** Triangle indices for {@link surfacePatch}. */
export function patchIndices(n = 48): Uint32Array {
  const out = new Uint32Array(n * n * 6);
  let o = 0;
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < n; i++) {
      const a = j * (n + 1) + i;
      const b = a + 1;
      const c = a + (n + 1);
      const d = c + 1;
      out[o++] = a;
      out[o++] = c;
      out[o++] = b;
      out[o++] = b;
      out[o++] = c;
      out[o++] = d;
    }
  }
  return out;
}

/**
 * Points of the horizon-grazing sightline for one condition: height above the
 * surface (x − d_h)² / 2R′, laid on the falling true surface. Null under ducting.
 */
export function rayPoints(horizonM: number | null, effectiveRadiusM: number | null, s: SceneScale, n = 64): Float32Array | null {
  if (horizonM === null || effectiveRadiusM === null) return null;
  const out = new Float32Array((n + 1) * 3);
  for (let i = 0; i <= n; i++) {
    const xM = (s.xMaxM * i) / n;
    const above = ((xM - horizonM) * (xM - horizonM)) / (2 * effectiveRadiusM);
    out[i * 3] = xM / KM;
    out[i * 3 + 1] = surfaceY(xM, 0, s) + (above * s.exaggeration) / KM;
    out[i * 3 + 2] = 0;
  }
  return out;
}
