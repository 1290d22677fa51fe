// Over 300 lines: one form whose refraction, visibility and light sections share one resolver and unit state.
import { useState } from 'react';
import { Controller, useForm, type Path } from 'react-hook-form';
import { View } from 'react-native';
import { z } from 'zod';
import {
  BACKGROUND_LIGHTING_LABELS,
  ConditionSetInputSchema,
  type ConditionSet,
  type ConditionSetInput,
} from '@/shared/schemas/library';
import { lengthText, typedToMetres } from '@/shared/units/typed-lengths';
import { UNIT_SYSTEMS, type UnitSystem } from '@/shared/units/unit-systems';
import { REFRACTION_PRESET_IDS, refractionPreset, type RefractionPresetId } from '@/shared/sightline/refraction-presets';
import { describeCondition } from './describe-condition';
import { StaleNotice } from './stale-notice';
import { useCreateConditionSet, useReloadLibrary, useUpdateConditionSet } from '@/components/data/library';
import { handleSaveError } from '@/components/data/server-errors';
import { useUnitSystem } from '@/components/data/session';
import { VISIBILITY_KIND_OPTIONS } from '@/components/check/format';
import { FormSegmented } from '@/components/ui/form-segmented';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Chip, ChipRow, toggled } from '@/components/ui/chip';
import { FormTextField } from '@/components/ui/form-text-field';
import { FormError } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { UnitNumberField } from '@/components/ui/unit-number-field';
import { UnitsField, unitsResolver } from '@/components/ui/units-field';
import { FieldError } from '@/components/ui/field-error';

type VisibilityKind = 'mor-5pct' | 'meteorological-range-2pct';

type Condition = ConditionSetInput['conditions'][number];
type Lighting = keyof typeof BACKGROUND_LIGHTING_LABELS;
const LIGHTING_OPTIONS = Object.entries(BACKGROUND_LIGHTING_LABELS).map(([value, label]) => ({
  value: value as Lighting,
  label,
}));

/** Douglas sea-state degrees with the WMO code table 3700 descriptions. */
const SEA_STATES = [
  'Calm (glassy)',
  'Calm (rippled)',
  'Smooth',
  'Slight',
  'Moderate',
  'Rough',
  'Very rough',
  'High',
  'Very high',
  'Phenomenal',
] as const;
const isPreset = (c: Record<string, unknown>): c is { preset: RefractionPresetId } =>
  Object.keys(c).length === 1 && typeof c.preset === 'string' && (REFRACTION_PRESET_IDS as readonly string[]).includes(c.preset);
const isOwnK = (c: Record<string, unknown>): c is { k: number } => Object.keys(c).length === 1 && typeof c.k === 'number';

/** What the form holds: the chosen presets as `conditions`, k values and lengths as typed, in the form's `units`. */
interface ConditionSetFormValues {
  units: UnitSystem;
  name: string;
  conditions: RefractionPresetId[];
  ks: string;
  visibilityM: string;
  visibilityKind: VisibilityKind;
  seaState: number | null;
  significantWaveHeightM: string;
  backgroundLighting: Lighting;
}

const K_MESSAGE = 'Type k values as numbers, separated by spaces (e.g. 0.2 −0.1).';
const kTokens = (ks: string) =>
  ks
    .split(/[;\s]+/)
    .map((t) => t.trim().replace(',', '.').replace('−', '-'))
    .filter(Boolean);

/**
 * The shared condition-set schema behind the form's text: the visibility
 * typed in the distance unit of `units`, the wave height in its height unit,
 * both to metres; `kept` are conditions of other kinds an edited set keeps.
 */
