// Over 300 lines: the quick check screen: one form, its answer table and the cautions share one request state.
import { useEffect, useMemo, useState, type ReactNode } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { BACKGROUND_LIGHTING_LABELS } from '@/shared/schemas/library';
import type { SightlineRequest, SightlineResult } from '@/shared/schemas/sightline';
import { refractionPreset } from '@/shared/sightline/refraction-presets';
import { useUnitSystem } from '@/components/data/session';
import { useSightline } from '@/components/data/sightline';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { OfflineIcon } from '@/components/ui/icons';
import { Screen } from '@/components/ui/screen';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { colors, space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { FieldError } from '@/components/ui/field-error';
import {
  applyLibraryConditionSet,
  applyLibraryTarget,
  buildRequest,
  DEFAULT_FORM,
  switchUnits,
  UNIT_SYSTEMS,
  type CheckFormValues,
  type ConditionLabel,
  type UnitSystem,
} from './check-form-model';
import { CautionsPanel } from './cautions-panel';
import { formatLength, LIMIT_EXPLANATIONS, LIMIT_LABELS, VISIBILITY_KIND_OPTIONS } from './format';
import { conditionStyle } from './condition-colors';
import { ConditionPicker } from './condition-picker';
import { RefractionBandPanel } from './refraction-band-panel';
import { ResultsTable } from './results-table';
import { LookoutView } from './lookout-view';
import { Sightline3d } from './sightline-3d';
import { Segmented } from './unit-switch';
import { LibraryPicks } from './library-picks';

/** The form's fields typed as decimal numbers. */
type DecimalField =
  | 'observerHeight'
  | 'targetHeight'
  | 'distance'
  | 'requiredVisible'
  | 'visibility'
  | 'targetSize'
  | 'resolutionArcmin'
  | 'lightIntensity'
  | 'customK';

/** The form's fields chosen from a few values. */
type ChoiceField = 'visibilityKind' | 'period' | 'backgroundLighting';

const presetLabel = (id: Parameters<typeof refractionPreset>[0]) => refractionPreset(id).label;

/** Settles typing before asking the server. */
function useSettled<T>(value: T, ms = 250): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return settled;
}

