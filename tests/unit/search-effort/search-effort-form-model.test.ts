import type { SweepWidthTable } from '@/shared/schemas/sweep-width';
import {
  describeRow,
  formFieldOf,
  parseCurveText,
  parseTableRowsText,
  SEARCH_EFFORT_DEFAULTS,
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
