import { z } from 'zod';
import { UNIT_SYSTEM_IDS } from './site';

/*
 * Trainer drills: one question generated reproducibly from a seed on one of
 * the organisation's posts (or an open-water setup), answered once, scored by
 * stated tolerance bands and explained with the numbers.
 */

/** Every kind the API names; `landmark-range` needs a post whose site has landmarks (else 422). */
export const DRILL_KINDS = [
  'horizon-distance',
  'hidden-height',
  'target-visible',
  'detection-range',
  'landmark-range',
  'bearing-fix',
  'refraction-effect',
] as const;
export type DrillKind = (typeof DRILL_KINDS)[number];

/** The kinds Kenning can set today. */
export const AVAILABLE_DRILL_KINDS = [
  'horizon-distance',
  'hidden-height',
  'target-visible',
  'detection-range',
  'refraction-effect',
  'bearing-fix',
  'landmark-range',
] as const satisfies readonly DrillKind[];

/** Largest seed: seeds are whole numbers 0 … 2³¹ − 1 (a PostgreSQL integer). */
export const MAX_DRILL_SEED = 2_147_483_647;

/** Body of `POST /api/v1/drills`. */
export const DrillRequestSchema = z.object({
  kind: z.enum(DRILL_KINDS, { error: `Choose the kind: ${DRILL_KINDS.join(', ')}.` }),
  /** One of the organisation's posts; absent: an open-water setup. */
  postId: z.uuid({ error: 'Choose a post (or leave it out for open water).' }).optional(),
  /** The same seed (with the same kind, post and libraries) gives the same question; absent: a random one. */
  seed: z
    .number({ error: 'The seed must be a whole number.' })
    .int('The seed must be a whole number.')
    .min(0, 'The seed is 0 or more.')
    .max(MAX_DRILL_SEED, `The seed is at most ${MAX_DRILL_SEED}.`)
    .optional(),
  /** Units the question asks in and the answer is given in (default metric: km and m). */
  units: z.enum(UNIT_SYSTEM_IDS, { error: `Units: ${UNIT_SYSTEM_IDS.join(', ')}.` }).default('metric'),
});
export type DrillRequest = z.infer<typeof DrillRequestSchema>;
export type DrillUnits = DrillRequest['units'];

/** The unit an answer is given in: a length unit, or `yes-no` for a choice (answer true or false). */
export const DRILL_ANSWER_UNITS = ['km', 'nmi', 'mi', 'm', 'ft', 'yes-no'] as const;
export type DrillAnswerUnit = (typeof DRILL_ANSWER_UNITS)[number];

/** The numbers a question is built on; SI (metres), k dimensionless. */
export const DrillInputsSchema = z
  .object({
    eyeHeightM: z.number(),
    k: z.number(),
    targetHeightM: z.number().optional(),
    distanceM: z.number().optional(),
    bearingDeg: z.number().optional(),
    targetName: z.string().optional(),
    /** refraction-effect: the k of the condition asked about. */
    otherK: z.number().optional(),
    /** detection-range: the condition set's visibility, metres (null: not stated). */
    visibilityM: z.number().nullable().optional(),
    conditionSetName: z.string().optional(),
    /** target-visible: which part of the target the question asks about. */
    part: z.enum(['top', 'base']).optional(),
  })
  .catchall(z.union([z.number(), z.string(), z.boolean(), z.null()]));
export type DrillInputs = z.infer<typeof DrillInputsSchema>;

export const DrillQuestionSchema = z.object({
  text: z.string(),
  inputs: DrillInputsSchema,
  unit: z.enum(DRILL_ANSWER_UNITS),
});
export type DrillQuestion = z.infer<typeof DrillQuestionSchema>;

/** The scoring bands, stated with every drill. */
export const DrillScoringSchema = z.object({
  /** Full credit (1) when the answer is within this share of the correct value, percent. */
  fullCreditWithinPct: z.number(),
  /** Partial credit when within this share, percent. */
  partialCreditWithinPct: z.number(),
  /** The score given for partial credit. */
  partialCredit: z.number(),
  /** Smallest band for small answers, in the answer's unit: full credit within ± this much. */
  fullCreditFloor: z.number(),
  /** Smallest partial band, in the answer's unit. */
  partialCreditFloor: z.number(),
  /** Why the bands are what they are. */
  why: z.string(),
});
export type DrillScoring = z.infer<typeof DrillScoringSchema>;

export const DrillCautionSchema = z.object({ code: z.string(), message: z.string() });

/** What is shown after an answer. */
export const DrillExplanationSchema = z.object({
  /** The working in words. */
  text: z.string(),
  /** The formula with the values put in. */
  formula: z.string(),
  /** The side view's numbers (metres, degrees, k): eye, effective radius, horizon, target, hidden part… */
  sideView: z.record(z.string(), z.union([z.number(), z.string(), z.boolean(), z.null()])),
  scoring: DrillScoringSchema,
  cautions: z.array(DrillCautionSchema),
});
export type DrillExplanation = z.infer<typeof DrillExplanationSchema>;

export const DrillSchema = z.object({
  id: z.uuid(),
  kind: z.enum(DRILL_KINDS),
  seed: z.number().int(),
  units: z.enum(UNIT_SYSTEM_IDS),
  postId: z.uuid().nullable(),
  question: DrillQuestionSchema,
  scoring: DrillScoringSchema,
  createdAt: z.string(),
  /** Present once answered. */
  result: z
    .object({
      value: z.union([z.number(), z.boolean()]),
      correctValue: z.union([z.number(), z.boolean()]),
      score: z.number(),
      explanation: DrillExplanationSchema,
      answeredAt: z.string(),
    })
    .nullable(),
});
export type Drill = z.infer<typeof DrillSchema>;

/** Body of `POST /api/v1/drills/:id/answer`: a number in the question's unit, or true/false for a yes-no question. */
export const DrillAnswerSchema = z.object({
  value: z.union([z.number().finite(), z.boolean()], { error: 'Answer with a number in the question’s unit (or true/false).' }),
});
export type DrillAnswer = z.infer<typeof DrillAnswerSchema>;

/** Answer of `POST /api/v1/drills/:id/answer`. */
export const DrillResultSchema = z.object({
  correctValue: z.union([z.number(), z.boolean()]),
  score: z.number().min(0).max(1),
  explanation: DrillExplanationSchema,
  unit: z.enum(DRILL_ANSWER_UNITS),
  /** For a drill of a course attempt: the attempt as it stands after this answer (scored once the last is in). */
  attempt: z
    .object({
      id: z.uuid(),
      completedAt: z.string().nullable(),
      scorePct: z.number().nullable(),
      passed: z.boolean().nullable(),
    })
    .nullable()
    .default(null),
  /** True when this exact answer had been received before (a resend): nothing was changed or counted again. */
  replayed: z.boolean().default(false),
});
export type DrillResult = z.infer<typeof DrillResultSchema>;
