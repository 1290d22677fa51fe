import {
  differenceCiede2000,
  filterDeficiencyDeuter,
  filterDeficiencyProt,
  filterDeficiencyTrit,
  parse,
  rgb,
  type Rgb,
} from 'culori';
import {
  CLASS_PALETTES,
  COVERAGE_CHANGE_PALETTE,
  CROSS_BEARING_PALETTE,
  paletteClass,
  paletteLookup,
  POST_VISIBILITY_PALETTE,
  POSTS_PER_CELL_PALETTE,
  type ClassPalette,
} from '@/components/map/class-palettes';
import { COVERAGE_CHANGE } from '@/shared/terrain/coverage-difference';
import { CROSS_BEARING_CLASS } from '@/shared/terrain/cross-bearing-quality';
import { COVERAGE_LAYER } from '@/shared/terrain/posts-per-cell';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';

const palettes = Object.values(CLASS_PALETTES);

/** A palette colour laid over the hillshade's grey at the palette's opacity (what the map shows). */
function over(hex: string, opacity: number, groundGrey: number): Rgb {
  const c = rgb(parse(hex))!;
  const g = groundGrey / 255;
  return {
    mode: 'rgb',
    r: c.r * opacity + g * (1 - opacity),
    g: c.g * opacity + g * (1 - opacity),
    b: c.b * opacity + g * (1 - opacity),
  };
}

const ciede2000 = differenceCiede2000();

describe('class palettes', () => {
  test.each([
    ['posts per cell', POSTS_PER_CELL_PALETTE, COVERAGE_LAYER],
    ['cross-bearing quality', CROSS_BEARING_PALETTE, CROSS_BEARING_CLASS],
    ['a post’s classes', POST_VISIBILITY_PALETTE, VISIBILITY_CLASS],
    ['coverage change', COVERAGE_CHANGE_PALETTE, COVERAGE_CHANGE],
  ] as const)('%s names every code of the core, once, with a unique label', (_name, palette, codes) => {
    const expected = Object.values(codes as Record<string, number>).sort();
    expect(palette.classes.map((c) => c.code).sort()).toEqual(expected);
    expect(new Set(palette.classes.map((c) => c.label)).size).toBe(palette.classes.length);
    for (const c of palette.classes) expect(c.meaning.length).toBeGreaterThan(10);
  });

  test('the layers the brief names map to the core codes: 0/1/2/3+ posts, none/single/weak/good, seen/target-only/blind', () => {
    expect(paletteClass(POSTS_PER_CELL_PALETTE, COVERAGE_LAYER.twoPosts)?.label).toBe('2 posts');
    expect(paletteClass(POSTS_PER_CELL_PALETTE, COVERAGE_LAYER.threeOrMorePosts)?.label).toBe('3 or more posts');
    expect(paletteClass(CROSS_BEARING_PALETTE, CROSS_BEARING_CLASS.good)?.label).toBe('Good crossing');
    expect(paletteClass(POST_VISIBILITY_PALETTE, VISIBILITY_CLASS.targetOnly)?.label).toBe('Target only');
    expect(paletteClass(COVERAGE_CHANGE_PALETTE, COVERAGE_CHANGE.lost)?.label).toBe('Lost');
    expect(paletteClass(POSTS_PER_CELL_PALETTE, 99)).toBeNull();
  });

  test('the lookup table gives each drawn code its colour at the palette opacity, and leaves the rest transparent', () => {
    const table = paletteLookup(POSTS_PER_CELL_PALETTE);
    const c = COVERAGE_LAYER.twoPosts * 4;
    expect([...table.slice(c, c + 4)]).toEqual([0x4f, 0x86, 0xc0, Math.round(0.72 * 255)]);
    expect(table[COVERAGE_LAYER.noData * 4 + 3]).toBe(0);
    expect(table[200 * 4 + 3]).toBe(0);
  });

  // Source: colour-vision deficiency simulation of Machado, Oliveira & Fernandes, "A
  // physiologically-based model for simulation of color vision deficiency", IEEE TVCG 15(6),
  // 2009, at full severity, as implemented by culori (npm); CIEDE2000 colour difference
  // (CIE 142-2001) by culori. ΔE00 ≥ 10 between two drawn classes is this project's own
  // threshold for "clearly different at a glance" (≈ 2.3 is a just-noticeable difference,
  // from memory).
  const visions: [string, (c: Rgb) => Rgb][] = [
    ['normal vision', (c) => c],
    ['protanopia', filterDeficiencyProt(1) as (c: Rgb) => Rgb],
    ['deuteranopia', filterDeficiencyDeuter(1) as (c: Rgb) => Rgb],
    ['tritanopia', filterDeficiencyTrit(1) as (c: Rgb) => Rgb],
  ];
  const cases = palettes.flatMap((p) =>
    visions.flatMap(([vision, simulate]) => [120, 181, 230].map((grey) => [p.id, vision, grey, p, simulate] as const)),
  );

  test.each(cases)(
    '%s under %s over grey %i: every two drawn classes differ by ΔE00 ≥ 10',
    (_id, _vision, grey, palette, simulate) => {
      const drawn = (palette as ClassPalette).classes.filter((c) => c.color !== null);
      let least = Infinity;
      for (let i = 0; i < drawn.length; i++) {
        for (let j = i + 1; j < drawn.length; j++) {
          const a = simulate(over(drawn[i]!.color!, palette.opacity, grey));
          const b = simulate(over(drawn[j]!.color!, palette.opacity, grey));
          least = Math.min(least, ciede2000(a, b));
        }
      }
      expect(least).toBeGreaterThanOrEqual(10);
    },
  );

  test('ordered scales get darker step by step (lightness carries the order, not hue)', () => {
    // common practice, no source: an ordinal scale reads by lightness.
    const lightness = (hex: string) => {
      const c = rgb(parse(hex))!;
      return 0.2126 * c.r + 0.7152 * c.g + 0.0722 * c.b;
    };
    const ramp = (palette: ClassPalette, codes: number[]) => codes.map((code) => lightness(paletteClass(palette, code)!.color!));
    const decreasing = (values: number[]) => values.every((v, i) => i === 0 || v < values[i - 1]!);
    expect(
      decreasing(
        ramp(POSTS_PER_CELL_PALETTE, [COVERAGE_LAYER.onePost, COVERAGE_LAYER.twoPosts, COVERAGE_LAYER.threeOrMorePosts]),
      ),
    ).toBe(true);
    expect(
      decreasing(ramp(CROSS_BEARING_PALETTE, [CROSS_BEARING_CLASS.single, CROSS_BEARING_CLASS.weak, CROSS_BEARING_CLASS.good])),
    ).toBe(true);
    expect(decreasing(ramp(POST_VISIBILITY_PALETTE, [VISIBILITY_CLASS.targetOnly, VISIBILITY_CLASS.seen]))).toBe(true);
  });
});
