import { QueryClientProvider } from '@tanstack/react-query';
import { act, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { createQueryClient } from '@/components/data/query-client';
import { CoverageFigures } from '@/components/plans/coverage-figures';
import { PlanCoveragePanel } from '@/components/plans/plan-coverage-panel';
import type { CoverageRun } from '@/shared/schemas/coverage';
import { IDS, sampleRun } from '@/tests/support/coverage-samples';
import { fakeApi } from '@/tests/support/fake-api';

const mockNavigate = jest.fn();
jest.mock('expo-router', () => ({ useRouter: () => ({ navigate: mockNavigate, setParams: jest.fn() }) }));

/** Query clients made by a test, cleared after it so no garbage-collection timer outlives the test file. */
const clients: ReturnType<typeof createQueryClient>[] = [];
const renderWithQueries = (ui: React.ReactElement) => {
  const client = createQueryClient();
  clients.push(client);
  return render(<QueryClientProvider client={client}>{ui}</QueryClientProvider>);
};

afterEach(() => {
  for (const c of clients.splice(0)) c.clear();
  jest.restoreAllMocks();
  delete (globalThis as { fetch?: unknown }).fetch;
  mockNavigate.mockReset();
});

const coveragePath = `/api/v1/plans/${IDS.plan}/coverage`;
const runPath = `/api/v1/coverage-runs/${IDS.run}`;
const running = (progress: number, stage: string): CoverageRun =>
  sampleRun({ status: 'running', progress, stage, cases: [], finishedAt: null, elapsedS: null });

describe('PlanCoveragePanel (editable plan)', () => {
  it('computes: button, then progress with its stage, then the figures with the failing rule first', async () => {
    const done = sampleRun();
    const calls = fakeApi({
      [`GET ${coveragePath}`]: [
        { body: { inputsHash: 'hash-1', current: null, latest: null, hasTerrain: true } },
        { body: { inputsHash: 'hash-1', current: running(0.1, ''), latest: running(0.1, ''), hasTerrain: true } },
        { body: { inputsHash: 'hash-1', current: done, latest: done, hasTerrain: true } },
      ],
      [`POST ${coveragePath}`]: [{ status: 202, body: { run: running(0.1, 'Queued for a worker') } }],
      [`GET ${runPath}`]: [{ body: { run: running(0.42, 'Viewsheds: post 1 of 2') } }, { body: { run: done } }],
    });
    renderWithQueries(<PlanCoveragePanel planId={IDS.plan} siteId={IDS.site} editable canRun />);
    await screen.findByText('Not computed yet.');
    fireEvent.click(screen.getByRole('button', { name: 'Compute coverage' }));

    const bar = await screen.findByRole('progressbar', { name: 'Computing coverage' });
    await waitFor(() => expect(bar.getAttribute('aria-valuenow')).toBe('42'), { timeout: 4000 });
    expect(screen.getByText('42 % · Viewsheds: post 1 of 2')).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Cancel the run' })).toBeTruthy();

    // Done: the poll stops, the plan's coverage is asked again, the figures show.
    await screen.findByText('Does not meet the standard', undefined, { timeout: 5000 });
    expect(calls.filter((c) => c.key === `GET ${coveragePath}`).length).toBeGreaterThanOrEqual(3);
    const rules = within(screen.getByRole('list', { name: 'Rules of the standard' })).getAllByRole('listitem');
    expect(rules[0]!.textContent).toContain('North block seen by 2 posts or more — 30.0 % now, 70.0 points short (0.70 km²)');
    expect(rules[1]!.textContent).toContain('At least 70 % of the site seen by 1 post or more');
    expect(screen.getByRole('listitem', { name: 'Seen by 1 post or more: 72.4 %' })).toBeTruthy();
    expect(screen.getByText(/Seen is not detected/)).toBeTruthy();

    fireEvent.click(screen.getByRole('link', { name: 'Open on the map' }));
    expect(mockNavigate).toHaveBeenCalledWith({
      pathname: '/sites/[siteId]/map',
      params: { siteId: IDS.site, runId: IDS.run, caseKey: done.cases[0]!.key },
    });
  }, 15_000);

  it('cancels a running run and says so', async () => {
    const run = running(0.3, 'Viewsheds');
    const cancelled = sampleRun({ ...run, status: 'cancelled', current: false, finishedAt: '2026-06-01T10:00:05.000Z' });
    fakeApi({
      [`GET ${coveragePath}`]: [
        { body: { inputsHash: 'hash-1', current: run, latest: run, hasTerrain: true } },
        { body: { inputsHash: 'hash-1', current: null, latest: cancelled, hasTerrain: true } },
      ],
      [`GET ${runPath}`]: [{ body: { run } }],
      [`POST ${runPath}/cancel`]: [{ body: { run: cancelled } }],
    });
    renderWithQueries(<PlanCoveragePanel planId={IDS.plan} siteId={IDS.site} editable canRun />);
    fireEvent.click(await screen.findByRole('button', { name: 'Cancel the run' }));
    await screen.findByText('Cancelled');
    expect(screen.getByRole('button', { name: 'Compute coverage' })).toBeTruthy();
  });

  it('marks figures of older inputs as out of date, and shows a failure’s reason', async () => {
    fakeApi({
      [`GET ${coveragePath}`]: [
        { body: { inputsHash: 'hash-2', current: null, latest: sampleRun({ current: false }), hasTerrain: true } },
      ],
    });
    const { unmount } = renderWithQueries(<PlanCoveragePanel planId={IDS.plan} siteId={IDS.site} editable canRun />);
    await screen.findByText('Out of date');
    expect(screen.getByRole('button', { name: 'Compute again' })).toBeTruthy();
    unmount();
    jest.restoreAllMocks();

    const failed = sampleRun({ status: 'failed', error: 'The terrain file is missing.', cases: [] });
    fakeApi({ [`GET ${coveragePath}`]: [{ body: { inputsHash: 'hash-1', current: null, latest: failed, hasTerrain: true } }] });
    renderWithQueries(<PlanCoveragePanel planId={IDS.plan} siteId={IDS.site} editable canRun={false} />);
    await screen.findByText('The coverage run failed');
    expect(screen.getByText('The terrain file is missing.')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Try again' })).toBeNull(); // not a planner
  });
});

describe('PlanCoveragePanel (frozen plan)', () => {
  it('shows the frozen run, and the revision’s own copy when the run cannot be fetched', async () => {
    const run = sampleRun();
    fakeApi({ [`GET ${runPath}`]: [{ status: 404, body: { error: { code: 'not_found', message: 'No such run.' } } }] });
    renderWithQueries(
      <PlanCoveragePanel
        planId={IDS.plan}
        siteId={IDS.site}
        editable={false}
        canRun={false}
        frozen={{
          runId: IDS.run,
          inputsHash: 'hash-1',
          datum: 'terrain',
          terrainId: null,
          terrainSha256: null,
          grid: run.grid!,
          cases: run.cases,
          layerHashes: {},
        }}
      />,
    );
    await screen.findByText(/the revision’s own copy shows/);
    expect(screen.getByText('Does not meet the standard')).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Compute/ })).toBeNull();
  });
});

