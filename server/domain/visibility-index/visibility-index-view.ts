import { encodeClassRaster } from '@/shared/terrain/encode-class-raster';
import type { VisibilityIndex, VisibilityIndexMapLayer } from '@/shared/schemas/visibility-index';
import { VISIBILITY_INDEX_CLASS_COUNT } from '@/shared/schemas/visibility-index';
import type { VisibilityIndexRecord } from '@/server/data/repositories/visibility-index-repository';

/**
 * The map layer of a finished index: class 0 where nothing was computed,
 * classes 1…N in equal steps of seen area up to the largest (upper bounds
 * rounded up to whole m², so every value falls in a class).
 */
export function visibilityIndexLayer(record: VisibilityIndexRecord): VisibilityIndexMapLayer | null {
  const { grid, seenM2 } = record;
  if (record.status !== 'done' || !grid || !seenM2) return null;
  let max = 0;
  for (const v of seenM2) if (v > max) max = v;
  const n = VISIBILITY_INDEX_CLASS_COUNT;
  const step = Math.max(1, Math.ceil(max / n));
  const classUpperM2 = Array.from({ length: n }, (_, c) => step * (c + 1));
  const classes = new Uint8Array(seenM2.length);
  for (let i = 0; i < seenM2.length; i++) {
    const v = seenM2[i] as number;
    if (v === v) classes[i] = Math.min(n, Math.max(1, Math.ceil(v / step)));
  }
  const raster = encodeClassRaster(
    { width: grid.width, height: grid.height, cellSize: grid.cellSizeM, xll: grid.xllM, yll: grid.yllM, crs: null },
    classes,
  );
  return { raster: { ...raster, epsg: grid.epsg }, classUpperM2, maxSeenM2: max };
}

/** The API form of a visibility index row. */
export function toVisibilityIndex(record: VisibilityIndexRecord): VisibilityIndex {
  return {
    id: record.id,
    siteId: record.siteId,
    terrainId: record.terrainId,
    heightM: record.heightM,
    radiusM: record.radiusM,
    rays: record.rays,
    strideCells: record.strideCells,
    status: record.status,
    progress: record.progress,
    error: record.error,
    siteAreaM2: record.siteAreaM2,
    elapsedS: record.elapsedS,
    createdAt: record.createdAt.toISOString(),
    finishedAt: record.finishedAt?.toISOString() ?? null,
    layer: visibilityIndexLayer(record),
  };
}
