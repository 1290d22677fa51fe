import type { SweepWidthTable } from '@/shared/schemas/sweep-width';
import {
  describeRow,
  formatSweepDistance,
  formFieldOf,
  parseCurveText,
  parseTableRowsText,
  retypeCurve,
  retypeTableRows,
  SEARCH_EFFORT_DEFAULTS,
  searchEffortResolver,
  searchUnits,
  tableFormResolver,
  toSweepRequest,
} from '@/components/search-effort/search-effort-form-model';

const table: SweepWidthTable = {
  id: '00000000-0000-4000-8000-000000000001',
  name: 'Test table',
  edition: 'E',
  sourceName: 'S',
  isExample: false,
  notes: '',
  rows: [{ searchObject: 'Raft', visibilityM: 5000, heightM: 10, sweepWidthM: 2000 }],
  retiredAt: null,
  version: 0,
  updatedAt: '2026-01-01T00:00:00.000Z',
};

describe('search-effort form', () => {
  it('reads a curve one point a line, with commas, semicolons, tabs or spaces, and POD in %', () => {
    expect(parseCurveText('0, 0.9\n500;60%\n\n1500\t0')).toEqual({
      points: [
        { rangeM: 0, pod: 0.9 },
        { rangeM: 500, pod: 0.6 },
        { rangeM: 1500, pod: 0 },
      ],
    });
    expect(parseCurveText('0, 1\nfar, 0')).toEqual({ error: expect.stringMatching(/^Line 2:/) });
  });

  it('builds the request from a table row, and names the missing choice', () => {
    const built = toSweepRequest({ ...SEARCH_EFFORT_DEFAULTS, tableId: table.id, rowIndex: '0', trackSpacing: '1000' }, [table]);
    expect(built).toEqual({ request: { sweepWidthM: 2000, model: 'inverse-cube', trackSpacingM: 1000 } });
    expect(toSweepRequest({ ...SEARCH_EFFORT_DEFAULTS, trackSpacing: '1000' }, [table])).toEqual({
      errors: { tableId: 'Choose a sweep-width table.' },
    });
    expect(toSweepRequest({ ...SEARCH_EFFORT_DEFAULTS, tableId: table.id, trackSpacing: '1000' }, [table])).toEqual({
      errors: { rowIndex: 'Choose a row of the table.' },
    });
  });

  it('puts the schema’s errors under the form’s fields', () => {
    const built = toSweepRequest({ ...SEARCH_EFFORT_DEFAULTS, source: 'width', sweepWidth: '-3', trackSpacing: '' }, []);
    expect(Object.keys('errors' in built ? built.errors : {}).sort()).toEqual(['sweepWidth', 'trackSpacing']);
    const curve = toSweepRequest({ ...SEARCH_EFFORT_DEFAULTS, source: 'curve', curve: '0, 2\n10, 0', trackSpacing: '5' }, []);
    expect(curve).toEqual({ errors: { curve: 'Point 1: The POD is 0 to 1.' } });
    expect(formFieldOf('lateralRangeCurve.3.rangeM', 'curve')).toBe('curve');
    expect(formFieldOf('sweepWidthM', 'table')).toBe('rowIndex');
    expect(formFieldOf('somethingElse', 'width')).toBeNull();
  });

  it('reads table rows one a line, separated by semicolons or tabs', () => {
    expect(parseTableRowsText('Raft, 6 persons; 10000; 15; 3700\nPerson\t5000\t2\t300,5')).toEqual({
      rows: [
        { searchObject: 'Raft, 6 persons', visibilityM: 10000, heightM: 15, sweepWidthM: 3700 },
        { searchObject: 'Person', visibilityM: 5000, heightM: 2, sweepWidthM: 300.5 },
      ],
    });
    expect(parseTableRowsText('Raft; 10000; 15')).toEqual({ error: expect.stringMatching(/^Line 1:/) });
  });

  it('describes a row in words', () => {
    expect(describeRow(table.rows[0]!)).toBe('Raft · visibility 5 km · height 10 m → W 2 km');
  });
});

/** Closeness of two lengths in metres. Tolerance 1e-9 m: the conversions are exact definitions. */
const near = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThan(1e-9);