describe('CoverageFigures', () => {
  it('switches case, and writes blind areas in the chosen coordinate format', async () => {
    const run = sampleRun();
    let key: string | null = null;
    const { rerender } = render(<CoverageFigures run={run} caseKey={key} onCase={(k) => (key = k)} />);
    const picker = screen.getByRole('group', { name: 'Condition · Spread' });
    const chip = within(picker).getByRole('checkbox', { name: 'no refraction (k 0)' });
    fireEvent.click(chip);
    expect(key).toBe(run.cases[1]!.key);
    rerender(<CoverageFigures run={run} caseKey={key} onCase={(k) => (key = k)} />);
    expect(screen.getByText('Meets the standard')).toBeTruthy();

    act(() => {
      fireEvent.click(screen.getByRole('checkbox', { name: 'DD' }));
    });
    const blind = within(screen.getByRole('list', { name: 'Blind areas' })).getAllByRole('listitem');
    // Decimal degrees, 5 decimals (format-coordinate.ts defaults).
    expect(blind[0]!.textContent).toContain('1. 0.90 km²around 51.81234, 15.23456');
    // Its map link opens the run's layers centred there.
    fireEvent.click(within(blind[0]!).getByRole('link', { name: 'Blind area 1 on the map' }));
    expect(mockNavigate).toHaveBeenCalledWith({
      pathname: '/sites/[siteId]/map',
      params: { siteId: IDS.site, runId: IDS.run, caseKey: run.cases[1]!.key, lat: '51.812340', lon: '15.234560' },
    });
    expect(screen.getByText(/5 patches of 0.05 km² or more unseen, 2.40 km² in all; the 2 largest:/)).toBeTruthy();
  });
});
