import { CROSS_BEARING_PALETTE, POST_VISIBILITY_PALETTE, POSTS_PER_CELL_PALETTE } from '@/components/map/class-palettes';
import { coverageLayersOf } from '@/components/map/coverage-run-layers';
import { coverageKeys } from '@/components/data/coverage';
import { EncodedClassRasterSchema } from '@/shared/schemas/coverage';
import { encodeClassRaster } from '@/shared/terrain/encode-class-raster';

// An invented 2 × 1 raster.
const raster = encodeClassRaster(
  { width: 2, height: 1, cellSize: 30, xll: 500_000, yll: 5_700_000, crs: { epsg: 32633, wkt: null } },
  Uint8Array.from([1, 2]),
);

describe('a run’s map layers', () => {
  test('in chip order with their palettes; ids name the kind so a pick survives a change of case', () => {
    const layers = coverageLayersOf({
      postsPerCell: raster,
      crossBearing: raster,
      postVisibility: { raster, postName: 'Tower B' },
    });
    expect(layers.map((l) => [l.id, l.title, l.palette])).toEqual([
      ['posts-per-cell', 'Posts per cell', POSTS_PER_CELL_PALETTE],
      ['cross-bearing', 'Cross-bearings', CROSS_BEARING_PALETTE],
      ['post-visibility', 'Tower B sees', POST_VISIBILITY_PALETTE],
    ]);
  });

  test('layers not arrived yet are left out', () => {
    expect(coverageLayersOf({ postsPerCell: null, crossBearing: raster }).map((l) => l.id)).toEqual(['cross-bearing']);
    expect(coverageLayersOf({})).toEqual([]);
  });
});

describe('coverage data module', () => {
  test('the layer schema takes what the encoder writes and refuses another encoding', () => {
    expect(EncodedClassRasterSchema.parse(raster)).toEqual(raster);
    expect(EncodedClassRasterSchema.safeParse({ ...raster, format: 'png' }).success).toBe(false);
  });

  test('keys are hierarchical: a run’s layers sit under the run, every key under coverage', () => {
    const layer = coverageKeys.layer('r1', { layer: 'posts-per-cell', caseKey: 'k' });
    expect(layer.slice(0, coverageKeys.run('r1').length)).toEqual([...coverageKeys.run('r1')]);
    expect(coverageKeys.plan('p1').slice(0, 2)).toEqual([...coverageKeys.plans()]);
    expect(coverageKeys.compare({ a: 'x', b: 'y', caseKey: 'k' })[0]).toBe(coverageKeys.all[0]);
  });
});
