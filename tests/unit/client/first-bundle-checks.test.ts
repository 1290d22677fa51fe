/**
 * The first bundle checks two things without zod: the ids in a route's address
 * and the API's error bodies. Each hand check must agree with the zod schema it
 * stands in for, on valid and invalid samples alike.
 * Source: zod v4's `z.uuid()` (RFC 9562 UUIDs) and Kenning's ApiErrorSchema,
 * the reference implementations these checks replace in the first bundle.
 */
import { z } from 'zod';
import { ApiErrorSchema } from '@/shared/schemas/error';
import { api, ApiRequestError, lazySchema } from '@/components/data/api-client';
import { isUuid, readIdParams } from '@/components/data/route-params';

// route-params' hook reads expo-router, which this Node test does not load (jest hoists the mock above the imports).
jest.mock('expo-router', () => ({ useLocalSearchParams: () => ({}) }));

const UUIDS = [
  '7d1f3c2a-5b6e-4f70-8a91-2b3c4d5e6f70', // version 4, variant 10xx
  '017f22e2-79b0-7cc3-98c4-dc0c0c07398f', // version 7 (RFC 9562 example)
  'f81d4fae-7dec-11d0-a765-00a0c91e6bf6', // version 1 (RFC 4122 example)
  '00000000-0000-0000-0000-000000000000', // nil
  'ffffffff-ffff-ffff-ffff-ffffffffffff', // max
  'F81D4FAE-7DEC-11D0-A765-00A0C91E6BF6', // upper case
  '7d1f3c2a-5b6e-0f70-8a91-2b3c4d5e6f70', // version 0: not allowed
  '7d1f3c2a-5b6e-9f70-8a91-2b3c4d5e6f70', // version 9: not allowed
  '7d1f3c2a-5b6e-4f70-ca91-2b3c4d5e6f70', // variant 110x: not allowed
  '7d1f3c2a5b6e4f708a912b3c4d5e6f70', // no hyphens
  '7d1f3c2a-5b6e-4f70-8a91-2b3c4d5e6f7', // one short
  ' 7d1f3c2a-5b6e-4f70-8a91-2b3c4d5e6f70',
  'g81d4fae-7dec-11d0-a765-00a0c91e6bf6',
  '',
];

describe('isUuid', () => {
  it.each(UUIDS)('agrees with z.uuid() on %p', (value) => {
    expect(isUuid(value)).toBe(z.uuid().safeParse(value).success);
  });

  it('takes only strings (a repeated parameter comes as an array)', () => {
    expect(isUuid([UUIDS[0]])).toBe(false);
    expect(isUuid(undefined)).toBe(false);
  });
});

describe('readIdParams', () => {
  const [a, b] = UUIDS as [string, string];

  it('gives the ids when the required ones are there and every one given is a UUID', () => {
    expect(readIdParams({ siteId: a, postId: b }, ['siteId', 'postId'])).toEqual({ siteId: a, postId: b });
    expect(readIdParams({ a }, [], ['a', 'b'])).toEqual({ a });
  });

  it('is null for a missing required id, or any id that is not a UUID', () => {
    expect(readIdParams({ siteId: a }, ['siteId', 'postId'])).toBeNull();
    expect(readIdParams({ siteId: 'nope' }, ['siteId'])).toBeNull();
    expect(readIdParams({ a, b: 'nope' }, [], ['a', 'b'])).toBeNull();
  });
});

describe('api error bodies', () => {
  const BODIES: unknown[] = [
    { error: { code: 'invalid_input', message: 'Name the site.', fields: { name: 'Name the site.' } } },
    { error: { code: 'not_found', message: 'No such site.' } },
    { error: { code: 'invalid_input', message: 'x', fields: { name: 3 } } },
    { error: { code: 5, message: 'x' } },
    { error: { message: 'x' } },
    { error: 'boom' },
    { message: 'x' },
    null,
    'Bad gateway',
  ];

  afterEach(() => jest.restoreAllMocks());

  it.each(BODIES.map((body) => [JSON.stringify(body), body]))('reads %s as ApiErrorSchema does', async (_label, body) => {
    jest.spyOn(globalThis, 'fetch').mockResolvedValue(new Response(JSON.stringify(body), { status: 422 }));
    const error = await api.get('/v1/sites', z.unknown()).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiRequestError);
    const reference = ApiErrorSchema.safeParse(body);
    const e = error as ApiRequestError;
    if (reference.success) {
      expect([e.code, e.message, e.fields]).toEqual([
        reference.data.error.code,
        reference.data.error.message,
        reference.data.error.fields ?? {},
      ]);
    } else {
      expect([e.status, e.code]).toEqual([422, 'http_error']);
    }
  });
});

describe('lazySchema', () => {
  afterEach(() => jest.restoreAllMocks());

  it('parses the answer with the loaded schema, and tries a failed load again on the next call', async () => {
    const load = jest
      .fn<Promise<z.ZodType<{ n: number }>>, []>()
      .mockRejectedValueOnce(new Error('chunk failed'))
      .mockResolvedValue(z.object({ n: z.number() }));
    const schema = lazySchema(load);
    jest.spyOn(globalThis, 'fetch').mockImplementation(async () => new Response(JSON.stringify({ n: 3 }), { status: 200 }));
    await expect(api.get('/x', schema)).rejects.toThrow('chunk failed');
    await expect(api.get('/x', schema)).resolves.toEqual({ n: 3 });
    await expect(api.get('/x', schema)).resolves.toEqual({ n: 3 });
    expect(load).toHaveBeenCalledTimes(2);
  });

  it('rejects an answer the schema does not accept', async () => {
    jest.spyOn(globalThis, 'fetch').mockResolvedValue(new Response(JSON.stringify({ n: 'three' }), { status: 200 }));
    await expect(
      api.get(
        '/x',
        lazySchema(async () => z.object({ n: z.number() })),
      ),
    ).rejects.toThrow();
  });
});
