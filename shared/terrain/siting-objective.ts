// Over 300 lines: the bitset and sparse-cell kernels of the siting objective, each small, kept beside the one objective they serve.
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';

/*
 * The objective of tower siting, on bitsets: a cell index runs over every
 * grid cell of every condition considered (condition c, grid cell g →
 * c × width × height + g), so one option's view under all conditions is one
 * bitset (bit i in word i >>> 5, bit i & 31) and the objective is the sum
 * over conditions. Weights are per cell (0 = not counted: outside the site,
 * no data).
 */

/** A post's view for the objective: the cells it counts (seen within its sector and range) and where it stands. */
export interface SitingView {
  /** Cells it sees, as a bitset over the objective's cells. */
  readonly seen: Uint32Array;
  /** The post's cell (column, row; row 0 = north), for bearings. */
  readonly col: number;
  readonly row: number;
}

/** The objective: weighted cells seen by at least one post, or by two whose bearings cross well. */
export interface SitingObjective {
  /** Number of cells (conditions × grid width × height). */
  readonly cellCount: number;
  /** Grid width and height, cells (a bearing needs a cell's column and row). */
  readonly width: number;
  readonly height: number;
  /** Weight of each cell, ≥ 0 (0 = not counted), length `cellCount`. */
  readonly weights: Float32Array;
  /** 1: seen by at least one post; 2: by two posts whose bearings cross within the usable band. */
  readonly minPosts: 1 | 2;
  /** Least crossing angle of a good cross-bearing, radians; default π/6 (30°), as `crossBearingQuality`. */
  readonly minCrossingAngle?: number;
}

const ANGLE_TOLERANCE = 1e-9; // radians, as crossBearingQuality; common practice, no source

/** Words of a bitset of `cellCount` cells. */
export const bitsetWords = (cellCount: number) => (cellCount + 31) >>> 5;

/** A bitset with the cells where `pick(i)` holds. */
export function bitsetOf(cellCount: number, pick: (i: number) => boolean): Uint32Array {
  const bits = new Uint32Array(bitsetWords(cellCount));
  for (let i = 0; i < cellCount; i++) if (pick(i)) bits[i >>> 5]! |= 1 << (i & 31);
  return bits;
}

/** Set bits of a 32-bit word (the classic SWAR count; Warren, "Hacker's Delight", 2nd ed., §5-1). */
function popcount(x: number): number {
  x -= (x >>> 1) & 0x55555555;
  x = (x & 0x33333333) + ((x >>> 2) & 0x33333333);
  x = (x + (x >>> 4)) & 0x0f0f0f0f;
  return Math.imul(x, 0x01010101) >>> 24;
}

const uniformCache = new WeakMap<Float32Array, Float32Array>();

/**
 * Per word of 32 cells, their common weight when all 32 share one, else NaN
 * (kept per weights array): most words lie wholly inside or outside a zone,
 * and their weighted count is then one popcount.
 */
function uniformWeights(weights: Float32Array): Float32Array {
  let uniform = uniformCache.get(weights);
  if (uniform) return uniform;
  uniform = new Float32Array(bitsetWords(weights.length)).fill(NaN);
  for (let w = 0; (w << 5) + 32 <= weights.length; w++) {
    const first = weights[w << 5]!;
    let same = true;
    for (let k = 1; k < 32 && same; k++) same = weights[(w << 5) + k] === first;
    if (same) uniform[w] = first;
  }
  uniformCache.set(weights, uniform);
  return uniform;
}

const nonZeroCache = new WeakMap<Uint32Array, Int32Array>();
let scratch = new Int32Array(0);

/**
 * The indices of the words of `bits` with any cell set (kept per bitset): a
 * post sees a small part of a large site, and a gain only needs its words.
 */
