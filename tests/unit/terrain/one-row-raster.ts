import type { HiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';

/** A one-row hidden-height raster of 25 m cells with the post in its first cell (test data, invented). */
export function oneRowHidden(values: number[]): HiddenHeightRaster {
  return {
    width: values.length,
    height: 1,
    cellSize: 25,
    xll: 0,
    yll: 0,
    crs: null,
    hidden: Float32Array.from(values),
    post: { col: 0, row: 0, eyeHeight: 10 },
    eyeElevation: 110,
    refractionCoefficient: 0.13,
    earthRadius: 6_371_008.8,
    maxDistance: Infinity,
  };
}
