import { createOutbox, memoryOutboxStore, SETTLED_KEPT_MS, type OutboxItem, type SendOutcome } from '@/components/offline/outbox';

// The outbox's rules: in order, each item delivered once, a refusal final, an unreachable server retried later.
// Idempotent delivery by key is the usual pattern for retried writes (common practice, no source); the server's
// side (a repeated key answered with the first answer) is tested in tests/api/incidents.test.ts.

const report = (n: number, at: string) => ({
  key: `key-${n}`,
  label: `Bearing ${n}`,
  path: '/v1/incidents/x/reports',
  body: { n },
  refresh: [['incidents']],
  createdAt: at,
});

/** A server that can be cut off; it records every delivery it took. */
function fakeServer() {
  const taken: string[] = [];
  let reachable = true;
  let refuse = new Set<string>();
  const send = async (item: OutboxItem): Promise<SendOutcome> => {
    if (!reachable) return { kind: 'unreachable', reason: 'Kenning cannot reach its server.' };
    if (refuse.has(item.key)) return { kind: 'refused', reason: 'That incident is closed.' };
    taken.push(item.key);
    return { kind: 'delivered' };
  };
  return {
    send,
    taken,
    cut: () => (reachable = false),
    restore: () => (reachable = true),
    refuse: (keys: string[]) => (refuse = new Set(keys)),
  };
}

it('keeps reports made offline and sends them in the order they were made, each once, when the network returns', async () => {
  const server = fakeServer();
  const outbox = createOutbox(memoryOutboxStore(), server.send);
  server.cut();
  await outbox.add(report(2, '2026-12-03T10:02:00Z'));
  await outbox.add(report(1, '2026-12-03T10:01:00Z'));
  await outbox.add(report(3, '2026-12-03T10:03:00Z'));
  expect(await outbox.flush()).toEqual([]);
  expect(await outbox.flush()).toEqual([]);
  // Only the oldest is tried while the server is away; the others wait behind it.
  expect((await outbox.list()).map((i) => [i.key, i.state, i.attempts])).toEqual([
    ['key-2', 'waiting', 0],
    ['key-1', 'waiting', 2],
    ['key-3', 'waiting', 0],
  ]);

  server.restore();
  // Two flushes at once (the network returning and a tap on "Send now"): still one delivery each.
  const [a, b] = await Promise.all([outbox.flush(), outbox.flush()]);
  expect([...a, ...b].map((i) => i.key)).toEqual(['key-1', 'key-2', 'key-3']);
  expect(server.taken).toEqual(['key-1', 'key-2', 'key-3']);
  expect((await outbox.list()).every((i) => i.state === 'sent')).toBe(true);
  await outbox.flush();
  expect(server.taken).toHaveLength(3);
});

it('adds an item once however often the form sends it, and keeps the server’s refusal without retrying it', async () => {
  const server = fakeServer();
  const outbox = createOutbox(memoryOutboxStore(), server.send);
  await outbox.add(report(1, '2026-12-03T10:01:00Z'));
  await outbox.add(report(1, '2026-12-03T10:01:00Z'));
  await outbox.add(report(2, '2026-12-03T10:02:00Z'));
  server.refuse(['key-1']);
  await outbox.flush();
  const items = await outbox.list();
  expect(items).toHaveLength(2);
  expect(items.find((i) => i.key === 'key-1')).toMatchObject({ state: 'refused', refusal: 'That incident is closed.' });
  // A refused item does not hold back the next one.
  expect(server.taken).toEqual(['key-2']);
  await outbox.flush();
  expect(server.taken).toEqual(['key-2']);
});

it('stops at the first item it cannot send, so a later one never overtakes it', async () => {
  const taken: string[] = [];
  let calls = 0;
  // The network drops after the first delivery.
  const outbox = createOutbox(memoryOutboxStore(), async (item) => {
    calls++;
    if (calls > 1) throw new TypeError('Failed to fetch');
    taken.push(item.key);
    return { kind: 'delivered' };
  });
  await outbox.add(report(1, '2026-12-03T10:01:00Z'));
  await outbox.add(report(2, '2026-12-03T10:02:00Z'));
  await outbox.add(report(3, '2026-12-03T10:03:00Z'));
  await outbox.flush();
  expect(taken).toEqual(['key-1']);
  expect(calls).toBe(2);
  const waiting = (await outbox.list()).filter((i) => i.state === 'waiting');
  expect(waiting.map((i) => [i.key, i.lastProblem])).toEqual([
    ['key-2', 'Failed to fetch'],
    ['key-3', undefined],
  ]);
});

it('drops settled items after a week but never a waiting one', async () => {
  let now = new Date('2026-12-03T10:00:00Z');
  const server = fakeServer();
  const outbox = createOutbox(memoryOutboxStore(), server.send, () => now);
  await outbox.add(report(1, '2026-12-03T09:00:00Z'));
  await outbox.flush();
  server.cut();
  await outbox.add(report(2, '2026-12-03T09:30:00Z'));
  now = new Date(now.getTime() + SETTLED_KEPT_MS + 60_000);
  await outbox.flush();
  expect((await outbox.list()).map((i) => [i.key, i.state])).toEqual([['key-2', 'waiting']]);
});

it('forgets everything at sign-out', async () => {
  const server = fakeServer();
  server.cut();
  const outbox = createOutbox(memoryOutboxStore(), server.send);
  await outbox.add(report(1, '2026-12-03T10:01:00Z'));
  await outbox.clear();
  server.restore();
  await outbox.flush();
  expect(await outbox.list()).toEqual([]);
  expect(server.taken).toEqual([]);
});
