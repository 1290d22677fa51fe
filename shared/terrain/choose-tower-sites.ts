// Over 300 lines: greedy, enumeration and the swap passes share their bookkeeping and are read together against the bound.
import {
  addSharedWeights,
  cellsNotIn,
  SitingState,
  sparseCells,
  weightOfSparse,
  wordIndexOf,
  type SitingObjective,
  type SitingView,
} from '@/shared/terrain/siting-objective';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';

/** One candidate location at one tower height, with what it would see. */
export interface SitingOption extends SitingView {
  /** Index of its location: at most one height per location is chosen. */
  readonly location: number;
  /** Tower height, metres (ties between equal gains go to the taller). */
  readonly heightM: number;
  /** Cost, in the caller's unit; 0 when costs are not given. */
  readonly cost: number;
}

/** Problems at most this large are solved exactly, by trying every set. */
export const EXACT_LIMIT = { options: 12, count: 3 } as const;

export interface ChooseTowerSitesInput {
  readonly objective: SitingObjective;
  /** Posts kept whatever is chosen (the existing ones). */
  readonly kept: readonly SitingView[];
  readonly options: readonly SitingOption[];
  /** How many new posts to choose, ≥ 1. */
  readonly count: number;
  /** Spend at most this on the chosen options (their `cost`); null = no budget. */
  readonly budget?: number | null;
  /** Stop once the objective (kept posts included) reaches this; null = choose `count`. */
  readonly goal?: number | null;
  /** `auto` (default): exact within {@link EXACT_LIMIT}, else greedy with a swap pass. */
  readonly method?: 'auto' | 'exact' | 'greedy';
  /** Run the swap pass after greedy; default true. */
  readonly swap?: boolean;
}

/** One chosen option, in the order of the coverage curve. */
export interface SitingStep {
  /** Index into `options`. */
  readonly option: number;
  /** Weighted cells it adds to those before it. */
  readonly gain: number;
  /** Objective with it and those before it (kept posts included). */
  readonly total: number;
}

export interface SitingChoice {
  readonly method: 'exact' | 'greedy' | 'greedy-swap';
  /** Objective of the kept posts alone. */
  readonly keptTotal: number;
  readonly steps: readonly SitingStep[];
  /** Objective of kept + chosen. */
  readonly total: number;
  /** Gains computed (a measure of the work). */
  readonly evaluations: number;
  /** Swaps that improved the greedy choice. */
  readonly swaps: number;
}

/** Larger gain first; then the taller tower; then the earlier option. */
function better(options: readonly SitingOption[], a: number, va: number, b: number, vb: number): boolean {
  if (va !== vb) return va > vb;
  const ha = options[a]!.heightM;
  const hb = options[b]!.heightM;
  if (ha !== hb) return ha > hb;
  return a < b;
}

const fresh = (input: ChooseTowerSitesInput) => {
  const state = new SitingState(input.objective);
  for (const view of input.kept) state.add(view);
  return state;
};

