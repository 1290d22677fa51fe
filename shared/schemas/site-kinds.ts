/**
 * The kinds of site and their names for people, without zod: the signed-in
 * home names each site's kind before the schemas have loaded.
 */
export const SITE_KINDS = ['forest-district', 'coast-stretch', 'search-area'] as const;
export type SiteKind = (typeof SITE_KINDS)[number];

export const SITE_KIND_LABELS: Record<SiteKind, string> = {
  'forest-district': 'Forest district',
  'coast-stretch': 'Coast stretch',
  'search-area': 'Search area',
};