export function nonZeroWords(bits: Uint32Array): Int32Array {
  let words = nonZeroCache.get(bits);
  if (words) return words;
  if (scratch.length < bits.length) scratch = new Int32Array(bits.length);
  let n = 0;
  let w = 0;
  // Four words at a time: most of a large site is outside one post's view.
  for (; w + 4 <= bits.length; w += 4) {
    if ((bits[w]! | bits[w + 1]! | bits[w + 2]! | bits[w + 3]!) === 0) continue;
    for (let k = w; k < w + 4; k++) if (bits[k] !== 0) scratch[n++] = k;
  }
  for (; w < bits.length; w++) if (bits[w] !== 0) scratch[n++] = w;
  words = scratch.slice(0, n);
  nonZeroCache.set(bits, words);
  return words;
}

/**
 * `total` plus the weights of the cells set in `word` (word `w` of a bitset),
 * added one by one in cell order; `same` is their one weight, NaN when they
 * differ (then one popcount does). A plain function, no closure: it is the
 * inner step of the kernels below.
 */
function addWordWeights(total: number, word: number, w: number, same: number, weights: Float32Array): number {
  if (!Number.isNaN(same)) return total + same * popcount(word);
  while (word !== 0) {
    const low = word & -word;
    total += weights[(w << 5) + 31 - Math.clz32(low)]!;
    word ^= low;
  }
  return total;
}

/**
 * Sum of the weights of the cells in `bits` and not in `minus` (null: none
 * taken out). `bits` must not change after its first use here (its non-zero
 * words are remembered); `minus` may.
 */
export function weightOf(bits: Uint32Array, weights: Float32Array, minus: Uint32Array | null = null): number {
  const uniform = uniformWeights(weights);
  const words = nonZeroWords(bits);
  let total = 0;
  for (let k = 0; k < words.length; k++) {
    const w = words[k]!;
    const word = bits[w]! & ~(minus === null ? 0 : minus[w]!);
    if (word !== 0) total = addWordWeights(total, word, w, uniform[w]!, weights);
  }
  return total;
}

/** Some cells as a sparse bitset: the indices of its non-zero words (ascending) and those words. */
export interface SparseCells {
  readonly words: Int32Array;
  readonly bits: Uint32Array;
}

/** The cells of `seen` in none of `covers` (full bitsets), as a sparse bitset. */
export function cellsNotIn(seen: Uint32Array, covers: readonly Uint32Array[]): SparseCells {
  const words = nonZeroWords(seen);
  const at = new Int32Array(words.length);
  const bits = new Uint32Array(words.length);
  let n = 0;
  for (let k = 0; k < words.length; k++) {
    const w = words[k]!;
    let word = seen[w]!;
    for (let j = 0; j < covers.length && word !== 0; j++) word &= ~covers[j]![w]!;
    if (word === 0) continue;
    at[n] = w;
    bits[n++] = word;
  }
  return { words: at.slice(0, n), bits: bits.slice(0, n) };
}

/** The cells of `bits` not in `minus`, as a sparse bitset (every word looked at; neither is remembered). */
export function sparseCells(bits: Uint32Array, minus: Uint32Array): SparseCells {
  let n = 0;
  for (let w = 0; w < bits.length; w++) if ((bits[w]! & ~minus[w]!) !== 0) n++;
  const words = new Int32Array(n);
  const kept = new Uint32Array(n);
  n = 0;
  for (let w = 0; w < bits.length; w++) {
    const word = bits[w]! & ~minus[w]!;
    if (word === 0) continue;
    words[n] = w;
    kept[n++] = word;
  }
  return { words, bits: kept };
}

/** Sum of the weights of the cells of `cells` that are also in `within` (a full bitset; null: all). */
export function weightOfSparse(cells: SparseCells, weights: Float32Array, within: Uint32Array | null = null): number {
  const uniform = uniformWeights(weights);
  const { words, bits } = cells;
  let total = 0;
  for (let k = 0; k < words.length; k++) {
    const w = words[k]!;
    const word = bits[k]! & (within === null ? -1 : within[w]!);
    if (word !== 0) total = addWordWeights(total, word, w, uniform[w]!, weights);
  }
  return total;
}

