import { useState } from 'react';
import { View } from 'react-native';
import {
  TARGET_KIND_LABELS,
  TARGET_KINDS,
  TargetInputSchema,
  TargetUpdateSchema,
  WATER_TARGET_KINDS,
  type Target,
} from '@/shared/schemas/library';
import { Segmented } from '@/components/check/unit-switch';
import { ApiRequestError } from '@/components/data/api-client';
import { useCreateTarget, useReloadLibrary, useUpdateTarget } from '@/components/data/library';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/states';
import { StaleNotice } from './stale-notice';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';

const EMPTY = {
  name: '',
  kind: 'smoke-column' as (typeof TARGET_KINDS)[number],
  period: 'day' as 'day' | 'night',
  height: '',
  width: '',
  required: '0',
  light: '',
  onWater: null as boolean | null,
};

/** The form's text values for a saved target. */
const valuesOf = (t: Target): typeof EMPTY => ({
  name: t.name,
  kind: t.kind,
  period: t.period,
  height: String(t.heightM),
  width: String(t.widthM),
  required: String(t.requiredVisibleM),
  light: t.lightIntensityCd === null ? '' : String(t.lightIntensityCd),
  onWater: t.onWater,
});

/**
 * A target profile: a new one, or — given `target` — an edit of it saved with
 * the version it was loaded at (what it is, how tall and wide, the part that
 * must show, day or night, its light in candela — needed at night — and
 * whether it floats: the waves hide its lower part, and on a coast it counts
 * over the sea only). The server's field errors show under each field;
 * when someone else saved first, the form says so and keeps what was typed.
 */
export function TargetForm({ target, onDone }: { target?: Target; onDone?: () => void }) {
  const create = useCreateTarget();
  const update = useUpdateTarget(target?.id ?? '');
  const reload = useReloadLibrary();
  const saving = target ? update : create;
  const [v, setV] = useState(target ? valuesOf(target) : EMPTY);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [failed, setFailed] = useState('');
  const [stale, setStale] = useState(false);
  const [added, setAdded] = useState('');
  const set = (k: keyof typeof v) => (t: string) => setV((f) => ({ ...f, [k]: t }));
  // Floats by default for kinds found on the water, until the planner says otherwise.
  const onWater = v.onWater ?? WATER_TARGET_KINDS.includes(v.kind);
  const submit = () => {
    setFailed('');
    setAdded('');
    setStale(false);
    const n = (t: string) => (t.trim() === '' ? undefined : Number(t.replace(',', '.')));
    const fields = {
      name: v.name,
      kind: v.kind,
      heightM: n(v.height),
      widthM: n(v.width),
      requiredVisibleM: n(v.required),
      period: v.period,
      lightIntensityCd: n(v.light) ?? null,
      onWater: v.onWater ?? undefined,
    };
    const onError = (e: Error) => {
      if (e instanceof ApiRequestError && e.code === 'stale_version') {
        setStale(true);
        return;
      }
      if (e instanceof ApiRequestError && Object.keys(e.fields).length) setErrors(e.fields);
      setFailed(e.message);
    };
    if (target) {
      const r = TargetUpdateSchema.safeParse({ ...fields, version: target.version });
      if (!r.success) {
        setErrors(Object.fromEntries(r.error.issues.map((i) => [String(i.path[0]), i.message])));
        return;
      }
      setErrors({});
      update.mutate(r.data, { onSuccess: () => onDone?.(), onError });
      return;
    }
    const r = TargetInputSchema.safeParse(fields);
    if (!r.success) {
      setErrors(Object.fromEntries(r.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setErrors({});
    create.mutate(r.data, {
      onSuccess: ({ target: saved }) => {
        setV(EMPTY);
        setAdded(`Added ${saved.name}.`);
      },
      onError,
    });
  };
  return (
    <Card accent="moss" aria-label={target ? `Edit ${target.name}` : 'New target'}>
      <AppText variant="heading">{target ? 'Edit this target' : 'Add a target'}</AppText>
      <FormError message={failed} />
      {added ? <AppText variant="small">{added}</AppText> : null}
      <TextField label="Name" value={v.name} onChangeText={set('name')} error={errors.name} />
      <Segmented
        label="Kind"
        value={v.kind}
        onChange={(k) => setV((f) => ({ ...f, kind: k }))}
        options={TARGET_KINDS.map((k) => ({ value: k, label: TARGET_KIND_LABELS[k] }))}
      />
      <View style={{ flexDirection: 'row', gap: space.md }}>
        <View style={{ flex: 1 }}>
          <TextField
            label="Height"
            unit="m"
            inputMode="decimal"
            value={v.height}
            onChangeText={set('height')}
            error={errors.heightM}
          />
        </View>
        <View style={{ flex: 1 }}>
          <TextField
            label="Width"
            unit="m"
            inputMode="decimal"
            value={v.width}
            onChangeText={set('width')}
            error={errors.widthM}
            hint="The critical size for the eye."
          />
        </View>
      </View>
      <TextField
        label="Top part that must show"
        unit="m"
        inputMode="decimal"
        value={v.required}
        onChangeText={set('required')}
        error={errors.requiredVisibleM}
        hint="E.g. the upper 30 m of a smoke column; 0 when any part will do."
      />
      <Segmented
        label="Seen by"
        value={v.period}
        onChange={(p) => setV((f) => ({ ...f, period: p }))}
        options={[
          { value: 'day', label: 'Day' },
          { value: 'night', label: 'Night' },
        ]}
      />
      {v.period === 'night' || v.kind === 'light' ? (
        <TextField
          label="Light intensity"
          unit="cd"
          inputMode="decimal"
          value={v.light}
          onChangeText={set('light')}
          error={errors.lightIntensityCd}
          hint="Candela, from the maker's data (a hand flare is thousands, a lifejacket light a few). Needed at night: an unlit target is not detected."
        />
      ) : null}
      <Segmented
        label="On the water"
        value={onWater ? 'yes' : 'no'}
        onChange={(w) => setV((f) => ({ ...f, onWater: w === 'yes' }))}
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
        <Button
          label={target ? 'Save changes' : 'Save target'}
          onPress={submit}
          busy={saving.isPending}
          disabled={saving.isPending}
        />
        {target && onDone ? <Button kind="quiet" label="Cancel" onPress={onDone} /> : null}
      </View>
    </Card>
  );
}
