import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import type { SweepWidthResult, SweepWidthTable } from '@/shared/schemas/sweep-width';
import { createQueryClient } from '@/components/data/query-client';
import { SearchEffortScreen } from '@/components/search-effort/search-effort-screen';

const TABLE: SweepWidthTable = {
  id: '00000000-0000-4000-8000-000000000001',
  name: 'Trial table',
  edition: 'Trial edition 1',
  sourceName: 'Own trials (invented for this test)',
  isExample: false,
  notes: '',
  rows: [{ searchObject: 'Raft', visibilityM: 9260, heightM: 15.24, sweepWidthM: 1852 }],
  retiredAt: null,
  version: 0,
  updatedAt: '2026-01-01T00:00:00.000Z',
};

/** The answer the server would give for W and S (C = W / S); the figures are the request's, not computed here. */
const answer = (sweepWidthM: number, trackSpacingM: number): SweepWidthResult => ({
  model: 'inverse-cube',
  sweepWidthM,
  trackSpacingM,
  coverageFactor: sweepWidthM / trackSpacingM,
  pod: 0.5,
  podRandomSearch: 0.4,
  tracksEachSide: null,
  method: 'Test method.',
  source: 'Test source.',
  warnings: [],
  caution: 'POD is an estimate.',
});

/** A planner who reads nautical units (their account setting). */
const NAUTICAL_PLANNER = {
  id: '00000000-0000-4000-8000-000000000009',
  email: 'planner@example.test',
  name: 'Test Planner',
  role: 'planner',
  organization: { id: '00000000-0000-4000-8000-000000000008', name: 'Test organisation' },
  unitPreference: 'nautical',
};

/**
 * A fake API: /me signed out (metric) or the given user, one table, the
 * sweep-width answer echoing the request, and a new table echoed back.
 */
function fakeApi(user: unknown = null) {
  const posted: unknown[] = [];
  globalThis.fetch = jest.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = String(input);
    const reply = (status: number, body: unknown) => ({ ok: status < 300, status, json: async () => body }) as Response;
    if (url.endsWith('/me')) {
      return user ? reply(200, { user }) : reply(401, { error: { code: 'unauthenticated', message: 'Sign in.' } });
    }
    if (url.endsWith('/v1/sweep-width-tables') && init?.method === 'POST') {
      const body = JSON.parse(String(init.body)) as Omit<SweepWidthTable, 'id'>;
      posted.push(body);
      return reply(201, { table: { ...TABLE, ...body, id: '00000000-0000-4000-8000-000000000002' } });
    }
    if (url.includes('/v1/sweep-width-tables')) return reply(200, { items: [TABLE], page: 1, pageSize: 200, total: 1 });
    if (url.endsWith('/v1/sweep-width') && init?.method === 'POST') {
      const body = JSON.parse(String(init.body)) as { sweepWidthM: number; trackSpacingM: number };
      posted.push(body);
      return reply(200, answer(body.sweepWidthM, body.trackSpacingM));
    }
    throw new Error(`No fake answer for ${init?.method ?? 'GET'} ${url}`);
  }) as typeof fetch;
  return posted;
}

const clients: ReturnType<typeof createQueryClient>[] = [];
afterEach(() => {
  for (const c of clients.splice(0)) c.clear();
  delete (globalThis as { fetch?: unknown }).fetch;
});

function renderScreen() {
  const client = createQueryClient();
  clients.push(client);
  return render(
    <QueryClientProvider client={client}>
      <SearchEffortScreen />
    </QueryClientProvider>,
  );
}

const box = (name: string) => screen.getByRole('textbox', { name }) as HTMLInputElement;
/** Closeness of lengths in metres; tolerance 1e-9 m (the conversions are exact definitions). */
const near = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThan(1e-9);

