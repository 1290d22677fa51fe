import { z } from 'zod';

export const SITE_KINDS = ['forest-district', 'coast-stretch', 'search-area'] as const;
export const SiteKindSchema = z.enum(SITE_KINDS);
export type SiteKind = z.infer<typeof SiteKindSchema>;

export const SITE_KIND_LABELS: Record<SiteKind, string> = {
  'forest-district': 'Forest district',
  'coast-stretch': 'Coast stretch',
  'search-area': 'Search area',
};

/** A site as listed: the place an agency plans lookouts for. */
export const SiteSummarySchema = z.object({
  id: z.uuid(),
  name: z.string(),
  kind: SiteKindSchema,
  notes: z.string(),
  /** ISO 8601. */
  updatedAt: z.string(),
});
export type SiteSummary = z.infer<typeof SiteSummarySchema>;

/** One page of a list endpoint. */
export const pageOf = <T extends z.ZodType>(item: T) =>
  z.object({ items: z.array(item), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() });

export const SiteListSchema = pageOf(SiteSummarySchema);

export const PageQuerySchema = z.object({
  page: z.coerce.number().int().min(1, 'Pages start at 1.').default(1),
  pageSize: z.coerce.number().int().min(1).max(200, 'At most 200 per page.').default(50),
});
