import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import type { TerrainCrs } from '@/shared/terrain/grid-spec';

/** Settings of {@link generateSyntheticTerrain}. */
export interface SyntheticTerrainOptions {
  /** Columns; default 600. */
  readonly width?: number;
  /** Rows; default 600. */
  readonly height?: number;
  /** Cell size, metres; default 25. */
  readonly cellSize?: number;
  /** Easting of the lower-left corner, metres; default 512 000. */
  readonly xll?: number;
  /** Northing of the lower-left corner, metres; default 5 731 000. */
  readonly yll?: number;
  /** Seed of the pseudo-random generator (any 32-bit integer); default 1. */
  readonly seed?: number;
  /** CRS to stamp on the result; default EPSG:32633 (WGS 84 / UTM zone 33N). */
  readonly crs?: TerrainCrs | null;
  /** Elevation of the lowest ground, metres; default 280. */
  readonly baseElevation?: number;
  /** Overall relief scale, metres; default 420. */
  readonly relief?: number;
}

const TAU = 2 * Math.PI;

/**
 * Generates an invented, seeded, synthetic forest-district terrain: rolling
 * ground with a few long ridges, two winding valleys cut into it and a few
 * rounded hills. The same options always give the same heights, bit for bit,
 * on every platform (only integer hashing and IEEE double arithmetic).
 * Feature sizes are in metres, so a larger grid at the same cell size covers
 * a larger district rather than stretching it.
 *
 * Ingredients: lattice value noise summed over octaves (fractional Brownian
 * motion), "ridged" noise 1 − |2n − 1| for crest lines, Gaussian hills, and
 * valleys carved along sine-perturbed lines. Source: the value-noise and
 * fBm constructions of procedural terrain synthesis (common practice in
 * computer graphics, no single source); the integer hash is a
 * multiply-xorshift mix in the style of MurmurHash3's finaliser (public
 * domain).
 *
 * @param options sizes in cells, cell size and origin in metres, seed; see
 *   {@link SyntheticTerrainOptions} for defaults
 * @returns a new terrain raster, heights in metres, row 0 = north
 * @throws TerrainInputError `invalid-option` for non-positive sizes
 * @example
 * const terrain = generateSyntheticTerrain({ width: 200, height: 200, seed: 7 });
 * terrain.heights.length; // 40 000
 */
