import type { SiteTerrain } from '@/shared/schemas/terrain';
import { gridBoundsM } from '@/shared/terrain/grid-spec';
import type { TerrainRecord } from '@/server/data/repositories/terrain-repository';

/** The API shape of a stored terrain. */
export function toSiteTerrain(record: TerrainRecord): SiteTerrain {
  return {
    id: record.id,
    siteId: record.siteId,
    active: record.active,
    originalName: record.originalName,
    originalFormat: record.originalFormat,
    width: record.width,
    height: record.height,
    cellSizeM: record.cellSizeM,
    xllM: record.xllM,
    yllM: record.yllM,
    crs: { epsg: record.epsg, wkt: record.crsWkt, label: record.crsLabel },
    nodataValue: record.nodataValue,
    nodataCells: record.nodataCells,
    minElevationM: record.minElevationM,
    maxElevationM: record.maxElevationM,
    sha256: record.sha256,
    coversBoundary: record.coversBoundary,
    uploadedBy: { id: record.uploadedById, name: record.uploadedByName },
    createdAt: record.createdAt,
    baseLayer: {
      kind: 'image',
      style: 'hillshade',
      url: `/api/v1/sites/${record.siteId}/terrain/hillshade.png?terrainId=${record.id}`,
      widthPx: record.hillshadeWidth,
      heightPx: record.hillshadeHeight,
      gridBounds: gridBoundsM(record),
      corners: record.corners,
    },
  };
}

/** Audit summary of a terrain (no WKT, no keys). */
export const summary = (record: TerrainRecord) => ({
  originalName: record.originalName,
  width: record.width,
  height: record.height,
  cellSizeM: record.cellSizeM,
  epsg: record.epsg,
  sha256: record.sha256,
  coversBoundary: record.coversBoundary,
});
