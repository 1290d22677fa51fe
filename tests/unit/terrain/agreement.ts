/**
 * Comparison statistics between two hidden-height rasters (test helper).
 */
export interface Agreement {
  /** Cells compared. */
  readonly cells: number;
  /** Share of cells (0–1) on which both agree whether a target of each height is seen. */
  readonly seenAgreement: (targetHeight: number) => number;
  /** Median |a − b| over cells hidden (> 1 mm) in the reference `b`, metres. */
  readonly medianErrorHidden: number;
  /** 95th percentile of |a − b| over cells hidden in `b`, metres. */
  readonly p95ErrorHidden: number;
}

/**
 * Compares `a` with the reference `b` (both hidden heights in metres, same
 * layout), leaving out NaN cells and cells within `exclusionRadius` cells of
 * the post. "Seen" for a target of height h means hidden ≤ h + 1 mm.
 */
export function compareHiddenHeights(
  a: Float32Array,
  b: Float32Array,
  width: number,
  post: { col: number; row: number },
  exclusionRadius = 0,
): Agreement {
  const indices: number[] = [];
  for (let i = 0; i < b.length; i++) {
    const col = i % width;
    const row = (i - col) / width;
    if (Math.hypot(col - post.col, row - post.row) <= exclusionRadius) continue;
    if (Number.isNaN(a[i]) || Number.isNaN(b[i])) continue;
    indices.push(i);
  }
  const tolerance = 0.001; // metres; common practice, no source
  const errors = indices
    .filter((i) => (b[i] as number) > tolerance)
    .map((i) => Math.abs((a[i] as number) - (b[i] as number)))
    .sort((x, y) => x - y);
  const quantile = (q: number): number => (errors.length === 0 ? 0 : (errors[Math.floor(q * (errors.length - 1))] as number));
  return {
    cells: indices.length,
    seenAgreement: (h) => {
      let same = 0;
      for (const i of indices) if ((a[i] as number) <= h + tolerance === (b[i] as number) <= h + tolerance) same++;
      return same / indices.length;
    },
    medianErrorHidden: quantile(0.5),
    p95ErrorHidden: quantile(0.95),
  };
}
