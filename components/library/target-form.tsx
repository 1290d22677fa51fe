import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import { z } from 'zod';
import {
  TARGET_KIND_LABELS,
  TARGET_KINDS,
  TargetInputSchema,
  WATER_TARGET_KINDS,
  type Target,
  type TargetInput,
} from '@/shared/schemas/library';
import { lengthText, typedToMetres } from '@/shared/units/typed-lengths';
import { UNIT_SYSTEMS, type UnitSystem } from '@/shared/units/unit-systems';
import { Segmented } from '@/components/check/unit-switch';
import { useCreateTarget, useReloadLibrary, useUpdateTarget } from '@/components/data/library';
import { handleSaveError } from '@/components/data/server-errors';
import { useUnitSystem } from '@/components/data/session';
import { FormSegmented } from '@/components/ui/form-segmented';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormTextField } from '@/components/ui/form-text-field';
import { FormError } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { UnitNumberField } from '@/components/ui/unit-number-field';
import { UnitsField, unitsResolver } from '@/components/ui/units-field';
import { StaleNotice } from './stale-notice';

type Kind = (typeof TARGET_KINDS)[number];

/** What the form holds: text as typed, lengths in the form's `units`; `onWater` null = by kind. */
interface TargetFormValues {
  units: UnitSystem;
  name: string;
  kind: Kind;
  period: 'day' | 'night';
  heightM: string;
  widthM: string;
  requiredVisibleM: string;
  lightIntensityCd: string;
  onWater: boolean | null;
}

/** A typed number, '' → null (no light), anything else as typed (the schema says why). */
const typedOrNull = (t: string) => {
  if (t.trim() === '') return null;
  const n = Number(t.trim().replace(',', '.'));
  return Number.isFinite(n) ? n : t;
};

/** The shared target schema behind the form's text: lengths typed in `units` become metres first. */
export function targetFormSchema(units: UnitSystem) {
  const unit = UNIT_SYSTEMS[units].height;
  const metres = (t: string) => typedToMetres(t, unit) ?? undefined;
  return z.preprocess((form) => {
    const { units: _units, onWater, ...v } = form as TargetFormValues;
    return {
      ...v,
      heightM: metres(v.heightM),
      widthM: metres(v.widthM),
      requiredVisibleM: metres(v.requiredVisibleM),
      lightIntensityCd: typedOrNull(v.lightIntensityCd),
      onWater: onWater ?? undefined,
    };
  }, TargetInputSchema);
}

/** The form's values for a saved target (or a new one), lengths in `units`. */
function valuesOf(t: Target | undefined, units: UnitSystem): TargetFormValues {
  const unit = UNIT_SYSTEMS[units].height;
  return {
    units,
    name: t?.name ?? '',
    kind: t?.kind ?? 'smoke-column',
    period: t?.period ?? 'day',
    heightM: t ? lengthText(t.heightM, unit) : '',
    widthM: t ? lengthText(t.widthM, unit) : '',
    requiredVisibleM: lengthText(t?.requiredVisibleM ?? 0, unit),
    lightIntensityCd: t?.lightIntensityCd == null ? '' : String(t.lightIntensityCd),
    onWater: t?.onWater ?? null,
  };
}

const FIELDS = ['name', 'kind', 'period', 'heightM', 'widthM', 'requiredVisibleM', 'lightIntensityCd', 'onWater'] as const;

/** When a target is looked for. */
const PERIOD_OPTIONS: { value: 'day' | 'night'; label: string }[] = [
  { value: 'day', label: 'Day' },
  { value: 'night', label: 'Night' },
];

/**
 * A target profile: a new one, or — given `target` — an edit of it saved with
 * the version it was loaded at (what it is, how tall and wide in the person's
 * units, the part that must show, day or night, its light in candela — needed
 * at night — and whether it floats: the waves hide its lower part, and on a
 * coast it counts over the sea only). The server's field errors show under
 * each field; when someone else saved first, the form says so and keeps what
 * was typed.
 */