/**
 * Chooses new lookout posts among candidate locations × tower heights so that
 * the weighted area seen (by one post, or by two with good cross-bearings)
 * is largest, keeping the existing posts, choosing at most one height per
 * location and at most `count` options (fewer when the `goal` is reached,
 * the `budget` is spent, or nothing adds anything).
 *
 * Method. Small problems (≤ {@link EXACT_LIMIT}.options options and
 * `count` ≤ {@link EXACT_LIMIT}.count) are solved exactly by trying every
 * feasible set. Otherwise greedy: each round adds the option with the largest
 * gain (with a budget: gain per cost, and at the end the best single
 * affordable option if it alone does better — Khuller, Moss & Naor 1999,
 * "The budgeted maximum coverage problem", Inf. Proc. Letters 70(1)), then
 * a swap pass replaces a chosen option by an unchosen one while that raises
 * the objective (it never lowers it).
 *
 * Seen by ≥ 1 post is a weighted coverage function: monotone and submodular
 * (a post adds at most what it adds to a smaller set). Greedy for a monotone
 * submodular function under a cardinality limit reaches at least (1 − 1/e) ≈
 * 0.632 of the optimum: Nemhauser, Wolsey & Fisher 1978, "An analysis of
 * approximations for maximizing submodular set functions — I", Math.
 * Programming 14, 265–294. Submodularity also makes lazy evaluation exact
 * (a gain can only shrink, so a stale gain is an upper bound; Minoux 1978,
 * "Accelerated greedy algorithms for maximizing submodular set functions"):
 * only the option on top is recomputed each round. One height per location
 * is a partition matroid; where a taller tower sees everything a lower one
 * does (and ties go to the taller), greedy picks the tallest and the bound
 * stands as for plain cardinality; with arbitrary options the matroid bound
 * of 1/2 applies (Fisher, Nemhauser & Wolsey 1978, part II).
 *
 * Seen by ≥ 2 posts with good cross-bearings is monotone but NOT submodular
 * (a post alone adds nothing; with a partner it adds much), so neither the
 * bound nor lazy evaluation holds: every gain is recomputed each round, and a
 * round where nothing adds anything falls back to the one-post gain to pick a
 * partner. The result is a good set without a guarantee.
 *
 * Deterministic: the same input gives the same choice.
 *
 * @param input objective, kept posts, options, count, budget, goal (not modified)
 * @returns the chosen options in curve order with gains and totals
 * @throws TerrainInputError `invalid-option` for a count below 1 or a negative cost
 * @example
 * const choice = chooseTowerSites({ objective, kept: [], options, count: 3 });
 * choice.steps.map((s) => options[s.option].heightM);
 */
export function chooseTowerSites(input: ChooseTowerSitesInput): SitingChoice {
  const { options, count } = input;
  if (!Number.isInteger(count) || count < 1) {
    throw new TerrainInputError('invalid-option', `Choose at least one post, got ${count}.`, 'count');
  }
  options.forEach((o, i) => {
    if (!(o.cost >= 0)) throw new TerrainInputError('invalid-option', `Option ${i}: a cost must be ≥ 0.`, `options.${i}.cost`);
  });
  const keptTotal = fresh(input).total;
  const method = input.method ?? 'auto';
  const exact = method === 'exact' || (method === 'auto' && options.length <= EXACT_LIMIT.options && count <= EXACT_LIMIT.count);
  const counter = { evaluations: 0 };
  if (exact) {
    const set = enumerateBest(input, counter);
    const steps = curveOrder(input, set, counter);
    return {
      method: 'exact',
      keptTotal,
      steps,
      total: steps.at(-1)?.total ?? keptTotal,
      evaluations: counter.evaluations,
      swaps: 0,
    };
  }
  const alone = new Float64Array(options.length).fill(NaN);
  let set = greedy(
    input,
    options.map((_, i) => i),
    counter,
    alone,
  ).map((s) => s.option);
  let swaps = 0;
  if (input.swap !== false && set.length > 0) ({ set, swaps } = swapPass(input, set, counter, alone));
  const steps = curveOrder(input, set, counter);
  return {
    method: input.swap === false ? 'greedy' : 'greedy-swap',
    keptTotal,
    steps,
    total: steps.at(-1)?.total ?? keptTotal,
    evaluations: counter.evaluations,
    swaps,
  };
}

