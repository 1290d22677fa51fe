// Over 300 lines: the site and post contracts (rings, shoreline, bands, tide, posts and patrols) with their field-by-field refinements and messages.
import { z } from 'zod';
import { ringSelfIntersection } from '@/shared/geo/ring-self-intersection';
import { UNIT_SYSTEM_IDS } from '@/shared/units/unit-systems';
import { LatLonSchema } from './lat-lon';
import { listQuerySchema, pageOf } from './list';
import { patchOf } from './patch-of';
import { SeenVersionSchema } from './seen-version';
import { SITE_KINDS } from './site-kinds';

export { SITE_KIND_LABELS, SITE_KINDS, type SiteKind } from './site-kinds';
export const SiteKindSchema = z.enum(SITE_KINDS, { error: `Choose one of: ${SITE_KINDS.join(', ')}.` });

export { UNIT_SYSTEM_IDS } from '@/shared/units/unit-systems';

/**
 * A polygon ring as [longitude, latitude] pairs (GeoJSON order, WGS84 degrees),
 * 3 to 2 000 distinct corners; the closing corner may be given or left out.
 */
export const RingSchema = z
  .array(z.tuple([z.number().min(-180).max(180), z.number().min(-90).max(90)]), {
    error: 'Give the corners as [longitude, latitude] pairs.',
  })
  .min(3, 'A boundary needs at least three corners.')
  .max(2000, 'At most 2 000 corners.')
  .transform((ring) => {
    const [first] = ring;
    const last = ring[ring.length - 1];
    const closed = first && last && first[0] === last[0] && first[1] === last[1];
    return closed ? ring : [...ring, first!];
  })
  .refine(
    (ring) => new Set(ring.slice(0, -1).map((p) => p.join(','))).size >= 3,
    'A boundary needs at least three distinct corners.',
  )
  .superRefine((ring, ctx) => {
    const crossing = ringSelfIntersection(ring);
    if (crossing) {
      ctx.addIssue({
        code: 'custom',
        message: `The ring crosses itself near ${crossing[1].toFixed(5)}, ${crossing[0].toFixed(5)} (latitude, longitude): move a corner so its sides do not cross.`,
      });
    }
  });

/**
 * A shoreline as [longitude, latitude] pairs (GeoJSON order, WGS84 degrees)
 * from its start: chainage (distance along the shore) runs from the first
 * corner. 2 to 5 000 corners; corners repeated one after another are dropped.
 */
export const ShorelineSchema = z
  .array(z.tuple([z.number().min(-180).max(180), z.number().min(-90).max(90)]), {
    error: 'Give the shoreline as [longitude, latitude] pairs.',
  })
  .max(5000, 'At most 5 000 corners.')
  .transform((line) => line.filter((p, i) => i === 0 || p[0] !== line[i - 1]![0] || p[1] !== line[i - 1]![1]))
  .refine((line) => line.length >= 2, 'A shoreline needs at least two distinct corners.');

/** Longest offshore distance a band may reach, metres (100 km). */
export const BAND_MAX_M = 100_000;

/**
 * An offshore band the supervisor names: the water between `fromM` and `toM`
 * metres from the shoreline (e.g. 0–926 m "surf zone").
 */
export const ShoreBandSchema = z
  .object({
    name: z.string({ error: 'Name the band.' }).trim().min(1, 'Name the band.').max(60, 'At most 60 characters.'),
    fromM: z
      .number({ error: 'The band’s inner edge must be a number of metres.' })
      .min(0, 'The inner edge cannot be negative.')
      .max(BAND_MAX_M, 'At most 100 km offshore.'),
    toM: z
      .number({ error: 'The band’s outer edge must be a number of metres.' })
      .positive('The outer edge must be beyond the shore.')
      .max(BAND_MAX_M, 'At most 100 km offshore.'),
  })
  .superRefine((band, ctx) => {
    if (!(band.toM > band.fromM))
      ctx.addIssue({ code: 'custom', path: ['toM'], message: 'The outer edge must be farther out than the inner edge.' });
  });
export type ShoreBand = z.infer<typeof ShoreBandSchema>;