export function TargetForm({ target, onDone }: { target?: Target; onDone?: () => void }) {
  const create = useCreateTarget();
  const update = useUpdateTarget(target?.id ?? '');
  const reload = useReloadLibrary();
  const saving = target ? update : create;
  const preferred = useUnitSystem();
  const [failed, setFailed] = useState('');
  const [stale, setStale] = useState(false);
  const [added, setAdded] = useState('');
  const { control, handleSubmit, setError, reset, watch, setValue, getValues } = useForm<TargetFormValues, unknown, TargetInput>({
    resolver: unitsResolver<TargetFormValues, TargetInput>(targetFormSchema),
    defaultValues: valuesOf(target, preferred),
  });
  const [units, kind, period, chosenWater] = watch(['units', 'kind', 'period', 'onWater']);
  const heightUnit = UNIT_SYSTEMS[units].height;
  // Floats by default for kinds found on the water, until the planner says otherwise.
  const onWater = chosenWater ?? WATER_TARGET_KINDS.includes(kind);

  const onError = (e: unknown) => handleSaveError(e, setError, FIELDS, { onStale: () => setStale(true), onMessage: setFailed });
  const save = handleSubmit((input) => {
    setFailed('');
    setAdded('');
    setStale(false);
    if (target) {
      update.mutate({ ...input, version: target.version }, { onSuccess: () => onDone?.(), onError });
      return;
    }
    create.mutate(input, {
      onSuccess: ({ target: saved }) => {
        reset(valuesOf(undefined, getValues('units')));
        setAdded(`Added ${saved.name}.`);
      },
      onError,
    });
  });
  const submit = () => void save();

  return (
    <Card accent="moss" aria-label={target ? `Edit ${target.name}` : 'New target'}>
      <AppText variant="heading">{target ? 'Edit this target' : 'Add a target'}</AppText>
      <FormError message={failed} />
      <View aria-live="polite">{added ? <AppText variant="small">{added}</AppText> : null}</View>
      <FormTextField control={control} name="name" label="Name" onSubmitEditing={submit} />
      <FormSegmented
        control={control}
        name="kind"
        label="Kind"
        options={TARGET_KINDS.map((k) => ({ value: k, label: TARGET_KIND_LABELS[k] }))}
      />
      <UnitsField control={control} name="units" />
      <View style={{ flexDirection: 'row', gap: space.md }}>
        <View style={{ flex: 1 }}>
          <UnitNumberField control={control} name="heightM" unit={heightUnit} label="Height" onSubmitEditing={submit} />
        </View>
        <View style={{ flex: 1 }}>
          <UnitNumberField
            control={control}
            name="widthM"
            unit={heightUnit}
            label="Width"
            hint="The critical size for the eye."
            onSubmitEditing={submit}
          />
        </View>
      </View>
      <UnitNumberField
        control={control}
        name="requiredVisibleM"
        unit={heightUnit}
        label="Top part that must show"
        hint={`E.g. the upper ${heightUnit === 'ft' ? '100 ft' : '30 m'} of a smoke column; 0 when any part will do.`}
        onSubmitEditing={submit}
      />
      <FormSegmented control={control} name="period" label="Seen by" options={PERIOD_OPTIONS} />
      {period === 'night' || kind === 'light' ? (
        <FormTextField
          control={control}
          name="lightIntensityCd"
          label="Light intensity"
          unit="cd"
          inputMode="decimal"
          hint="Candela, from the maker's data (a hand flare is thousands, a lifejacket light a few). Needed at night: an unlit target is not detected."
          onSubmitEditing={submit}
        />
      ) : null}
      <Segmented
        label="On the water"
        value={onWater ? 'yes' : 'no'}
        onChange={(w) => setValue('onWater', w === 'yes')}
        options={[
          { value: 'yes', label: 'Floats' },
          { value: 'no', label: 'On land or in the air' },
        ]}
      />
      <AppText variant="small" tone="muted">
        {onWater
          ? 'Waves hide its lower part, and on a coast site it counts only over the sea.'
          : 'Counted over the whole site; waves do not hide it.'}
      </AppText>
      {stale ? <StaleNotice what="target" onReload={() => void reload()} /> : null}
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button label={target ? 'Save changes' : 'Save target'} onPress={submit} busy={saving.isPending} />
        {target && onDone ? <Button kind="quiet" label="Cancel" onPress={onDone} /> : null}
      </View>
    </Card>
  );
}