export function QuickCheck() {
  const { wide } = useLayout();
  const preferred = useUnitSystem();
  // Starts in the person's own units (account page); the switch below changes them for this check.
  const [form, setForm] = useState<CheckFormValues>(() =>
    preferred === DEFAULT_FORM.units ? DEFAULT_FORM : { ...switchUnits(DEFAULT_FORM, preferred), beforeSwitch: undefined },
  );
  const built = useMemo(() => buildRequest(form, presetLabel), [form]);
  const errors = 'errors' in built ? built.errors : {};
  const valid = 'request' in built ? built : null;
  const settled = useSettled(valid);
  const evaluation = useSightline(settled?.request ?? null, settled?.labels ?? []);
  const units = UNIT_SYSTEMS[form.units];
  // The library entries last taken into the form; typing in one of their fields lets go of the pick.
  const [picked, setPicked] = useState<{ targetId: string | null; setId: string | null; left: number }>({
    targetId: null,
    setId: null,
    left: 0,
  });
  const TARGET_FIELDS: (keyof CheckFormValues)[] = ['targetHeight', 'targetSize', 'requiredVisible'];
  const SET_FIELDS: (keyof CheckFormValues)[] = ['presets', 'customK', 'weather', 'visibility', 'visibilityKind'];
  const set =
    <K extends keyof CheckFormValues>(key: K) =>
    (value: CheckFormValues[K]) => {
      setForm((f) => ({ ...f, [key]: value }));
      if (TARGET_FIELDS.includes(key)) setPicked((p) => ({ ...p, targetId: null }));
      if (SET_FIELDS.includes(key)) setPicked((p) => ({ ...p, setId: null, left: 0 }));
    };

  /** A decimal field of the form, with its error; typing in it lets go of a library pick it came from. */
  const decimal = (key: DecimalField, label: string, unit: string | undefined, hint?: string) => (
    <TextField
      label={label}
      unit={unit}
      inputMode="decimal"
      value={form[key]}
      onChangeText={set(key)}
      error={errors[key]}
      hint={hint}
    />
  );

  /** A choice of the form, one of a few. */
  const choice = <K extends ChoiceField>(key: K, label: string, options: { value: CheckFormValues[K]; label: string }[]) => (
    <Segmented<CheckFormValues[K]> label={label} value={form[key]} onChange={set(key)} options={options} />
  );

  const formPane = (
    <Card style={{ gap: space.lg }}>
      <LibraryPicks
        targetId={picked.targetId}
        conditionSetId={picked.setId}
        onTarget={(t) => {
          setForm((f) => applyLibraryTarget(f, t));
          setPicked((p) => ({ ...p, targetId: t.id }));
        }}
        onConditionSet={(c) => {
          const { form: next, left } = applyLibraryConditionSet(form, c);
          setForm(next);
          setPicked((p) => ({ ...p, setId: c.id, left }));
        }}
      />
      {picked.setId && picked.left > 0 ? (
        <Notice tone="caution">
          <AppText variant="small">
            {picked.left} condition{picked.left === 1 ? '' : 's'} of that set cannot be entered here (the quick check takes the
            presets, one k and one lapse rate); plans use the whole set.
          </AppText>
        </Notice>
      ) : null}
      <Segmented<UnitSystem>
        label="Units"
        value={form.units}
        onChange={(u) => setForm((f) => switchUnits(f, u))}
        options={Object.entries(UNIT_SYSTEMS).map(([value, u]) => ({ value: value as UnitSystem, label: u.label }))}
      />
      {decimal('observerHeight', 'Height of eye', units.height, 'Above the sea or the plain, including any structure.')}
      <Pair>
        {decimal('targetHeight', 'Target height', units.height)}
        {decimal('distance', 'Distance', units.distance)}
      </Pair>
      {decimal('requiredVisible', 'Part that must show', units.height, 'e.g. the top 30 m of a smoke column; 0 = any part.')}
      <Pair>
        {decimal('visibility', 'Visibility', units.distance, 'Leave empty if unknown.')}
        {decimal('targetSize', 'Target size', units.height, 'Its width, for the angular limit.')}
      </Pair>
      {choice('visibilityKind', 'Visibility is', VISIBILITY_KIND_OPTIONS)}
      {decimal('resolutionArcmin', 'Eye must resolve', 'arcmin', '1′ is normal acuity; lookouts searching need several.')}
      {choice('period', 'Searching by', [
        { value: 'day', label: 'Day' },
        { value: 'night', label: 'Night (a light)' },
      ])}
      {form.period === 'night' ? (
        <>
          {decimal(
            'lightIntensity',
            'Light intensity',
            'cd',
            "Candela, from the maker's data. Empty: the target is unlit and is not detected at night.",
          )}
          {choice(
            'backgroundLighting',
            'Lights behind it',
            Object.entries(BACKGROUND_LIGHTING_LABELS).map(([value, label]) => ({
              value: value as CheckFormValues['backgroundLighting'],
              label,
            })),
          )}
        </>
      ) : null}
      <Pair>
        <TextField
          label="Sea state"
          unit="0–9"
          inputMode="numeric"
          value={form.seaState}
          onChangeText={(t) => setForm((f) => ({ ...f, seaState: t, waveHeight: t.trim() === '' ? f.waveHeight : '' }))}
          error={errors.seaState}
          hint="Douglas degree, for a target on the water."
        />
        <TextField
          label="Or wave height"
          unit={units.height}
          inputMode="decimal"
          value={form.waveHeight}
          onChangeText={(t) => setForm((f) => ({ ...f, waveHeight: t, seaState: t.trim() === '' ? f.seaState : '' }))}
          error={errors.waveHeight}
          hint="Significant height; crests hide half of it."
        />
      </Pair>
      <View style={{ gap: space.sm }}>
        <AppText variant="label">Refraction conditions</AppText>
        <ConditionPicker value={form.presets} onChange={set('presets')} />
        <FieldError message={errors.presets} />
        {decimal('customK', 'Your own k (optional)', undefined, 'Refraction coefficient; 0.13 is standard optical.')}
        <WeatherCondition value={form.weather} onChange={set('weather')} error={errors.weather} />
      </View>
    </Card>
  );

  const answer = (() => {
    if (!valid)
      return (
        <Notice tone="danger" title="Check the fields marked in red">
          {null}
        </Notice>
      );
    if (evaluation.isPending) return <LoadingState label="Computing…" />;
    if (evaluation.isError) return <ErrorState error={evaluation.error} onRetry={() => void evaluation.refetch()} />;
    const data = evaluation.data;
    return <Answer request={data.request} labels={data.context} data={data} units={units} />;
  })();

  return (
    <Screen
      title="Quick check"
      subtitle="How far one height of eye sees, and how much of a target the earth hides, under each refraction condition."
      maxWidth={1280}
    >
      {wide ? (
        <View style={{ flexDirection: 'row', gap: space.xl, alignItems: 'flex-start' }}>
          <View style={{ width: 380 }}>{formPane}</View>
          <View style={{ flex: 1, gap: space.lg }}>{answer}</View>
        </View>
      ) : (
        <View style={{ gap: space.lg }}>
          {formPane}
          {answer}
        </View>
      )}
    </Screen>
  );
}

