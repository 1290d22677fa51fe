// Over 300 lines: one form (post, north, instrument, readings) with its resolver, idempotency and outbox handling.
import { useEffect, useMemo, useRef, useState } from 'react';
import { useForm, type FieldErrors, type Resolver } from 'react-hook-form';
import { View } from 'react-native';
import { modelDeclination } from '@/shared/fixes/declination';
import { BEARING_INSTRUMENTS } from '@/shared/fixes/instruments';
import {
  IncidentReportInputSchema,
  SIGHTING_KINDS,
  type IncidentReportInput,
  type SightingKind,
} from '@/shared/schemas/incident';
import { DEFAULT_VERTICAL_SIGMA_DEG, type VerticalAngleReference } from '@/shared/schemas/fix';
import type { Post } from '@/shared/schemas/site';
import { NetworkError } from '@/components/data/api-client';
import { incidentKeys, useReportBearing } from '@/components/data/incidents';
import { deviceOutbox } from '@/components/offline/device-outbox';
import { applyServerErrors } from '@/components/data/server-errors';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Chip, ChipRow } from '@/components/ui/chip';
import { FormChipChoice } from '@/components/ui/form-chip-choice';
import { FormTextField } from '@/components/ui/form-text-field';
import { FormError, Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { eastWest, SIGHTING_LABELS } from './incident-words';

/** The form as typed: numbers stay text until sent. */
interface ReportForm {
  postId: string;
  bearingDeg: string;
  bearingReference: 'true' | 'magnetic';
  declinationDeg: string;
  instrument: string;
  bearingSigmaDeg: string;
  verticalAngleDeg: string;
  verticalAngleSigmaDeg: string;
  verticalAngleReference: VerticalAngleReference;
  kind: SightingKind;
  note: string;
}

/** The fields typed as angles in degrees. */
type DegreeField = 'bearingDeg' | 'declinationDeg' | 'bearingSigmaDeg' | 'verticalAngleDeg' | 'verticalAngleSigmaDeg';

type ReportFields = Omit<IncidentReportInput, 'observedAt' | 'idempotencyKey'>;

const FIELDS = [
  'postId',
  'bearingDeg',
  'bearingReference',
  'declinationDeg',
  'bearingSigmaDeg',
  'verticalAngleDeg',
  'verticalAngleSigmaDeg',
  'verticalAngleReference',
  'kind',
  'note',
] as const satisfies readonly (keyof ReportForm)[];

/** A random key for one report: the same key on a retry means "the same report". */
export function newIdempotencyKey(): string {
  const c = globalThis.crypto;
  if (typeof c?.randomUUID === 'function') return c.randomUUID();
  const bytes = new Uint8Array(16);
  c.getRandomValues(bytes);
  return Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
}

/** Text → number for an optional field: '' is absent, text that is not a number is NaN (refused by the schema). */
const numberOrAbsent = (text: string) => (text.trim() === '' ? undefined : Number(text.trim().replace(',', '.')));

/**
 * Checks the typed form with the API's own schema (a placeholder time and
 * key stand in for the ones added when sending), so an error shows under
 * the field of the same name.
 */
const reportResolver: Resolver<ReportForm, unknown, ReportFields> = (values) => {
  const typed = {
    postId: values.postId,
    bearingDeg: numberOrAbsent(values.bearingDeg),
    bearingReference: values.bearingReference,
    declinationDeg: values.bearingReference === 'magnetic' ? numberOrAbsent(values.declinationDeg) : undefined,
    bearingSigmaDeg: numberOrAbsent(values.bearingSigmaDeg),
    verticalAngleDeg: numberOrAbsent(values.verticalAngleDeg),
    ...(numberOrAbsent(values.verticalAngleDeg) !== undefined && {
      verticalAngleSigmaDeg: numberOrAbsent(values.verticalAngleSigmaDeg),
      verticalAngleReference: values.verticalAngleReference,
    }),
    kind: values.kind,
    note: values.note,
  };
  const parsed = IncidentReportInputSchema.safeParse({
    ...typed,
    observedAt: new Date().toISOString(),
    idempotencyKey: 'checking-only',
  });
  if (parsed.success) {
    const { observedAt: _o, idempotencyKey: _k, ...fields } = parsed.data;
    return { values: fields, errors: {} };
  }
  const errors: FieldErrors<ReportForm> = {};
  for (const issue of parsed.error.issues) {
    const field = issue.path[0] as keyof ReportForm;
    if (!(FIELDS as readonly string[]).includes(field) || errors[field]) continue;
    const missing = issue.code === 'invalid_type' && typed[field as keyof typeof typed] === undefined;
    const notNumber = Number.isNaN(typed[field as keyof typeof typed]);
    errors[field] = {
      type: issue.code,
      message: notNumber ? 'Type a number of degrees.' : missing ? requiredMessage(field) : issue.message,
    };
  }
  return { values: {}, errors };
};

function requiredMessage(field: keyof ReportForm): string {
  if (field === 'bearingDeg') return 'Type the bearing, in degrees from north (0–360).';
  if (field === 'bearingSigmaDeg') return 'Give the bearing’s uncertainty, or pick the instrument.';
  return 'Required.';
}

/** What makes two sends the same report (the time and key are added when sending). */
function signatureOf(fields: ReportFields): string {
  return JSON.stringify(fields);
}

/** Which north a bearing is read from. */
const NORTH_OPTIONS = [
  { id: 'true', name: 'True north' },
  { id: 'magnetic', name: 'Magnetic (compass)' },
];

/** What a vertical angle is measured from. */
const VERTICAL_REFERENCE_OPTIONS = [
  { id: 'horizontal', name: 'The horizontal (level)' },
  { id: 'horizon', name: 'The sea horizon' },
];

/**
 * Reporting a bearing to what is seen from one of the site's posts. The
 * idempotency key and the time are fixed when a report is first sent and kept
 * while its content stays the same, so a double tap or a retry after a lost
 * answer is stored once; a changed report gets a new key.
 */
export function ReportBearingForm({
  incidentId,
  posts,
  preferredPostId,
}: {
  incidentId: string;
  posts: readonly Post[];
  preferredPostId?: string | null;
}) {
  const report = useReportBearing(incidentId);
  const [formError, setFormError] = useState('');
  const [sent, setSent] = useState<string | null>(null);
  const attempt = useRef<{ key: string; observedAt: string; signature: string } | null>(null);
  const defaultPost = posts.find((p) => p.id === preferredPostId) ?? (posts.length === 1 ? posts[0] : undefined);
  const { control, handleSubmit, setError, setValue, getValues, watch } = useForm<ReportForm, unknown, ReportFields>({
    resolver: reportResolver,
    defaultValues: {
      postId: defaultPost?.id ?? '',
      bearingDeg: '',
      bearingReference: 'true',
      declinationDeg: '',
      instrument: BEARING_INSTRUMENTS[0].key,
      bearingSigmaDeg: String(BEARING_INSTRUMENTS[0].sigmaDeg),
      verticalAngleDeg: '',
      verticalAngleSigmaDeg: String(DEFAULT_VERTICAL_SIGMA_DEG),
      verticalAngleReference: 'horizontal',
      kind: 'smoke',
      note: '',
    },
  });
  // The posts and the lookout's watch may arrive after the form: choose the watch post then, unless one is chosen.
  const defaultPostId = defaultPost?.id;
  useEffect(() => {
    if (defaultPostId && !getValues('postId')) setValue('postId', defaultPostId);
  }, [defaultPostId, getValues, setValue]);
  const postId = watch('postId');
  const reference = watch('bearingReference');
  const instrument = watch('instrument');
  const verticalTyped = watch('verticalAngleDeg').trim() !== '';
  const post = posts.find((p) => p.id === postId);
  // The declination the server will use for a magnetic bearing with none typed: the same model, at the post, now.
  const model = useMemo(() => (post ? modelDeclination(post.location.latDeg, post.location.lonDeg, new Date()) : null), [post]);

  // A second tap while a report is on its way is ignored (a retry after a failure sends the same key again).
  const inFlight = useRef(false);
  const onSubmit = handleSubmit((fields) => {
    if (inFlight.current) return;
    inFlight.current = true;
    setFormError('');
    setSent(null);
    const signature = signatureOf(fields);
    if (!attempt.current || attempt.current.signature !== signature) {
      attempt.current = { key: newIdempotencyKey(), observedAt: new Date().toISOString(), signature };
    }
    const { key, observedAt } = attempt.current;
    report.mutate(
      { ...fields, observedAt, idempotencyKey: key },
      {
        onSettled: () => {
          inFlight.current = false;
        },
        onSuccess: (result) => {
          attempt.current = null;
          setSent(
            `${result.replayed ? 'Already received (stored once)' : 'Sent'}: ${result.report.trueBearingDeg.toFixed(1)}° true from ${result.report.postName}` +
              (result.report.declinationSource === 'model'
                ? ` (declination ${eastWest(result.report.declinationDeg)} from the magnetic model).`
                : '.'),
          );
          // The post, north, instrument and what is seen stay for the next bearing; the readings are cleared.
          for (const name of ['bearingDeg', 'declinationDeg', 'verticalAngleDeg', 'note'] as const) setValue(name, '');
        },
        onError: (e) => {
          if (!(e instanceof NetworkError)) {
            setFormError(applyServerErrors(e, setError, FIELDS));
            return;
          }
          // No network: the report waits on the device with its key and time, and goes once the network is back.
          const from = posts.find((p) => p.id === fields.postId)?.name ?? 'the post';
          const reading = `${fields.bearingDeg}° ${fields.bearingReference === 'magnetic' ? 'magnetic' : 'true'}`;
          void deviceOutbox
            .add({
              key,
              label: `Bearing ${reading} from ${from}, ${new Date(observedAt).toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' })}`,
              path: `/v1/incidents/${incidentId}/reports`,
              body: { ...fields, observedAt, idempotencyKey: key },
              refresh: [incidentKeys.detail(incidentId), incidentKeys.lists()],
            })
            .then(
              () => {
                attempt.current = null;
                setSent(
                  `No network: the bearing ${reading} from ${from} is kept on this device and will be sent when the network is back.`,
                );
                for (const name of ['bearingDeg', 'declinationDeg', 'verticalAngleDeg', 'note'] as const) setValue(name, '');
              },
              () =>
                setFormError('No network, and this device could not keep the report. Write it down and send it when you can.'),
            );
        },
      },
    );
  });

  /** An angle field of the report, in degrees; Enter sends the report. */
  const degrees = (name: DegreeField, label: string, hint: string) => (
    <FormTextField
      control={control}
      name={name}
      label={label}
      unit="°"
      inputMode="decimal"
      hint={hint}
      onSubmitEditing={() => void onSubmit()}
    />
  );

  return (
    <Card style={{ gap: space.md }} aria-label="Report a bearing">
      <AppText variant="heading">Report a bearing</AppText>
      <FormChipChoice control={control} name="postId" label="From the post" options={posts} />
      {degrees('bearingDeg', 'Bearing', 'Degrees clockwise from north, 0–360.')}
      <FormChipChoice control={control} name="bearingReference" label="North used" options={NORTH_OPTIONS} />
      {reference === 'magnetic' ? (
        <View style={{ gap: space.sm }}>
          <Notice tone="info" title="Declination">
            <AppText variant="small">
              {model && post
                ? `At ${post.name} today the magnetic model gives ${eastWest(model.declinationDeg)} (${model.model}); ` +
                  'Kenning adds it to your compass bearing unless you type your own below.' +
                  (model.withinModelYears
                    ? ''
                    : ' The date is outside the model’s years: the figure may be a degree or more off.')
                : 'Choose the post: the declination is worked out for its place and today’s date.'}
            </AppText>
          </Notice>
          {degrees(
            'declinationDeg',
            'Declination (optional)',
            'East positive, e.g. 3.5 for 3.5° E or −2 for 2° W. Leave empty to use the model’s.',
          )}
        </View>
      ) : null}
      <ChipRow label="Instrument">
        {BEARING_INSTRUMENTS.map((i) => (
          <Chip
            key={i.key}
            label={`${i.label} · ±${i.sigmaDeg}°`}
            on={instrument === i.key}
            onPress={() => {
              setValue('instrument', i.key);
              setValue('bearingSigmaDeg', String(i.sigmaDeg), { shouldValidate: false });
            }}
          />
        ))}
      </ChipRow>
      {degrees(
        'bearingSigmaDeg',
        'Uncertainty of the bearing',
        'One standard deviation; the instrument fills it in, type your own if you know better.',
      )}
      {degrees(
        'verticalAngleDeg',
        'Vertical angle (optional)',
        'Below the horizontal is negative, e.g. −1.5 to the base of a smoke below the tower. While only one post reports, the smoke is placed where this sight line meets the ground.',
      )}
      {verticalTyped ? (
        <View style={{ gap: space.sm }}>
          <FormChipChoice
            control={control}
            name="verticalAngleReference"
            label="Vertical angle measured from"
            options={VERTICAL_REFERENCE_OPTIONS}
          />
          {degrees(
            'verticalAngleSigmaDeg',
            'Uncertainty of the vertical angle',
            'One standard deviation: 0.1° for a level clinometer read to a tenth; 0.25–0.5° for a hand clinometer.',
          )}
          <Notice tone="caution" title="A range from one angle is an estimate">
            <AppText variant="small">
              Refraction near the horizon varies widely, and a tenth of a degree can move a point seen just below it by
              kilometres. Read the angle to the base of the smoke, and confirm with a bearing from a second post.
            </AppText>
          </Notice>
        </View>
      ) : null}
      <FormChipChoice
        control={control}
        name="kind"
        label="What is seen"
        options={SIGHTING_KINDS.map((k) => ({ id: k, name: SIGHTING_LABELS[k] }))}
      />
      <FormTextField control={control} name="note" label="Note (optional)" placeholder="e.g. white smoke, drifting east" />
      <FormError message={formError} />
      {sent ? (
        <Notice tone="info">
          <AppText variant="small">{sent}</AppText>
        </Notice>
      ) : null}
      <View style={{ flexDirection: 'row' }}>
        <Button label="Send the bearing" onPress={() => void onSubmit()} busy={report.isPending} />
      </View>
    </Card>
  );
}
