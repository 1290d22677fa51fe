import { TERRAIN_MESH_ENCODING, type TerrainMeshResponse } from '@/shared/schemas/terrain';
import { decimateTerrain } from '@/shared/terrain/decimate-terrain';
import { gridSpecToM } from '@/shared/terrain/grid-spec';
import type { Actor } from '@/server/domain/actor';
import { activeTerrain } from './active-terrain';
import type { TerrainDeps } from './terrain-deps';

/**
 * Meshes recently made, by terrain id and edge. Process-wide on purpose: a stored terrain never
 * changes (a new upload is a new id), so an entry can never be stale; at most eight are kept.
 */
const meshes = new Map<string, TerrainMeshResponse>();
const MESHES_KEPT = 8;

/**
 * The site's active terrain decimated to at most `maxEdge` cells a side
 * (block means of the cells with data), as little-endian Float32 heights in
 * base64, for a 3D view.
 */
export async function terrainMesh(
  deps: Pick<TerrainDeps, 'cache'>,
  actor: Actor,
  siteId: string,
  maxEdge: number,
): Promise<TerrainMeshResponse> {
  const { terrain: record } = await activeTerrain(actor, siteId);
  const key = `${record.id}:${maxEdge}`;
  const known = meshes.get(key);
  if (known) return known;
  const terrain = await deps.cache.loadTerrain(record);
  const mesh = decimateTerrain(terrain, maxEdge);
  let min = Infinity;
  let max = -Infinity;
  for (const v of mesh.heights) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const bytes = Buffer.from(mesh.heights.buffer, mesh.heights.byteOffset, mesh.heights.byteLength);
  const response: TerrainMeshResponse = {
    terrainId: record.id,
    ...gridSpecToM(mesh),
    factor: mesh.factor,
    minElevationM: Number.isFinite(min) ? min : record.minElevationM,
    maxElevationM: Number.isFinite(max) ? max : record.maxElevationM,
    encoding: TERRAIN_MESH_ENCODING,
    // Float32Array is little-endian on every platform Node runs on; say so explicitly if that ever changes.
    heights: bytes.toString('base64'),
  };
  meshes.set(key, response);
  if (meshes.size > MESHES_KEPT) meshes.delete(meshes.keys().next().value as string);
  return response;
}
