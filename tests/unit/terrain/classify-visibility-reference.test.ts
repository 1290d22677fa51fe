import { computeHiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { classifyVisibility, VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';

// classifyVisibility against a cell-by-cell statement of its contract (the classes' definitions in
// visibility-classes.ts): out of range beyond the circle (Euclidean distance in cells), none for NaN,
// seen at ≤ tolerance, target only at ≤ target height + tolerance, else blind. Common practice, no source.
function reference(
  values: Float32Array,
  W: number,
  target: number,
  tolerance: number,
  limit: { col: number; row: number; maxCells: number } | null,
): Uint8Array {
  const out = new Uint8Array(values.length);
  for (let i = 0; i < values.length; i++) {
    const col = i % W;
    const row = (i - col) / W;
    const v = values[i] as number;
    if (limit !== null && (limit.maxCells <= 0 || (col - limit.col) ** 2 + (row - limit.row) ** 2 > limit.maxCells ** 2))
      out[i] = VISIBILITY_CLASS.outOfRange;
    else if (Number.isNaN(v)) out[i] = VISIBILITY_CLASS.none;
    else if (v <= tolerance) out[i] = VISIBILITY_CLASS.seen;
    else if (v <= target + tolerance) out[i] = VISIBILITY_CLASS.targetOnly;
    else out[i] = VISIBILITY_CLASS.blind;
  }
  return out;
}

describe('classifyVisibility cell by cell', () => {
  const terrain = generateSyntheticTerrain({ width: 150, height: 110, seed: 17 });
  const post = { col: 60, row: 50, eyeHeight: 12 };
  const hidden = computeHiddenHeightRaster(terrain, post, { maxDistance: 2_500 });
  // Exact class edges and NaN on purpose.
  hidden.hidden[10] = 0.001;
  hidden.hidden[11] = 30.001;
  hidden.hidden[12] = NaN;
  hidden.hidden[13] = 0;

  test.each([
    { target: 30, range: null },
    { target: 30, range: 40 * 25 },
    { target: 0, range: 75.5 * 25 },
    { target: 5, range: 0 },
    { target: 12, range: 1e9 },
  ])('target $target m, range $range m', ({ target, range }) => {
    const options = range === null ? {} : { rangeLimit: { col: post.col, row: post.row, maxDistance: range } };
    const classes = classifyVisibility(hidden, target, options).classes;
    const expected = reference(
      hidden.hidden,
      terrain.width,
      target,
      0.001,
      range === null ? null : { col: post.col, row: post.row, maxCells: range / terrain.cellSize },
    );
    let differing = 0;
    for (let i = 0; i < classes.length; i++) if (classes[i] !== expected[i]) differing++;
    expect(differing).toBe(0);
    const kinds = new Set(classes);
    expect(kinds.size).toBeGreaterThanOrEqual(range === 0 ? 1 : 3); // the comparison covers several classes
  });
});
