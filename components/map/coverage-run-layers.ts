import { useMemo } from 'react';
import type { EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';
import { useCoverageLayer } from '@/components/data/coverage';
import {
  CROSS_BEARING_PALETTE,
  PATROL_FRACTION_PALETTE,
  POST_VISIBILITY_PALETTE,
  POSTS_PER_CELL_PALETTE,
} from './class-palettes';
import type { MapCoverageLayer } from './map-coverage-layer';

/** A run's rasters for one case, as far as they have arrived. */
export interface CaseRasters {
  readonly postsPerCell?: EncodedClassRaster | null;
  readonly crossBearing?: EncodedClassRaster | null;
  /** The chosen post's classes and its name. */
  readonly postVisibility?: { readonly raster: EncodedClassRaster; readonly postName: string } | null;
  /** A patrol's share of its cycle in view, and its name. */
  readonly patrolFraction?: { readonly raster: EncodedClassRaster; readonly postName: string } | null;
}

/**
 * The map layers of a coverage run's case, in chip order. Ids name the kind
 * of layer only, so the chosen chip stays chosen when the case or the post
 * changes.
 */
export function coverageLayersOf(rasters: CaseRasters): MapCoverageLayer[] {
  const layers: MapCoverageLayer[] = [];
  if (rasters.postsPerCell)
    layers.push({ id: 'posts-per-cell', title: 'Posts per cell', raster: rasters.postsPerCell, palette: POSTS_PER_CELL_PALETTE });
  if (rasters.crossBearing)
    layers.push({ id: 'cross-bearing', title: 'Cross-bearings', raster: rasters.crossBearing, palette: CROSS_BEARING_PALETTE });
  if (rasters.postVisibility)
    layers.push({
      id: 'post-visibility',
      title: `${rasters.postVisibility.postName} sees`,
      raster: rasters.postVisibility.raster,
      palette: POST_VISIBILITY_PALETTE,
    });
  if (rasters.patrolFraction)
    layers.push({
      id: 'patrol-fraction',
      title: `${rasters.patrolFraction.postName}: time in view`,
      raster: rasters.patrolFraction.raster,
      palette: PATROL_FRACTION_PALETTE,
    });
  return layers;
}

/**
 * Loads a finished run's layers for a case: posts per cell, cross-bearings,
 * the chosen post's visibility classes (when a post is chosen and is one
 * of the run's) and a patrol's share of its cycle in view (when given).
 * Layers come in as they arrive.
 */
export function useCoverageRunLayers(
  runId: string | null,
  caseKey: string | null,
  post: { id: string; name: string } | null,
  patrol: { id: string; name: string } | null = null,
): { layers: MapCoverageLayer[]; pending: boolean; error: Error | null } {
  const key = caseKey ?? '';
  const perCell = useCoverageLayer(runId, caseKey ? { layer: 'posts-per-cell', caseKey: key } : null);
  const cross = useCoverageLayer(runId, caseKey ? { layer: 'cross-bearing', caseKey: key } : null);
  const visibility = useCoverageLayer(
    runId,
    caseKey && post ? { layer: 'post-visibility', caseKey: key, postId: post.id } : null,
  );
  const fraction = useCoverageLayer(
    runId,
    caseKey && patrol ? { layer: 'patrol-fraction', caseKey: key, postId: patrol.id } : null,
  );
  const postName = post?.name ?? '';
  const patrolName = patrol?.name ?? '';
  const layers = useMemo(
    () =>
      coverageLayersOf({
        postsPerCell: perCell.data,
        crossBearing: cross.data,
        postVisibility: visibility.data ? { raster: visibility.data, postName } : null,
        patrolFraction: fraction.data ? { raster: fraction.data, postName: patrolName } : null,
      }),
    [perCell.data, cross.data, visibility.data, postName, fraction.data, patrolName],
  );
  return {
    layers,
    pending: perCell.isLoading || cross.isLoading || visibility.isLoading || fraction.isLoading,
    error: perCell.error ?? cross.error ?? visibility.error ?? fraction.error ?? null,
  };
}