describe('search effort in the person’s units', () => {
  it('re-types the sweep width and spacing when the units change, and asks in metres', async () => {
    const posted = fakeApi();
    renderScreen();
    fireEvent.click(await screen.findByRole('radio', { name: 'Sweep width' }));
    fireEvent.change(box('Sweep width W'), { target: { value: '926' } });
    fireEvent.change(box('Track spacing S'), { target: { value: '1852' } });
    fireEvent.click(screen.getByRole('radio', { name: 'ft · nmi' }));
    // Source: NIST SP 811 Appendix B.8: 1 nmi = 1852 m exactly, so 926 m = 0.5 nmi and 1852 m = 1 nmi.
    await waitFor(() => expect(box('Sweep width W').value).toBe('0.5'));
    expect(box('Track spacing S').value).toBe('1');
    expect(screen.getAllByText('nmi').length).toBe(2);

    fireEvent.change(box('Track spacing S'), { target: { value: '2' } });
    fireEvent.click(screen.getByRole('button', { name: 'Compute POD' }));
    await waitFor(() => expect(posted).toHaveLength(1));
    const request = posted[0] as { sweepWidthM: number; trackSpacingM: number; model: string };
    near(request.sweepWidthM, 926);
    near(request.trackSpacingM, 3704);
    expect(request.model).toBe('inverse-cube');
    // The result in nautical miles: W = 0.5 nmi, S = 2 nmi, C = 0.25.
    await screen.findByLabelText('Sweep width W: 0.5 nmi');
    expect(screen.getByText('W / S, S = 2 nmi')).toBeTruthy();
    expect(screen.getByLabelText('Coverage factor C: 0.25')).toBeTruthy();
  });

  it('reads a curve in the chosen unit, re-types it on a switch, and names the unit of a line it cannot read', async () => {
    const posted = fakeApi();
    renderScreen();
    fireEvent.click(await screen.findByRole('radio', { name: 'Lateral-range curve' }));
    fireEvent.change(box('Lateral-range curve'), { target: { value: '0, 1\n1609.344, 0' } });
    fireEvent.click(screen.getByRole('radio', { name: 'ft · mi' }));
    // Source: NIST SP 811 Appendix B.8: 1 mi = 1609.344 m exactly.
    await waitFor(() => expect(box('Lateral-range curve').value).toBe('0, 1\n1, 0'));
    fireEvent.change(box('Track spacing S'), { target: { value: '1' } });
    fireEvent.click(screen.getByRole('button', { name: 'Compute POD' }));
    await waitFor(() => expect(posted).toHaveLength(1));
    const request = posted[0] as { lateralRangeCurve: { rangeM: number }[]; trackSpacingM: number };
    near(request.lateralRangeCurve[1]!.rangeM, 1609.344);
    near(request.trackSpacingM, 1609.344);

    fireEvent.change(box('Lateral-range curve'), { target: { value: '0, 1\nfar, 0' } });
    fireEvent.click(screen.getByRole('button', { name: 'Compute POD' }));
    await screen.findByText('Line 2: write “range in statute miles, POD”, e.g. “0.3, 0.6”.');
    expect(posted).toHaveLength(1);
  });

  it('describes table rows in the chosen units and keeps metric as it was', async () => {
    fakeApi();
    renderScreen();
    fireEvent.click(await screen.findByRole('checkbox', { name: 'Trial table' }));
    // Metric as before: 9260 m → 9.3 km, 15.24 m, W 1852 m → 1.85 km.
    await screen.findByRole('checkbox', { name: 'Raft · visibility 9.3 km · height 15.24 m → W 1.85 km' });
    fireEvent.click(screen.getByRole('radio', { name: 'ft · nmi' }));
    // Source: NIST SP 811 B.8: 9260 m = 5 nmi, 15.24 m = 50 ft, 1852 m = 1 nmi.
    await screen.findByRole('checkbox', { name: 'Raft · visibility 5 nmi · height 50 ft → W 1 nmi' });
  });

  it('starts in the person’s own units and saves a new table’s rows in metres', async () => {
    const posted = fakeApi(NAUTICAL_PLANNER);
    renderScreen();
    // The planner's setting: nautical miles in the form once the session is known.
    await screen.findByText('One row a line: search object; visibility nmi; height of eye ft; sweep width nmi.');
    const form = screen.getByLabelText('New sweep-width table');
    const inForm = (name: string) => within(form).getByRole('textbox', { name }) as HTMLInputElement;
    fireEvent.change(inForm('Table name'), { target: { value: 'Trial' } });
    fireEvent.change(inForm('Edition'), { target: { value: 'Trial edition 1' } });
    fireEvent.change(inForm('Source'), { target: { value: 'Own trials (invented for this test)' } });
    fireEvent.change(inForm('Rows'), { target: { value: 'Raft; 5; 50; 1' } });
    fireEvent.click(within(form).getByRole('button', { name: 'Save table' }));
    await waitFor(() => expect(posted).toHaveLength(1));
    const row = (posted[0] as { rows: SweepWidthTable['rows'] }).rows[0]!;
    // Source: NIST SP 811 Appendix B.8: 5 nmi = 9260 m, 50 ft = 15.24 m, 1 nmi = 1852 m (exact).
    near(row.visibilityM, 9260);
    near(row.heightM, 15.24);
    near(row.sweepWidthM, 1852);
    await within(form).findByText('Added Trial.');
  });
});
