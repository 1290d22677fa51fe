import { writeArrayBuffer } from 'geotiff';
import type { CoverageLayerName } from '@/shared/schemas/coverage';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import type { EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';
import { writeEsriAsciiGrid } from '@/shared/terrain/formats/esri-ascii-grid-writer';
import { LAYER_LEGENDS } from '@/shared/terrain/class-layer-legends';

const gridOf = (encoded: EncodedClassRaster) => ({
  width: encoded.width,
  height: encoded.height,
  cellSize: encoded.cellSize,
  xll: encoded.xll,
  yll: encoded.yll,
  crs: encoded.epsg === null ? null : { epsg: encoded.epsg, wkt: null },
});

/**
 * A stored class layer as a single-band 8-bit GeoTIFF, written by the
 * `geotiff` package's writer (`writeArrayBuffer`: one uncompressed strip,
 * 8-bit samples — all a class layer needs — and GeoKeys from the metadata
 * keys ending in "GeoKey"). Georeferenced like the layer's grid: pixel scale
 * = cell size, tie point (0, 0) at the grid's north-west corner, raster type
 * PixelIsArea, projected CRS by EPSG code (GTModelType 1,
 * ProjectedCSTypeGeoKey). Nodata in GDAL's GDAL_NODATA tag. (The package's
 * writer knows no ImageDescription tag: the legend goes with the answer, in
 * {@link LAYER_LEGENDS}.)
 *
 * Source: OGC GeoTIFF 1.1 (ModelPixelScaleTag 33550, ModelTiepointTag 33922,
 * GeoKeyDirectoryTag 34735; GTModelTypeGeoKey 1024, GTRasterTypeGeoKey 1025,
 * ProjectedCSTypeGeoKey 3072); GDAL GTiff
 * driver documentation (GDAL_NODATA 42113).
 *
 * @param encoded the stored layer (`kenning-rle8/1`; not modified)
 * @param layer which layer it is (for its legend and nodata)
 * @returns the file's bytes
 */
export function layerGeoTiff(encoded: EncodedClassRaster, layer: CoverageLayerName): Buffer {
  const values = decodeClassRaster(encoded);
  const { nodata } = LAYER_LEGENDS[layer];
  const { width, height, cellSize, xll, yll } = encoded;
  const metadata: Record<string, unknown> = {
    width,
    height,
    BitsPerSample: [8],
    SampleFormat: [1],
    ModelPixelScale: [cellSize, cellSize, 0],
    ModelTiepoint: [0, 0, 0, xll, yll + height * cellSize, 0],
    GTModelTypeGeoKey: 1,
    GTRasterTypeGeoKey: 1,
    GDAL_NODATA: `${nodata}\0`,
  };
  if (encoded.epsg !== null) metadata.ProjectedCSTypeGeoKey = encoded.epsg;
  else metadata.ProjectedCSTypeGeoKey = 32767; // user-defined: the grid's CRS is not known by code
  return Buffer.from(writeArrayBuffer(values, metadata) as ArrayBuffer);
}

/**
 * A stored class layer as an ESRI ASCII grid (`ncols`, `nrows`,
 * `xllcorner`, `yllcorner`, `cellsize`, `NODATA_value`, then the rows north
 * to south), values as whole numbers, and the `.prj` text for its CRS when
 * Kenning can write one (WGS 84 / UTM zones), else null.
 *
 * Source: ESRI ASCII raster format (ArcGIS documentation).
 */
export function layerAsciiGrid(encoded: EncodedClassRaster, layer: CoverageLayerName): { asc: string; prj: string | null } {
  const codes = decodeClassRaster(encoded);
  return writeEsriAsciiGrid(gridOf(encoded), Float32Array.from(codes), {
    nodata: LAYER_LEGENDS[layer].nodata,
    decimals: 0,
  });
}
