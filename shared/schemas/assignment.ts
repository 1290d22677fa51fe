import { z } from 'zod';
import { listQuerySchema, pageOf } from './list';
import { PlanResultRowSchema } from './plan';
import { PostSchema } from './site';
import { SeenVersionSchema } from './seen-version';

const instant = (what: string) => z.iso.datetime({ offset: true, error: `${what} must be a date and time (ISO 8601).` });

/** Someone put on a post for a stretch of time (a watch). Times are ISO 8601 with an offset. */
export const AssignmentInputSchema = z
  .object({
    postId: z.uuid({ error: 'Choose a post.' }),
    userId: z.uuid({ error: 'Choose a person.' }),
    startsAt: instant('Start'),
    /** Null: until further notice. */
    endsAt: instant('End').nullable().default(null),
    note: z.string().trim().max(500, 'At most 500 characters.').default(''),
  })
  .refine((a) => a.endsAt === null || Date.parse(a.endsAt) > Date.parse(a.startsAt), {
    message: 'The watch must end after it starts.',
    path: ['endsAt'],
  });
export type AssignmentInput = z.infer<typeof AssignmentInputSchema>;

export const AssignmentUpdateSchema = z
  .object({
    startsAt: instant('Start'),
    endsAt: instant('End').nullable(),
    note: z.string().trim().max(500, 'At most 500 characters.'),
  })
  .partial()
  .extend({ version: SeenVersionSchema });

const Person = z.object({ id: z.uuid(), name: z.string(), role: z.string() });

export const AssignmentSchema = z.object({
  id: z.uuid(),
  postId: z.uuid(),
  postName: z.string(),
  siteId: z.uuid(),
  siteName: z.string(),
  person: Person,
  startsAt: z.string(),
  endsAt: z.string().nullable(),
  note: z.string(),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type Assignment = z.infer<typeof AssignmentSchema>;

/** A watch window: `from`/`to` ISO 8601; default now → 7 days on. */
const WindowSchema = z.object({
  from: instant('From').optional(),
  to: instant('To').optional(),
});

export const AssignmentListQuerySchema = listQuerySchema(['startsAt', '-startsAt'] as const)
  .extend({
    siteId: z.uuid({ error: 'Not a site id.' }).optional(),
    postId: z.uuid({ error: 'Not a post id.' }).optional(),
    userId: z.uuid({ error: 'Not a person id.' }).optional(),
  })
  .extend(WindowSchema.shape);
export type AssignmentListQuery = z.infer<typeof AssignmentListQuerySchema>;
export const AssignmentListSchema = pageOf(AssignmentSchema);

export const RosterQuerySchema = WindowSchema;

/** A site's watch roster over a window: each post's watches and the stretches nobody covers. */
export const RosterSchema = z.object({
  siteId: z.uuid(),
  from: z.string(),
  to: z.string(),
  posts: z.array(
    z.object({
      postId: z.uuid(),
      postName: z.string(),
      assignments: z.array(AssignmentSchema),
      gaps: z.array(z.object({ from: z.string(), to: z.string() })),
    }),
  ),
});
export type Roster = z.infer<typeof RosterSchema>;

/** Someone of the organisation, as pickers show them. */
export const PersonSchema = Person;
export const PeopleSchema = z.object({ items: z.array(Person) });

/** What a lookout needs before a watch: their posts and what the approved plans expect from each. */
export const BriefingSchema = z.object({
  assignments: z.array(AssignmentSchema),
  posts: z.array(
    z.object({
      post: PostSchema,
      siteName: z.string(),
      /** The latest approved plan that uses this post, or null. */
      plan: z
        .object({
          id: z.uuid(),
          title: z.string(),
          version: z.number().int(),
          revision: z.number().int(),
          approvedAt: z.string(),
        })
        .nullable(),
      results: z.array(PlanResultRowSchema),
      cautions: z.array(z.object({ code: z.string(), message: z.string() })),
    }),
  ),
});
export type Briefing = z.infer<typeof BriefingSchema>;
