import { SITING_ADDED } from '@/shared/schemas/siting';
import {
  addedColour,
  coverageCurve,
  KEPT_COLOUR,
  parseHeights,
  parseLatLon,
  STEP_COLOURS,
} from '@/components/siting/siting-format';

describe('siting screen helpers', () => {
  it('reads a typed point in decimal degrees and refuses what is not one', () => {
    // common practice, no source: "lat, lon" in decimal degrees, latitude within ±90°, longitude within ±180°.
    expect(parseLatLon('51.68, 15.27')).toEqual({ latDeg: 51.68, lonDeg: 15.27 });
    expect(parseLatLon(' -33.9 18.4 ')).toEqual({ latDeg: -33.9, lonDeg: 18.4 });
    expect(parseLatLon('95, 10')).toBeNull();
    expect(parseLatLon('51.68')).toBeNull();
    expect(parseLatLon('north, east')).toBeNull();
  });

  it('reads heights, converting from feet when the person reads feet', () => {
    // Source: 1 ft = 0.3048 m exactly (international foot, 1959 agreement).
    expect(parseHeights('0, 10, 20')).toEqual([0, 10, 20]);
    expect(parseHeights('0 100', (ft) => ft * 0.3048)).toEqual([0, 30.48]);
    expect(parseHeights('10, x')).toBeNull();
    expect(parseHeights('')).toBeNull();
  });

  it('draws the curve from the kept posts through each step', () => {
    // common practice, no source: the curve starts at what the kept posts see and adds the steps in order.
    const step = (name: string, totalSeenM2: number, totalSeenPct: number) =>
      ({ candidate: { name }, totalSeenM2, totalSeenPct }) as Parameters<typeof coverageCurve>[0]['steps'][number];
    const points = coverageCurve({ keptSeenM2: 5e7, keptSeenPct: 40, steps: [step('A', 7e7, 56), step('B', 8e7, 64)] });
    expect(points.map((p) => [p.towers, p.seenM2, p.seenPct])).toEqual([
      [0, 5e7, 40],
      [1, 7e7, 56],
      [2, 8e7, 64],
    ]);
    expect(coverageCurve({ keptSeenM2: null, keptSeenPct: null, steps: [] })).toEqual([]);
  });

  it('colours the added-area codes: nothing outside, the kept ground, then one colour per step', () => {
    expect(addedColour(SITING_ADDED.outside)).toBeNull();
    expect(addedColour(SITING_ADDED.kept)).toBe(KEPT_COLOUR);
    expect(addedColour(SITING_ADDED.firstStep)).toBe(STEP_COLOURS[0]);
    expect(addedColour(SITING_ADDED.firstStep + STEP_COLOURS.length)).toBe(STEP_COLOURS[0]);
  });
});
