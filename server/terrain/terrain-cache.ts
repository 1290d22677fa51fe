import { readFile } from 'node:fs/promises';
import { readGeoTiff } from '@/shared/terrain/formats/geotiff-reader';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import type { FileStore } from '@/server/storage/file-store';
import type { CachedTerrainSource, TerrainCache } from '@/server/domain/ports/terrain-cache';
export type { CachedTerrainSource, TerrainCache } from '@/server/domain/ports/terrain-cache';

/**
 * An LRU cache of terrain rasters keyed by terrain id, bounded by the bytes of
 * their heights (4 per cell). A terrain larger than the bound is still
 * returned, and kept alone until the next load. Terrains are immutable once
 * stored (a replacement gets a new id), so entries never go stale.
 *
 * Meant to be shared by everything on the server that reads terrain: the
 * terrain routes (elevation, profile) and, later, coverage jobs.
 *
 * @param options the file store and the byte budget (e.g. 512 MiB ≈ eight 4000 × 4000 grids)
 * @example
 * const cache = createTerrainCache({ files, maxBytes: 512 * 2 ** 20 });
 * const terrain = await cache.loadTerrain(row);
 */
export function createTerrainCache(options: { files: FileStore; maxBytes: number }): TerrainCache {
  const { files, maxBytes } = options;
  const held = new Map<string, TerrainRaster>(); // insertion order = recency
  const loading = new Map<string, Promise<TerrainRaster>>();
  let bytes = 0;

  const keep = (id: string, terrain: TerrainRaster): void => {
    held.set(id, terrain);
    bytes += terrain.heights.byteLength;
    for (const [oldId, old] of held) {
      if (bytes <= maxBytes || oldId === id) break;
      held.delete(oldId);
      bytes -= old.heights.byteLength;
    }
  };

  const read = async (source: CachedTerrainSource): Promise<TerrainRaster> => {
    const file = await readFile(files.localPath(source.storeKey));
    const buffer =
      file.byteOffset === 0 && file.byteLength === file.buffer.byteLength
        ? (file.buffer as ArrayBuffer)
        : (file.buffer.slice(file.byteOffset, file.byteOffset + file.byteLength) as ArrayBuffer);
    const raster = await readGeoTiff(buffer);
    // The GeoTIFF carries the EPSG code only; the row keeps the WKT too.
    return { ...raster, crs: { epsg: source.epsg, wkt: source.crsWkt } };
  };

  return {
    async loadTerrain(source) {
      const hit = held.get(source.id);
      if (hit) {
        held.delete(source.id);
        held.set(source.id, hit);
        return hit;
      }
      const pending = loading.get(source.id);
      if (pending) return pending;
      const promise = read(source).then(
        (terrain) => {
          loading.delete(source.id);
          keep(source.id, terrain);
          return terrain;
        },
        (error: unknown) => {
          loading.delete(source.id);
          throw error;
        },
      );
      loading.set(source.id, promise);
      return promise;
    },
    stats: () => ({ terrains: held.size, bytes, maxBytes }),
    clear() {
      held.clear();
      bytes = 0;
    },
  };
}