/** For each word of the objective's cells, the bitsets (by their index in the list given) with any cell in it. */
export interface WordIndex {
  /** Entries of word w: `entries[offsets[w]]` up to `entries[offsets[w + 1]]`. */
  readonly offsets: Int32Array;
  readonly entries: Int32Array;
  /** The bitset's word at each entry (read in order, not from 300 places). */
  readonly bits: Uint32Array;
}

const INDEX_BLOCK = 2048; // words; common practice (cache blocking), no source

/** The word index of these bitsets (all of one objective). */
export function wordIndexOf(bitsets: readonly Uint32Array[]): WordIndex {
  const length = bitsets[0]?.length ?? 0;
  const offsets = new Int32Array(length + 1);
  for (const bits of bitsets) {
    const words = nonZeroWords(bits);
    for (let k = 0; k < words.length; k++) offsets[words[k]! + 1]!++;
  }
  for (let w = 0; w < length; w++) offsets[w + 1]! += offsets[w]!;
  const entries = new Int32Array(offsets[length]!);
  const entryBits = new Uint32Array(offsets[length]!);
  const next = offsets.slice(0, length);
  // A block of words at a time, so the writes stay within a few hundred kB.
  const cursor = new Int32Array(bitsets.length);
  for (let end = INDEX_BLOCK; end < length + INDEX_BLOCK; end += INDEX_BLOCK) {
    for (let i = 0; i < bitsets.length; i++) {
      const bits = bitsets[i]!;
      const words = nonZeroWords(bits);
      let k = cursor[i]!;
      for (; k < words.length && words[k]! < end; k++) {
        const w = words[k]!;
        const at = next[w]!++;
        entries[at] = i;
        entryBits[at] = bits[w]!;
      }
      cursor[i] = k;
    }
  }
  return { offsets, entries, bits: entryBits };
}

/**
 * For every bitset of the index, the weight of its cells among `cells`, added
 * to `out[i]` (one walk of `cells`' words; only the bitsets with a cell in a
 * word are visited there).
 */
export function addSharedWeights(
  cells: SparseCells,
  index: WordIndex,
  weights: Float32Array,
  out: Float64Array,
  sign: 1 | -1 = 1,
): void {
  const uniform = uniformWeights(weights);
  const { offsets, entries } = index;
  for (let k = 0; k < cells.words.length; k++) {
    const w = cells.words[k]!;
    const mine = cells.bits[k]!;
    const same = uniform[w]!;
    const last = offsets[w + 1]!;
    if (!Number.isNaN(same)) {
      const weight = sign * same;
      for (let e = offsets[w]!; e < last; e++) {
        const word = mine & index.bits[e]!;
        if (word !== 0) out[entries[e]!]! += weight * popcount(word);
      }
      continue;
    }
    for (let e = offsets[w]!; e < last; e++) {
      const i = entries[e]!;
      let word = mine & index.bits[e]!;
      if (word === 0) continue;
      let sum = 0;
      while (word !== 0) {
        const low = word & -word;
        sum += weights[(w << 5) + 31 - Math.clz32(low)]!;
        word ^= low;
      }
      out[i]! += sign * sum;
    }
  }
}

/**
 * What a set of posts has reached so far, built up one post at a time: the
 * cells covered (seen by one, or well cross-bearing) and the posts in it.
 * Adding a post never removes a covered cell, so the objective is monotone.
 */
export class SitingState {
  /** Cells counted as covered. */
  readonly covered: Uint32Array;
  /** With two posts needed: cells seen by any post of the set (only there can a new post make a pair). */
  private readonly seenByAny: Uint32Array | null;
  /** Posts in the set, in the order added. */
  readonly views: SitingView[] = [];
  /** Weighted cells covered. */
  total = 0;

  constructor(readonly objective: SitingObjective) {
    if (objective.weights.length !== objective.cellCount) {
      throw new TerrainInputError('invalid-layer', 'One weight per cell is needed.', 'weights');
    }
    this.covered = new Uint32Array(bitsetWords(objective.cellCount));
    this.seenByAny = objective.minPosts === 2 ? new Uint32Array(bitsetWords(objective.cellCount)) : null;
  }

