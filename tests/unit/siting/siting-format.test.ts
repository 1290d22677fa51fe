import { SITING_ADDED, SitingRunInputSchema } from '@/shared/schemas/siting';
import {
  addedColour,
  coverageCurve,
  KEPT_COLOUR,
  parseHeights,
  parseLatLon,
  readAccessLine,
  readSitingLimits,
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

  it('reads costs, budget and goal, refusing by field what the API would refuse', () => {
    // Source: the API's own rules (SitingRunInputSchema: one cost per height, costs ≥ 0, a budget > 0 needs
    // costs, a goal in (0, 100] %); every request the form builds must also pass that schema.
    const base = {
      candidates: [{ latDeg: 51.68, lonDeg: 15.27, name: 'Fox hill' }],
      heightsM: [0, 15, 30],
      count: 2,
      targetId: '00000000-0000-4000-8000-000000000001',
      conditionSetId: '00000000-0000-4000-8000-000000000002',
      objective: { minPosts: 1 },
    };
    const ok = readSitingLimits({ costs: '0, 40, 90', budget: '100', goalPct: '85 %' }, 3);
    expect(ok).toEqual({ costs: [0, 40, 90], budget: 100, goalPct: 85, errors: {} });
    expect(SitingRunInputSchema.safeParse({ ...base, costs: ok.costs, budget: ok.budget, goalPct: ok.goalPct }).success).toBe(
      true,
    );
    expect(readSitingLimits({ costs: '', budget: '', goalPct: '' }, 3)).toEqual({
      costs: null,
      budget: null,
      goalPct: null,
      errors: {},
    });

    const bad = [
      [{ costs: '0, 40', budget: '', goalPct: '' }, 'costs', /one cost per tower height/],
      [{ costs: '0, -1, 5', budget: '', goalPct: '' }, 'costs', /negative/],
      [{ costs: 'a lot', budget: '', goalPct: '' }, 'costs', /numbers/],
      [{ costs: '', budget: '100', goalPct: '' }, 'budget', /needs the costs/],
      [{ costs: '1, 2, 3', budget: '0', goalPct: '' }, 'budget', /more than 0/],
      [{ costs: '', budget: '', goalPct: '120' }, 'goalPct', /at most 100/],
      [{ costs: '', budget: '', goalPct: '0' }, 'goalPct', /more than 0/],
    ] as const;
    for (const [text, field, message] of bad) {
      const read = readSitingLimits(text, 3);
      expect(read.errors[field]).toMatch(message);
      // The API refuses the same request on the same field.
      const api = SitingRunInputSchema.safeParse({ ...base, costs: read.costs, budget: read.budget, goalPct: read.goalPct });
      if (read.costs?.some((c) => Number.isNaN(c))) continue; // not a number: never sent
      expect(api.success).toBe(false);
      expect(api.error!.issues.some((i) => i.path[0] === field)).toBe(true);
    }
  });

  it('reads the access line as [lon, lat] pairs and the distance from it', () => {
    // Source: the API's FromTerrainSchema (a line of at least two [lon, lat] pairs, 0 < withinM ≤ 50 km;
    // GeoJSON's longitude-first order, RFC 7946 §3.1.1).
    const points = [
      { latDeg: 51.6, lonDeg: 15.2 },
      { latDeg: 51.7, lonDeg: 15.3 },
    ];
    const read = readAccessLine(points, '1200');
    expect(read).toEqual({
      accessLine: {
        line: [
          [15.2, 51.6],
          [15.3, 51.7],
        ],
        withinM: 1200,
      },
      errors: {},
    });
    const request = {
      candidates: { fromTerrain: { spacingM: 1500, accessLine: read.accessLine } },
      heightsM: [0],
      count: 1,
      targetId: '00000000-0000-4000-8000-000000000001',
      conditionSetId: '00000000-0000-4000-8000-000000000002',
      objective: { minPosts: 1 },
    };
    expect(SitingRunInputSchema.safeParse(request).success).toBe(true);
    const short = readAccessLine(points.slice(0, 1), '0');
    expect(short.accessLine).toBeNull();
    expect(short.errors['candidates.fromTerrain.accessLine.line']).toMatch(/two points/);
    expect(short.errors['candidates.fromTerrain.accessLine.withinM']).toMatch(/more than 0/);
    expect(readAccessLine(points, '60000').errors['candidates.fromTerrain.accessLine.withinM']).toMatch(/50 000/);
  });
});
