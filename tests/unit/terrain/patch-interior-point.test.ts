import { patchInteriorPoint, squaredEdgeDistances } from '@/shared/terrain/patch-interior-point';

/** A mask from rows of '#' (in) and '.' (out). */
const maskOf = (rows: string[]) => ({
  mask: Uint8Array.from(rows.join('').split(''), (ch) => (ch === '#' ? 1 : 0)),
  width: rows[0]!.length,
  height: rows.length,
});

/** Brute force: for every in-cell, the distance to the nearest out-cell (padding included), in cells. */
function bruteDistances(mask: Uint8Array, width: number, height: number): Float64Array {
  const d = new Float64Array(width * height);
  for (let r = 0; r < height; r++)
    for (let c = 0; c < width; c++) {
      if (mask[r * width + c] === 0) continue;
      let best = Infinity;
      for (let rr = -1; rr <= height; rr++)
        for (let cc = -1; cc <= width; cc++) {
          const out = rr < 0 || rr >= height || cc < 0 || cc >= width || mask[rr * width + cc] === 0;
          if (out) best = Math.min(best, Math.hypot(rr - r, cc - c));
        }
      d[r * width + c] = best;
    }
  return d;
}

describe('patchInteriorPoint', () => {
  it('puts a C-shaped patch’s point inside it, where the centroid falls outside', () => {
    // Regression for blind-area links landing on seen ground: the centroid of a non-convex patch is not in it.
    const { mask, width, height } = maskOf([
      '..........',
      '.#######..',
      '.#######..',
      '.##.......',
      '.##.......',
      '.##.......',
      '.##.......',
      '.#######..',
      '.#######..',
      '..........',
    ]);
    let n = 0;
    let sc = 0;
    let sr = 0;
    mask.forEach((m, i) => {
      if (m) {
        n++;
        sc += i % width;
        sr += Math.floor(i / width);
      }
    });
    const centroidCell = Math.round(sr / n) * width + Math.round(sc / n);
    expect(mask[centroidCell]).toBe(0); // the centroid is on ground outside the patch
    const p = patchInteriorPoint(mask, width, height)!;
    expect(mask[p.row * width + p.col]).toBe(1);
  });

  it('puts a U-shaped patch’s point inside it', () => {
    const { mask, width, height } = maskOf(['##....##', '##....##', '##....##', '##....##', '########', '########']);
    const p = patchInteriorPoint(mask, width, height)!;
    expect(mask[p.row * width + p.col]).toBe(1);
    expect(p.edgeDistanceCells).toBeGreaterThanOrEqual(1);
  });

  it('finds the middle of a square block, 3 cells from the nearest outside cell', () => {
    // Source: common practice, no source — the Euclidean distance from the middle of a 5 × 5 block to the ring around it is 3 cells.
    const { mask, width, height } = maskOf(['.......', '.#####.', '.#####.', '.#####.', '.#####.', '.#####.', '.......']);
    expect(patchInteriorPoint(mask, width, height)).toEqual({ col: 3, row: 3, edgeDistanceCells: 3 });
  });

  it('counts the grid’s edge as the patch’s edge', () => {
    const { mask, width, height } = maskOf(['###', '###', '###']);
    expect(patchInteriorPoint(mask, width, height)).toEqual({ col: 1, row: 1, edgeDistanceCells: 2 });
  });

  it('agrees with brute force on the farthest distance for random patches', () => {
    // Source: Felzenszwalb & Huttenlocher (2012) — the transform is exact; checked here against the definition.
    let seed = 7;
    const rand = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    for (let t = 0; t < 25; t++) {
      const width = 3 + Math.floor(rand() * 12);
      const height = 3 + Math.floor(rand() * 12);
      const mask = Uint8Array.from({ length: width * height }, () => (rand() < 0.7 ? 1 : 0));
      const p = patchInteriorPoint(mask, width, height);
      const brute = bruteDistances(mask, width, height);
      const max = Math.max(...brute);
      if (max === 0) {
        expect(p).toBeNull();
        continue;
      }
      expect(p!.edgeDistanceCells).toBeCloseTo(max, 12);
      expect(brute[p!.row * width + p!.col]).toBeCloseTo(max, 12);
    }
  });

  it('agrees with brute force on wider masks (several column blocks and a remainder)', () => {
    // Source: Felzenszwalb & Huttenlocher (2012), as above; widths 17–44 span the first pass's blocks of 8 columns.
    let seed = 11;
    const rand = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    for (let t = 0; t < 6; t++) {
      const width = 17 + Math.floor(rand() * 28);
      const height = 5 + Math.floor(rand() * 20);
      const mask = Uint8Array.from({ length: width * height }, () => (rand() < 0.85 ? 1 : 0));
      const p = patchInteriorPoint(mask, width, height);
      const brute = bruteDistances(mask, width, height);
      const max = Math.max(...brute);
      expect(max).toBeGreaterThan(1);
      expect(p!.edgeDistanceCells).toBeCloseTo(max, 12);
      expect(brute[p!.row * width + p!.col]).toBeCloseTo(max, 12);
    }
  });

  it('answers null for an empty mask, refuses a mask of the wrong size, and does not change its input', () => {
    expect(patchInteriorPoint(new Uint8Array(4), 2, 2)).toBeNull();
    expect(() => patchInteriorPoint(new Uint8Array(5), 2, 2)).toThrow(/width × height/);
    const { mask, width, height } = maskOf(['.#.', '###', '.#.']);
    const copy = mask.slice();
    patchInteriorPoint(mask, width, height);
    expect(mask).toEqual(copy);
  });
});

