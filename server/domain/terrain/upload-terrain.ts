import path from 'node:path';
import type { SiteTerrain, TerrainFormat } from '@/shared/schemas/terrain';
import { gridSpecToM } from '@/shared/terrain/grid-spec';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
import type { Actor } from '@/server/domain/actor';
import { AppError } from '@/server/domain/app-error';
import type { StoredFile } from '@/server/domain/ports/file-store';
import { TerrainIngestError, type TerrainIngestErrorCode } from '@/server/domain/ports/terrain-ingest';
import { getSite } from '@/server/domain/sites/manage-sites';
import type { TerrainDeps, TerrainUpload } from './terrain-deps';
import { summary, toSiteTerrain } from './to-site-terrain';

const FORMATS: Record<string, TerrainFormat> = { '.tif': 'geotiff', '.tiff': 'geotiff', '.asc': 'esri-ascii' };
const ACCEPTED = 'Kenning reads GeoTIFF (.tif, .tiff) and ESRI ASCII grids (.asc, with an optional .prj).';

const INGEST_ERRORS: Record<TerrainIngestErrorCode, { status: number; code: string }> = {
  'wrong-type': { status: 415, code: 'terrain_wrong_type' },
  corrupt: { status: 422, code: 'terrain_corrupt' },
  truncated: { status: 422, code: 'terrain_truncated' },
  unsupported: { status: 422, code: 'terrain_unsupported' },
  oversize: { status: 413, code: 'terrain_too_large' },
  'in-degrees': { status: 422, code: 'terrain_in_degrees' },
  'crs-missing': { status: 422, code: 'terrain_crs_missing' },
  'crs-unsupported': { status: 422, code: 'terrain_crs_unsupported' },
  'crs-conflict': { status: 422, code: 'terrain_crs_conflict' },
  'outside-crs': { status: 422, code: 'terrain_outside_crs' },
  implausible: { status: 422, code: 'terrain_implausible' },
  empty: { status: 422, code: 'terrain_empty' },
};

/**
 * Uploads a terrain for a site: checks the file kind, ingests it in a worker
 * (read, CRS, nodata, hillshade), moves the normalised grid and the picture
 * into the file store, and in one transaction makes it the site's active
 * terrain (the previous one stays, inactive) with an audit event. On any
 * failure nothing is kept: no row, no stored file.
 */
export async function uploadTerrain(
  deps: TerrainDeps,
  actor: Actor,
  siteId: string,
  upload: TerrainUpload,
): Promise<SiteTerrain> {
  const site = await getSite(actor, siteId);
  const format = FORMATS[path.extname(upload.file.originalName).toLowerCase()];
  if (!format) {
    throw new AppError(415, 'terrain_wrong_type', `“${upload.file.originalName}” is not a terrain file. ${ACCEPTED}`, {
      file: `Choose a .tif, .tiff or .asc file. ${ACCEPTED}`,
    });
  }
  if (upload.prj && path.extname(upload.prj.originalName).toLowerCase() !== '.prj') {
    throw new AppError(415, 'terrain_wrong_type', `“${upload.prj.originalName}” is not a .prj file.`, {
      prj: 'The second file must be the grid’s .prj (its coordinate system).',
    });
  }
  if (upload.prj && format !== 'esri-ascii') {
    throw AppError.badRequest('A .prj goes with an ASCII grid only; a GeoTIFF carries its own CRS.', {
      prj: 'Leave this out for a GeoTIFF.',
    });
  }

  const result = await deps
    .ingest({
      filePath: upload.file.path,
      format,
      prjPath: upload.prj?.path ?? null,
      epsg: upload.epsg,
      maxCells: deps.maxCells,
      hillshadeMaxEdge: deps.hillshadeMaxEdge,
      boundary: site.boundary,
      outDir: upload.workDir,
    })
    .catch((error: unknown) => {
      if (error instanceof TerrainIngestError) {
        const mapped = INGEST_ERRORS[error.code];
        throw new AppError(mapped.status, mapped.code, error.message, { [error.field]: error.message }, { cause: error });
      }
      throw error;
    });

  const stored: StoredFile[] = [];
  try {
    const grid = await deps.files.adopt(result.gridPath);
    stored.push(grid);
    const picture = await deps.files.adopt(result.hillshadePath);
    stored.push(picture);
    const record = await deps.db.transaction(async (t) => {
      // One upload at a time per site: the site row is the lock.
      await sitesRepository.lockForUpdate(actor.organizationId, siteId, t);
      const { created, replacedId } = await terrainRepository.createActive(
        actor.organizationId,
        siteId,
        actor.userId,
        {
          storeKey: grid.key,
          sha256: grid.sha256,
          storedBytes: grid.bytes,
          originalName: upload.file.originalName.slice(0, 255),
          originalFormat: format,
          originalBytes: upload.file.bytes,
          ...gridSpecToM(result),
          epsg: result.epsg,
          crsWkt: result.wkt,
          crsLabel: result.crsLabel,
          nodataValue: result.nodataValue,
          nodataCells: result.nodataCells,
          minElevationM: result.minElevation,
          maxElevationM: result.maxElevation,
          coversBoundary: result.coversBoundary,
          hillshadeKey: picture.key,
          hillshadeWidth: result.hillshadeWidth,
          hillshadeHeight: result.hillshadeHeight,
          corners: result.corners,
        },
        t,
      );
      await auditRepository.record(
        actor,
        {
          action: 'upload',
          entityType: 'site_terrain',
          entityId: created.id,
          after: { ...summary(created), siteId, replacedId },
        },
        t,
      );
      return created;
    });
    return toSiteTerrain(record);
  } catch (error) {
    await Promise.all(stored.map((file) => deps.files.remove(file.key)));
    throw error;
  }
}