export function conditionSetFormSchema(units: UnitSystem, kept: readonly Condition[] = []) {
  const { height, distance } = UNIT_SYSTEMS[units];
  return z.preprocess((form, ctx) => {
    const v = form as ConditionSetFormValues;
    const own = kTokens(v.ks).map(Number);
    if (own.some((k) => !Number.isFinite(k))) ctx.addIssue({ code: 'custom', message: K_MESSAGE, path: ['ks'], input: v.ks });
    return {
      name: v.name,
      conditions: [...v.conditions.map((preset) => ({ preset })), ...own.filter(Number.isFinite).map((k) => ({ k })), ...kept],
      visibilityM: typedToMetres(v.visibilityM, distance),
      visibilityKind: v.visibilityKind,
      seaState: v.seaState,
      significantWaveHeightM: typedToMetres(v.significantWaveHeightM, height),
      backgroundLighting: v.backgroundLighting,
    };
  }, ConditionSetInputSchema);
}

/** The form's values for a saved set (or a new one), lengths in `units`. */
function valuesOf(set: ConditionSet | undefined, units: UnitSystem): ConditionSetFormValues {
  const { height, distance } = UNIT_SYSTEMS[units];
  return {
    units,
    name: set?.name ?? '',
    conditions: (set?.conditions ?? []).filter(isPreset).map((c) => c.preset),
    ks: (set?.conditions ?? [])
      .filter(isOwnK)
      .map((c) => String(c.k))
      .join(' '),
    visibilityM: lengthText(set?.visibilityM, distance),
    visibilityKind: set?.visibilityKind ?? 'mor-5pct',
    seaState: set?.seaState ?? null,
    significantWaveHeightM: lengthText(set?.significantWaveHeightM, height),
    backgroundLighting: set?.backgroundLighting ?? 'none',
  };
}

/**
 * A condition set: a new one, or — given `set` — an edit of it (saved whole,
 * with the version it was loaded at): named refraction conditions (presets and
 * any k of your own) judged together, with the visibility they come with (in
 * the person's distance unit), the sea (a Douglas degree or a wave height) and
 * the lights behind a target at night. Conditions of other kinds in an edited
 * set are kept as they are. When someone else saved first, the form says so
 * and keeps what was typed.
 */
