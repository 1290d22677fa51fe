import { useState } from 'react';
import { Controller, useForm, type Path } from 'react-hook-form';
import { View } from 'react-native';
import type { Calibration, CalibrationMethod } from '@/shared/schemas/calibration';
import { applyServerErrors } from '@/components/data/server-errors';
import { useLengthUnits, useSession } from '@/components/data/session';
import { useCalibrations, useRecordCalibration, useSaveCalibrationAsConditionSet } from '@/components/data/trainer';
import { FormSegmented } from '@/components/ui/form-segmented';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormTextField } from '@/components/ui/form-text-field';
import { EmptyState, ErrorState, FormError, LoadingState, Notice } from '@/components/ui/states';
import { Screen } from '@/components/ui/screen';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { FieldRow } from '@/components/ui/field-row';
import {
  CALIBRATION_DEFAULTS,
  calibrationFieldOf,
  toCalibrationInput,
  type CalibrationFormValues,
} from './calibration-form-model';
import { PostPicker } from './post-picker';
import { showLength } from './trainer-format';
import { TrainerCautions } from './training-screen';

const METHODS: { value: CalibrationMethod; label: string }[] = [
  { value: 'dip', label: 'Dip of the sea horizon' },
  { value: 'reciprocal', label: 'Reciprocal angles' },
  { value: 'mark', label: 'Reference mark' },
];

const fmtK = (k: number | null) => (k === null ? '—' : k.toFixed(3));

/** What the observer saw of the mark. */
const MARK_SEEN_OPTIONS: { value: 'read' | 'yes' | 'no'; label: string }[] = [
  { value: 'read', label: 'Visible from a height' },
  { value: 'yes', label: 'Top visible' },
  { value: 'no', label: 'Not visible' },
];

/** k of the day: a field sighting (dip, reciprocal zenith angles, a reference mark) solved for k; planners save it as a condition set. */
export function CalibrationScreen() {
  const { wide } = useLayout();
  const units = useLengthUnits();
  const { data: user } = useSession();
  const planner = user?.role === 'planner';
  const record = useRecordCalibration();
  const [formError, setFormError] = useState('');
  const [result, setResult] = useState<Calibration | null>(null);
  const { control, handleSubmit, setError, clearErrors, watch } = useForm<CalibrationFormValues>({
    defaultValues: CALIBRATION_DEFAULTS,
  });
  const method = watch('method');

  const solve = handleSubmit((values) => {
    setFormError('');
    clearErrors();
    const built = toCalibrationInput(values, units, false);
    if ('errors' in built) {
      for (const [f, m] of Object.entries(built.errors))
        setError(f as keyof CalibrationFormValues, { type: 'validate', message: m });
      return;
    }
    record.mutate(built.input, {
      onSuccess: ({ calibration }) => setResult(calibration),
      onError: (e) => setFormError(applyServerErrors(e, setError, calibrationFieldOf)),
    });
  });

  /** A number field of the sighting, typed in its unit. */
  const decimal = (name: Path<CalibrationFormValues>, label: string, unit: string, hint?: string) => (
    <FormTextField control={control} name={name} label={label} unit={unit} hint={hint} inputMode="decimal" />
  );

  const form = (
    <Card accent="moss" aria-label="Field sighting" style={{ gap: space.md, flex: 1, width: '100%' }}>
      <AppText variant="heading">Field sighting</AppText>
      <FormError message={formError} />
      <FormSegmented control={control} name="method" label="Method" options={METHODS} />
      {method === 'dip' ? (
        <>
          {decimal('eyeHeight', 'Height of eye above the sea', units.height)}
          {decimal('observedDipArcmin', 'Measured dip of the sea horizon', '′', 'Minutes of arc below the horizontal.')}
          {decimal('accuracyArcmin', 'Instrument accuracy ±', '′')}
        </>
      ) : null}
      {method === 'reciprocal' ? (
        <>
          {decimal('distance', 'Length of the line', units.distance)}
          {decimal('zenithAngle1Deg', 'Zenith angle at end 1', '°')}
          {decimal('zenithAngle2Deg', 'Zenith angle at end 2', '°')}
          {decimal('accuracyArcsec', 'Accuracy of one angle ±', '″')}
          <AppText variant="small" tone="muted">
            Both angles measured at the same time.
          </AppText>
        </>
      ) : null}
      {method === 'mark' ? (
        <>
          {decimal('eyeHeight', 'Height of eye', units.height)}
          {decimal('distance', 'Distance to the mark', units.distance)}
          {decimal('markHeight', 'Height of the mark', units.height)}
          <FormSegmented control={control} name="markVisible" label="What was seen" options={MARK_SEEN_OPTIONS} />
          {watch('markVisible') === 'read' ? (
            <>
              {decimal('observedVisibleFrom', 'Visible from (above the mark’s base)', units.height)}
              {decimal('accuracy', 'Read to ±', units.height)}
            </>
          ) : (
            <AppText variant="small" tone="muted">
              Only seen or not seen: this gives a bound on k, not a value.
            </AppText>
          )}
        </>
      ) : null}
      <AppText variant="label">Weather at the time (optional)</AppText>
      <FieldRow>
        {decimal('pressureHpa', 'Pressure', 'hPa')}
        {decimal('temperatureC', 'Temperature', '°C')}
        {decimal('lapseRateKPerKm', 'Lapse rate', 'K/km')}
      </FieldRow>
      <Controller
        control={control}
        name="postIds"
        render={({ field }) => <PostPicker value={field.value} onChange={field.onChange} />}
      />
      <FormTextField control={control} name="notes" label="Notes" />
      <Button label="Solve for k" busy={record.isPending} onPress={() => void solve()} style={{ alignSelf: 'flex-start' }} />
    </Card>
  );

  return (
    <Screen title="k of the day" subtitle="The refraction coefficient from a sighting in the field.">
      <TrainerCautions />
      <View style={{ flexDirection: wide ? 'row' : 'column', gap: space.xl, alignItems: 'flex-start' }}>
        {form}
        <View style={{ flex: 1, gap: space.xl, width: '100%' }}>
          {result ? <CalibrationResult calibration={result} planner={planner} units={units} /> : null}
          <RecentCalibrations planner={planner} />
        </View>
      </View>
    </Screen>
  );
}