const uniqueBandNames = (bands: readonly { name: string }[], ctx: z.RefinementCtx) => {
  const seen = new Set<string>();
  bands.forEach((b, i) => {
    const key = b.name.trim().toLowerCase();
    if (seen.has(key)) ctx.addIssue({ code: 'custom', path: [i, 'name'], message: 'Two bands have this name.' });
    seen.add(key);
  });
};

/** What a shore post's heights (ground elevation) are measured from. */
export const HEIGHT_DATUMS = ['mean-sea-level', 'chart-datum'] as const;
export type HeightDatum = (typeof HEIGHT_DATUMS)[number];
export const HEIGHT_DATUM_LABELS: Record<HeightDatum, string> = {
  'mean-sea-level': 'Mean sea level',
  'chart-datum': 'Chart datum (of the local chart)',
};

const tideMetres = (what: string) =>
  z
    .number({ error: `${what} must be a number of metres.` })
    .min(-20, 'At least −20 m.')
    .max(20, 'At most 20 m.');

/**
 * The water level(s) to compute with, metres above the site's height datum:
 * one level, or a high/low pair (each becomes a condition of the run).
 */
export const TideSchema = z.union(
  [
    z.strictObject({ levelM: tideMetres('The tide level') }),
    z
      .strictObject({ lowM: tideMetres('Low water'), highM: tideMetres('High water') })
      .refine((t) => t.highM >= t.lowM, { path: ['highM'], message: 'High water must be at or above low water.' }),
  ],
  { error: 'Give the tide as { levelM } or { lowM, highM }, metres above the datum.' },
);
export type Tide = z.infer<typeof TideSchema>;

export const PriorityZoneSchema = z.object({
  name: z.string().trim().min(1, 'Name the zone.').max(120),
  /** Relative importance, 1 (low) … 10 (high). */
  weight: z.number().int().min(1, 'Weight is 1 to 10.').max(10, 'Weight is 1 to 10.'),
  ring: RingSchema,
});
export type PriorityZone = z.infer<typeof PriorityZoneSchema>;

/** A site: the place an agency plans lookouts for. */
export const SiteSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  kind: SiteKindSchema,
  notes: z.string(),
  /** Outer boundary ring (closed), or null while not drawn yet. */
  boundary: z.array(z.tuple([z.number(), z.number()])).nullable(),
  priorityZones: z.array(z.object({ name: z.string(), weight: z.number(), ring: z.array(z.tuple([z.number(), z.number()])) })),
  defaultUnits: z.enum(UNIT_SYSTEM_IDS),
  /** IANA time zone, e.g. Europe/Oslo. */
  timeZone: z.string(),
  /** Land/sea mask from the terrain: cells at or below this height are sea, metres; null = not stated. */
  seaLevelMaxM: z.number().nullable().default(null),
  /** The sea part of the site as a ring ([lon, lat], WGS84); null = not drawn. */
  seaArea: z
    .array(z.tuple([z.number(), z.number()]))
    .nullable()
    .default(null),
  /** Ground height where targets stand, for smooth-earth figures, metres above sea level; null = see `smoothEarthGround`. */
  targetGroundM: z.number().nullable().default(null),
  /** The shoreline ([lon, lat], WGS84) from its start; null = not drawn. Always sent by the API; optional for older copies. */
  shoreline: z
    .array(z.tuple([z.number(), z.number()]))
    .nullable()
    .optional(),
  /** Offshore bands, metres from the shoreline. */
  bands: z.array(z.object({ name: z.string(), fromM: z.number(), toM: z.number() })).optional(),
  /** What posts' ground elevations (and the tide) are measured from. */
  heightDatum: z.enum(HEIGHT_DATUMS).optional(),
  /** Water level(s) above the datum for the coverage run; null = the datum itself. */
  tide: z
    .union([z.object({ levelM: z.number() }), z.object({ lowM: z.number(), highM: z.number() })])
    .nullable()
    .optional(),
  version: z.number().int(),
  /** ISO 8601. */
  updatedAt: z.string(),
});
export type Site = z.infer<typeof SiteSchema>;

export const SiteSummarySchema = SiteSchema.pick({ id: true, name: true, kind: true, notes: true, updatedAt: true }).extend({
  postCount: z.number().int(),
});
export type SiteSummary = z.infer<typeof SiteSummarySchema>;

