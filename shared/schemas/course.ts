import { z } from 'zod';
import { AVAILABLE_DRILL_KINDS, DRILL_KINDS, DrillSchema } from './drill';
import { UNIT_SYSTEM_IDS } from './site';

/*
 * Trainer courses: a planner composes a drill set (kinds, posts, number of
 * questions, pass mark, validity in days) and assigns it to people; each
 * attempt is that many drills, scored when the last is answered; a person is
 * qualified while a passed attempt is within the validity.
 */

const uuids = (what: string, max: number) =>
  z
    .array(z.uuid({ error: `Not a ${what} id.` }), { error: `Give a list of ${what} ids.` })
    .max(max, `At most ${max}.`)
    .refine((ids) => new Set(ids).size === ids.length, `A ${what} is listed twice.`);

/** Body of `POST /api/v1/courses`. */
export const CourseInputSchema = z
  .object({
    name: z.string({ error: 'Name the course.' }).trim().min(1, 'Name the course.').max(120, 'At most 120 characters.'),
    /** The kinds of question, each asked in turn. */
    kinds: z
      .array(z.enum(AVAILABLE_DRILL_KINDS, { error: `Kinds: ${AVAILABLE_DRILL_KINDS.join(', ')}.` }))
      .min(1, 'Choose at least one kind of question.')
      .refine((kinds) => new Set(kinds).size === kinds.length, 'A kind is listed twice.'),
    /** The organisation's posts the questions are set on; empty: open water. */
    postIds: uuids('post', 50).default([]),
    questionCount: z
      .number({ error: 'The number of questions must be a whole number.' })
      .int('The number of questions must be a whole number.')
      .min(1, 'At least 1 question.')
      .max(50, 'At most 50 questions.'),
    /** The mean score needed to pass, percent. */
    passMarkPct: z
      .number({ error: 'The pass mark must be a percentage.' })
      .min(0, 'The pass mark is 0 to 100 %.')
      .max(100, 'The pass mark is 0 to 100 %.'),
    /** How long a pass keeps someone qualified, days. */
    validityDays: z
      .number({ error: 'The validity must be a whole number of days.' })
      .int('The validity must be a whole number of days.')
      .min(1, 'At least 1 day.')
      .max(3650, 'At most 3 650 days.'),
    units: z.enum(UNIT_SYSTEM_IDS, { error: `Units: ${UNIT_SYSTEM_IDS.join(', ')}.` }).default('metric'),
    /** People of the organisation to assign it to. */
    assigneeIds: uuids('person', 500).default([]),
  })
  .refine((c) => !c.kinds.includes('bearing-fix') || c.postIds.length > 0, {
    message: 'Bearing-fix questions need posts (each with a second post on its site).',
    path: ['kinds'],
  });
export type CourseInput = z.infer<typeof CourseInputSchema>;

/** Body of `POST /api/v1/courses/:id/assignees`. */
export const CourseAssignSchema = z.object({ userIds: uuids('person', 500).refine((ids) => ids.length > 0, 'Choose someone.') });

const Person = z.object({ id: z.uuid(), name: z.string() });

export const CourseSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  kinds: z.array(z.enum(DRILL_KINDS)),
  postIds: z.array(z.uuid()),
  questionCount: z.number().int(),
  passMarkPct: z.number(),
  validityDays: z.number().int(),
  units: z.enum(UNIT_SYSTEM_IDS),
  createdBy: Person,
  assignees: z.array(Person),
  version: z.number().int(),
  createdAt: z.string(),
});
export type Course = z.infer<typeof CourseSchema>;

/** One attempt: its drills in order and, once the last is answered, the score and the verdict. */
export const CourseAttemptSchema = z.object({
  id: z.uuid(),
  courseId: z.uuid(),
  userId: z.uuid(),
  startedAt: z.string(),
  completedAt: z.string().nullable(),
  /** Mean score of the drills, percent; null until every drill is answered. */
  scorePct: z.number().nullable(),
  passMarkPct: z.number(),
  passed: z.boolean().nullable(),
  answered: z.number().int(),
  questionCount: z.number().int(),
  drills: z.array(DrillSchema),
});
export type CourseAttempt = z.infer<typeof CourseAttemptSchema>;

/** A person's standing in a course. */
export const CoursePersonResultSchema = z.object({
  user: Person,
  attempts: z.array(
    z.object({
      id: z.uuid(),
      startedAt: z.string(),
      completedAt: z.string().nullable(),
      scorePct: z.number().nullable(),
      passed: z.boolean().nullable(),
    }),
  ),
  /** When the latest passed attempt was completed. */
  lastPassedAt: z.string().nullable(),
  /** Passed within the validity: qualified until this instant; null when never passed. */
  qualifiedUntil: z.string().nullable(),
  qualified: z.boolean(),
  /** Latest completed attempt's score minus the one before, percentage points; null with fewer than two. */
  trendPct: z.number().nullable(),
  /** Mean score per kind of question over every answered drill of the course, 0…1. */
  byKind: z.array(z.object({ kind: z.enum(DRILL_KINDS), answered: z.number().int(), meanScore: z.number() })),
});
export type CoursePersonResult = z.infer<typeof CoursePersonResultSchema>;

export const CourseResultsSchema = z.object({ course: CourseSchema, people: z.array(CoursePersonResultSchema) });

/** Query of `GET /api/v1/qualifications`: one person and/or one course (observers: always themselves). */
export const QualificationQuerySchema = z.object({
  userId: z.uuid({ error: 'Not a person id.' }).optional(),
  courseId: z.uuid({ error: 'Not a course id.' }).optional(),
});
export type QualificationQuery = z.infer<typeof QualificationQuerySchema>;

/** A person's qualification by one course: passed within its validity (for the roster and the briefing). */
export const QualificationSchema = z.object({
  user: Person,
  course: z.object({ id: z.uuid(), name: z.string(), validityDays: z.number().int() }),
  /** Assigned and not qualified now: the course is due. */
  due: z.boolean(),
  qualified: z.boolean(),
  qualifiedUntil: z.string().nullable(),
  lastPassedAt: z.string().nullable(),
});
export type Qualification = z.infer<typeof QualificationSchema>;
export const QualificationListSchema = z.object({ items: z.array(QualificationSchema) });