/** Greedy over the allowed options (lazy when the objective is submodular). */
function greedy(
  input: ChooseTowerSitesInput,
  allowed: readonly number[],
  counter: { evaluations: number },
  alone: Float64Array | null = null,
): SitingStep[] {
  const { options, count } = input;
  const budget = input.budget ?? null;
  const goal = input.goal ?? null;
  const lazy = input.objective.minPosts === 1;
  const state = fresh(input);
  const fallback = input.objective.minPosts === 2 ? freshOne(input) : null;
  const usedLocations = new Set<number>();
  const bound = new Map<number, number>(allowed.map((i) => [i, Infinity]));
  const freshIn = new Map<number, number>();
  let spent = 0;
  const steps: SitingStep[] = [];
  const eligible = (i: number) =>
    !usedLocations.has(options[i]!.location) && (budget === null || spent + options[i]!.cost <= budget + 1e-9);
  const value = (i: number, gain: number) => (budget === null ? gain : gain / Math.max(options[i]!.cost, 1e-12));

  for (let round = 0; round < count; round++) {
    if (goal !== null && state.total >= goal) break;
    let pick = -1;
    let pickGain = 0;
    if (lazy) {
      for (;;) {
        let top = -1;
        let topValue = -Infinity;
        for (const [i, b] of bound) {
          if (eligible(i) && (top === -1 || better(options, i, b, top, topValue))) {
            top = i;
            topValue = b;
          }
        }
        if (top === -1) break;
        if (freshIn.get(top) === round) {
          pick = top;
          break;
        }
        const gain = state.gain(options[top]!);
        counter.evaluations++;
        bound.set(top, value(top, gain));
        if (round === 0 && alone) alone[top] = gain;
        freshIn.set(top, round);
      }
      pickGain = pick === -1 ? 0 : state.gain(options[pick]!);
    } else {
      let pickValue = -Infinity;
      const gains = new Map<number, number>();
      for (const i of allowed) {
        if (!eligible(i)) continue;
        const gain = state.gain(options[i]!);
        counter.evaluations++;
        gains.set(i, gain);
        if (pick === -1 || better(options, i, value(i, gain), pick, pickValue)) {
          pick = i;
          pickValue = value(i, gain);
        }
      }
      pickGain = pick === -1 ? 0 : gains.get(pick)!;
      if (pick !== -1 && pickGain === 0 && fallback) {
        // Nothing makes a new good cross-bearing alone: take the best partner by one-post cover.
        let alt = -1;
        let altValue = -Infinity;
        for (const i of gains.keys()) {
          const v = value(i, fallback.gain(options[i]!));
          counter.evaluations++;
          if (alt === -1 || better(options, i, v, alt, altValue)) {
            alt = i;
            altValue = v;
          }
        }
        if (altValue <= 0) break;
        pick = alt;
      }
    }
    if (pick === -1) break;
    if (pickGain <= 0 && input.objective.minPosts === 1) break;
    const gain = state.add(options[pick]!);
    fallback?.add(options[pick]!);
    usedLocations.add(options[pick]!.location);
    spent += options[pick]!.cost;
    bound.delete(pick);
    steps.push({ option: pick, gain, total: state.total });
  }
  if (budget !== null) return bestSingleIfBetter(input, allowed, steps, counter);
  return steps;
}

/** The kept posts as a one-post-cover state (the ≥ 2 objective's fallback to pick a first partner). */
function freshOne(input: ChooseTowerSitesInput) {
  const state = new SitingState({ ...input.objective, minPosts: 1 });
  for (const view of input.kept) state.add(view);
  return state;
}

/** With a budget, the best single affordable option when it alone beats the gain-per-cost choice. */
function bestSingleIfBetter(
  input: ChooseTowerSitesInput,
  allowed: readonly number[],
  steps: SitingStep[],
  counter: { evaluations: number },
): SitingStep[] {
  const state = fresh(input);
  let best = -1;
  let bestGain = -Infinity;
  for (const i of allowed) {
    if (input.options[i]!.cost > input.budget! + 1e-9) continue;
    const gain = state.gain(input.options[i]!);
    counter.evaluations++;
    if (best === -1 || better(input.options, i, gain, best, bestGain)) {
      best = i;
      bestGain = gain;
    }
  }
  const total = steps.at(-1)?.total ?? state.total;
  if (best === -1 || state.total + bestGain <= total) return steps;
  return [{ option: best, gain: bestGain, total: state.total + bestGain }];
}

