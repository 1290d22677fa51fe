// Over 300 lines: one site form (fields, boundary, zones, three ways of entering a ring) sharing its draft.
import { zodResolver } from '@hookform/resolvers/zod';
import { useQuery } from '@tanstack/react-query';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { Controller, useFieldArray, useForm, type Path } from 'react-hook-form';
import { View } from 'react-native';
import { z } from 'zod';
import {
  PriorityZoneSchema,
  RingSchema,
  HEIGHT_DATUM_LABELS,
  HEIGHT_DATUMS,
  SITE_KIND_LABELS,
  SITE_KINDS,
  SiteInputSchema,
  UNIT_SYSTEM_IDS,
  type HeightDatum,
  type Site,
} from '@/shared/schemas/site';
import type { LengthUnit } from '@/shared/units/length';
import { lengthText, typedToMetres } from '@/shared/units/typed-lengths';
import { UNIT_SYSTEMS, type UnitSystem } from '@/shared/units/unit-systems';
import { Segmented } from '@/components/check/unit-switch';
import { handleSaveError } from '@/components/data/server-errors';
import { useSession } from '@/components/data/session';
import { sitePostsQuery, useCreateSite, useUpdateSite } from '@/components/data/sites';
import { siteTerrainQuery } from '@/components/data/terrain';
import { FormSegmented } from '@/components/ui/form-segmented';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FieldRow } from '@/components/ui/field-row';
import { FormTextField } from '@/components/ui/form-text-field';
import { UnitNumberField } from '@/components/ui/unit-number-field';
import { FormError, Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { GeoJsonImport } from './geojson-import';
import { ShorelineField } from './shoreline-field';
import { RingField } from './ring-field';
import type { RingDrawContext } from './ring-draw-map';

/**
 * The form's own schema: the shared site schema, with a zone's weight typed
 * as text and its outline required, and the two heights typed in `heightUnit`
 * (stored in metres).
 */
export const siteFormSchema = (heightUnit: LengthUnit, distanceUnit: LengthUnit = 'km') =>
  SiteInputSchema.pick({
    name: true,
    kind: true,
    notes: true,
    boundary: true,
    defaultUnits: true,
    timeZone: true,
    seaArea: true,
    shoreline: true,
    heightDatum: true,
  }).extend({
    // Band edges typed in the distance unit, checked by the shared schema in metres.
    bands: z
      .array(
        z.object({
          name: z.string(),
          fromM: z.preprocess((t) => typedToMetres(t, distanceUnit), z.number({ error: 'Give the distance from the shore.' })),
          toM: z.preprocess((t) => typedToMetres(t, distanceUnit), z.number({ error: 'Give the distance from the shore.' })),
        }),
      )
      .pipe(SiteInputSchema.shape.bands.unwrap()),
    tideLowM: z.preprocess((t) => typedToMetres(t, heightUnit), z.number({ error: 'A number, please.' }).nullable()),
    tideHighM: z.preprocess((t) => typedToMetres(t, heightUnit), z.number({ error: 'A number, please.' }).nullable()),
    seaLevelMaxM: z.preprocess((t) => typedToMetres(t, heightUnit), SiteInputSchema.shape.seaLevelMaxM),
    targetGroundM: z.preprocess((t) => typedToMetres(t, heightUnit), SiteInputSchema.shape.targetGroundM),
    priorityZones: z
      .array(
        PriorityZoneSchema.extend({
          weight: z.coerce.number({ error: 'Weight is 1 to 10.' }).pipe(PriorityZoneSchema.shape.weight),
          ring: RingSchema.nullable().refine((r) => r !== null, 'Draw, type or import the zone’s outline.'),
        }),
      )
      .max(50, 'At most 50 zones.'),
  });
export const SiteFormSchema = siteFormSchema('m');

type FormIn = z.input<typeof SiteFormSchema>;
type FormOut = z.output<typeof SiteFormSchema>;

const browserTimeZone = () => {
  try {
    return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
  } catch {
    return 'UTC';
  }
};

function valuesOf(site: Site | undefined, heightUnit: LengthUnit, distanceUnit: LengthUnit): FormIn {
  const tide = site?.tide ?? null;
  return {
    name: site?.name ?? '',
    kind: site?.kind ?? 'forest-district',
    notes: site?.notes ?? '',
    boundary: site?.boundary ?? null,
    defaultUnits: site?.defaultUnits ?? 'metric',
    timeZone: site?.timeZone ?? browserTimeZone(),
    seaArea: site?.seaArea ?? null,
    seaLevelMaxM: lengthText(site?.seaLevelMaxM, heightUnit),
    targetGroundM: lengthText(site?.targetGroundM, heightUnit),
    shoreline: site?.shoreline ?? null,
    heightDatum: site?.heightDatum ?? 'mean-sea-level',
    bands: (site?.bands ?? []).map((b) => ({
      name: b.name,
      fromM: lengthText(b.fromM, distanceUnit),
      toM: lengthText(b.toM, distanceUnit),
    })),
    tideLowM: lengthText(tide ? ('levelM' in tide ? tide.levelM : tide.lowM) : null, heightUnit),
    tideHighM: lengthText(tide && 'highM' in tide ? tide.highM : null, heightUnit),
    priorityZones: (site?.priorityZones ?? []).map((z) => ({ name: z.name, weight: String(z.weight), ring: z.ring })),
  };
}

const ROOT_FIELDS = [
  'name',
  'kind',
  'notes',
  'boundary',
  'defaultUnits',
  'timeZone',
  'priorityZones',
  'seaArea',
  'seaLevelMaxM',
  'targetGroundM',
  'shoreline',
  'heightDatum',
  'bands',
] as const;

/** Where a server field path shows on this form: a zone's part under that part, a corner's under its outline. */
function fieldOf(path: string): Path<FormIn> | undefined {
  const [root, index, part] = path.split('.');
  if (root === 'priorityZones' && index !== undefined && (part === 'name' || part === 'weight' || part === 'ring')) {
    return `priorityZones.${Number(index)}.${part}`;
  }
  if (root === 'bands' && index !== undefined && (part === 'name' || part === 'fromM' || part === 'toM')) {
    return `bands.${Number(index)}.${part}`;
  }
  if (root === 'tide') return index === 'highM' ? 'tideHighM' : 'tideLowM';
  return (ROOT_FIELDS as readonly string[]).includes(root ?? '') ? (root as Path<FormIn>) : undefined;
}

/**
 * Creates a site or — given `site` — edits it, saved with the version it was
 * loaded at: name, kind, default units, time zone, notes, the boundary and the
 * named priority zones with their weights. A failed save keeps everything
 * typed and says which field and why.
 */
export function SiteForm({ site, onReload }: { site?: Site; onReload?: () => void }) {
  const router = useRouter();
  const create = useCreateSite();
  const update = useUpdateSite(site?.id ?? '');
  const saving = site ? update : create;
  const [formError, setFormError] = useState('');
  const [stale, setStale] = useState(false);
  const [importing, setImporting] = useState(false);
  // Heights are typed in the person's own units, else in the units this form gives the site.
  const preference = useSession().data?.unitPreference ?? null;
  const heightUnitOf = (defaultUnits: UnitSystem) => UNIT_SYSTEMS[preference ?? defaultUnits].height;
  const distanceUnitOf = (defaultUnits: UnitSystem) => UNIT_SYSTEMS[preference ?? defaultUnits].distance;
  const { control, handleSubmit, setError, formState, watch } = useForm<FormIn, unknown, FormOut>({
    resolver: (values, context, options) =>
      zodResolver(siteFormSchema(heightUnitOf(values.defaultUnits ?? 'metric'), distanceUnitOf(values.defaultUnits ?? 'metric')))(
        values,
        context,
        options,
      ),
    defaultValues: valuesOf(site, heightUnitOf(site?.defaultUnits ?? 'metric'), distanceUnitOf(site?.defaultUnits ?? 'metric')),
  });
  const heightUnit = heightUnitOf(watch('defaultUnits') ?? 'metric');
  const distanceUnit = distanceUnitOf(watch('defaultUnits') ?? 'metric');
  const bands = useFieldArray({ control, name: 'bands' });
  const zones = useFieldArray({ control, name: 'priorityZones' });
  const posts = useQuery({ ...sitePostsQuery(site?.id ?? ''), enabled: !!site });
  const terrain = useQuery({ ...siteTerrainQuery(site?.id ?? ''), enabled: !!site });
  const boundary = watch('boundary') ?? null;
  const zoneValues = watch('priorityZones');
  /** The drawing map's surroundings for one outline: the site's terrain and posts and the form's other outlines. */
  const drawContext = (editing: 'boundary' | 'sea' | number): RingDrawContext => ({
    site: site ?? null,
    posts: posts.data ?? [],
    terrain: terrain.data ?? null,
    boundary: editing === 'boundary' ? null : boundary,
    zones: zoneValues.flatMap((z, i) => (i !== editing && z.ring ? [{ name: z.name || `Zone ${i + 1}`, ring: z.ring }] : [])),
  });

  const submit = handleSubmit((v) => {
    setFormError('');
    setStale(false);
    const { tideLowM, tideHighM, ...rest } = v;
    const tide =
      tideLowM === null && tideHighM === null
        ? null
        : tideLowM !== null && tideHighM !== null
          ? { lowM: tideLowM, highM: tideHighM }
          : { levelM: (tideLowM ?? tideHighM)! };
    const input = {
      ...rest,
      tide,
      priorityZones: v.priorityZones.map((z) => ({ name: z.name, weight: z.weight, ring: z.ring! })),
    };
    const onError = (e: unknown) =>
      handleSaveError(e, setError, fieldOf, { onStale: () => setStale(true), onMessage: setFormError });
    const open = (id: string) => router.navigate({ pathname: '/sites/[siteId]', params: { siteId: id } });
    // The saved site comes back with a new version, which remounts this form (its key on the edit
    // screen) before a per-call onSuccess could run; the promise resolves regardless.
    const saved = site ? update.mutateAsync({ ...input, version: site.version }) : create.mutateAsync(input);
    saved.then((s) => open(s.id), onError);
  });

  const rootZoneError = formState.errors.priorityZones?.root?.message ?? formState.errors.priorityZones?.message;

  return (
    <Card accent="moss" aria-label={site ? 'Edit site' : 'New site'} style={{ gap: space.lg }}>
      <FormError message={formError} />
      <FormTextField control={control} name="name" label="Name" onSubmitEditing={() => void submit()} />
      <FormSegmented
        control={control}
        name="kind"
        label="Kind"
        options={SITE_KINDS.map((k) => ({ value: k, label: SITE_KIND_LABELS[k] }))}
      />
      <Controller
        control={control}
        name="defaultUnits"
        render={({ field }) => (
          <Segmented<UnitSystem>
            label="Default units"
            value={field.value ?? 'metric'}
            onChange={field.onChange}
            options={UNIT_SYSTEM_IDS.map((u) => ({ value: u, label: UNIT_SYSTEMS[u].name }))}
          />
        )}
      />
      <FormTextField
        control={control}
        name="timeZone"
        label="Time zone"
        autoCapitalize="none"
        hint="IANA name, e.g. Europe/Oslo or America/Anchorage; watches and plans show times in it."
        onSubmitEditing={() => void submit()}
      />
      <FormTextField control={control} name="notes" label="Notes" multiline numberOfLines={3} style={{ minHeight: 72 }} />
      <Controller
        control={control}
        name="boundary"
        render={({ field, fieldState }) => (
          <RingField
            label="Boundary"
            ring={field.value ?? null}
            onChange={field.onChange}
            error={fieldState.error?.message}
            optional
            drawContext={drawContext('boundary')}
          />
        )}
      />
      <View style={{ gap: space.sm }} aria-label="Sea and ground for detection">
        <AppText variant="heading">Sea and ground</AppText>
        <AppText tone="muted">
          On a coast, targets on the water (a swimmer, a raft, a boat) count over the sea only. Give the sea as an outline, or as
          the height at or below which the terrain is sea, or both (then the cells in both).
        </AppText>
        <Controller
          control={control}
          name="seaArea"
          render={({ field, fieldState }) => (
            <RingField
              label="Sea area"
              ring={field.value ?? null}
              onChange={field.onChange}
              error={fieldState.error?.message}
              optional
              drawContext={drawContext('sea')}
            />
          )}
        />
        <UnitNumberField
          control={control}
          name="seaLevelMaxM"
          label="Terrain at or below this height is sea"
          unit={heightUnit}
          hint="Empty: no sea from the terrain. Usually a little above mean sea level (tide, spray)."
        />
        <UnitNumberField
          control={control}
          name="targetGroundM"
          label="Ground the targets stand on, for smooth-earth figures"
          unit={heightUnit}
          hint="Empty: sea level on a coast, each post’s own ground inland. Terrain coverage uses the terrain itself."
        />
      </View>
      <View style={{ gap: space.sm }} aria-label="Shore and offshore bands">
        <AppText variant="heading">Shore and offshore bands</AppText>
        <AppText tone="muted">
          For coast watch: the shoreline, from where its chainage starts, and the bands of water off it you watch (e.g. surf zone,
          inshore, offshore). Coverage runs then say how much of the shore each band is watched along, where the gaps are and hour
          by hour from the roster.
        </AppText>
        <Controller
          control={control}
          name="shoreline"
          render={({ field, fieldState }) => (
            <ShorelineField
              line={field.value ?? null}
              onChange={field.onChange}
              error={fieldState.error?.message}
              drawContext={drawContext('sea')}
              heightUnit={heightUnit}
            />
          )}
        />
        {formState.errors.bands?.root?.message || formState.errors.bands?.message ? (
          <AppText tone="danger" role="alert">
            {formState.errors.bands?.root?.message ?? formState.errors.bands?.message}
          </AppText>
        ) : null}
        {bands.fields.map((f, i) => (
          <View key={f.id} style={{ gap: space.xs }} aria-label={`Band ${i + 1}`}>
            <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap', alignItems: 'flex-start' }}>
              <View style={{ flex: 2, minWidth: 160 }}>
                <FormTextField control={control} name={`bands.${i}.name`} label={`Band ${i + 1} name`} />
              </View>
              <View style={{ flex: 1, minWidth: 110 }}>
                <UnitNumberField control={control} name={`bands.${i}.fromM`} label="From the shore" unit={distanceUnit} />
              </View>
              <View style={{ flex: 1, minWidth: 110 }}>
                <UnitNumberField control={control} name={`bands.${i}.toM`} label="Out to" unit={distanceUnit} />
              </View>
            </View>
            <Button
              kind="quiet"
              label={`Remove band ${i + 1}`}
              onPress={() => bands.remove(i)}
              style={{ alignSelf: 'flex-start' }}
            />
          </View>
        ))}
        <Button
          kind="secondary"
          label="Add a band"
          onPress={() => {
            const last = bands.fields.length ? watch(`bands.${bands.fields.length - 1}.toM`) : '';
            bands.append({ name: '', fromM: String(last || '0'), toM: '' });
          }}
          style={{ alignSelf: 'flex-start' }}
        />
        <Controller
          control={control}
          name="heightDatum"
          render={({ field }) => (
            <Segmented<HeightDatum>
              label="Heights of posts are above"
              value={field.value ?? 'mean-sea-level'}
              onChange={field.onChange}
              options={HEIGHT_DATUMS.map((d) => ({ value: d, label: HEIGHT_DATUM_LABELS[d] }))}
            />
          )}
        />
        <FieldRow minWidth={150} gap={space.md}>
          <UnitNumberField
            control={control}
            name="tideLowM"
            label="Tide: low water (or the one level)"
            unit={heightUnit}
            hint="Above the datum. Empty: the datum itself."
          />
          <UnitNumberField
            control={control}
            name="tideHighM"
            label="Tide: high water"
            unit={heightUnit}
            hint="Give both for a high/low pair: each is a condition of the run."
          />
        </FieldRow>
      </View>
      <View style={{ gap: space.sm }}>
        <AppText variant="heading">Priority zones</AppText>
        <AppText tone="muted">
          Parts of the site that matter most (a village edge, a bathing beach), each with a weight from 1 (low) to 10 (high).
        </AppText>
        {rootZoneError ? (
          <AppText tone="danger" role="alert">
            {rootZoneError}
          </AppText>
        ) : null}
        {zones.fields.map((f, i) => (
          <View key={f.id} style={{ gap: space.sm }} aria-label={`Priority zone ${i + 1}`}>
            <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
              <View style={{ flex: 3, minWidth: 180 }}>
                <FormTextField control={control} name={`priorityZones.${i}.name`} label={`Zone ${i + 1} name`} />
              </View>
              <View style={{ flex: 1, minWidth: 100 }}>
                <FormTextField
                  control={control}
                  name={`priorityZones.${i}.weight`}
                  label="Weight"
                  inputMode="numeric"
                  hint="1–10"
                />
              </View>
            </View>
            <Controller
              control={control}
              name={`priorityZones.${i}.ring`}
              render={({ field, fieldState }) => (
                <RingField
                  label={`Zone ${i + 1} outline`}
                  ring={field.value ?? null}
                  onChange={field.onChange}
                  error={fieldState.error?.message}
                  drawContext={drawContext(i)}
                />
              )}
            />
            <Button
              kind="quiet"
              label={`Remove zone ${i + 1}`}
              onPress={() => zones.remove(i)}
              style={{ alignSelf: 'flex-start' }}
            />
          </View>
        ))}
        <Button
          kind="secondary"
          label="Add a priority zone"
          onPress={() => zones.append({ name: '', weight: '5', ring: null })}
          style={{ alignSelf: 'flex-start' }}
        />
        {importing ? (
          <GeoJsonImport
            label="Zones from a GeoJSON file"
            onUseAll={(found) => {
              zones.append(found.map((p) => ({ name: p.name, weight: '5', ring: p.ring })));
              setImporting(false);
            }}
          />
        ) : (
          <Button
            kind="quiet"
            label="Import zones from a GeoJSON file"
            onPress={() => setImporting(true)}
            style={{ alignSelf: 'flex-start' }}
          />
        )}
      </View>
      {stale ? (
        <Notice tone="danger" title="Not saved: this site changed">
          <AppText>
            Someone else saved this site after you opened it, so your changes were not saved. Reload to see their version, then
            make your change again.
          </AppText>
          {onReload ? <Button kind="secondary" label="Reload the site" onPress={onReload} /> : null}
        </Notice>
      ) : null}
      <Button label={site ? 'Save changes' : 'Create site'} onPress={() => void submit()} busy={saving.isPending} />
    </Card>
  );
}
