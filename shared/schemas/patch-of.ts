import { z } from 'zod';

type Patched<T extends z.ZodRawShape> = {
  [K in keyof T]: z.ZodOptional<T[K] extends z.ZodDefault<infer Inner> ? Inner : T[K]>;
};

/**
 * The fields of a create schema, all optional and without their defaults,
 * for PATCH bodies. Zod 4 applies a default even inside `.partial()`, so a
 * partial of a create schema would reset every field the client left out
 * (e.g. a site's boundary to null); here a field left out stays as stored.
 *
 * @param schema - a create schema (a plain z.object)
 * @returns an object schema with every field optional and no defaults
 *
 * @example
 * patchOf(z.object({ a: z.number().default(0) })).parse({}); // {}
 */
export function patchOf<T extends z.ZodRawShape>(schema: z.ZodObject<T>): z.ZodObject<Patched<T>> {
  const shape = Object.fromEntries(
    Object.entries(schema.shape).map(([key, field]) => [
      key,
      z.optional((field instanceof z.ZodDefault ? field.unwrap() : field) as z.ZodType),
    ]),
  );
  return z.object(shape) as unknown as z.ZodObject<Patched<T>>;
}
