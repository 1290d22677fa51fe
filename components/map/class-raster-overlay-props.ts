import type { EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';
import type { ClassPalette } from './class-palettes';
import type { MapCamera, MapSize } from './map-camera';

/** What a class raster overlay draws (the native and the web one alike). */
export interface ClassRasterOverlayProps {
  /** The layer as the API sends it (grid + run-length data). */
  raster: EncodedClassRaster;
  /** Its decoded codes (`useDecodedRaster`), row 0 = north. */
  values: Uint8Array;
  palette: ClassPalette;
  camera: MapCamera;
  size: MapSize;
}
