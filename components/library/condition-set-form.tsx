import { useState } from 'react';
import { View } from 'react-native';
import {
  BACKGROUND_LIGHTING_LABELS,
  ConditionSetInputSchema,
  type ConditionSet,
  type ConditionSetInput,
} from '@/shared/schemas/library';
import { REFRACTION_PRESET_IDS, refractionPreset, type RefractionPresetId } from '@/shared/sightline/refraction-presets';
import { describeCondition } from './describe-condition';
import { StaleNotice } from './stale-notice';
import { Segmented } from '@/components/check/unit-switch';
import { ApiRequestError } from '@/components/data/api-client';
import { useCreateConditionSet, useReloadLibrary, useUpdateConditionSet } from '@/components/data/library';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Chip, ChipRow } from '@/components/ui/chip';
import { FormError } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';

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

/**
 * A condition set: a new one, or — given `set` — an edit of it (saved whole,
 * with the version it was loaded at): named refraction conditions (presets and
 * any k of your own) judged together, with the visibility they come with.
 * with the sea (a Douglas degree or a wave height) and the lights behind a
 * target at night. Conditions of other kinds in an edited set are kept as
 * they are. When someone else saved first, the form says so.
 */
export function ConditionSetForm({ set, onDone }: { set?: ConditionSet; onDone?: () => void }) {
  const create = useCreateConditionSet();
  const update = useUpdateConditionSet(set?.id ?? '');
  const reload = useReloadLibrary();
  const saving = set ? update : create;
  const [name, setName] = useState(set?.name ?? '');
  const [presets, setPresets] = useState<RefractionPresetId[]>(() =>
    (set?.conditions ?? []).filter(isPreset).map((c) => c.preset),
  );
  const [ks, setKs] = useState(() =>
    (set?.conditions ?? [])
      .filter(isOwnK)
      .map((c) => String(c.k))
      .join(' '),
  );
  const kept = (set?.conditions ?? []).filter((c) => !isPreset(c) && !isOwnK(c)) as unknown as Condition[];
  const [visibility, setVisibility] = useState(set?.visibilityM == null ? '' : String(set.visibilityM / 1000));
  const [visibilityKind, setVisibilityKind] = useState<VisibilityKind>(set?.visibilityKind ?? 'mor-5pct');
  const [seaState, setSeaState] = useState<number | null>(set?.seaState ?? null);
  const [waveHeight, setWaveHeight] = useState(set?.significantWaveHeightM == null ? '' : String(set.significantWaveHeightM));
  const [lighting, setLighting] = useState<Lighting>(set?.backgroundLighting ?? 'none');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [failed, setFailed] = useState('');
  const [stale, setStale] = useState(false);
  const [added, setAdded] = useState('');

  const submit = () => {
    setFailed('');
    setAdded('');
    setStale(false);
    const next: Record<string, string> = {};
    const own = ks
      .split(/[;\s]+/)
      .map((t) => t.trim().replace(',', '.'))
      .filter(Boolean)
      .map(Number);
    if (own.some((k) => !Number.isFinite(k))) next.k = 'Type k values as numbers, separated by spaces (e.g. 0.2 −0.1).';
    const km = visibility.trim() === '' ? null : Number(visibility.replace(',', '.'));
    const r = ConditionSetInputSchema.safeParse({
      name,
      conditions: [...presets.map((preset) => ({ preset })), ...own.filter(Number.isFinite).map((k) => ({ k })), ...kept],
      visibilityM: km === null ? null : km * 1000,
      visibilityKind,
      seaState,
      significantWaveHeightM: waveHeight.trim() === '' ? null : Number(waveHeight.replace(',', '.')),
      backgroundLighting: lighting,
    });
    if (!r.success) {
      for (const i of r.error.issues) {
        const key = i.path[0] === 'conditions' ? (i.path.length > 2 ? 'k' : 'conditions') : String(i.path[0]);
        next[key] ??= i.message;
      }
    }
    setErrors(next);
    if (!r.success || Object.keys(next).length) return;
    const onError = (e: Error) => {
      if (e instanceof ApiRequestError && e.code === 'stale_version') {
        setStale(true);
        return;
      }
      if (e instanceof ApiRequestError && Object.keys(e.fields).length) setErrors(e.fields);
      setFailed(e.message);
    };
    if (set) {
      update.mutate({ ...r.data, version: set.version }, { onSuccess: () => onDone?.(), onError });
      return;
    }
    create.mutate(r.data, {
      onSuccess: ({ conditionSet }) => {
        setName('');
        setPresets([]);
        setKs('');
        setVisibility('');
        setSeaState(null);
        setWaveHeight('');
        setLighting('none');
        setAdded(`Added ${conditionSet.name}.`);
      },
      onError,
    });
  };

  return (
    <Card accent="moss" aria-label={set ? `Edit ${set.name}` : 'New condition set'}>
      <AppText variant="heading">{set ? 'Edit this condition set' : 'Add a condition set'}</AppText>
      <FormError message={failed} />
      {added ? <AppText variant="small">{added}</AppText> : null}
      <TextField
        label="Name"
        value={name}
        onChangeText={setName}
        error={errors.name}
        placeholder="e.g. Autumn morning, valley fog"
      />
      <ChipRow label="Refraction conditions">
        {REFRACTION_PRESET_IDS.map((id) => (
          <Chip
            key={id}
            label={refractionPreset(id).label}
            on={presets.includes(id)}
            onPress={() => setPresets((list) => (list.includes(id) ? list.filter((x) => x !== id) : [...list, id]))}
          />
        ))}
      </ChipRow>
      {errors.conditions ? (
        <AppText variant="small" tone="danger" role="alert">
          {errors.conditions}
        </AppText>
      ) : null}
      {kept.map((c, i) => (
        <AppText key={i} variant="small" tone="muted">
          Kept as it is: {describeCondition(c as never)}
        </AppText>
      ))}
      <TextField
        label="Your own k values"
        value={ks}
        onChangeText={setKs}
        error={errors.k}
        hint="Refraction coefficients, separated by spaces; negative for sub-refraction."
      />
      <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap', alignItems: 'flex-start' }}>
        <View style={{ flex: 1, minWidth: 160 }}>
          <TextField
            label="Visibility"
            unit="km"
            inputMode="decimal"
            value={visibility}
            onChangeText={setVisibility}
            error={errors.visibilityM}
            hint="Empty when not stated."
          />
        </View>
        <Segmented
          label="Reported as"
          value={visibilityKind}
          onChange={setVisibilityKind}
          options={[
            { value: 'mor-5pct', label: 'MOR (5 %)' },
            { value: 'meteorological-range-2pct', label: 'Met. range (2 %)' },
          ]}
        />
      </View>
      <ChipRow label="Sea state (Douglas degree)">
        {SEA_STATES.map((label, degree) => (
          <Chip
            key={label}
            label={`${degree} ${label}`}
            on={seaState === degree}
            onPress={() => {
              setSeaState((s) => (s === degree ? null : degree));
              setWaveHeight('');
            }}
          />
        ))}
      </ChipRow>
      {errors.seaState ? (
        <AppText variant="small" tone="danger" role="alert">
          {errors.seaState}
        </AppText>
      ) : null}
      <TextField
        label="Or the significant wave height"
        unit="m"
        inputMode="decimal"
        value={waveHeight}
        onChangeText={(t) => {
          setWaveHeight(t);
          if (t.trim() !== '') setSeaState(null);
        }}
        error={errors.significantWaveHeightM}
        hint="Waves hide the lower part of targets on the water (half the wave height). Leave both empty on land."
      />
      <Segmented label="Lights behind a target at night" value={lighting} onChange={setLighting} options={LIGHTING_OPTIONS} />
      {stale ? <StaleNotice what="condition set" onReload={() => void reload()} /> : null}
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button
          label={set ? 'Save changes' : 'Save condition set'}
          onPress={submit}
          busy={saving.isPending}
          disabled={saving.isPending}
        />
        {set && onDone ? <Button kind="quiet" label="Cancel" onPress={onDone} /> : null}
      </View>
    </Card>
  );
}
