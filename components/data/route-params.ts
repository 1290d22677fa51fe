import { useLocalSearchParams } from 'expo-router';

/**
 * A UUID as zod's `z.uuid()` accepts it (RFC 9562: version 1–8, variant 10xx,
 * and the nil and max ids). Route files check their ids with this rather than
 * with zod, which the first bundle leaves to the deferred chunk.
 */
const UUID =
  /^([0-9a-fA-F]{8}-[0-9a-fA-F]{4}-[1-8][0-9a-fA-F]{3}-[89abAB][0-9a-fA-F]{3}-[0-9a-fA-F]{12}|00000000-0000-0000-0000-000000000000|ffffffff-ffff-ffff-ffff-ffffffffffff)$/;

export function isUuid(value: unknown): value is string {
  return typeof value === 'string' && UUID.test(value);
}

type IdParams<R extends string, O extends string> = { [K in R]: string } & { [K in O]?: string };

/** The id parameters of a route when each required one is present and every one given is a UUID; otherwise null. */
export function readIdParams<R extends string, O extends string = never>(
  params: Record<string, unknown>,
  required: readonly R[],
  optional: readonly O[] = [],
): IdParams<R, O> | null {
  const ids: Record<string, string> = {};
  for (const name of [...required, ...optional]) {
    const value = params[name];
    if (value === undefined && (optional as readonly string[]).includes(name)) continue;
    if (!isUuid(value)) return null;
    ids[name] = value;
  }
  return ids as IdParams<R, O>;
}

/** `readIdParams` of the current route's parameters. */
export function useIdParams<R extends string, O extends string = never>(
  required: readonly R[],
  optional: readonly O[] = [],
): IdParams<R, O> | null {
  return readIdParams(useLocalSearchParams(), required, optional);
}