  /** A copy to try additions on. */
  clone(): SitingState {
    const copy = new SitingState(this.objective);
    copy.covered.set(this.covered);
    if (this.seenByAny) copy.seenByAny!.set(this.seenByAny);
    copy.views.push(...this.views);
    copy.total = this.total;
    return copy;
  }

  /** Weighted cells the post would add. */
  gain(view: SitingView): number {
    if (this.objective.minPosts === 1) return weightOf(view.seen, this.objective.weights, this.covered);
    return this.crossGain(view, false);
  }

  /** Adds the post; returns its gain. */
  add(view: SitingView): number {
    let gain: number;
    if (this.objective.minPosts === 1) {
      gain = weightOf(view.seen, this.objective.weights, this.covered);
      const words = nonZeroWords(view.seen);
      for (let k = 0; k < words.length; k++) this.covered[words[k]!]! |= view.seen[words[k]!]!;
    } else {
      gain = this.crossGain(view, true);
      const words = nonZeroWords(view.seen);
      for (let k = 0; k < words.length; k++) this.seenByAny![words[k]!]! |= view.seen[words[k]!]!;
    }
    this.views.push(view);
    this.total += gain;
    return gain;
  }

  /**
   * ≥ 2 posts with good cross-bearings: a cell becomes covered when the new
   * post sees it and so does a post of the set whose bearing line to the cell
   * crosses the new one's at q = min(θ, π − θ) ≥ the band limit — the same
   * pairwise test as `crossBearingQuality` (|sin θ| from the cross product;
   * the post's own cell has no bearing). Only pairs with the new post can
   * make new good cells, so the gain is exact.
   */
  private crossGain(view: SitingView, write: boolean): number {
    const { weights, width, height } = this.objective;
    const gridCells = width * height;
    const goodFrom = (this.objective.minCrossingAngle ?? Math.PI / 6) - ANGLE_TOLERANCE;
    // sin² of the band limit, with a margin: clearly above or below it needs no arcsine; near it,
    // the arcsine decides as crossBearingQuality's does.
    const sin2 = Math.sin(goodFrom) ** 2;
    const surelyGood = goodFrom <= 0 ? -Infinity : goodFrom >= Math.PI / 2 ? Infinity : sin2 + 1e-9;
    const surelyNot = goodFrom <= 0 ? -Infinity : sin2 - 1e-9;
    const seenByAny = this.seenByAny!;
    const others = this.views;
    let gain = 0;
    const words = nonZeroWords(view.seen);
    for (let k = 0; k < words.length; k++) {
      const w = words[k]!;
      // Only cells a post of the set sees can pair with the new one.
      let word = view.seen[w]! & ~this.covered[w]! & seenByAny[w]!;
      while (word !== 0) {
        const low = word & -word;
        word ^= low;
        const i = (w << 5) + 31 - Math.clz32(low);
        const weight = weights[i]!;
        if (weight === 0) continue;
        const g = i % gridCells;
        const col = g % width;
        const row = (g - col) / width;
        const ax = col - view.col;
        const ay = view.row - row;
        const la = ax * ax + ay * ay;
        if (la === 0) continue;
        for (const other of others) {
          if ((other.seen[w]! & low) === 0) continue;
          const bx = col - other.col;
          const by = other.row - row;
          const lb = bx * bx + by * by;
          if (lb === 0) continue;
          const cross = ax * by - ay * bx;
          const s = (cross * cross) / (la * lb);
          if (s >= surelyGood || (s > surelyNot && Math.asin(Math.sqrt(s > 1 ? 1 : s)) >= goodFrom)) {
            gain += weight;
            if (write) this.covered[w]! |= low;
            break;
          }
        }
      }
    }
    return gain;
  }
}

/** The objective of a set of posts (added in the given order; the total does not depend on it). */
export function objectiveOf(objective: SitingObjective, views: readonly SitingView[]): number {
  const state = new SitingState(objective);
  for (const view of views) state.add(view);
  return state.total;
}