export function ConditionSetForm({ set, onDone }: { set?: ConditionSet; onDone?: () => void }) {
  const create = useCreateConditionSet();
  const update = useUpdateConditionSet(set?.id ?? '');
  const reload = useReloadLibrary();
  const saving = set ? update : create;
  const preferred = useUnitSystem();
  const [kept] = useState(() => (set?.conditions ?? []).filter((c) => !isPreset(c) && !isOwnK(c)) as unknown as Condition[]);
  const [resolver] = useState(() =>
    unitsResolver<ConditionSetFormValues, ConditionSetInput>((units) => conditionSetFormSchema(units, kept)),
  );
  const [failed, setFailed] = useState('');
  const [stale, setStale] = useState(false);
  const [added, setAdded] = useState('');
  const { control, handleSubmit, setError, reset, watch, setValue, getValues, formState } = useForm<
    ConditionSetFormValues,
    unknown,
    ConditionSetInput
  >({ resolver, defaultValues: valuesOf(set, preferred) });
  const units = watch('units');
  const { height, distance } = UNIT_SYSTEMS[units];
  const presetCount = watch('conditions').length;

  /** A server path under this form: an own k (after the presets) under the k field, other conditions under the chips. */
  const fieldOf = (path: string): Path<ConditionSetFormValues> | undefined => {
    const [root, index] = path.split('.');
    if (root === 'conditions') return index !== undefined && Number(index) >= presetCount ? 'ks' : 'conditions';
    const known = ['name', 'visibilityM', 'visibilityKind', 'seaState', 'significantWaveHeightM', 'backgroundLighting'];
    return known.includes(root ?? '') ? (root as Path<ConditionSetFormValues>) : undefined;
  };
  const onError = (e: unknown) => handleSaveError(e, setError, fieldOf, { onStale: () => setStale(true), onMessage: setFailed });
  const save = handleSubmit((input) => {
    setFailed('');
    setAdded('');
    setStale(false);
    if (set) {
      update.mutate({ ...input, version: set.version }, { onSuccess: () => onDone?.(), onError });
      return;
    }
    create.mutate(input, {
      onSuccess: ({ conditionSet }) => {
        reset(valuesOf(undefined, getValues('units')));
        setAdded(`Added ${conditionSet.name}.`);
      },
      onError,
    });
  });
  const submit = () => void save();
  const conditionsError = formState.errors.conditions;
  const conditionsMessage =
    conditionsError?.message ??
    (Array.isArray(conditionsError) ? conditionsError.find((x) => x)?.message : undefined) ??
    conditionsError?.root?.message;

  return (
    <Card accent="moss" aria-label={set ? `Edit ${set.name}` : 'New condition set'}>
      <AppText variant="heading">{set ? 'Edit this condition set' : 'Add a condition set'}</AppText>
      <FormError message={failed} />
      <View aria-live="polite">{added ? <AppText variant="small">{added}</AppText> : null}</View>
      <FormTextField
        control={control}
        name="name"
        label="Name"
        placeholder="e.g. Autumn morning, valley fog"
        onSubmitEditing={submit}
      />
      <Controller
        control={control}
        name="conditions"
        render={({ field }) => (
          <ChipRow label="Refraction conditions">
            {REFRACTION_PRESET_IDS.map((id) => (
              <Chip
                key={id}
                label={refractionPreset(id).label}
                on={field.value.includes(id)}
                onPress={() => field.onChange(toggled(field.value, id))}
              />
            ))}
          </ChipRow>
        )}
      />
      <FieldError message={conditionsMessage} />
      {kept.map((c, i) => (
        <AppText key={i} variant="small" tone="muted">
          Kept as it is: {describeCondition(c as never)}
        </AppText>
      ))}
      <FormTextField
        control={control}
        name="ks"
        label="Your own k values"
        hint="Refraction coefficients, separated by spaces; negative for sub-refraction."
        onSubmitEditing={submit}
      />
      <UnitsField control={control} name="units" />
      <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap', alignItems: 'flex-start' }}>
        <View style={{ flex: 1, minWidth: 160 }}>
          <UnitNumberField
            control={control}
            name="visibilityM"
            unit={distance}
            label="Visibility"
            hint="Empty when not stated."
            onSubmitEditing={submit}
          />
        </View>
        <FormSegmented control={control} name="visibilityKind" label="Reported as" options={VISIBILITY_KIND_OPTIONS} />
      </View>
      <Controller
        control={control}
        name="seaState"
        render={({ field, fieldState }) => (
          <>
            <ChipRow label="Sea state (Douglas degree)">
              {SEA_STATES.map((label, degree) => (
                <Chip
                  key={label}
                  label={`${degree} ${label}`}
                  on={field.value === degree}
                  onPress={() => {
                    field.onChange(field.value === degree ? null : degree);
                    setValue('significantWaveHeightM', '');
                  }}
                />
              ))}
            </ChipRow>
            <FieldError message={fieldState.error?.message} />
          </>
        )}
      />
      <UnitNumberField
        control={control}
        name="significantWaveHeightM"
        unit={height}
        label="Or the significant wave height"
        hint="Waves hide the lower part of targets on the water (half the wave height). Leave both empty on land."
        onChangeTextAlso={(t) => {
          if (t.trim() !== '') setValue('seaState', null);
        }}
        onSubmitEditing={submit}
      />
      <FormSegmented
        control={control}
        name="backgroundLighting"
        label="Lights behind a target at night"
        options={LIGHTING_OPTIONS}
      />
      {stale ? <StaleNotice what="condition set" onReload={() => void reload()} /> : null}
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button label={set ? 'Save changes' : 'Save condition set'} onPress={submit} busy={saving.isPending} />
        {set && onDone ? <Button kind="quiet" label="Cancel" onPress={onDone} /> : null}
      </View>
    </Card>
  );
}