describe('search-effort form in other units', () => {
  it('types lengths in metres (metric), nautical miles and feet (nautical), statute miles and feet (imperial)', () => {
    expect(searchUnits('metric')).toEqual({ distance: 'm', height: 'm' });
    expect(searchUnits('nautical')).toEqual({ distance: 'nmi', height: 'ft' });
    expect(searchUnits('imperial')).toEqual({ distance: 'mi', height: 'ft' });
  });

  it('reads a curve in nautical miles into metres, and names the unit of a line it cannot read', () => {
    const curve = parseCurveText('0, 1\n0.5; 50%\n2 0', 'nmi');
    if (!('points' in curve)) throw new Error(curve.error);
    // Source: NIST SP 811 Appendix B.8: 1 nmi = 1852 m exactly.
    near(curve.points[1]!.rangeM, 926);
    near(curve.points[2]!.rangeM, 3704);
    expect(curve.points.map((p) => p.pod)).toEqual([1, 0.5, 0]);
    expect(parseCurveText('0, 1\nfar, 0', 'nmi')).toEqual({
      error: 'Line 2: write “range in nautical miles, POD”, e.g. “0.3, 0.6”.',
    });
    expect(parseCurveText('x', 'm')).toEqual({ error: 'Line 1: write “range in metres, POD”, e.g. “500, 0.6”.' });
  });

  it('re-types a curve’s ranges on a unit switch and back, leaving the PODs and unreadable lines', () => {
    // Source: 926 m = 0.5 nmi, 3704 m = 2 nmi (NIST SP 811 B.8: 1 nmi = 1852 m).
    expect(retypeCurve('0, 0.9\n926; 60%\n3704\t0\nfar, 0', 'm', 'nmi')).toBe('0, 0.9\n0.5; 60%\n2\t0\nfar, 0');
    expect(retypeCurve('0.5, 0.6', 'nmi', 'm')).toBe('926, 0.6');
    // Source: NIST SP 811 B.8: 1 mi = 1609.344 m; 1000 m = 0.621 mi (three significant digits).
    expect(retypeCurve('1000, 0.5', 'm', 'mi')).toBe('0.621, 0.5');
    // Round trip: the same length within the rounding (three significant digits).
    const back = parseCurveText(retypeCurve(retypeCurve('1234, 0.5', 'm', 'nmi'), 'nmi', 'm'));
    expect('points' in back && Math.abs(back.points[0]!.rangeM - 1234) / 1234).toBeLessThan(5e-3);
  });

  it('reads table rows in nautical units and re-types them between units', () => {
    const nautical = searchUnits('nautical');
    const rows = parseTableRowsText('Raft; 5.4; 50; 2', nautical);
    if (!('rows' in rows)) throw new Error(rows.error);
    // Source: NIST SP 811 B.8: 5.4 nmi = 10 000.8 m, 50 ft = 15.24 m, 2 nmi = 3704 m.
    near(rows.rows[0]!.visibilityM, 10_000.8);
    near(rows.rows[0]!.heightM, 15.24);
    near(rows.rows[0]!.sweepWidthM, 3704);
    expect(parseTableRowsText('Raft; 5.4; 50', nautical)).toEqual({
      error: 'Line 1: write “search object; visibility nmi; height ft; sweep width nmi”.',
    });
    // 10 000 m = 5.40 nmi (written without the trailing zero), 15.24 m = 50 ft, 3704 m = 2 nmi; the object's name keeps its comma.
    expect(retypeTableRows('Raft, 6; 10000; 15.24; 3704', searchUnits('metric'), nautical)).toBe('Raft, 6; 5.4; 50; 2');
    // Back to metres at three significant digits (what was typed was no more precise): 3704 → 3700, 1852 → 1850.
    expect(retypeTableRows('Raft; 2; 50; 1', nautical, searchUnits('metric'))).toBe('Raft; 3700; 15.2; 1850');
    expect(retypeTableRows('Raft; far; 50; 1', nautical, nautical)).toBe('Raft; far; 50; 1');
  });

  it('builds the request in metres from lengths typed in nautical miles', () => {
    const built = toSweepRequest(
      { ...SEARCH_EFFORT_DEFAULTS, units: 'nautical', source: 'width', sweepWidth: '1', trackSpacing: '2' },
      [],
    );
    if (!('request' in built)) throw new Error(JSON.stringify(built.errors));
    // Source: NIST SP 811 B.8: 1 nmi = 1852 m.
    near(built.request.sweepWidthM!, 1852);
    near(built.request.trackSpacingM, 3704);
    const curve = toSweepRequest(
      { ...SEARCH_EFFORT_DEFAULTS, units: 'imperial', source: 'curve', curve: '0, 1\n1, 0', trackSpacing: '5' },
      [],
    );
    if (!('request' in curve)) throw new Error(JSON.stringify(curve.errors));
    // Source: NIST SP 811 B.8: 1 mi = 1609.344 m.
    near(curve.request.lateralRangeCurve![1]!.rangeM, 1609.344);
  });

  it('restates a curve point’s limit in the unit its ranges are typed in', () => {
    const built = toSweepRequest(
      { ...SEARCH_EFFORT_DEFAULTS, units: 'nautical', source: 'curve', curve: '0, 1\n600, 0', trackSpacing: '5' },
      [],
    );
    // The shared schema's limit is 1 000 km = 540 nmi (1 000 000 / 1852 = 539.96).
    expect(built).toEqual({ errors: { curve: 'Point 2: At most 540 nmi.' } });
  });

  it('resolves the form through react-hook-form: request in metres, or errors under the fields', async () => {
    const resolve = searchEffortResolver();
    const opts = { fields: {}, shouldUseNativeValidation: false } as never;
    const ok = await resolve(
      { ...SEARCH_EFFORT_DEFAULTS, tableId: table.id, rowIndex: '0', trackSpacing: '1000' },
      [table],
      opts,
    );
    expect(ok).toEqual({ values: { sweepWidthM: 2000, model: 'inverse-cube', trackSpacingM: 1000 }, errors: {} });
    const bad = await resolve({ ...SEARCH_EFFORT_DEFAULTS, trackSpacing: '1000' }, [], opts);
    expect(bad.errors).toEqual({ tableId: { type: 'validate', message: 'Choose a sweep-width table.' } });
  });

  it('resolves the table form: rows in metres, errors naming the line in the unit of the column', async () => {
    const resolve = tableFormResolver();
    const opts = { fields: {}, shouldUseNativeValidation: false } as never;
    const base = { units: 'nautical' as const, name: 'T', edition: 'E', sourceName: 'S' };
    const ok = await resolve({ ...base, rows: 'Raft; 2; 50; 1' }, undefined, opts);
    expect(ok.errors).toEqual({});
    near((ok.values as { rows: { heightM: number }[] }).rows[0]!.heightM, 15.24);
    // The schema's 20 000 m height limit = 65 600 ft (20 000 / 0.3048 = 65 616.8, three significant digits).
    const high = await resolve({ ...base, rows: 'Raft; 2; 70000; 1' }, undefined, opts);
    expect(high.errors).toEqual({ rows: { type: 'validate', message: 'Line 1 (heightM): At most 65600 ft.' } });
    const unread = await resolve({ ...base, rows: 'Raft; 2' }, undefined, opts);
    expect(unread.errors.rows?.message).toBe('Line 1: write “search object; visibility nmi; height ft; sweep width nmi”.');
  });

  it('describes rows and shows W and S in the person’s units', () => {
    // Source: NIST SP 811 B.8: 5000 m = 2.70 nmi; 10 m = 32.8 ft; 2000 m = 1.08 nmi.
    expect(describeRow(table.rows[0]!, 'nautical')).toBe('Raft · visibility 2.7 nmi · height 32.8 ft → W 1.08 nmi');
    // 5000 m = 3.11 mi, 2000 m = 1.24 mi (1 mi = 1609.344 m).
    expect(describeRow(table.rows[0]!, 'imperial')).toBe('Raft · visibility 3.11 mi · height 32.8 ft → W 1.24 mi');
    expect(formatSweepDistance(2000)).toBe('2 km');
    expect(formatSweepDistance(850, 'metric')).toBe('850 m');
    expect(formatSweepDistance(926, 'nautical')).toBe('0.5 nmi');
    // A person in the water: W = 60 m = 197 ft, under 0.05 nmi.
    expect(formatSweepDistance(60, 'nautical')).toBe('197 ft');
  });
});