function CalibrationResult({
  calibration: c,
  planner,
  units,
}: {
  calibration: Calibration;
  planner: boolean;
  units: ReturnType<typeof useLengthUnits>;
}) {
  return (
    <Card accent="ember" aria-label="Calibration result" style={{ gap: space.sm }}>
      <AppText variant="heading">
        {c.resultKind === 'estimate'
          ? `k = ${fmtK(c.k)}`
          : c.resultKind === 'lower-bound'
            ? `k ≥ ${fmtK(c.kMin)}`
            : c.resultKind === 'upper-bound'
              ? `k ≤ ${fmtK(c.kMax)}`
              : 'No k found'}
      </AppText>
      <AppText>
        Range from the instrument’s accuracy: {c.kMin === null ? 'no lower limit' : fmtK(c.kMin)} to{' '}
        {c.kMax === null ? 'no upper limit' : fmtK(c.kMax)}
      </AppText>
      <AppText>
        Effective earth radius:{' '}
        {c.effectiveRadiusM === null ? '— (none under a duct)' : showLength(c.effectiveRadiusM, units, true)}
      </AppText>
      {c.regime ? <AppText>Regime: {c.regime}</AppText> : null}
      <AppText>
        {c.kFromWeather === null
          ? 'No weather readings: no k from the weather to compare.'
          : `k from the weather: ${fmtK(c.kFromWeather)}${c.differenceFromWeather === null ? '' : ` (difference ${c.differenceFromWeather >= 0 ? '+' : ''}${c.differenceFromWeather.toFixed(3)})`}`}
      </AppText>
      <AppText variant="small" tone="muted">
        {c.working}
      </AppText>
      {c.warnings.map((w) => (
        <Notice key={w.code} tone="danger">
          <AppText>{w.message}</AppText>
        </Notice>
      ))}
      {c.cautions.length > 0 ? (
        <Notice title="Cautions">
          {c.cautions.map((w) => (
            <AppText key={w.code} variant="small">
              {w.message}
            </AppText>
          ))}
        </Notice>
      ) : null}
      <SaveAsConditionSet calibration={c} planner={planner} />
    </Card>
  );
}

function SaveAsConditionSet({ calibration, planner }: { calibration: Calibration; planner: boolean }) {
  const save = useSaveCalibrationAsConditionSet();
  const [savedHere, setSaved] = useState(false);
  if (savedHere || calibration.conditionSetId !== null) return <AppText tone="moss">Saved as a condition set.</AppText>;
  if (!planner || calibration.resultKind === 'none') return null;
  return (
    <>
      {save.isError ? <FormError message={save.error.message} /> : null}
      <Button
        kind="secondary"
        label="Save as a condition set"
        busy={save.isPending}
        style={{ alignSelf: 'flex-start' }}
        onPress={() => save.mutate(calibration.id, { onSuccess: () => setSaved(true) })}
      />
    </>
  );
}

function RecentCalibrations({ planner }: { planner: boolean }) {
  const list = useCalibrations();
  if (list.isPending) return <LoadingState label="Loading the sightings…" />;
  if (list.isError) return <ErrorState error={list.error} onRetry={() => void list.refetch()} />;
  if (list.data.items.length === 0)
    return <EmptyState title="No sightings yet" body="Solved sightings of your organisation show here." />;
  return (
    <Card aria-label="Recent sightings" style={{ gap: space.sm }}>
      <AppText variant="heading">Recent sightings</AppText>
      {list.data.items.map((c) => (
        <View key={c.id} style={{ gap: 2 }}>
          <AppText variant="label">
            {c.observedAt.slice(0, 16).replace('T', ' ')} · {c.method} · k {fmtK(c.k ?? c.kMin ?? c.kMax)}
          </AppText>
          <AppText variant="small" tone="muted">
            {c.postName ?? 'no post'} · {c.observer.name}
            {c.kFromWeather !== null ? ` · weather k ${fmtK(c.kFromWeather)}` : ''}
          </AppText>
          <SaveAsConditionSet calibration={c} planner={planner} />
        </View>
      ))}
    </Card>
  );
}