/** Objective of kept + the given options. */
function totalOf(input: ChooseTowerSitesInput, set: readonly number[], counter: { evaluations: number }): number {
  const state = fresh(input);
  for (const i of set) state.add(input.options[i]!);
  counter.evaluations += set.length;
  return state.total;
}

const feasible = (input: ChooseTowerSitesInput, set: readonly number[]) => {
  const locations = new Set(set.map((i) => input.options[i]!.location));
  if (locations.size !== set.length) return false;
  const budget = input.budget ?? null;
  return budget === null || set.reduce((sum, i) => sum + input.options[i]!.cost, 0) <= budget + 1e-9;
};

/** The best feasible set of at most `count` options, trying them all (first found wins a tie). */
function enumerateBest(input: ChooseTowerSitesInput, counter: { evaluations: number }): number[] {
  const n = input.options.length;
  let best: number[] = [];
  let bestTotal = totalOf(input, [], counter);
  const set: number[] = [];
  const visit = (from: number) => {
    if (set.length > 0 && feasible(input, set)) {
      const total = totalOf(input, set, counter);
      if (total > bestTotal + 1e-9 * Math.max(1, bestTotal)) {
        best = [...set];
        bestTotal = total;
      }
    }
    if (set.length === input.count) return;
    for (let i = from; i < n; i++) {
      set.push(i);
      visit(i + 1);
      set.pop();
    }
  };
  visit(0);
  return best;
}

/**
 * Swap pass: for each chosen option in turn, the unchosen one that raises the
 * objective most in its place (keeping one height per location and the
 * budget), until a full pass finds none or after 5 passes. Only strict gains
 * are taken, so the objective never goes down; of equal swaps, the first in
 * the order tried is taken.
 */
function swapPass(input: ChooseTowerSitesInput, start: readonly number[], counter: { evaluations: number }, alone: Float64Array) {
  return input.objective.minPosts === 1 ? swapPassCover(input, start, counter, alone) : swapPassAny(input, start, counter);
}

/** The swap pass for any objective: each candidate's total is computed in full. */
function swapPassAny(input: ChooseTowerSitesInput, start: readonly number[], counter: { evaluations: number }) {
  const { options } = input;
  const set = [...start];
  let current = totalOf(input, set, counter);
  let swaps = 0;
  for (let pass = 0; pass < 5; pass++) {
    let improved = false;
    for (let k = 0; k < set.length; k++) {
      const others = set.filter((_, j) => j !== k);
      const base = fresh(input);
      for (const i of others) base.add(options[i]!);
      const taken = new Set(others.map((i) => options[i]!.location));
      let best = -1;
      let bestTotal = current;
      for (let i = 0; i < options.length; i++) {
        if (set.includes(i) || taken.has(options[i]!.location)) continue;
        if (!feasible(input, [...others, i])) continue;
        const total = base.total + base.gain(options[i]!);
        counter.evaluations++;
        if (total > bestTotal + 1e-9 * Math.max(1, bestTotal)) {
          best = i;
          bestTotal = total;
        }
      }
      if (best !== -1) {
        set[k] = best;
        current = bestTotal;
        swaps++;
        improved = true;
      }
    }
    if (!improved) break;
  }
  return { set, swaps };
}

/**
 * The swap pass for seen by ≥ 1 post, without rebuilding the set for each
 * swap. With S the chosen set, k the option taken out and U_k the cells only
 * k covers (seen by k, by no other chosen option, by no kept post), what an
 * option i adds in k's place splits into two disjoint parts:
 *
 *   gain(i | S − k) = gain(i | S) + weight(seen_i ∩ U_k)
 *
 * gain(i | S) does not depend on k, and after a swap of k for b it follows as
 * gain(i | S − k) − weight(seen_i ∩ V_b), V_b what b adds to S − k. The
 * shared weights of every option with U_k (or V_b) come from one walk of its
 * words through an index of which options see each word. The sums are those
 * of the same cells, so the choice is the one trying every set in full gives
 * (options tried in the order of what each adds alone, the first of equal
 * swaps taken).
 */
