import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { createQueryClient } from '@/components/data/query-client';
import { hourOf } from '@/components/plans/band-rules-field';
import { PlanEditor } from '@/components/plans/plan-editor';
import type { Plan } from '@/shared/schemas/plan';
import { STAMP, testConditionSet, testPost, testSite } from '@/tests/support/plan-fixtures';

const mockReplace = jest.fn();
jest.mock('expo-router', () => ({
  useRouter: () => ({ replace: mockReplace, back: jest.fn(), canGoBack: () => true }),
}));

// An invented coast with two offshore bands (metres from the shoreline), one shore post and a boat to find.
const site = testSite({
  name: 'Test strand',
  kind: 'coast-stretch',
  shoreline: [
    [14.0, 61.0],
    [14.2, 61.0],
  ],
  bands: [
    { name: 'Surf zone', fromM: 0, toM: 926 },
    { name: 'Inshore', fromM: 926, toM: 5556 },
  ],
});
const post = testPost({ siteId: site.id, name: 'Shore post' });
const boat = {
  id: '00000000-0000-4000-8000-000000000202',
  name: 'Small boat',
  kind: 'vessel',
  heightM: 1,
  widthM: 4,
  requiredVisibleM: 0,
  period: 'day',
  lightIntensityCd: null,
  onWater: true,
  version: 0,
  updatedAt: STAMP,
};
const conditions = testConditionSet();
const plan: Plan = {
  id: '00000000-0000-4000-8000-000000000401',
  siteId: site.id,
  title: 'Strand cover',
  postIds: [post.id],
  targetIds: [boat.id],
  conditionSetIds: [conditions.id],
  standard: { minSeenPct: 0, priorityMinPosts: 1, targetRules: [], crossBearingMinPct: null },
  lookout: { resolutionArcmin: 1, magnification: 1 },
  status: 'draft',
  version: 1,
  previousId: null,
  rowVersion: 3,
  preparedBy: { id: '00000000-0000-4000-8000-000000000501', name: 'Planner', role: 'planner' },
  siteName: site.name,
  submittedAt: null,
  updatedAt: STAMP,
};
const page = <T,>(items: T[]) => ({ items, total: items.length, page: 1, pageSize: 200 });

/** A fake API: GETs by path (query ignored), and the plan's PATCH answered by `onPatch`, its bodies kept. */
function fakeApi(onPatch: (body: unknown) => { status: number; body: unknown }) {
  const patches: unknown[] = [];
  const gets: Record<string, unknown> = {
    '/api/v1/sites': page([{ id: site.id, name: site.name, kind: site.kind, notes: '', updatedAt: STAMP, postCount: 1 }]),
    [`/api/v1/sites/${site.id}`]: { site },
    [`/api/v1/sites/${site.id}/posts`]: page([post]),
    '/api/v1/targets': page([boat]),
    '/api/v1/conditions': page([conditions]),
  };
  // jsdom has no fetch of its own: the app's API client finds this one.
  globalThis.fetch = jest.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const path = String(input).split('?')[0]!;
    const method = init?.method ?? 'GET';
    let answer: { status: number; body: unknown };
    if (method === 'PATCH' && path === `/api/v1/plans/${plan.id}`) {
      const body = JSON.parse(String(init!.body)) as unknown;
      patches.push(body);
      answer = onPatch(body);
    } else if (method === 'GET' && path in gets) answer = { status: 200, body: gets[path] };
    else throw new Error(`No fake answer for ${method} ${path}`);
    return { ok: answer.status < 300, status: answer.status, json: async () => answer.body } as Response;
  }) as typeof fetch;
  return patches;
}

const clients: ReturnType<typeof createQueryClient>[] = [];
const renderEditor = (p: Plan = plan) => {
  const client = createQueryClient();
  clients.push(client);
  return render(
    <QueryClientProvider client={client}>
      <PlanEditor plan={p} />
    </QueryClientProvider>,
  );
};

afterEach(() => {
  for (const c of clients.splice(0)) c.clear();
  delete (globalThis as { fetch?: unknown }).fetch;
  mockReplace.mockReset();
});

const field = (scope: HTMLElement, label: string) => within(scope).getByLabelText(label) as HTMLInputElement;

