/**
 * JSON with object keys sorted and undefined members left out, so equal
 * content always gives the same text (and the same hash), whatever the key
 * order it was built in.
 *
 * Source: the idea of RFC 8785 (JSON Canonicalization Scheme), key ordering only.
 *
 * @example
 * canonicalJson({ b: 1, a: [true, null] }); // '{"a":[true,null],"b":1}'
 */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}
