/* Port: what the terrain upload use case needs of the ingest (a worker thread in server/workers/terrain-ingest-runner, reading with server/terrain/ingest-terrain-file). */

import type { TerrainFormat } from '@/shared/schemas/terrain';
import type { GridSpec } from '@/shared/terrain/grid-spec';

/** What to ingest: the uploaded file(s) on local disk and the uploader's settings. */
export interface TerrainIngestRequest {
  /** The grid file (.tif, .tiff or .asc). */
  readonly filePath: string;
  readonly format: TerrainFormat;
  /** The .prj beside an ASCII grid, or null. */
  readonly prjPath: string | null;
  /** EPSG code given by the uploader for a grid without a CRS, or null. */
  readonly epsg: number | null;
  /** Largest grid accepted, cells. */
  readonly maxCells: number;
  /** Longest edge of the hillshade picture, pixels. */
  readonly hillshadeMaxEdge: number;
  /** The site's boundary as [lon, lat] pairs, or null. */
  readonly boundary: readonly (readonly [number, number])[] | null;
  /** Folder the normalised grid and the picture are written to. */
  readonly outDir: string;
}

/** What the ingest produced: the grid (its CRS as `epsg`, `wkt` and `crsLabel`), its extremes and its files. */
export interface TerrainIngestResult extends Omit<GridSpec, 'crs'> {
  readonly epsg: number | null;
  readonly wkt: string | null;
  readonly crsLabel: string;
  readonly nodataValue: number | null;
  readonly nodataCells: number;
  readonly minElevation: number;
  readonly maxElevation: number;
  readonly coversBoundary: boolean | null;
  readonly corners: Record<'northWest' | 'northEast' | 'southEast' | 'southWest', { latDeg: number; lonDeg: number }>;
  /** Normalised Float32 GeoTIFF (nodata = NaN). */
  readonly gridPath: string;
  /** Hillshade PNG (grey + alpha). */
  readonly hillshadePath: string;
  readonly hillshadeWidth: number;
  readonly hillshadeHeight: number;
  /** Milliseconds spent reading, shading and writing. */
  readonly timings: { readonly readMs: number; readonly hillshadeMs: number; readonly writeMs: number };
}

/** Reasons an upload cannot become a terrain. */
export type TerrainIngestErrorCode =
  | 'wrong-type'
  | 'corrupt'
  | 'truncated'
  | 'unsupported'
  | 'oversize'
  | 'in-degrees'
  | 'crs-missing'
  | 'crs-unsupported'
  | 'crs-conflict'
  | 'outside-crs'
  | 'implausible'
  | 'empty';

/** A terrain upload refused for a reason the uploader can fix; `field` names the form field at fault. */
export class TerrainIngestError extends Error {
  readonly code: TerrainIngestErrorCode;
  readonly field: 'file' | 'prj' | 'epsg';
  constructor(code: TerrainIngestErrorCode, field: 'file' | 'prj' | 'epsg', message: string) {
    super(message);
    this.name = 'TerrainIngestError';
    this.code = code;
    this.field = field;
  }
}

/** Runs terrain ingests off the request thread. */
export type TerrainIngestRunner = (request: TerrainIngestRequest) => Promise<TerrainIngestResult>;