describe('the plan form’s band rules', () => {
  it('adds "Inshore: 95 % of the shore by ≥ 1 post, 08:00–20:00" and sends it in the standard', async () => {
    const patches = fakeApi((body) => ({ status: 200, body: { plan: { ...plan, ...(body as object), rowVersion: 4 } } }));
    renderEditor();
    fireEvent.click(await screen.findByRole('button', { name: 'Add a band rule' }));
    const rule = screen.getByLabelText('Band rule 1');
    // The bands offered are the site's own.
    const bands = within(rule).getByRole('radiogroup', { name: 'Rule 1: band' });
    expect(
      within(bands)
        .getAllByRole('radio')
        .map((r) => r.textContent),
    ).toEqual(['Surf zone', 'Inshore']);
    fireEvent.click(within(bands).getByRole('radio', { name: 'Inshore' }));
    fireEvent.change(field(rule, 'Share of the shore'), { target: { value: '95' } });
    fireEvent.change(field(rule, 'From'), { target: { value: '08:00' } });
    fireEvent.change(field(rule, 'To'), { target: { value: '20:00' } });
    expect(within(rule).getByText('Reads: Inshore: 95 % of the shore by ≥ 1 post, 08:00–20:00')).toBeTruthy();
    // Estimates, not detection: the caution stays beside the rules.
    expect(screen.getByText(/it is not detection\. Estimates only; refraction near the horizon varies widely/)).toBeTruthy();

    fireEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    await waitFor(() => expect(patches).toHaveLength(1));
    expect((patches[0] as { standard: { bandRules: unknown } }).standard.bandRules).toEqual([
      { band: 'Inshore', minPosts: 1, minPct: 95, fromHour: 8, toHour: 20 },
    ]);
    await waitFor(() => expect(mockReplace).toHaveBeenCalled());
  });

  it('shows the schema’s reason under the field and sends nothing when the window ends before it starts', async () => {
    const patches = fakeApi(() => ({ status: 500, body: {} }));
    renderEditor();
    fireEvent.click(await screen.findByRole('button', { name: 'Add a band rule' }));
    const rule = screen.getByLabelText('Band rule 1');
    fireEvent.change(field(rule, 'From'), { target: { value: '20:00' } });
    fireEvent.change(field(rule, 'To'), { target: { value: '08:00' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(await within(rule).findByText('The end must be after the start.')).toBeTruthy();
    expect(field(rule, 'To').getAttribute('aria-invalid')).toBe('true');
    expect(patches).toHaveLength(0);
  });

  it('puts the server’s field errors under the rule’s fields and keeps what was typed', async () => {
    const withRule: Plan = {
      ...plan,
      standard: { ...plan.standard, bandRules: [{ band: 'Surf zone', minPosts: 2, minPct: 80, fromHour: 0, toHour: 24 }] },
    };
    const patches = fakeApi(() => ({
      status: 400,
      body: {
        error: {
          code: 'invalid_input',
          message: 'Check the marked fields.',
          fields: { 'standard.bandRules.0.fromHour': 'The start is an hour, 0 to 23.' },
        },
      },
    }));
    renderEditor(withRule);
    const rule = await screen.findByLabelText('Band rule 1');
    // The stored rule, as the form shows it.
    expect(field(rule, 'Share of the shore').value).toBe('80');
    expect(field(rule, 'From').value).toBe('00:00');
    expect(field(rule, 'To').value).toBe('24:00');
    expect(within(rule).getByRole('radio', { name: '2 posts' }).getAttribute('aria-checked')).toBe('true');
    expect(within(rule).getByText('Reads: Surf zone: 80 % of the shore by ≥ 2 posts, all day')).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(await within(rule).findByText('The start is an hour, 0 to 23.')).toBeTruthy();
    expect(patches).toHaveLength(1);
    expect(field(rule, 'Share of the shore').value).toBe('80');
    expect(mockReplace).not.toHaveBeenCalled();
  });

  it('sends an empty list when the last rule is removed, and none for a plan that never had band rules', async () => {
    const withRule: Plan = {
      ...plan,
      standard: { ...plan.standard, bandRules: [{ band: 'Inshore', minPosts: 1, minPct: 95, fromHour: 8, toHour: 20 }] },
    };
    const patches = fakeApi((body) => ({ status: 200, body: { plan: { ...plan, ...(body as object) } } }));
    const first = renderEditor(withRule);
    fireEvent.click(await screen.findByRole('button', { name: 'Remove rule 1' }));
    fireEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    await waitFor(() => expect(patches).toHaveLength(1));
    expect((patches[0] as { standard: { bandRules?: unknown } }).standard.bandRules).toEqual([]);
    first.unmount();

    renderEditor();
    await screen.findByRole('button', { name: 'Add a band rule' });
    fireEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    await waitFor(() => expect(patches).toHaveLength(2));
    expect((patches[1] as { standard: object }).standard).not.toHaveProperty('bandRules');
  });
});

describe('hours typed on a band rule', () => {
  it('reads 8, 08, 08:00 and 24:00 as whole hours and anything else as not a number', () => {
    // common practice, no source: a 24-hour clock, 24:00 the end of the day (ISO 8601 allows it).
    expect([hourOf('8'), hourOf('08'), hourOf('08:00'), hourOf(' 20:00 '), hourOf('24:00')]).toEqual([8, 8, 8, 20, 24]);
    expect(hourOf('08:30')).toBe(8.5);
    expect(hourOf('')).toBeNaN();
    expect(hourOf('eight')).toBeNaN();
  });
});
