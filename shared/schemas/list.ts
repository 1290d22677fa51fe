import { z } from 'zod';

/** One page of a list endpoint. */
export const pageOf = <T extends z.ZodType>(item: T) =>
  z.object({ items: z.array(item), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() });

export const PageQuerySchema = z.object({
  page: z.coerce.number().int().min(1, 'Pages start at 1.').default(1),
  pageSize: z.coerce.number().int().min(1).max(200, 'At most 200 per page.').default(50),
});

/**
 * Query of a list endpoint: a page, a sort key (`-` for descending) from
 * `sorts` (the first is the default) and an optional text to look for.
 */
export const listQuerySchema = <const S extends readonly [string, ...string[]]>(sorts: S) =>
  PageQuerySchema.extend({
    sort: z.enum(sorts, { error: `Sort by one of: ${sorts.join(', ')}.` }).default(sorts[0]),
    q: z.string().trim().max(120, 'At most 120 characters.').optional(),
  });

/** Splits a sort key such as `-updatedAt` into the field and its direction. */
export const sortOrder = <F extends string>(sort: `-${F}` | F): [F, 'ASC' | 'DESC'] =>
  sort.startsWith('-') ? [sort.slice(1) as F, 'DESC'] : [sort as F, 'ASC'];
