import { COVERAGE_CHANGE } from '@/shared/terrain/coverage-difference';
import { CROSS_BEARING_CLASS } from '@/shared/terrain/cross-bearing-quality';
import { COVERAGE_LAYER } from '@/shared/terrain/posts-per-cell';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';
import { PATROL_FRACTION_CODE } from '@/shared/terrain/patrol-sweep';

/**
 * Colours and names of the coverage layers' class codes, for the map overlay,
 * its legend and the tap read-out.
 *
 * Kenning's own scheme, built on one rule so a reader learns it once:
 * **amber = nobody sees it** (blind, unseen, no bearing, coverage lost) and
 * **deeper blue (violet for bearings) = better covered**, with lightness
 * falling steadily along every ordered scale. Hue pairs sit on the
 * blue–yellow axis that red–green colour vision keeps, and neighbouring
 * classes differ in lightness too, so the classes stay apart under
 * protanopia, deuteranopia and tritanopia: the unit test simulates all three
 * (Machado, Oliveira & Fernandes 2009, through culori) over the grey of the
 * hillshade and asks for a CIEDE2000 difference of at least 10 between any two
 * drawn classes. Colour is never the only cue: the legend names every class
 * and the tap read-out says the class at the point.
 */

/** One class of a layer. */
export interface PaletteClass {
  /** The code stored in the raster (the first of a range). */
  readonly code: number;
  /** Last code of a class that stands for a range of codes (`code` … `codeTo`); default `code` alone. */
  readonly codeTo?: number;
  /** Short name for the legend and the read-out. */
  readonly label: string;
  /** What it means, one sentence. */
  readonly meaning: string;
  /** Fill colour `#RRGGBB`, or null for "not drawn" (the map shows through). */
  readonly color: string | null;
}

/** A layer's classes, in legend order. */
export interface ClassPalette {
  /** A coverage layer's kind, or 'visibility-index' (the site map's tower heat map, legend made per layer). */
  readonly id: CoverageLayerKind | 'visibility-index';
  /** Legend heading. */
  readonly title: string;
  /** Opacity of the drawn classes over the base map, 0 … 1. */
  readonly opacity: number;
  readonly classes: readonly PaletteClass[];
}

/** The coverage layers Kenning draws. */
export type CoverageLayerKind = 'posts-per-cell' | 'cross-bearing' | 'post-visibility' | 'coverage-change' | 'patrol-fraction';

const AMBER = '#E69F2E';

/** How many posts see the target (COVERAGE_LAYER codes). */
export const POSTS_PER_CELL_PALETTE: ClassPalette = {
  id: 'posts-per-cell',
  title: 'Posts that see the target',
  opacity: 0.72,
  classes: [
    { code: COVERAGE_LAYER.unseen, label: 'No post', meaning: 'No post sees the target here.', color: AMBER },
    {
      code: COVERAGE_LAYER.onePost,
      label: '1 post',
      meaning: 'One post sees it: a bearing, no cross-bearing.',
      color: '#A9CBEA',
    },
    {
      code: COVERAGE_LAYER.twoPosts,
      label: '2 posts',
      meaning: 'Two posts see it: a cross-bearing is possible.',
      color: '#4F86C0',
    },
    {
      code: COVERAGE_LAYER.threeOrMorePosts,
      label: '3 or more posts',
      meaning: 'Three or more posts see it.',
      color: '#1B3A6B',
    },
    {
      code: COVERAGE_LAYER.noData,
      label: 'No terrain data',
      meaning: 'The terrain has no ground here: not assessed.',
      color: null,
    },
  ],
};

/** Quality of a cross-bearing fix (CROSS_BEARING_CLASS codes). */
export const CROSS_BEARING_PALETTE: ClassPalette = {
  id: 'cross-bearing',
  title: 'Cross-bearing quality',
  opacity: 0.72,
  classes: [
    {
      code: CROSS_BEARING_CLASS.none,
      label: 'No bearing',
      meaning: 'No post sees the target here (or no terrain data).',
      color: AMBER,
    },
    {
      code: CROSS_BEARING_CLASS.single,
      label: 'Single bearing',
      meaning: 'One post sees it: a bearing, no fix.',
      color: '#D3CAE6',
    },
    {
      code: CROSS_BEARING_CLASS.weak,
      label: 'Weak crossing',
      meaning: 'Two or more posts see it, but their bearings cross too flat for a good fix.',
      color: '#8E78C0',
    },
    {
      code: CROSS_BEARING_CLASS.good,
      label: 'Good crossing',
      meaning: 'At least two bearings cross steeply enough for a good fix.',
      color: '#3E2170',
    },
  ],
};

