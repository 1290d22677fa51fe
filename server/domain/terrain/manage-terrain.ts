import path from 'node:path';
import type { Readable } from 'node:stream';
import type { Site } from '@/shared/schemas/site';
import { TERRAIN_MESH_ENCODING } from '@/shared/schemas/terrain';
import type {
  ElevationQuery,
  ElevationResponse,
  SiteTerrain,
  TerrainFormat,
  TerrainMeshResponse,
  TerrainProfileRequest,
  TerrainProfileResponse,
} from '@/shared/schemas/terrain';
import { MEAN_EARTH_RADIUS_M } from '@/shared/sightline';
import { refractionFromCondition } from '@/shared/sightline/refraction-from-condition';
import { decimateTerrain } from '@/shared/terrain/decimate-terrain';
import { gridProjection, TerrainCrsError } from '@/shared/terrain/grid-projection';
import { elevationAt } from '@/shared/terrain/terrain-elevation';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { terrainProfile } from '@/shared/terrain/terrain-profile';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import { terrainRepository, type TerrainRecord } from '@/server/data/repositories/terrain-repository';
import { AppError } from '@/server/domain/app-error';
import type { FileStore, StoredFile } from '@/server/domain/ports/file-store';
import { TerrainIngestError, type TerrainIngestErrorCode } from '@/server/domain/ports/terrain-ingest';
import type { TerrainCache } from '@/server/domain/ports/terrain-cache';
import type { TerrainIngestRunner } from '@/server/domain/ports/terrain-ingest';
import type { Actor } from '../actor';
import { getSite } from '../sites/manage-sites';
import { gridBoundsM, gridSpecToM } from '@/shared/terrain/grid-spec';
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

/** Standing cautions of every terrain profile. */
const PROFILE_CAUTIONS = [
  {
    code: 'estimates-only',
    message:
      'Estimates from the terrain grid with a uniform refraction: trees, buildings and the grid’s own errors are not included, and the ground between cell centres is interpolated.',
  },
  {
    code: 'refraction-varies',
    message:
      'Refraction close to the ground varies widely and quickly (heated slopes, inversions in valleys); compare several conditions before relying on a line of sight.',
  },
  {
    code: 'visibility-not-detection',
    message: 'A target in line of sight is not necessarily detected: haze, contrast, lighting and the observer decide that.',
  },
  {
    code: 'follow-procedures',
    message: 'Use these figures to support, not replace, your agency’s procedures, local regulations and licensed practice.',
  },
];

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
const summary = (record: TerrainRecord) => ({
  originalName: record.originalName,
  width: record.width,
  height: record.height,
  cellSizeM: record.cellSizeM,
  epsg: record.epsg,
  sha256: record.sha256,
  coversBoundary: record.coversBoundary,
});

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

async function activeTerrain(actor: Actor, siteId: string): Promise<{ site: Site; terrain: TerrainRecord }> {
  const site = await getSite(actor, siteId);
  const terrain = await terrainRepository.findActive(actor.organizationId, siteId);
  if (!terrain) {
    throw new AppError(404, 'no_terrain', `${site.name} has no terrain yet. A planner can upload a GeoTIFF or ESRI ASCII grid.`);
  }
  return { site, terrain };
}

/** The site's active terrain; 404 `no_terrain` when it has none. */
export async function getActiveTerrain(actor: Actor, siteId: string): Promise<SiteTerrain> {
  return toSiteTerrain((await activeTerrain(actor, siteId)).terrain);
}

/**
 * The hillshade PNG of the site's active terrain, or of one of its terrains by
 * id (replaced ones too: plan revisions keep referring to them).
 */
export async function openHillshade(
  deps: Pick<TerrainDeps, 'files'>,
  actor: Actor,
  siteId: string,
  terrainId?: string,
): Promise<{ stream: Readable; terrainId: string }> {
  let terrain: TerrainRecord;
  if (terrainId) {
    await getSite(actor, siteId);
    const found = await terrainRepository.findInSite(actor.organizationId, siteId, terrainId);
    if (!found) throw AppError.notFound('That terrain');
    terrain = found;
  } else {
    terrain = (await activeTerrain(actor, siteId)).terrain;
  }
  return { stream: await deps.files.open(terrain.hillshadeKey), terrainId: terrain.id };
}

/** Maps the terrain core's point errors to a 422 naming the fields. */
function pointError(error: unknown, fields: string[], what: string): never {
  if (error instanceof TerrainInputError && (error.code === 'point-outside-raster' || error.code === 'point-on-nodata')) {
    const outside = error.code === 'point-outside-raster';
    const message = outside ? `The ${what} is outside the site’s terrain.` : `The terrain has no ground height at the ${what}.`;
    throw new AppError(
      422,
      outside ? 'outside_terrain' : 'no_elevation',
      message,
      Object.fromEntries(fields.map((f) => [f, message])),
    );
  }
  throw error;
}

