/** One request the fake API answered: "METHOD path" and the JSON body sent, if any. */
export interface FakeApiCall {
  readonly key: string;
  readonly body: unknown;
}

/**
 * Puts a fake API in place of `fetch` (jsdom has none of its own: the app's
 * API client finds this one). It answers per "METHOD path", in order when a
 * list is given (the last answer repeats), and throws for a request it has no
 * answer for.
 *
 * @returns the calls as they are made (the list fills as the test runs)
 */
export function fakeApi(answers: Record<string, { status?: number; body: unknown }[]>): FakeApiCall[] {
  const calls: FakeApiCall[] = [];
  globalThis.fetch = jest.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const key = `${init?.method ?? 'GET'} ${String(input)}`;
    calls.push({ key, body: typeof init?.body === 'string' ? JSON.parse(init.body) : undefined });
    const list = answers[key];
    if (!list?.length) throw new Error(`No fake answer for ${key}`);
    const answer = list.length > 1 ? list.shift()! : list[0]!;
    const status = answer.status ?? 200;
    return { ok: status < 300, status, json: async () => answer.body } as Response;
  }) as typeof fetch;
  return calls;
}