/** What one post sees (VISIBILITY_CLASS codes). */
export const POST_VISIBILITY_PALETTE: ClassPalette = {
  id: 'post-visibility',
  title: 'What the post sees',
  opacity: 0.72,
  classes: [
    { code: VISIBILITY_CLASS.seen, label: 'Ground seen', meaning: 'The ground itself is in view.', color: '#1E5A9E' },
    {
      code: VISIBILITY_CLASS.targetOnly,
      label: 'Target only',
      meaning: 'The ground is hidden; only a target of the chosen height (a smoke column, a mast) shows.',
      color: '#9FC8EC',
    },
    { code: VISIBILITY_CLASS.blind, label: 'Blind', meaning: 'Not even the top of the target is in view.', color: AMBER },
    {
      code: VISIBILITY_CLASS.outOfRange,
      label: 'Too far',
      meaning: 'Beyond the target’s detection range from this post (visibility, size, light or waves), in view or not.',
      color: '#332233',
    },
    {
      code: VISIBILITY_CLASS.none,
      label: 'Not computed',
      meaning: 'No terrain data, or beyond the post’s range limit.',
      color: null,
    },
  ],
};

/**
 * Share of a patrol's cycle each cell is in view (PATROL_FRACTION_CODE: 1
 * never, 1 + p for p % of the cycle), in four bands of a quarter each: the
 * same rule, amber for never watched and deeper blue for watched longer.
 */
export const PATROL_FRACTION_PALETTE: ClassPalette = {
  id: 'patrol-fraction',
  title: 'Share of the patrol cycle in view',
  opacity: 0.74,
  classes: [
    { code: PATROL_FRACTION_CODE.never, label: 'Never', meaning: 'The patrol never has the target here in view.', color: AMBER },
    { code: 2, codeTo: 26, label: 'Up to 25 %', meaning: 'In view for at most a quarter of the cycle.', color: '#CFE1F2' },
    { code: 27, codeTo: 51, label: '26–50 %', meaning: 'In view for a quarter to half of the cycle.', color: '#86B5E0' },
    { code: 52, codeTo: 76, label: '51–75 %', meaning: 'In view for half to three quarters of the cycle.', color: '#3A75B8' },
    {
      code: 77,
      codeTo: 101,
      label: 'Over 75 %',
      meaning: 'In view for more than three quarters of the cycle.',
      color: '#15356B',
    },
    {
      code: PATROL_FRACTION_CODE.none,
      label: 'Not judged',
      meaning: 'Outside the judged area, or no terrain data.',
      color: null,
    },
  ],
};

/** What changed between two coverage runs (COVERAGE_CHANGE codes). */
export const COVERAGE_CHANGE_PALETTE: ClassPalette = {
  id: 'coverage-change',
  title: 'Change in coverage',
  opacity: 0.78,
  classes: [
    { code: COVERAGE_CHANGE.gained, label: 'Gained', meaning: 'Unseen before, seen after.', color: '#174F96' },
    {
      code: COVERAGE_CHANGE.morePosts,
      label: 'More posts',
      meaning: 'Seen before and after, by more posts after.',
      color: '#9CC4EA',
    },
    {
      code: COVERAGE_CHANGE.fewerPosts,
      label: 'Fewer posts',
      meaning: 'Seen before and after, by fewer posts after.',
      color: '#F5CE8A',
    },
    { code: COVERAGE_CHANGE.lost, label: 'Lost', meaning: 'Seen before, unseen after.', color: '#A8550F' },
    { code: COVERAGE_CHANGE.unchanged, label: 'Unchanged', meaning: 'Seen by as many posts as before.', color: null },
    { code: COVERAGE_CHANGE.noData, label: 'No terrain data', meaning: 'No ground data in either run.', color: null },
  ],
};

/** Every palette, by layer kind. */
export const CLASS_PALETTES: Readonly<Record<CoverageLayerKind, ClassPalette>> = {
  'posts-per-cell': POSTS_PER_CELL_PALETTE,
  'cross-bearing': CROSS_BEARING_PALETTE,
  'post-visibility': POST_VISIBILITY_PALETTE,
  'coverage-change': COVERAGE_CHANGE_PALETTE,
  'patrol-fraction': PATROL_FRACTION_PALETTE,
};

/** The class of a code in a palette, or null for a code the palette does not know. */
export function paletteClass(palette: ClassPalette, code: number): PaletteClass | null {
  return palette.classes.find((c) => code >= c.code && code <= (c.codeTo ?? c.code)) ?? null;
}

/** RGBA bytes per code (256 × 4), alpha from the palette's opacity; unknown and undrawn codes are transparent. */
export function paletteLookup(palette: ClassPalette): Uint8ClampedArray {
  const table = new Uint8ClampedArray(256 * 4);
  const alpha = Math.round(palette.opacity * 255);
  for (const c of palette.classes) {
    if (c.color === null || c.code < 0 || c.code > 255) continue;
    const hex = c.color.slice(1);
    for (let code = c.code; code <= Math.min(255, c.codeTo ?? c.code); code++) {
      table[code * 4] = parseInt(hex.slice(0, 2), 16);
      table[code * 4 + 1] = parseInt(hex.slice(2, 4), 16);
      table[code * 4 + 2] = parseInt(hex.slice(4, 6), 16);
      table[code * 4 + 3] = alpha;
    }
  }
  return table;
}