const isTimeZone = (tz: string) => {
  try {
    new Intl.DateTimeFormat('en', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
};

export const SiteInputSchema = z.object({
  name: z.string({ error: 'Name the site.' }).trim().min(1, 'Name the site.').max(160, 'At most 160 characters.'),
  kind: SiteKindSchema,
  notes: z.string().max(5000, 'At most 5 000 characters.').default(''),
  boundary: RingSchema.nullable().default(null),
  priorityZones: z.array(PriorityZoneSchema).max(50, 'At most 50 zones.').default([]),
  defaultUnits: z.enum(UNIT_SYSTEM_IDS).default('metric'),
  timeZone: z.string().refine(isTimeZone, 'Not a time zone name (use e.g. Europe/Oslo).').default('UTC'),
  /**
   * Land/sea mask from the terrain: cells at or below this height are sea, metres (−500…100); null = not
   * stated. Targets on the water count only on sea cells.
   */
  seaLevelMaxM: z
    .number({ error: 'Sea level must be a number of metres.' })
    .min(-500, 'At least −500 m.')
    .max(100, 'At most 100 m.')
    .nullable()
    .default(null),
  /** The sea part of the site, a ring ([lon, lat], WGS84) drawn or imported; null = none. */
  seaArea: RingSchema.nullable().default(null),
  /**
   * Ground height where targets stand, for the smooth-earth plan results, metres above sea level
   * (−500…9000); null = sea level on a coast, each post's own ground inland.
   */
  targetGroundM: z
    .number({ error: 'Ground height must be a number of metres.' })
    .min(-500, 'At least −500 m.')
    .max(9000, 'At most 9 000 m.')
    .nullable()
    .default(null),
  /** The shoreline, [lon, lat] from its start (chainage 0); null = none. */
  shoreline: ShorelineSchema.nullable().default(null),
  /** Offshore bands the supervisor names, metres from the shoreline; at most 12, names unique. */
  bands: z.array(ShoreBandSchema).max(12, 'At most 12 bands.').superRefine(uniqueBandNames).default([]),
  /** What ground elevations and the tide are measured from. */
  heightDatum: z.enum(HEIGHT_DATUMS, { error: `Choose one of: ${HEIGHT_DATUMS.join(', ')}.` }).default('mean-sea-level'),
  /** Water level(s) above the datum for the coverage run; null = the datum itself (0 m). */
  tide: TideSchema.nullable().default(null),
});
export type SiteInput = z.infer<typeof SiteInputSchema>;

/** Changes to a site (a field left out stays as it is) and the version last seen. */
export const SiteUpdateSchema = patchOf(SiteInputSchema).extend({
  version: SeenVersionSchema,
});

export const SiteListSchema = pageOf(SiteSummarySchema);

// ---------------------------------------------------------------- posts

export const POST_KINDS = ['tower', 'hilltop', 'shore-post', 'vessel', 'aircraft'] as const;
export const POST_KIND_LABELS: Record<(typeof POST_KINDS)[number], string> = {
  tower: 'Tower',
  hilltop: 'Hilltop',
  'shore-post': 'Shore post',
  vessel: 'Vessel',
  aircraft: 'Aircraft',
};
export const POST_STATUSES = ['existing', 'proposed'] as const;

/** Kinds of post that move: they may patrol a route (`route`, `speedMps`, `cycleMinutes`). */
export const PATROL_POST_KINDS = ['vessel', 'aircraft'] as const satisfies readonly (typeof POST_KINDS)[number][];
export const isPatrolKind = (kind: string): boolean => (PATROL_POST_KINDS as readonly string[]).includes(kind);

/** Most waypoints a route may have. */
export const MAX_ROUTE_WAYPOINTS = 100;
/** Fastest patrol, m/s (≈ 390 kn: above any patrol aircraft's search speed). */
export const MAX_PATROL_SPEED_MPS = 200;
/** Longest patrol cycle, minutes (one day). */
export const MAX_CYCLE_MINUTES = 1440;

const metres = (what: string, max: number) =>
  z
    .number({ error: `${what} must be a number of metres.` })
    .min(0, `${what} cannot be negative.`)
    .max(max, `${what} must be at most ${max} m.`);
const bearing = z
  .number({ error: 'A bearing is a number of degrees.' })
  .min(0, 'Bearings run 0–360°.')
  .max(360, 'Bearings run 0–360°.');

/** A place a lookout watches from. Heights in metres; location WGS84. */
export const PostSchema = z.object({
  id: z.uuid(),
  siteId: z.uuid(),
  name: z.string(),
  kind: z.enum(POST_KINDS),
  location: LatLonSchema,
  /** Ground (or sea) elevation at the post, metres above the datum. */
  groundElevationM: z.number(),
  /** Height of the structure (tower cab floor, deck), metres above ground. */
  structureHeightM: z.number(),
  /** Eye height above the platform, metres. */
  eyeHeightM: z.number(),
  /** Viewing sector, clockwise from → to, degrees true; null = all round. */
  sector: z.object({ fromDeg: z.number(), toDeg: z.number() }).nullable(),
  status: z.enum(POST_STATUSES),
  /**
   * A vessel's or aircraft's patrol route: waypoints (WGS84) joined by
   * straight legs, followed from the first to the last once per cycle; the
   * craft holds at the last waypoint for the rest of the cycle. Null = the
   * post stays at its location.
   */
  route: z.array(LatLonSchema).nullish(),
  /** Speed along the route, m/s; null without a route. */
  speedMps: z.number().nullish(),
  /** Length of one patrol cycle (time on station), minutes; null without a route. */
  cycleMinutes: z.number().nullish(),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type Post = z.infer<typeof PostSchema>;

export const PostInputSchema = z.object({
  name: z.string({ error: 'Name the post.' }).trim().min(1, 'Name the post.').max(120, 'At most 120 characters.'),
  kind: z.enum(POST_KINDS, { error: `Choose one of: ${POST_KINDS.join(', ')}.` }),
  location: LatLonSchema,
  groundElevationM: z
    .number({ error: 'Ground elevation must be a number of metres.' })
    .min(-500, 'At least −500 m.')
    .max(9000, 'At most 9 000 m.'),
  structureHeightM: metres('Structure height', 500).default(0),
  eyeHeightM: metres('Eye height', 10).default(1.6),
  sector: z.object({ fromDeg: bearing, toDeg: bearing }).nullable().default(null),
  status: z.enum(POST_STATUSES).default('existing'),
  route: z
    .array(LatLonSchema, { error: 'A route is a list of waypoints { latDeg, lonDeg }.' })
    .min(2, 'A route needs at least two waypoints (one leg).')
    .max(MAX_ROUTE_WAYPOINTS, `At most ${MAX_ROUTE_WAYPOINTS} waypoints.`)
    .nullish(),
  speedMps: z
    .number({ error: 'Speed must be a number of metres per second.' })
    .positive('Speed must be more than 0.')
    .max(MAX_PATROL_SPEED_MPS, `Speed must be at most ${MAX_PATROL_SPEED_MPS} m/s.`)
    .nullish(),
  cycleMinutes: z
    .number({ error: 'The cycle must be a number of minutes.' })
    .positive('The cycle must be more than 0 minutes.')
    .max(MAX_CYCLE_MINUTES, `The cycle must be at most ${MAX_CYCLE_MINUTES} minutes (one day).`)
    .nullish(),
});
export type PostInput = z.infer<typeof PostInputSchema>;

/** Changes to a post (a field left out stays as it is) and the version last seen. */
export const PostUpdateSchema = patchOf(PostInputSchema).extend({
  version: SeenVersionSchema,
});

export const POST_SORTS = ['name', '-name', 'kind', 'status', '-updatedAt'] as const;
export const PostListQuerySchema = listQuerySchema(POST_SORTS).extend({
  pageSize: z.coerce.number().int().min(1).max(500, 'At most 500 per page.').default(200),
  kind: z.enum(POST_KINDS, { error: `Kinds: ${POST_KINDS.join(', ')}.` }).optional(),
  status: z.enum(POST_STATUSES, { error: `Statuses: ${POST_STATUSES.join(', ')}.` }).optional(),
});
export type PostListQuery = z.infer<typeof PostListQuerySchema>;

export const PostListSchema = pageOf(PostSchema);
