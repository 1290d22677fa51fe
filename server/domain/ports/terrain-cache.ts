/* Port: terrain reads for the use cases (an LRU over the file store in server/terrain/terrain-cache). */

import type { TerrainRaster } from '@/shared/terrain/terrain-raster';

/** The fields of a stored terrain the cache needs (a `site_terrains` row as the repository returns it). */
export interface CachedTerrainSource {
  readonly id: string;
  readonly storeKey: string;
  readonly epsg: number | null;
  readonly crsWkt: string | null;
}

/** Terrains held in memory, least recently used first out. */
export interface TerrainCache {
  /**
   * The terrain of a stored row: from memory when held, otherwise read from
   * the file store (the normalised Float32 GeoTIFF, the reader's fast path) and
   * kept. Concurrent loads of one terrain share one read. The raster is shared:
   * treat it as immutable, as the whole terrain core does.
   */
  loadTerrain(source: CachedTerrainSource): Promise<TerrainRaster>;
  /** Terrains held and their bytes. */
  stats(): { terrains: number; bytes: number; maxBytes: number };
  /** Drops everything. */
  clear(): void;
}
