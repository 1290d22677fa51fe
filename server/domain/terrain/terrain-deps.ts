import type { FileStore } from '@/server/domain/ports/file-store';
import type { TerrainCache } from '@/server/domain/ports/terrain-cache';
import type { TerrainIngestRunner } from '@/server/domain/ports/terrain-ingest';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';

/** What the terrain use cases need. */
export interface TerrainDeps extends UseCaseDeps {
  files: FileStore;
  ingest: TerrainIngestRunner;
  cache: TerrainCache;
  /** Largest grid accepted, cells. */
  maxCells: number;
  /** Longest edge of the hillshade picture, pixels. */
  hillshadeMaxEdge: number;
}

/** An uploaded terrain on local disk, as the route (or the seeder) received it. */
export interface TerrainUpload {
  file: { path: string; originalName: string; bytes: number };
  prj: { path: string; originalName: string } | null;
  /** EPSG code the uploader gave, for a grid that carries no CRS. */
  epsg: number | null;
  /** A folder of the caller's, removed by the caller afterwards; the ingest writes its outputs here. */
  workDir: string;
}