function swapPassCover(
  input: ChooseTowerSitesInput,
  start: readonly number[],
  counter: { evaluations: number },
  knownAlone: Float64Array,
) {
  const { options } = input;
  const { weights } = input.objective;
  const seen = options.map((o) => o.seen);
  const index = wordIndexOf(seen);
  const set = [...start];
  const kept = fresh(input);
  // What each adds to the kept posts alone: greedy's first round computed most of them.
  const alone = Array.from(knownAlone, (gain, i) => {
    if (!Number.isNaN(gain)) return gain;
    counter.evaluations++;
    return kept.gain(options[i]!);
  });
  const order = options.map((_, i) => i).sort((a, b) => alone[b]! - alone[a]! || a - b);
  const tolerance = (total: number) => 1e-9 * Math.max(1, total);
  const full = kept.clone();
  for (const i of set) full.add(options[i]!);
  counter.evaluations += set.length;
  let current = full.total;
  // gain(i | S) = what i adds alone − what it shares with the cells S adds to the kept posts.
  const shared = new Float64Array(options.length);
  addSharedWeights(sparseCells(full.covered, kept.covered), index, weights, shared);
  const gainToSet = Float64Array.from(options, (_, i) => alone[i]! - shared[i]!);
  let swaps = 0;
  // Once every position has been tried on the same set without a swap, trying again changes nothing.
  let triedSinceSwap = 0;
  for (let pass = 0; pass < 5 && triedSinceSwap < set.length; pass++) {
    let improved = false;
    for (let k = 0; k < set.length && triedSinceSwap < set.length; k++) {
      triedSinceSwap++;
      const others = set.filter((_, j) => j !== k);
      const coveredByBase = [kept.covered, ...others.map((i) => seen[i]!)];
      const only = cellsNotIn(seen[set[k]!]!, coveredByBase);
      const baseTotal = current - weightOfSparse(only, weights);
      shared.fill(0);
      addSharedWeights(only, index, weights, shared);
      const taken = new Set(others.map((i) => options[i]!.location));
      let best = -1;
      let bestTotal = current;
      for (const i of order) {
        if (baseTotal + alone[i]! <= bestTotal + tolerance(bestTotal)) break;
        if (set.includes(i) || taken.has(options[i]!.location)) continue;
        if (!feasible(input, [...others, i])) continue;
        const total = baseTotal + gainToSet[i]! + shared[i]!;
        if (total > bestTotal + tolerance(bestTotal)) {
          best = i;
          bestTotal = total;
        }
      }
      if (best === -1) continue;
      const added = cellsNotIn(seen[best]!, coveredByBase);
      addSharedWeights(added, index, weights, shared, -1);
      for (let i = 0; i < options.length; i++) gainToSet[i]! += shared[i]!;
      set[k] = best;
      current = bestTotal;
      swaps++;
      triedSinceSwap = 0;
      improved = true;
    }
    if (!improved) break;
  }
  return { set, swaps };
}

/** The chosen options ordered as greedy would add them (the coverage curve), with gains and totals. */
function curveOrder(input: ChooseTowerSitesInput, set: readonly number[], counter: { evaluations: number }): SitingStep[] {
  if (set.length === 0) return [];
  const state = fresh(input);
  const left = [...set];
  const steps: SitingStep[] = [];
  while (left.length > 0) {
    let pick = -1;
    let pickGain = -Infinity;
    for (const i of left) {
      const gain = state.gain(input.options[i]!);
      counter.evaluations++;
      if (pick === -1 || better(input.options, i, gain, pick, pickGain)) {
        pick = i;
        pickGain = gain;
      }
    }
    const gain = state.add(input.options[pick]!);
    steps.push({ option: pick, gain, total: state.total });
    left.splice(left.indexOf(pick), 1);
  }
  return steps;
}
