import { createElement, useMemo } from 'react';
import type { ClassRasterOverlayProps } from './class-raster-overlay-props';
import { classRasterBounds, paintClassRaster } from './class-raster-pixels';
import { gridRectToScreen } from './map-camera';

/**
 * Web: the class raster painted once into an offscreen canvas (one pixel per
 * cell, row 0 at the top — see `paintClassRaster`), turned into a PNG and laid
 * as an image over the raster's grid rectangle. Pixelated scaling keeps class
 * edges on cell edges at any zoom; undrawn classes are transparent, the rest
 * carry the palette's opacity.
 */
export function ClassRasterOverlay({ raster, values, palette, camera, size }: ClassRasterOverlayProps) {
  const url = useMemo(() => {
    if (typeof document === 'undefined') return null;
    const canvas = document.createElement('canvas');
    canvas.width = raster.width;
    canvas.height = raster.height;
    const context = canvas.getContext('2d');
    if (!context) return null;
    const image = context.createImageData(raster.width, raster.height);
    image.data.set(paintClassRaster(values, raster, palette));
    context.putImageData(image, 0, 0);
    return canvas.toDataURL('image/png');
  }, [raster, values, palette]);
  if (!url) return null;
  const rect = gridRectToScreen(camera, size, classRasterBounds(raster));
  return createElement('img', {
    src: url,
    alt: '',
    'aria-hidden': true,
    'data-layer': palette.id,
    draggable: false,
    style: {
      position: 'absolute',
      left: rect.left,
      top: rect.top,
      width: rect.width,
      height: rect.height,
      imageRendering: 'pixelated',
      pointerEvents: 'none',
      userSelect: 'none',
    },
  });
}