/** 8-connected patches of a mask, as lists of cell indices (flood fill written plainly, for the test). */
function patchesOf(mask: Uint8Array, width: number, height: number): number[][] {
  const seen = new Uint8Array(mask.length);
  const patches: number[][] = [];
  for (let start = 0; start < mask.length; start++) {
    if (mask[start] === 0 || seen[start] === 1) continue;
    const cells: number[] = [];
    const stack = [start];
    seen[start] = 1;
    while (stack.length > 0) {
      const i = stack.pop()!;
      cells.push(i);
      const r = Math.floor(i / width);
      const c = i % width;
      for (let dr = -1; dr <= 1; dr++)
        for (let dc = -1; dc <= 1; dc++) {
          const rr = r + dr;
          const cc = c + dc;
          if (rr < 0 || rr >= height || cc < 0 || cc >= width) continue;
          const j = rr * width + cc;
          if (mask[j] === 1 && seen[j] === 0) {
            seen[j] = 1;
            stack.push(j);
          }
        }
    }
    patches.push(cells);
  }
  return patches;
}

describe('squaredEdgeDistances', () => {
  it('gives every patch of a many-patch mask the distances it has alone (other patches counted as outside)', () => {
    // Source: the definition of the Euclidean distance transform, checked by brute force on each patch alone;
    // the property itself (a nearer outside cell in another patch would join the two patches) is derived in
    // squaredEdgeDistances' comment — common practice, no source.
    let seed = 23;
    const rand = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    let patchesChecked = 0;
    for (let t = 0; t < 12; t++) {
      const width = 10 + Math.floor(rand() * 30);
      const height = 10 + Math.floor(rand() * 30);
      // Near the percolation threshold: many patches, some large and ragged, some touching only at corners.
      const mask = Uint8Array.from({ length: width * height }, () => (rand() < 0.45 ? 1 : 0));
      const all = squaredEdgeDistances(mask, width, height);
      for (const cells of patchesOf(mask, width, height)) {
        const alone = new Uint8Array(mask.length);
        for (const i of cells) alone[i] = 1;
        const brute = bruteDistances(alone, width, height);
        for (const i of cells) {
          const r = Math.floor(i / width);
          const c = i % width;
          expect(Math.sqrt(all[(r + 1) * (width + 2) + c + 1]!)).toBeCloseTo(brute[i]!, 12);
        }
        patchesChecked++;
      }
      // Outside the mask, and on the padding, the distance is 0.
      expect(
        all.filter((_, i) => {
          const r = Math.floor(i / (width + 2)) - 1;
          const c = (i % (width + 2)) - 1;
          const inside = r >= 0 && r < height && c >= 0 && c < width && mask[r * width + c] === 1;
          return !inside && _ !== 0;
        }),
      ).toHaveLength(0);
    }
    expect(patchesChecked).toBeGreaterThan(100);
  });
});
