import { render, screen } from '@testing-library/react';
import { POSTS_PER_CELL_PALETTE } from '@/components/map/class-palettes';
import { ClassRasterOverlay } from '@/components/map/class-raster-overlay';
import { ReadoutBar } from '@/components/map/map-chrome';
import { ClassLegend } from '@/components/map/map-legend';
import { createReadoutStore } from '@/components/map/readout-store';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import { encodeClassRaster } from '@/shared/terrain/encode-class-raster';
import { COVERAGE_LAYER } from '@/shared/terrain/posts-per-cell';

// A synthetic coverage layer (invented): 6 × 4 cells of 50 m, the north row "3+ posts",
// one "2 posts" cell in the south-east corner, no data in the west column of row 2, the rest unseen.
const { unseen, twoPosts, threeOrMorePosts, noData } = COVERAGE_LAYER;
const grid = { width: 6, height: 4, cellSize: 50, xll: 500_000, yll: 5_700_000, crs: { epsg: 32633, wkt: null } };
const codes = new Uint8Array(24).fill(unseen);
codes.fill(threeOrMorePosts, 0, 6);
codes[2 * 6] = noData;
codes[23] = twoPosts;
const raster = encodeClassRaster(grid, codes);

/** jsdom has no canvas: a 2D context that keeps what is painted, and a fixed PNG address. */
let painted: ImageData | null = null;
beforeEach(() => {
  painted = null;
  jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockImplementation(function (this: HTMLCanvasElement) {
    return {
      createImageData: (w: number, h: number) => ({ width: w, height: h, data: new Uint8ClampedArray(w * h * 4) }),
      putImageData: (image: ImageData) => {
        painted = image;
      },
    } as unknown as CanvasRenderingContext2D;
  } as unknown as typeof HTMLCanvasElement.prototype.getContext);
  jest.spyOn(HTMLCanvasElement.prototype, 'toDataURL').mockReturnValue('data:image/png;base64,TEST');
});
afterEach(() => jest.restoreAllMocks());

describe('ClassRasterOverlay (web)', () => {
  // 0.1 px a metre, centred on the raster's middle (500 150, 5 700 100) in a 400 × 300 view:
  // its 300 m × 200 m span is 30 × 20 px, with the north-west corner at (200 − 15, 150 − 10).
  const camera = { centerX: 500_150, centerY: 5_700_100, pxPerM: 0.1 };
  const size = { width: 400, height: 300 };

  it('decodes the raster, paints one pixel per cell with row 0 (north) on top, and lays the picture over its grid rectangle', () => {
    const { container } = render(
      <ClassRasterOverlay
        raster={raster}
        values={decodeClassRaster(raster)}
        palette={POSTS_PER_CELL_PALETTE}
        camera={camera}
        size={size}
      />,
    );
    const img = container.querySelector('img[data-layer="posts-per-cell"]') as HTMLImageElement;
    expect(img).not.toBeNull();
    expect(img.getAttribute('src')).toBe('data:image/png;base64,TEST');
    expect(img.style.left).toBe('185px');
    expect(img.style.top).toBe('140px');
    expect(img.style.width).toBe('30px');
    expect(img.style.height).toBe('20px');
    expect(img.style.imageRendering).toBe('pixelated');

    expect(painted).not.toBeNull();
    const image = painted!;
    expect([image.width, image.height]).toEqual([6, 4]);
    const px = (col: number, row: number) => Array.from(image.data.slice((row * 6 + col) * 4, (row * 6 + col) * 4 + 4));
    const alpha = Math.round(POSTS_PER_CELL_PALETTE.opacity * 255);
    expect(px(0, 0)).toEqual([0x1b, 0x3a, 0x6b, alpha]); // north row: 3+ posts (deep blue)
    expect(px(5, 0)).toEqual([0x1b, 0x3a, 0x6b, alpha]);
    expect(px(0, 1)).toEqual([0xe6, 0x9f, 0x2e, alpha]); // unseen (amber)
    expect(px(0, 2)[3]).toBe(0); // no data: transparent
    expect(px(5, 3)).toEqual([0x4f, 0x86, 0xc0, alpha]); // south-east: 2 posts
  });

  it('moves with the camera: twice the zoom, twice the size, about the view centre', () => {
    const { container } = render(
      <ClassRasterOverlay
        raster={raster}
        values={decodeClassRaster(raster)}
        palette={POSTS_PER_CELL_PALETTE}
        camera={{ ...camera, pxPerM: 0.2 }}
        size={size}
      />,
    );
    const img = container.querySelector('img') as HTMLImageElement;
    expect([img.style.left, img.style.top, img.style.width, img.style.height]).toEqual(['170px', '130px', '60px', '40px']);
  });
});

describe('ClassLegend', () => {
  it('names every class of the layer, with its meaning, and says which are not tinted', () => {
    render(<ClassLegend palette={POSTS_PER_CELL_PALETTE} />);
    const list = screen.getByRole('list', { name: 'Legend: Posts that see the target' });
    const items = list.querySelectorAll('[role="listitem"]');
    expect(items).toHaveLength(POSTS_PER_CELL_PALETTE.classes.length);
    for (const label of ['No post', '1 post', '2 posts', '3 or more posts', 'No terrain data (not tinted)']) {
      expect(screen.getByText(label)).toBeTruthy();
    }
    expect(screen.getByText('Two posts see it: a cross-bearing is possible.')).toBeTruthy();
  });
});

describe('ReadoutBar', () => {
  it('says the tapped position in the chosen format and the layer’s class there', async () => {
    const store = createReadoutStore();
    const { findByText } = render(<ReadoutBar store={store} format="dd" onFormat={() => {}} />);
    store.set({ kind: 'tap', point: { latDeg: 51.5, lonDeg: 15.25 }, layerClass: 'Posts that see the target: 2 posts' });
    expect(await findByText('51.50000, 15.25000')).toBeTruthy();
    expect(await findByText('Posts that see the target: 2 posts')).toBeTruthy();
    expect(screen.getByText('Tapped point')).toBeTruthy();
    expect(screen.getByRole('radio', { name: 'Decimal degrees' }).getAttribute('aria-checked')).toBe('true');
  });
});
