import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { PNG } from 'pngjs';
import { readEsriAsciiGrid } from '@/shared/terrain/formats/esri-ascii-grid-reader';
import { readGeoTiff } from '@/shared/terrain/formats/geotiff-reader';
import { writeGeoTiff } from '@/shared/terrain/formats/geotiff-writer';
import { TerrainFormatError, REPROJECT_ADVICE } from '@/shared/terrain/formats/terrain-format-error';
import { wktForEpsg } from '@/shared/terrain/formats/wkt-for-epsg';
import { gridProjection, TerrainCrsError, type GridProjection } from '@/shared/terrain/grid-projection';
import { computeHillshade } from '@/shared/terrain/hillshade';
import { hillshadeImage } from '@/shared/terrain/hillshade-image';
import { elevationAt } from '@/shared/terrain/terrain-elevation';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import type { TerrainCrs } from '@/shared/terrain/grid-spec';
import { TerrainIngestError, type TerrainIngestRequest, type TerrainIngestResult } from '@/server/domain/ports/terrain-ingest';
export type { TerrainIngestRequest, TerrainIngestResult, TerrainIngestErrorCode } from '@/server/domain/ports/terrain-ingest';
export { TerrainIngestError } from '@/server/domain/ports/terrain-ingest';

/** Ground elevations outside this range are taken for a unit or nodata mistake, metres. */
const PLAUSIBLE_ELEVATION_M = { min: -12_000, max: 9_000 } as const;

/**
 * Turns an uploaded terrain file into what Kenning stores: reads it (GeoTIFF
 * or ESRI ASCII grid), settles its CRS (the file's own, else the uploader's
 * EPSG code; projected and metric only), marks nodata as NaN, checks the
 * heights are plausible metres, and writes the normalised Float32 GeoTIFF
 * (the reader's fast path) and the hillshade PNG into `outDir`. CPU-heavy: run
 * it in a worker thread (see `server/workers/terrain-ingest-runner.ts`).
 *
 * @throws TerrainIngestError for anything the uploader can fix
 */
export async function ingestTerrainFile(request: TerrainIngestRequest): Promise<TerrainIngestResult> {
  const started = performance.now();
  const raster = await readRaster(request);
  if (raster.width * raster.height > request.maxCells) {
    throw oversize(raster.width, raster.height, request.maxCells);
  }
  const crs = settleCrs(raster.crs, request.epsg);
  let projection: GridProjection;
  try {
    projection = gridProjection(crs);
  } catch (error) {
    if (!(error instanceof TerrainCrsError)) throw error;
    if (error.code === 'missing') throw new TerrainIngestError('crs-missing', 'epsg', error.message);
    if (error.code === 'geographic')
      throw new TerrainIngestError('in-degrees', request.epsg !== null && !raster.crs ? 'epsg' : 'file', error.message);
    throw new TerrainIngestError(
      'crs-unsupported',
      request.prjPath ? 'prj' : request.epsg !== null ? 'epsg' : 'file',
      error.message,
    );
  }

  // Nodata → NaN, statistics, plausibility.
  const heights = raster.heights;
  const marker = raster.nodata;
  let nodataCells = 0;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < heights.length; i++) {
    const v = heights[i] as number;
    if (v !== v || v === marker || !Number.isFinite(v)) {
      heights[i] = NaN;
      nodataCells++;
      continue;
    }
    if (v < min) min = v;
    if (v > max) max = v;
  }
  if (nodataCells === heights.length) {
    throw new TerrainIngestError('empty', 'file', 'Every cell of this terrain is nodata: there is no ground to use.');
  }
  if (min < PLAUSIBLE_ELEVATION_M.min || max > PLAUSIBLE_ELEVATION_M.max) {
    throw new TerrainIngestError(
      'implausible',
      'file',
      `Heights run from ${round(min)} to ${round(max)}; Kenning expects metres between ${PLAUSIBLE_ELEVATION_M.min} and ${PLAUSIBLE_ELEVATION_M.max}. ` +
        'If a value such as −32768 or −9999 marks missing data, declare it as the nodata value (NODATA_value in an ASCII grid, or the GeoTIFF nodata tag); convert feet to metres first.',
    );
  }
  const terrain: TerrainRaster = { ...raster, heights, nodata: null, crs };
  const corners = gridCorners(terrain, projection);
  const coversBoundary = request.boundary ? boundaryCovered(terrain, projection, request.boundary) : null;
  const read = performance.now();

  const relief = computeHillshade(terrain);
  const image = hillshadeImage(relief, request.hillshadeMaxEdge);
  const shaded = performance.now();

  const gridPath = path.join(request.outDir, 'grid.tif');
  const hillshadePath = path.join(request.outDir, 'hillshade.png');
  writeFileSync(gridPath, Buffer.from(writeGeoTiff(terrain, heights)));
  const png = new PNG({ width: image.width, height: image.height, colorType: 4, inputColorType: 4, inputHasAlpha: true });
  png.data = Buffer.from(image.greyAlpha.buffer, image.greyAlpha.byteOffset, image.greyAlpha.byteLength);
  writeFileSync(hillshadePath, PNG.sync.write(png, { colorType: 4, inputColorType: 4, inputHasAlpha: true }));
  const written = performance.now();

  return {
    width: terrain.width,
    height: terrain.height,
    cellSize: terrain.cellSize,
    xll: terrain.xll,
    yll: terrain.yll,
    epsg: crs?.epsg ?? null,
    wkt: crs?.wkt ?? null,
    crsLabel: projection.label,
    nodataValue: marker,
    nodataCells,
    minElevation: min,
    maxElevation: max,
    coversBoundary,
    corners,
    gridPath,
    hillshadePath,
    hillshadeWidth: image.width,
    hillshadeHeight: image.height,
    timings: { readMs: read - started, hillshadeMs: shaded - read, writeMs: written - shaded },
  };
}