function Answer({
  request,
  labels,
  data,
  units,
}: {
  request: SightlineRequest;
  labels: ConditionLabel[];
  data: NonNullable<ReturnType<typeof useSightline<ConditionLabel[]>>['data']>;
  units: (typeof UNIT_SYSTEMS)[UnitSystem];
}) {
  // The eye, the target and the results, as both drawings of the sightline take them.
  const sightline = {
    observerHeightM: request.observerHeightM,
    targetHeightM: request.targetHeightM,
    distanceM: request.distanceM,
    results: data.results,
  };
  const warnings = data.results.flatMap((r, i) => r.warnings.map((w) => ({ ...w, label: labels[i]?.label ?? '' })));
  return (
    <View style={{ gap: space.lg }}>
      <CautionsPanel cautions={data.cautions} />
      {data.computedOn === 'device' ? (
        <Notice tone="info" title="Offline">
          <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center' }}>
            <OfflineIcon color={colors.moss} size={20} />
            <AppText variant="small">
              Kenning cannot reach its server, so this answer was computed on this device with the same formulas.
            </AppText>
          </View>
        </Notice>
      ) : null}
      <ResultsTable
        results={data.results}
        labels={labels}
        units={units}
        observerHeightM={request.observerHeightM}
        earthRadiusM={request.earthRadiusM}
      />
      <LimitWords results={data.results} labels={labels} units={units} />
      {warnings.length ? (
        <Notice tone="caution" title="Notes on these results">
          {warnings.map((w, i) => (
            <AppText key={i} variant="small">
              {w.label}: {w.message}
            </AppText>
          ))}
        </Notice>
      ) : null}
      <Card>
        <AppText variant="heading">As the lookout sees it</AppText>
        <LookoutView {...sightline} targetSizeM={request.targetSizeM} labels={labels} units={units} />
      </Card>
      <RefractionBandPanel request={request} units={units} />
      <Card>
        <AppText variant="heading">3D view</AppText>
        <Sightline3d
          {...sightline}
          earthRadiusM={request.earthRadiusM}
          colors={data.results.map((_, i) => conditionStyle(i).color)}
        />
      </Card>
    </View>
  );
}

/** k from pressure, temperature and lapse rate, as a further condition. */
function WeatherCondition({
  value,
  onChange,
  error,
}: {
  value: CheckFormValues['weather'];
  onChange: (v: CheckFormValues['weather']) => void;
  error?: string;
}) {
  type Reading = 'pressureHpa' | 'temperatureC' | 'lapseRateKPerM';
  const reading = (key: Reading, label: string, unit: string, hint?: string) => (
    <TextField
      label={label}
      unit={unit}
      inputMode="decimal"
      value={value[key]}
      onChangeText={(text) => onChange({ ...value, [key]: text })}
      hint={hint}
    />
  );
  return (
    <View style={{ gap: space.sm }}>
      <Pressable
        role="checkbox"
        aria-checked={value.enabled}
        onPress={() => onChange({ ...value, enabled: !value.enabled })}
        style={styles.check}
      >
        <View style={[styles.box, value.enabled && styles.boxOn]} />
        <AppText variant="small">From weather readings (k by the surveying relation)</AppText>
      </Pressable>
      {value.enabled ? (
        <View style={{ gap: space.sm }}>
          <Pair>
            {reading('pressureHpa', 'Pressure', 'hPa')}
            {reading('temperatureC', 'Air temperature', '°C')}
          </Pair>
          {reading(
            'lapseRateKPerM',
            'Lapse rate Γ = −dT/dh',
            'K/m',
            '0.0065 is the standard atmosphere; negative in an inversion (air warming with height).',
          )}
          <FieldError message={error} />
        </View>
      ) : null}
    </View>
  );
}

/** Two fields side by side, sharing the width. */
function Pair({ children }: { children: [ReactNode, ReactNode] }) {
  return (
    <View style={styles.pair}>
      <View style={styles.half}>{children[0]}</View>
      <View style={styles.half}>{children[1]}</View>
    </View>
  );
}

const styles = StyleSheet.create({
  check: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 44 },
  box: { width: 20, height: 20, borderRadius: 4, borderWidth: 1.5, borderColor: colors.lineStrong },
  boxOn: { backgroundColor: colors.ink, borderColor: colors.ink },
  pair: { flexDirection: 'row', gap: space.md },
  half: { flex: 1 },
});

/** The limiting factor of each result in words: how far, and why not farther. */
function LimitWords({
  results,
  labels,
  units,
}: {
  results: SightlineResult[];
  labels: ConditionLabel[];
  units: (typeof UNIT_SYSTEMS)[UnitSystem];
}) {
  const lines = results.flatMap((r, i) =>
    r.limitedBy === null || r.detectionRangeM === null
      ? []
      : [
          `${labels[i]?.label ?? ''}: detected out to ${formatLength(r.detectionRangeM, units.distance)}, limited by the ${LIMIT_LABELS[r.limitedBy]}. ${LIMIT_EXPLANATIONS[r.limitedBy]}`,
        ],
  );
  if (lines.length === 0) return null;
  return (
    <Card style={{ gap: space.xs }} aria-label="What limits detection">
      <AppText variant="heading">What limits detection</AppText>
      {lines.map((line) => (
        <AppText key={line} variant="small">
          {line}
        </AppText>
      ))}
      <AppText variant="small" tone="muted">
        Detection here means a lookout who looks at the right place could make the target out; searching a wide arc, people detect
        less, and less often.
      </AppText>
    </Card>
  );
}
