/**
 * Writes the demo terrain: an invented, seeded, synthetic forest district
 * (ridges, winding valleys, a few hills) as a Float32 GeoTIFF in
 * WGS 84 / UTM zone 33N (EPSG:32633) with invented coordinates.
 *
 *   node --import tsx server/scripts/generate-demo-terrain.ts [--out assets/terrain/demo-forest-district.tif]
 *        [--seed 20260] [--size 600] [--cell-size 25]
 *
 * Same options → the same file, byte for byte.
 */
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { writeGeoTiff } from '@/shared/terrain/formats/geotiff-writer';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';

const { values } = parseArgs({
  options: {
    out: { type: 'string', default: path.join(__dirname, '..', '..', 'assets', 'terrain', 'demo-forest-district.tif') },
    seed: { type: 'string', default: '20260' },
    size: { type: 'string', default: '600' },
    'cell-size': { type: 'string', default: '25' },
  },
});
const seed = Number(values.seed);
const size = Number(values.size);
const cellSize = Number(values['cell-size']);
if (!Number.isInteger(seed) || !Number.isInteger(size) || size < 2 || !(cellSize > 0)) {
  process.stderr.write('generate-demo-terrain: --seed and --size must be integers (size ≥ 2), --cell-size > 0.\n');
  process.exit(2);
}
const terrain = generateSyntheticTerrain({
  width: size,
  height: size,
  cellSize,
  seed,
  xll: 512_000,
  yll: 5_731_000,
  crs: { epsg: 32633, wkt: null },
});
writeFileSync(values.out, Buffer.from(writeGeoTiff(terrain, terrain.heights, { nodata: null })));
let low = Infinity;
let high = -Infinity;
for (const h of terrain.heights) {
  low = Math.min(low, h);
  high = Math.max(high, h);
}
process.stderr.write(
  `generate-demo-terrain: wrote ${values.out}: ${size} × ${size} cells of ${cellSize} m, seed ${seed}, ` +
    `heights ${low.toFixed(1)} … ${high.toFixed(1)} m, EPSG:32633, lower-left corner (512000, 5731000)\n`,
);
