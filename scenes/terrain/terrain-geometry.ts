import type { GridSpecM } from '@/shared/terrain/grid-spec';

/**
 * Pure data → geometry for the 3D terrain scene. Scene units: 1 = 1 km; x
 * east, y up, z south (three.js looks down −z, so north is "away"); origin at
 * the middle of the mesh grid at its lowest ground. Heights are multiplied by
 * `exaggeration`. The mesh is the terrain decimated by the API (block means,
 * row 0 = north, vertex = cell centre).
 */

/** The decimated terrain the scene is built from (metres, grid CRS). */
export interface MeshGrid extends GridSpecM {
  readonly minElevationM: number;
  readonly maxElevationM: number;
  /** width × height heights, metres, row 0 = north; NaN = nodata. */
  readonly heights: Float32Array;
}

/** Where grid metres land in the scene. */
export interface SceneFrame {
  /** Grid point at the scene's origin, metres. */
  readonly originX: number;
  readonly originY: number;
  /** Elevation at scene height 0, metres. */
  readonly baseElevationM: number;
  /** Vertical exaggeration (dimensionless). */
  readonly exaggeration: number;
  /** Half the grid's width and depth, scene units. */
  readonly halfWidth: number;
  readonly halfDepth: number;
}

const KM = 1000;

/** The scene frame of a mesh: centred on it, ground at its lowest point. */
export function sceneFrame(mesh: MeshGrid, exaggeration: number): SceneFrame {
  const w = mesh.width * mesh.cellSizeM;
  const h = mesh.height * mesh.cellSizeM;
  return {
    originX: mesh.xllM + w / 2,
    originY: mesh.yllM + h / 2,
    baseElevationM: Number.isFinite(mesh.minElevationM) ? mesh.minElevationM : 0,
    exaggeration,
    halfWidth: w / 2 / KM,
    halfDepth: h / 2 / KM,
  };
}

/** A grid point and elevation (metres) in scene units [x, y, z]. */
export function toScene(frame: SceneFrame, x: number, y: number, elevationM: number): [number, number, number] {
  return [(x - frame.originX) / KM, ((elevationM - frame.baseElevationM) * frame.exaggeration) / KM, -(y - frame.originY) / KM];
}

/** Vertices, texture coordinates and triangles of the terrain surface. */
export interface SurfaceGeometry {
  /** x, y, z per vertex (one vertex per mesh cell, row-major, row 0 = north). */
  readonly positions: Float32Array;
  /** u, v per vertex over `textureBounds` (u east, v north; v = 0 at the south edge, as three.js textures are flipped). */
  readonly uvs: Float32Array;
  /** Triangle corners; cells next to nodata are left out. */
  readonly indices: Uint32Array;
}

/**
 * The surface of a mesh grid: a vertex at each cell centre, two triangles per
 * square of four neighbouring vertices with data (counter-clockwise seen from
 * above, so normals point up), texture coordinates over `textureBounds` (the
 * hillshade's grid rectangle).
 */
export function terrainSurface(
  mesh: MeshGrid,
  frame: SceneFrame,
  textureBounds: { west: number; south: number; east: number; north: number },
): SurfaceGeometry {
  const { width: W, height: H, cellSizeM: cs, heights } = mesh;
  const positions = new Float32Array(W * H * 3);
  const uvs = new Float32Array(W * H * 2);
  const north = mesh.yllM + H * cs;
  const tw = textureBounds.east - textureBounds.west;
  const th = textureBounds.north - textureBounds.south;
  for (let r = 0; r < H; r++) {
    const y = north - (r + 0.5) * cs;
    for (let c = 0; c < W; c++) {
      const i = r * W + c;
      const x = mesh.xllM + (c + 0.5) * cs;
      const h = heights[i] as number;
      const [sx, sy, sz] = toScene(frame, x, y, h === h ? h : frame.baseElevationM);
      positions[i * 3] = sx;
      positions[i * 3 + 1] = sy;
      positions[i * 3 + 2] = sz;
      uvs[i * 2] = (x - textureBounds.west) / tw;
      uvs[i * 2 + 1] = (y - textureBounds.south) / th;
    }
  }
  const out: number[] = [];
  const ok = (i: number) => {
    const v = heights[i] as number;
    return v === v;
  };
  for (let r = 0; r + 1 < H; r++) {
    for (let c = 0; c + 1 < W; c++) {
      const a = r * W + c; // north-west
      const b = a + 1; // north-east
      const d = a + W; // south-west
      const e = d + 1; // south-east
      if (!(ok(a) && ok(b) && ok(d) && ok(e))) continue;
      // Seen from above (+y), with x east and z south, a → d → b turns counter-clockwise.
      out.push(a, d, b, b, d, e);
    }
  }
  return { positions, uvs, indices: Uint32Array.from(out) };
}

/** Ground of the mesh at a grid point (bilinear between cell centres, clamped at the edges), or null without data. */
export function meshElevationAt(mesh: MeshGrid, x: number, y: number): number | null {
  const { width: W, height: H, cellSizeM: cs, heights } = mesh;
  const fc = Math.min(Math.max((x - mesh.xllM) / cs - 0.5, 0), W - 1);
  const fr = Math.min(Math.max((mesh.yllM + H * cs - y) / cs - 0.5, 0), H - 1);
  if (!Number.isFinite(fc) || !Number.isFinite(fr)) return null;
  const c0 = Math.floor(fc);
  const r0 = Math.floor(fr);
  const c1 = Math.min(c0 + 1, W - 1);
  const r1 = Math.min(r0 + 1, H - 1);
  const tc = fc - c0;
  const tr = fr - r0;
  const v = (r: number, c: number) => heights[r * W + c] as number;
  const value = (v(r0, c0) * (1 - tc) + v(r0, c1) * tc) * (1 - tr) + (v(r1, c0) * (1 - tc) + v(r1, c1) * tc) * tr;
  return Number.isNaN(value) ? null : value;
}

/** A default exaggeration that makes the relief about a tenth of the grid's width, between ×1 and ×5. */
export function defaultExaggeration(mesh: MeshGrid): number {
  const relief = Math.max(mesh.maxElevationM - mesh.minElevationM, 1);
  const widthM = Math.max(mesh.width, mesh.height) * mesh.cellSizeM;
  return Math.min(Math.max(Math.round((widthM * 0.1) / relief), 1), 5);
}
