import { z } from 'zod';
import { LapseRateConditionSchema, RefractionRegimeSchema } from './sightline';

/*
 * Field calibration, "k of the day": the refraction coefficient solved from a
 * sighting in the field (a measured dip, reciprocal zenith angles, or a
 * reference mark), logged with time, post, observer and weather. Lengths in
 * metres, angles in the units their field names give.
 */

const instant = (what: string) => z.iso.datetime({ offset: true, error: `${what} must be a date and time (ISO 8601).` });

const positiveMetres = (what: string, max: number) =>
  z
    .number({ error: `${what} must be a number of metres.` })
    .gt(0, `${what} must be more than 0 m.`)
    .max(max, `${what} must be at most ${max} m.`);
const metres = (what: string, max: number) =>
  z
    .number({ error: `${what} must be a number of metres.` })
    .min(0, `${what} cannot be negative.`)
    .max(max, `${what} must be at most ${max} m.`);
const zenith = (which: string) =>
  z
    .number({ error: `Zenith angle ${which} must be a number of degrees.` })
    .gt(0, `Zenith angle ${which} must be more than 0°.`)
    .lt(180, `Zenith angle ${which} must be less than 180°.`);

/** What every calibration may carry beside its measurement. */
const CommonFields = {
  /** The post it was observed from (in the caller's organisation); absent for a sighting elsewhere. */
  postId: z.uuid({ error: 'Choose a post (or leave it out).' }).optional(),
  /** When the sighting was made (ISO 8601 with offset); default: when it is sent. */
  observedAt: instant('Observed at').optional(),
  /** Weather at the time, if read: pressure (hPa), air temperature (°C), lapse rate Γ = −dT/dh (K/m). */
  weather: LapseRateConditionSchema.optional(),
  notes: z.string().trim().max(2000, 'At most 2 000 characters.').default(''),
  /** Also save the k (with its low and high ends) as a condition set "observed, <date>" (planners only). */
  saveAsConditionSet: z.boolean({ error: 'Save as a condition set: true or false.' }).default(false),
};

/** A measured dip of the sea horizon at a known height of eye. */
export const DipCalibrationInputSchema = z.object({
  method: z.literal('dip'),
  /** Height of eye above the sea, metres. */
  eyeHeightM: positiveMetres('Height of eye', 10_000),
  /** Measured dip of the sea horizon below the horizontal, minutes of arc (positive downward; ≤ 0 means a duct). */
  observedDipArcmin: z
    .number({ error: 'The observed dip must be a number of minutes of arc.' })
    .min(-60, 'The observed dip must be at least −60′.')
    .max(600, 'The observed dip must be at most 600′ (10°).'),
  /** The instrument's stated accuracy, ± minutes of arc. */
  accuracyArcmin: z
    .number({ error: 'The accuracy must be a number of minutes of arc.' })
    .min(0, 'The accuracy cannot be negative.')
    .max(60, 'The accuracy must be at most 60′.'),
  ...CommonFields,
});

/** Zenith angles measured at the same time at both ends of a line of known length. */
export const ReciprocalCalibrationInputSchema = z.object({
  method: z.literal('reciprocal'),
  /** Horizontal distance between the two stations, metres. */
  distanceM: positiveMetres('Distance', 200_000),
  /** Zenith angle at station 1 towards station 2, degrees. */
  zenithAngle1Deg: zenith('1'),
  /** Zenith angle at station 2 towards station 1, degrees. */
  zenithAngle2Deg: zenith('2'),
  /** The instrument's stated accuracy of one zenith angle, ± seconds of arc. */
  accuracyArcsec: z
    .number({ error: 'The accuracy must be a number of seconds of arc.' })
    .min(0, 'The accuracy cannot be negative.')
    .max(3600, 'The accuracy must be at most 3600″.'),
  ...CommonFields,
});

/**
 * A reference mark at a known distance: either the height on the mark from
 * which it was visible (`observedVisibleFromM`: 0 = the base showed), or only
 * whether its top was visible (`markVisible`), which gives a bound.
 */
export const MarkCalibrationInputSchema = z
  .object({
    method: z.literal('mark'),
    /** Height of eye above the surface the mark stands on, metres. */
    eyeHeightM: metres('Height of eye', 10_000),
    /** Surface distance to the mark, metres. */
    distanceM: positiveMetres('Distance', 500_000),
    /** Height of the mark's top above the surface, metres. */
    markHeightM: positiveMetres('Mark height', 10_000),
    /** The lowest height on the mark that was visible, metres above its base (the part below was hidden). */
    observedVisibleFromM: metres('Visible from', 10_000).optional(),
    /** Whether the mark's top was visible at all (when the visible part was not read). */
    markVisible: z.boolean({ error: 'Mark visible: true or false.' }).optional(),
    /** How well the visible-from height was read, ± metres (default 0). */
    accuracyM: metres('Accuracy', 1000).default(0),
    ...CommonFields,
  })
  .superRefine((m, ctx) => {
    if (m.observedVisibleFromM === undefined && m.markVisible === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['observedVisibleFromM'],
        message: 'Give the height from which the mark was visible, or say whether its top was visible (markVisible).',
      });
    }
    if (m.observedVisibleFromM !== undefined && m.observedVisibleFromM > m.markHeightM) {
      ctx.addIssue({
        code: 'custom',
        path: ['observedVisibleFromM'],
        message: 'The visible part cannot start above the top of the mark.',
      });
    }
    if (m.observedVisibleFromM !== undefined && m.markVisible === false) {
      ctx.addIssue({
        code: 'custom',
        path: ['markVisible'],
        message: 'A mark seen from some height up was visible: leave markVisible out or set it true.',
      });
    }
  });