const round = (v: number) => Math.round(v * 10) / 10;

function oversize(width: number, height: number, maxCells: number): TerrainIngestError {
  return new TerrainIngestError(
    'oversize',
    'file',
    `The grid has ${width} × ${height} = ${(width * height).toLocaleString('en')} cells; Kenning takes at most ` +
      `${maxCells.toLocaleString('en')} cells (e.g. 5000 × 5000). Clip it to the site or resample it to a coarser cell ` +
      '(e.g. gdal_translate -projwin … or gdalwarp -tr 25 25).',
  );
}

async function readRaster(request: TerrainIngestRequest): Promise<TerrainRaster> {
  try {
    if (request.format === 'esri-ascii') {
      const prj = request.prjPath ? readFileSync(request.prjPath, 'utf8') : null;
      if (prj !== null && (prj.includes('\0') || !/[A-Z]{4,}\s*\[/i.test(prj))) {
        throw new TerrainIngestError(
          'wrong-type',
          'prj',
          'The .prj file is not a coordinate system description (well-known text).',
        );
      }
      return readEsriAsciiGrid(readFileSync(request.filePath, 'latin1'), prj, { maxCells: request.maxCells });
    }
    const bytes = readFileSync(request.filePath);
    const buffer =
      bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength
        ? (bytes.buffer as ArrayBuffer)
        : (bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
    return await readGeoTiff(buffer, { maxCells: request.maxCells });
  } catch (error) {
    if (!(error instanceof TerrainFormatError)) throw error;
    switch (error.code) {
      case 'geographic-crs':
        throw new TerrainIngestError('in-degrees', 'file', error.message);
      case 'oversize':
        throw new TerrainIngestError('oversize', 'file', error.message);
      default:
        throw new TerrainIngestError(error.code, 'file', error.message);
    }
  }
}

/** The file's CRS, else the uploader's EPSG code; a conflict between the two is refused. */
function settleCrs(fromFile: TerrainCrs | null, epsg: number | null): TerrainCrs | null {
  const fileHas = fromFile !== null && (fromFile.epsg !== null || !!fromFile.wkt);
  if (epsg === null) return fileHas ? fromFile : null;
  if (!fileHas) return { epsg, wkt: wktForEpsg(epsg) };
  if (fromFile.epsg !== null && fromFile.epsg !== epsg) {
    throw new TerrainIngestError(
      'crs-conflict',
      'epsg',
      `The file says its CRS is EPSG:${fromFile.epsg} but EPSG:${epsg} was given. Leave the EPSG field empty to use the file's own.`,
    );
  }
  return { epsg, wkt: fromFile.wkt };
}

function gridCorners(terrain: TerrainRaster, projection: GridProjection): TerrainIngestResult['corners'] {
  const west = terrain.xll;
  const south = terrain.yll;
  const east = west + terrain.width * terrain.cellSize;
  const north = south + terrain.height * terrain.cellSize;
  const corner = (x: number, y: number) => {
    const p = projection.toLatLon(x, y);
    if (!(Math.abs(p.latDeg) <= 90 && Math.abs(p.lonDeg) <= 360)) {
      throw new TerrainIngestError(
        'outside-crs',
        'file',
        `The grid's corner (${x}, ${y}) does not fall on the earth in ${projection.label}: the coordinates do not fit the CRS. ${REPROJECT_ADVICE}`,
      );
    }
    return { latDeg: p.latDeg, lonDeg: ((((p.lonDeg + 180) % 360) + 360) % 360) - 180 };
  };
  return {
    northWest: corner(west, north),
    northEast: corner(east, north),
    southEast: corner(east, south),
    southWest: corner(west, south),
  };
}

/** Whether every point of the boundary (its corners and its edges every cell or so) has ground data. */
function boundaryCovered(
  terrain: TerrainRaster,
  projection: GridProjection,
  ring: readonly (readonly [number, number])[],
): boolean {
  const points = ring.map(([lonDeg, latDeg]) => projection.toGrid({ latDeg, lonDeg }));
  for (let i = 0; i < points.length; i++) {
    const a = points[i] as { x: number; y: number };
    const b = points[(i + 1) % points.length] as { x: number; y: number };
    const steps = Math.min(10_000, Math.max(1, Math.ceil(Math.hypot(b.x - a.x, b.y - a.y) / terrain.cellSize)));
    for (let s = 0; s <= steps; s++) {
      const x = a.x + ((b.x - a.x) * s) / steps;
      const y = a.y + ((b.y - a.y) * s) / steps;
      try {
        if (elevationAt(terrain, x, y) === null) return false;
      } catch {
        return false;
      }
    }
  }
  return true;
}
