import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen } from '@testing-library/react';
import { createQueryClient } from '@/components/data/query-client';
import { ReportBearingForm } from '@/components/incidents/report-bearing-form';
import { deviceOutbox } from '@/components/offline/device-outbox';
import type { Post } from '@/shared/schemas/site';

const INCIDENT = '00000000-0000-4000-8000-0000000000a1';
const POST = '00000000-0000-4000-8000-0000000000b2';
const USER = '00000000-0000-4000-8000-0000000000c3';
const post = { id: POST, name: 'Test Tower', location: { latDeg: 51.8, lonDeg: 15.2 }, groundElevationM: 500 } as unknown as Post;

const answer = (body: Record<string, unknown>) => ({
  report: {
    id: '2',
    seq: 2,
    postId: POST,
    postName: 'Test Tower',
    observedAt: body.observedAt,
    bearingDeg: body.bearingDeg,
    bearingReference: 'true',
    declinationDeg: 0,
    declinationSource: 'none',
    trueBearingDeg: body.bearingDeg,
    bearingSigmaDeg: body.bearingSigmaDeg,
    verticalAngleDeg: null,
    kind: 'smoke',
    note: '',
    idempotencyKey: body.idempotencyKey,
    reportedBy: { id: USER, name: 'Someone' },
    recordedAt: new Date().toISOString(),
  },
  fix: null,
  fixProblem: 'Bearings from one post so far.',
  replayed: false,
  mailed: false,
});

/** A fake API for the reports route: the first `failures` sends never arrive (network), the rest are stored. */
function fakeReports(failures: number) {
  const bodies: Record<string, unknown>[] = [];
  globalThis.fetch = jest.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    expect(`${init?.method} ${String(input)}`).toBe(`POST /api/v1/incidents/${INCIDENT}/reports`);
    const body = JSON.parse(String(init?.body)) as Record<string, unknown>;
    bodies.push(body);
    if (bodies.length <= failures) throw new TypeError('Failed to fetch');
    return { ok: true, status: 201, json: async () => answer(body) } as Response;
  }) as typeof fetch;
  return bodies;
}

const clients: ReturnType<typeof createQueryClient>[] = [];
const renderForm = () => {
  const client = createQueryClient();
  clients.push(client);
  return render(
    <QueryClientProvider client={client}>
      <ReportBearingForm incidentId={INCIDENT} posts={[post]} preferredPostId={POST} />
    </QueryClientProvider>,
  );
};
afterEach(async () => {
  for (const c of clients.splice(0)) c.clear();
  await deviceOutbox.clear();
  delete (globalThis as { fetch?: unknown }).fetch;
});

const bearingField = () => screen.getByLabelText('Bearing');
const send = () => fireEvent.click(screen.getByRole('button', { name: 'Send the bearing' }));

describe('ReportBearingForm', () => {
  it('keeps a report that cannot go on the device, sends it later with the same idempotency key and time, and a new report with a new key', async () => {
    // Source: IETF draft-ietf-httpapi-idempotency-key-header (the same key on a retried request), from memory.
    const bodies = fakeReports(1);
    renderForm();
    fireEvent.change(bearingField(), { target: { value: '47.5' } });
    send();
    await screen.findByText(/^No network: the bearing 47\.5° true from Test Tower is kept on this device/);
    const kept = await deviceOutbox.list();
    expect(kept).toHaveLength(1);
    expect(kept[0]).toMatchObject({
      key: bodies[0]!.idempotencyKey,
      state: 'waiting',
      path: `/v1/incidents/${INCIDENT}/reports`,
    });

    // The network is back: the outbox sends it, the same report as the first try.
    await deviceOutbox.flush();
    expect(bodies).toHaveLength(2);
    expect(bodies[1]!.idempotencyKey).toBe(bodies[0]!.idempotencyKey);
    expect(bodies[1]!.observedAt).toBe(bodies[0]!.observedAt);
    expect(bodies[0]).toMatchObject({
      postId: POST,
      bearingDeg: 47.5,
      bearingReference: 'true',
      bearingSigmaDeg: 0.5,
      kind: 'smoke',
    });
    expect((await deviceOutbox.list())[0]!.state).toBe('sent');

    fireEvent.change(bearingField(), { target: { value: '52' } });
    send();
    await screen.findByText(/^Sent: 52\.0° true from Test Tower/);
    expect(bodies).toHaveLength(3);
    expect(bodies[2]!.idempotencyKey).not.toBe(bodies[0]!.idempotencyKey);
  });

  it('a double tap sends one report', async () => {
    // Common practice, no source: a second tap on a send button while the first is on its way does nothing.
    const bodies = fakeReports(0);
    renderForm();
    fireEvent.change(bearingField(), { target: { value: '120' } });
    send();
    send();
    await screen.findByText(/^Sent: 120\.0° true/);
    expect(bodies).toHaveLength(1);
  });

  it('the instrument fills the uncertainty; a missing bearing is said under its field and nothing is sent', async () => {
    // Common practice, no source: a hand compass is read to 1–2° (shared/fixes/instruments.ts).
    const bodies = fakeReports(0);
    renderForm();
    fireEvent.click(screen.getByRole('checkbox', { name: /Hand compass/ }));
    expect((screen.getByLabelText('Uncertainty of the bearing') as HTMLInputElement).value).toBe('1.5');
    send();
    await screen.findByText('Type the bearing, in degrees from north (0–360).');
    fireEvent.change(bearingField(), { target: { value: 'north-east' } });
    send();
    await screen.findByText('Type a number of degrees.');
    expect(bodies).toHaveLength(0);
  });
});