/** Ground elevation of the active terrain at a WGS84 position (bilinear between cell centres). */
export async function terrainElevation(
  deps: Pick<TerrainDeps, 'cache'>,
  actor: Actor,
  siteId: string,
  query: ElevationQuery,
): Promise<ElevationResponse> {
  const { terrain: record } = await activeTerrain(actor, siteId);
  const terrain = await deps.cache.loadTerrain(record);
  const { x, y } = gridProjection(terrain.crs).toGrid(query);
  let elevation: number | null;
  try {
    elevation = elevationAt(terrain, x, y);
  } catch (error) {
    pointError(error, ['latDeg', 'lonDeg'], 'position');
  }
  if (elevation === null) pointError(new TerrainInputError('point-on-nodata', ''), ['latDeg', 'lonDeg'], 'position');
  return { terrainId: record.id, latDeg: query.latDeg, lonDeg: query.lonDeg, xM: x, yM: y, elevationM: elevation };
}

/**
 * The terrain profile from a post (or a position with an eye height) to a
 * target, under each refraction condition.
 */
export async function profileTerrain(
  deps: Pick<TerrainDeps, 'cache'>,
  actor: Actor,
  siteId: string,
  request: TerrainProfileRequest,
): Promise<TerrainProfileResponse> {
  const { terrain: record } = await activeTerrain(actor, siteId);
  let observer: { latDeg: number; lonDeg: number; eyeHeightM: number; postId: string | null; recorded: number | null };
  if (request.postId) {
    const post = await postsRepository.findInSite(actor.organizationId, siteId, request.postId);
    if (!post)
      throw new AppError(404, 'not_found', 'That post was not found on this site.', { postId: 'No such post on this site.' });
    observer = {
      ...post.location,
      eyeHeightM: post.structureHeightM + post.eyeHeightM,
      postId: post.id,
      recorded: post.groundElevationM,
    };
  } else {
    const given = request.observer as NonNullable<TerrainProfileRequest['observer']>;
    observer = { ...given, postId: null, recorded: null };
  }
  const terrain = await deps.cache.loadTerrain(record);
  let projection;
  try {
    projection = gridProjection(terrain.crs);
  } catch (error) {
    if (error instanceof TerrainCrsError) throw new AppError(500, 'terrain_crs', error.message);
    throw error;
  }
  const from = projection.toGrid(observer);
  const to = projection.toGrid(request.target);
  const earthRadius = request.earthRadiusM ?? MEAN_EARTH_RADIUS_M;
  const ks = request.conditions.map((c) => refractionFromCondition(c, earthRadius));
  let profile;
  try {
    profile = terrainProfile(terrain, {
      observer: { ...from, eyeHeight: observer.eyeHeightM },
      target: { ...to, height: request.targetHeightM },
      conditions: ks.map((k) => ({ refractionCoefficient: k, earthRadius })),
    });
  } catch (error) {
    if (
      error instanceof TerrainInputError &&
      error.code === 'invalid-option' &&
      /same point|at the observer/.test(error.message)
    ) {
      throw new AppError(422, 'same_point', 'The target is where the observer is: pick a target elsewhere.', {
        target: 'Pick a target away from the observer.',
      });
    }
    const observerFields = request.postId ? ['postId'] : ['observer.latDeg', 'observer.lonDeg'];
    const isObserver = error instanceof TerrainInputError && /observer/.test(error.message);
    pointError(error, isObserver ? observerFields : ['target.latDeg', 'target.lonDeg'], isObserver ? 'observer' : 'target');
  }
  const finite = (v: number): number | null => (Number.isFinite(v) ? v : null);
  const point = (p: { distance: number; ground: number; lowered: number } | null) =>
    p && { distanceM: p.distance, groundElevationM: p.ground, loweredElevationM: p.lowered };
  const bearing = ((Math.atan2(to.x - from.x, to.y - from.y) * 180) / Math.PI + 360) % 360;
  return {
    terrainId: record.id,
    observer: {
      latDeg: observer.latDeg,
      lonDeg: observer.lonDeg,
      postId: observer.postId,
      groundElevationM: profile.observerGround,
      recordedGroundElevationM: observer.recorded,
      eyeHeightM: observer.eyeHeightM,
      eyeElevationM: profile.eyeElevation,
    },
    target: {
      latDeg: request.target.latDeg,
      lonDeg: request.target.lonDeg,
      groundElevationM: profile.targetGround,
      heightM: request.targetHeightM,
    },
    distanceM: profile.distance,
    gridBearingDeg: bearing,
    spacingM: profile.spacing,
    samples: Array.from(profile.sampleDistances, (d, i) => ({
      distanceM: d,
      groundElevationM: finite(profile.sampleGround[i] as number),
    })),
    results: profile.conditions.map((c) => ({
      k: c.refractionCoefficient,
      effectiveRadiusM: c.refractionCoefficient < 1 ? c.earthRadius / (1 - c.refractionCoefficient) : null,
      loweredGroundM: Array.from(c.loweredGround, finite),
      sightLine: { eyeElevationM: profile.eyeElevation, targetTopElevationM: c.targetTopLowered },
      hiddenHeightM: c.hiddenHeight,
      horizon: point(c.horizon),
      firstObstruction: point(c.firstObstruction),
      groundSeen: c.groundSeen,
      targetTopSeen: c.targetTopSeen,
    })),
    cautions: PROFILE_CAUTIONS,
  };
}

/** Meshes recently made, by terrain id and edge (a terrain never changes once stored). */
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