/** Body of `POST /api/v1/calibrations`, one of three methods. */
export const CalibrationInputSchema = z.discriminatedUnion(
  'method',
  [DipCalibrationInputSchema, ReciprocalCalibrationInputSchema, MarkCalibrationInputSchema],
  { error: 'Choose the method: dip, reciprocal or mark.' },
);
export type CalibrationInput = z.infer<typeof CalibrationInputSchema>;
export type CalibrationMethod = CalibrationInput['method'];
export type DipCalibrationInput = z.infer<typeof DipCalibrationInputSchema>;
export type ReciprocalCalibrationInput = z.infer<typeof ReciprocalCalibrationInputSchema>;
export type MarkCalibrationInput = z.infer<typeof MarkCalibrationInputSchema>;

/** The measurement alone (what the pure core needs). */
export type CalibrationMeasurement =
  | Pick<DipCalibrationInput, 'method' | 'eyeHeightM' | 'observedDipArcmin' | 'accuracyArcmin'>
  | Pick<ReciprocalCalibrationInput, 'method' | 'distanceM' | 'zenithAngle1Deg' | 'zenithAngle2Deg' | 'accuracyArcsec'>
  | Pick<
      MarkCalibrationInput,
      'method' | 'eyeHeightM' | 'distanceM' | 'markHeightM' | 'observedVisibleFromM' | 'markVisible' | 'accuracyM'
    >;

/** What the solved k is: an estimate with its range, or only a bound. */
export const CALIBRATION_RESULT_KINDS = ['estimate', 'lower-bound', 'upper-bound', 'none'] as const;

export const CalibrationWarningSchema = z.object({ code: z.string(), message: z.string() });
export type CalibrationWarning = z.infer<typeof CalibrationWarningSchema>;

/** The figures solved from one measurement. */
export const CalibrationFiguresSchema = z.object({
  /** Solved refraction coefficient, dimensionless; null when only a bound is known (see kMin/kMax). */
  k: z.number().nullable(),
  /** Lowest k the instrument's accuracy allows (or the lower bound); null = no lower limit found. */
  kMin: z.number().nullable(),
  /** Highest k the instrument's accuracy allows (or the upper bound); null = no upper limit (k ≥ 1 possible). */
  kMax: z.number().nullable(),
  resultKind: z.enum(CALIBRATION_RESULT_KINDS),
  /** Refraction regime of k (of the bound when only a bound is known); null when nothing was found. */
  regime: RefractionRegimeSchema.nullable(),
  /** Effective Earth radius R/(1 − k), metres; null without k or under ducting. */
  effectiveRadiusM: z.number().nullable(),
  /** k from the weather readings (pressure, temperature, lapse rate), if given. */
  kFromWeather: z.number().nullable(),
  /** k − kFromWeather, when both exist. */
  differenceFromWeather: z.number().nullable(),
  /** How k was found, in words, with the values put in. */
  working: z.string(),
  warnings: z.array(CalibrationWarningSchema),
});
export type CalibrationFigures = z.infer<typeof CalibrationFiguresSchema>;

/** A logged calibration. */
export const CalibrationSchema = CalibrationFiguresSchema.extend({
  id: z.uuid(),
  method: z.enum(['dip', 'reciprocal', 'mark']),
  /** The measured fields as sent (eyeHeightM, observedDipArcmin, … by method). */
  measurement: z.record(z.string(), z.union([z.number(), z.boolean(), z.string()])),
  postId: z.uuid().nullable(),
  postName: z.string().nullable(),
  observer: z.object({ id: z.uuid(), name: z.string() }),
  observedAt: z.string(),
  weather: LapseRateConditionSchema.nullable(),
  notes: z.string(),
  /** The condition set it was saved as, if any. */
  conditionSetId: z.uuid().nullable(),
  cautions: z.array(z.object({ code: z.string(), message: z.string() })),
  createdAt: z.string(),
});
export type Calibration = z.infer<typeof CalibrationSchema>;

/** Query of `GET /api/v1/calibrations`: by post and observation time (ISO 8601), newest first. */
export const CalibrationListQuerySchema = z
  .object({
    postId: z.uuid({ error: 'Not a post id.' }).optional(),
    from: instant('From').optional(),
    to: instant('To').optional(),
    page: z.coerce.number({ error: 'Page must be a number.' }).int().min(1, 'Pages start at 1.').default(1),
    pageSize: z.coerce
      .number({ error: 'Page size must be a number.' })
      .int()
      .min(1)
      .max(500, 'At most 500 per page.')
      .default(100),
  })
  .refine((q) => q.from === undefined || q.to === undefined || Date.parse(q.to) > Date.parse(q.from), {
    message: 'The window must end after it starts.',
    path: ['to'],
  });
export type CalibrationListQuery = z.infer<typeof CalibrationListQuerySchema>;

export const CalibrationListSchema = z.object({
  items: z.array(CalibrationSchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});

/** Body of `POST /api/v1/calibrations/:id/condition-set` (optional name; default "observed, <date>"). */
export const SaveCalibrationAsConditionSetSchema = z.object({
  name: z.string().trim().min(1, 'Name the set.').max(120, 'At most 120 characters.').optional(),
});
