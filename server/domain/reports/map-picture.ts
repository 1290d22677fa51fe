import { PNG } from 'pngjs';
import { CROSS_BEARING_CLASS } from '@/shared/terrain/cross-bearing-quality';
import { COVERAGE_LAYER } from '@/shared/terrain/posts-per-cell';
import type { Extent } from './map-frame';

/**
 * The raster part of a printed map: the terrain's hillshade, lightened, and
 * over it one coverage layer's classes, sampled (nearest cell) at each pixel
 * of the map's extent, as a PNG for pdfkit. Rows of the layer run north to
 * south (row 0 = north), as every Kenning layer does.
 *
 * Print colours follow the app's rule (amber = nobody sees it; deeper blue,
 * violet for bearings = better covered; lightness falls along each ordered
 * scale) and add a diagonal hatch to the amber class, so the classes stay
 * apart on a greyscale printer or photocopy.
 */

export interface PrintClass {
  code: number;
  label: string;
  /** Fill, [r, g, b] 0–255; null = not drawn (the hillshade shows). */
  rgb: [number, number, number] | null;
  /** Dark diagonal lines over the fill (the "nobody" class). */
  hatched: boolean;
}

export interface PrintPalette {
  title: string;
  classes: PrintClass[];
}

const AMBER: [number, number, number] = [230, 159, 46];
const HATCH: [number, number, number] = [96, 60, 8];

export const POSTS_PER_CELL_PRINT: PrintPalette = {
  title: 'Posts that see the target',
  classes: [
    { code: COVERAGE_LAYER.unseen, label: 'No post (hatched)', rgb: AMBER, hatched: true },
    { code: COVERAGE_LAYER.onePost, label: '1 post', rgb: [198, 221, 242], hatched: false },
    { code: COVERAGE_LAYER.twoPosts, label: '2 posts', rgb: [91, 143, 199], hatched: false },
    { code: COVERAGE_LAYER.threeOrMorePosts, label: '3 or more posts', rgb: [27, 58, 107], hatched: false },
    { code: COVERAGE_LAYER.noData, label: 'No terrain data (not drawn)', rgb: null, hatched: false },
  ],
};

export const CROSS_BEARING_PRINT: PrintPalette = {
  title: 'Cross-bearings',
  classes: [
    { code: CROSS_BEARING_CLASS.none, label: 'No bearing (hatched)', rgb: AMBER, hatched: true },
    { code: CROSS_BEARING_CLASS.single, label: 'Single bearing', rgb: [220, 211, 238], hatched: false },
    { code: CROSS_BEARING_CLASS.weak, label: 'Weak crossing (too flat)', rgb: [142, 120, 192], hatched: false },
    { code: CROSS_BEARING_CLASS.good, label: 'Good crossing', rgb: [62, 33, 112], hatched: false },
  ],
};

export interface Hillshade {
  width: number;
  height: number;
  /** RGBA rows, north first. */
  data: Uint8Array;
  /** Grid metres the picture covers. */
  bounds: Extent;
}

export interface ClassLayer {
  width: number;
  height: number;
  cellSizeM: number;
  xllM: number;
  yllM: number;
  codes: Uint8Array;
}

/**
 * Paints `extent` at `widthPx` × `heightPx`: hillshade (or plain paper when
 * there is none), then the layer's classes; outside the layer only the
 * hillshade. Returns PNG bytes.
 */
export function mapPicture(args: {
  extent: Extent;
  widthPx: number;
  heightPx: number;
  hillshade: Hillshade | null;
  layer?: { raster: ClassLayer; palette: PrintPalette; mask?: Uint8Array | null } | null;
}): Buffer {
  const { extent, widthPx, heightPx, hillshade, layer } = args;
  const png = new PNG({ width: widthPx, height: heightPx, colorType: 2 });
  const out = png.data;
  const mx = (extent.east - extent.west) / widthPx;
  const my = (extent.north - extent.south) / heightPx;
  const lut = new Array<PrintClass | undefined>(256);
  for (const c of layer?.palette.classes ?? []) lut[c.code] = c;
  const hs = hillshade;
  const hsX = hs ? hs.width / (hs.bounds.east - hs.bounds.west) : 0;
  const hsY = hs ? hs.height / (hs.bounds.north - hs.bounds.south) : 0;
  const r = layer?.raster;
  for (let j = 0; j < heightPx; j++) {
    const y = extent.north - (j + 0.5) * my;
    const hsRow = hs ? Math.floor((hs.bounds.north - y) * hsY) : -1;
    const layerRow = r ? r.height - 1 - Math.floor((y - r.yllM) / r.cellSizeM) : -1;
    for (let i = 0; i < widthPx; i++) {
      const x = extent.west + (i + 0.5) * mx;
      // Relief: the hillshade's grey, lightened so that the classes and lines stay readable over it.
      let shade = 1;
      if (hs && hsRow >= 0 && hsRow < hs.height) {
        const hsCol = Math.floor((x - hs.bounds.west) * hsX);
        if (hsCol >= 0 && hsCol < hs.width) shade = hs.data[(hsRow * hs.width + hsCol) * 4]! / 255;
      }
      let red = 120 + 135 * shade;
      let green = red;
      let blue = red;
      if (r && layerRow >= 0 && layerRow < r.height) {
        const col = Math.floor((x - r.xllM) / r.cellSizeM);
        if (col >= 0 && col < r.width) {
          const index = layerRow * r.width + col;
          const cls = layer.mask && layer.mask[index] === 0 ? undefined : lut[r.codes[index]!];
          if (cls?.rgb) {
            const rgb = cls.hatched && (i + j) % 7 === 0 ? HATCH : cls.rgb;
            const light = 0.82 + 0.18 * shade;
            red = rgb[0] * light;
            green = rgb[1] * light;
            blue = rgb[2] * light;
          }
        }
      }
      // pngjs takes RGBA in `data` whatever colour type it writes.
      const o = (j * widthPx + i) * 4;
      out[o] = red;
      out[o + 1] = green;
      out[o + 2] = blue;
      out[o + 3] = 255;
    }
  }
  // One fixed filter and a middling level: the adaptive five-filter search at level 9 took most of the time.
  return PNG.sync.write(png, { colorType: 2, filterType: 1, deflateLevel: 6 });
}