export function generateSyntheticTerrain(options: SyntheticTerrainOptions = {}): TerrainRaster {
  const width = options.width ?? 600;
  const height = options.height ?? 600;
  const cellSize = options.cellSize ?? 25;
  const seed = (options.seed ?? 1) | 0;
  const base = options.baseElevation ?? 280;
  const relief = options.relief ?? 420;
  if (!Number.isInteger(width) || width < 1 || !Number.isInteger(height) || height < 1 || !(cellSize > 0)) {
    throw new TerrainInputError(
      'invalid-option',
      `Synthetic terrain needs positive integer sizes and a positive cell size, got ${width} × ${height} at ${cellSize} m.`,
    );
  }

  const rand = mulberry32(seed ^ 0x5bd1e995);
  // Ridges: long crest lines at random orientations.
  const ridges = Array.from({ length: 4 }, () => {
    const angle = rand() * Math.PI;
    return {
      cos: Math.cos(angle),
      sin: Math.sin(angle),
      offset: rand() * 1000,
      wavelength: 5000 + rand() * 5000,
      amplitude: 0.5 + rand() * 0.5,
    };
  });
  // Hills: a few rounded summits, placed within the first 15 km square and repeated.
  const hills = Array.from({ length: 6 }, () => ({
    x: rand() * 15000,
    y: rand() * 15000,
    radius: 600 + rand() * 1200,
    amplitude: 0.3 + rand() * 0.6,
  }));
  // Valleys: winding lines with depth.
  const valleys = Array.from({ length: 2 }, () => {
    const angle = rand() * Math.PI;
    return {
      cos: Math.cos(angle),
      sin: Math.sin(angle),
      offset: (rand() - 0.5) * 8000,
      meanderAmp: 400 + rand() * 800,
      meanderLen: 3000 + rand() * 4000,
      phase: rand() * TAU,
      halfWidth: 350 + rand() * 300,
      depth: 0.45 + rand() * 0.25,
    };
  });
  const period = 15000;
  const valleySpacing = 7000;

  const heights = new Float32Array(width * height);
  for (let row = 0; row < height; row++) {
    const y = (height - row - 0.5) * cellSize;
    for (let col = 0; col < width; col++) {
      const x = (col + 0.5) * cellSize;
      // Rolling ground.
      let z = 0.45 * fbm(x / 5000, y / 5000, seed, 5);
      // Ridges: crest lines bent by a slow warp field, their height modulated
      // along the crest by one shared noise field.
      const modulation = 0.4 + 0.6 * valueNoise(x / 9000 + 13.1, y / 9000 - 7.7, seed + 17);
      const warp = fbm(x / 6000 + 3.3, y / 6000 + 5.1, seed + 29, 3);
      for (const r of ridges) {
        const u = (x * r.cos + y * r.sin + r.offset) / r.wavelength + 0.9 * warp;
        const phase = u - Math.floor(u);
        const crest = 1 - Math.abs(2 * phase - 1);
        z += 0.3 * r.amplitude * crest * crest * crest * modulation;
      }
      // Hills, repeated every `period` metres.
      const hx = x % period;
      const hy = y % period;
      for (const hl of hills) {
        const dx = wrapDelta(hx - hl.x, period);
        const dy = wrapDelta(hy - hl.y, period);
        z += hl.amplitude * Math.exp(-(dx * dx + dy * dy) / (2 * hl.radius * hl.radius));
      }
      // Valleys, repeated every `valleySpacing` metres across their direction.
      for (const v of valleys) {
        const along = x * v.cos + y * v.sin;
        const across = -x * v.sin + y * v.cos - v.offset;
        const centred = across - v.meanderAmp * Math.sin((TAU * along) / v.meanderLen + v.phase);
        const d = centred - valleySpacing * Math.round(centred / valleySpacing);
        z -= v.depth * Math.exp(-(d * d) / (2 * v.halfWidth * v.halfWidth));
      }
      // Fine roughness (tens of metres).
      z += 0.03 * fbm(x / 400, y / 400, seed + 101, 3);
      heights[row * width + col] = base + relief * (z + 0.5);
    }
  }
  return {
    heights,
    width,
    height,
    cellSize,
    xll: options.xll ?? 512_000,
    yll: options.yll ?? 5_731_000,
    nodata: null,
    crs: options.crs === undefined ? { epsg: 32633, wkt: null } : options.crs,
  };
}

function wrapDelta(d: number, period: number): number {
  if (d > period / 2) return d - period;
  if (d < -period / 2) return d + period;
  return d;
}

function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Deterministic lattice value in [0, 1). */
function lattice(ix: number, iy: number, seed: number): number {
  let h = Math.imul(ix | 0, 0x27d4eb2d) ^ Math.imul(iy | 0, 0x165667b1) ^ Math.imul(seed, 0x9e3779b1);
  h = Math.imul(h ^ (h >>> 16), 0x85ebca6b);
  h = Math.imul(h ^ (h >>> 13), 0xc2b2ae35);
  h ^= h >>> 16;
  return (h >>> 0) / 4294967296;
}

function valueNoise(x: number, y: number, seed: number): number {
  const ix = Math.floor(x);
  const iy = Math.floor(y);
  const fx = x - ix;
  const fy = y - iy;
  const ux = fx * fx * fx * (fx * (fx * 6 - 15) + 10);
  const uy = fy * fy * fy * (fy * (fy * 6 - 15) + 10);
  const a = lattice(ix, iy, seed);
  const b = lattice(ix + 1, iy, seed);
  const c = lattice(ix, iy + 1, seed);
  const d = lattice(ix + 1, iy + 1, seed);
  return a + (b - a) * ux + (c - a) * uy + (a - b - c + d) * ux * uy;
}

/** Sum of octaves, roughly in [-0.5, 0.5]. */
function fbm(x: number, y: number, seed: number, octaves: number): number {
  let sum = 0;
  let amp = 0.5;
  let freq = 1;
  let norm = 0;
  for (let o = 0; o < octaves; o++) {
    sum += amp * (valueNoise(x * freq, y * freq, seed + o * 1013) - 0.5);
    norm += amp;
    amp *= 0.5;
    freq *= 2.03;
  }
  return sum / norm;
}
