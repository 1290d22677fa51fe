import { useMemo } from 'react';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import type { EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';
import type { ClassPalette } from './class-palettes';

/**
 * A coverage layer the map can draw: one class raster of a coverage run (or
 * one post's classes, or a difference between two runs) and the palette that
 * names its codes. This is what the plan page passes to the map
 * (`SiteMapScreen`'s `coverageLayers` prop) once the coverage API serves runs.
 *
 * @example
 * const layers: MapCoverageLayer[] = [
 *   { id: `${run.id}:posts`, title: 'Posts per cell — 30 m smoke, standard optical', raster: run.layers.postsPerCell, palette: POSTS_PER_CELL_PALETTE },
 *   { id: `${run.id}:cross`, title: 'Cross-bearings', raster: run.layers.crossBearing, palette: CROSS_BEARING_PALETTE },
 * ];
 * <SiteMapScreen siteId={siteId} coverageLayers={layers} />
 */
export interface MapCoverageLayer {
  /** Stable id (e.g. `${runId}:${layer}`), also the layer chip's key. */
  readonly id: string;
  /** Shown on the layer chip and over the legend. */
  readonly title: string;
  /** The layer as the API sends it (`kenning-rle8/1`). */
  readonly raster: EncodedClassRaster;
  readonly palette: ClassPalette;
}

/** The raster's codes, decoded once per raster (row 0 = north); null with an error message when it cannot be read. */
export function useDecodedRaster(raster: EncodedClassRaster | null): { values: Uint8Array | null; error: string | null } {
  return useMemo(() => {
    if (!raster) return { values: null, error: null };
    try {
      return { values: decodeClassRaster(raster), error: null };
    } catch (e) {
      return { values: null, error: e instanceof Error ? e.message : 'The layer cannot be read.' };
    }
  }, [raster]);
}
