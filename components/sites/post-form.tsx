// Over 300 lines: one post form (kind, place, heights, sector) with its units and terrain lookup.
import { useEffect, useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import { z } from 'zod';
import { CoordinateError } from '@/shared/geo/coordinate-error';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { parseCoordinate } from '@/shared/geo/parse-coordinate';
import { isPatrolKind, POST_KIND_LABELS, POST_KINDS, PostInputSchema, type Post, type PostInput } from '@/shared/schemas/site';
import { convertSpeed, SPEED_UNIT_OF_SYSTEM } from '@/shared/units/speed';
import { lengthText, typedToMetres } from '@/shared/units/typed-lengths';
import { UNIT_SYSTEM_IDS, UNIT_SYSTEMS, type UnitSystem } from '@/shared/units/unit-systems';
import { handleSaveError } from '@/components/data/server-errors';
import { useUnitSystem } from '@/components/data/session';
import { useCreatePost, useSite, useSitePosts, useUpdatePost } from '@/components/data/sites';
import { useSiteTerrain } from '@/components/data/terrain';
import { FormSegmented } from '@/components/ui/form-segmented';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FieldRow } from '@/components/ui/field-row';
import { FormTextField } from '@/components/ui/form-text-field';
import { FormError, Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { UnitNumberField } from '@/components/ui/unit-number-field';
import { UnitsField, unitsResolver } from '@/components/ui/units-field';
import { formatPosition } from '@/components/map/map-chrome';
import { GroundFromTerrain } from './ground-from-terrain';
import { PatrolFields, readRouteText, routeText, speedText } from './patrol-fields';

type Kind = (typeof POST_KINDS)[number];

/** What the form holds: text as typed, lengths in the form's `units`. */
interface PostFormValues {
  units: UnitSystem;
  name: string;
  kind: Kind;
  location: string;
  groundElevationM: string;
  structureHeightM: string;
  eyeHeightM: string;
  status: 'existing' | 'proposed';
  sector: { fromDeg: string; toDeg: string };
  /** Patrol (vessels and aircraft): waypoints one a line, speed in the units' speed unit, cycle in minutes. */
  route: string;
  speedMps: string;
  cycleMinutes: string;
}

/** A typed number, '' left out (so the schema's default applies), anything else as typed. */
const typedNumber = (t: unknown) => {
  if (typeof t !== 'string') return t;
  const s = t.trim().replace(',', '.');
  if (s === '') return undefined;
  return Number.isFinite(Number(s)) ? Number(s) : t;
};

/** The coordinate typed, in any usual format, or why it is not one. */
function readLocation(text: string): { latDeg: number; lonDeg: number } | string {
  if (!text.trim()) return 'Enter where the post is.';
  try {
    const p = parseCoordinate(text);
    return { latDeg: p.latDeg, lonDeg: p.lonDeg };
  } catch (e) {
    return e instanceof CoordinateError ? e.message : 'Not a coordinate.';
  }
}

/** The shared post schema with the form's text: lengths typed in `units`, the location in any format. */
export function postFormSchema(units: UnitSystem) {
  const unit = UNIT_SYSTEMS[units].height;
  const length = <S extends z.ZodType>(schema: S) => z.preprocess((t) => typedToMetres(t, unit) ?? undefined, schema);
  return PostInputSchema.extend({
    units: z.enum(UNIT_SYSTEM_IDS),
    location: z.string().transform((text, ctx) => {
      const read = readLocation(text);
      if (typeof read === 'string') {
        ctx.addIssue({ code: 'custom', message: read });
        return z.NEVER;
      }
      return read;
    }),
    groundElevationM: length(PostInputSchema.shape.groundElevationM),
    structureHeightM: length(PostInputSchema.shape.structureHeightM),
    eyeHeightM: length(PostInputSchema.shape.eyeHeightM),
    sector: z.preprocess((s) => {
      const { fromDeg = '', toDeg = '' } = (s ?? {}) as { fromDeg?: string; toDeg?: string };
      return fromDeg.trim() || toDeg.trim() ? { fromDeg: typedNumber(fromDeg), toDeg: typedNumber(toDeg) } : null;
    }, PostInputSchema.shape.sector),
    route: z.string().transform((text, ctx) => {
      const read = readRouteText(text);
      if (read !== null && !Array.isArray(read)) {
        ctx.addIssue({ code: 'custom', message: `Line ${read.line}: ${read.message}` });
        return z.NEVER;
      }
      const checked = PostInputSchema.shape.route.safeParse(read);
      if (!checked.success) {
        ctx.addIssue({ code: 'custom', message: checked.error.issues[0]?.message ?? 'Not a route.' });
        return z.NEVER;
      }
      return checked.data ?? null;
    }),
    speedMps: z.preprocess((t) => {
      const n = typedNumber(t);
      return n === undefined ? null : typeof n === 'number' ? convertSpeed(n, SPEED_UNIT_OF_SYSTEM[units]) : n;
    }, PostInputSchema.shape.speedMps),
    cycleMinutes: z.preprocess((t) => typedNumber(t) ?? null, PostInputSchema.shape.cycleMinutes),
  }).transform((post) =>
    // A post that does not move has no patrol, whatever the hidden fields hold.
    isPatrolKind(post.kind) ? post : { ...post, route: null, speedMps: null, cycleMinutes: null },
  );
}

/** The form's values for an existing post (or a new one), lengths in `units`. */
function valuesOf(p: Post | undefined, units: UnitSystem): PostFormValues {
  const unit = UNIT_SYSTEMS[units].height;
  return {
    units,
    name: p?.name ?? '',
    kind: p?.kind ?? 'tower',
    location: p ? formatCoordinate(p.location, 'dd') : '',
    groundElevationM: p ? lengthText(p.groundElevationM, unit) : '',
    structureHeightM: lengthText(p?.structureHeightM ?? 0, unit),
    eyeHeightM: lengthText(p?.eyeHeightM ?? 1.6, unit),
    status: p?.status ?? 'existing',
    sector: { fromDeg: p?.sector ? String(p.sector.fromDeg) : '', toDeg: p?.sector ? String(p.sector.toDeg) : '' },
    route: routeText(p?.route),
    speedMps: speedText(p?.speedMps, SPEED_UNIT_OF_SYSTEM[units]),
    cycleMinutes: p?.cycleMinutes == null ? '' : String(p.cycleMinutes),
  };
}

const FIELDS = [
  'name',
  'kind',
  'location',
  'groundElevationM',
  'structureHeightM',
  'eyeHeightM',
  'status',
  'sector.fromDeg',
  'sector.toDeg',
  'sector',
  'route',
  'speedMps',
  'cycleMinutes',
] as const;

/** Whether a post stands or is only planned. */
const STATUS_OPTIONS: { value: 'existing' | 'proposed'; label: string }[] = [
  { value: 'existing', label: 'Existing' },
  { value: 'proposed', label: 'Proposed' },
];

/**
 * A post's form: a new post, or — given `post` — an edit of that post saved
 * with the version it was loaded at. Coordinates in any usual format (DD,
 * DDM, DMS, UTM), heights in the person's units (their own choice, else the
 * site's), stored in metres. When someone else saved the post first the form
 * says so and offers `onReload` (the parent remounts the form with the new
 * version). A failed save keeps everything typed.
 */
export function PostForm({
  siteId,
  post,
  onDone,
  onReload,
}: {
  siteId: string;
  post?: Post;
  onDone?: () => void;
  onReload?: () => void;
}) {
  const site = useSite(siteId);
  const preferred = useUnitSystem(site.data?.defaultUnits);
  const [initial] = useState(() => valuesOf(post, preferred));
  const [formError, setFormError] = useState('');
  const [stale, setStale] = useState(false);
  const create = useCreatePost(siteId);
  const update = useUpdatePost(siteId, post?.id ?? '');
  const saving = post ? update : create;
  const { control, handleSubmit, setError, setValue, reset, watch, getValues, formState } = useForm<
    PostFormValues,
    unknown,
    z.output<ReturnType<typeof postFormSchema>>
  >({
    resolver: unitsResolver<PostFormValues, z.output<ReturnType<typeof postFormSchema>>>(postFormSchema),
    defaultValues: initial,
  });
  const units = watch('units');
  const heightUnit = UNIT_SYSTEMS[units].height;
  const locationText = watch('location');
  const located = locationText.trim() ? readLocation(locationText) : null;
  const parsed = located && typeof located !== 'string' ? located : null;
  const kind = watch('kind');
  const sitePosts = useSitePosts(siteId);
  const terrain = useSiteTerrain(siteId);
  const previousUnits = useRef(units);
  // The speed is re-typed in the new unit when the units change (the same speed).
  useEffect(() => {
    const from = SPEED_UNIT_OF_SYSTEM[previousUnits.current];
    previousUnits.current = units;
    const typed = Number(getValues('speedMps').replace(',', '.'));
    if (getValues('speedMps').trim() && Number.isFinite(typed) && from !== SPEED_UNIT_OF_SYSTEM[units])
      setValue('speedMps', speedText(convertSpeed(typed, from), SPEED_UNIT_OF_SYSTEM[units]));
  }, [units, getValues, setValue]);

  const onError = (e: unknown) =>
    handleSaveError(e, setError, FIELDS, { onStale: () => setStale(true), onMessage: setFormError });

  const save = handleSubmit((out) => {
    setFormError('');
    setStale(false);
    const { units: _units, ...fields } = out;
    // An untouched location keeps its full precision (the text shows it rounded to about a metre).
    const input: PostInput = post && getValues('location') === initial.location ? { ...fields, location: post.location } : fields;
    if (post) {
      // The saved post comes back with a new version, which remounts this form (its key) before a
      // per-call onSuccess could run; the promise resolves regardless, so the page learns of the save.
      update.mutateAsync({ ...input, version: post.version }).then(() => onDone?.(), onError);
    } else {
      create.mutate(input, {
        onSuccess: () => {
          reset(valuesOf(undefined, getValues('units')));
          onDone?.();
        },
        onError,
      });
    }
  });
  const submit = () => void save();

  return (
    <Card accent="moss" aria-label={post ? 'Edit post' : 'New post'}>
      <AppText variant="heading">{post ? 'Edit this post' : 'Add a post'}</AppText>
      <FormError message={formError} />
      <FormTextField control={control} name="name" label="Name" onSubmitEditing={submit} />
      <FormSegmented
        control={control}
        name="kind"
        label="Kind"
        options={POST_KINDS.map((k) => ({ value: k, label: POST_KIND_LABELS[k] }))}
      />
      <FormTextField
        control={control}
        name="location"
        label="Location"
        onSubmitEditing={submit}
        hint={
          parsed
            ? `Read as ${formatCoordinate(parsed, 'dd')} · ${formatCoordinate(parsed, 'utm')} · ${formatPosition(parsed, 'mgrs')} (WGS 84)`
            : 'WGS 84: decimal degrees, degrees-minutes, DMS, UTM (e.g. 33U 516200 5741300) or MGRS (33U WT 16200 41300).'
        }
        autoCapitalize="characters"
      />
      {typeof located === 'string' && !formState.errors.location ? (
        <AppText variant="small" tone="danger" role="alert">
          {located}
        </AppText>
      ) : null}
      <UnitsField control={control} name="units" />
      <FieldRow minWidth={140} gap={space.md}>
        <>
          <UnitNumberField
            control={control}
            name="groundElevationM"
            unit={heightUnit}
            label="Ground elevation"
            onSubmitEditing={submit}
          />
          <GroundFromTerrain
            siteId={siteId}
            location={parsed}
            unit={heightUnit}
            onElevation={(m) => setValue('groundElevationM', lengthText(m, heightUnit), { shouldValidate: false })}
          />
        </>
        <UnitNumberField
          control={control}
          name="structureHeightM"
          unit={heightUnit}
          label="Structure height"
          onSubmitEditing={submit}
        />
        <UnitNumberField
          control={control}
          name="eyeHeightM"
          unit={heightUnit}
          label="Eye above platform"
          onSubmitEditing={submit}
        />
      </FieldRow>
      <View style={{ flexDirection: 'row', gap: space.md }}>
        <View style={{ flex: 1 }}>
          <FormTextField
            control={control}
            name="sector.fromDeg"
            label="Sector from"
            unit="°"
            inputMode="decimal"
            hint="Leave both empty for all round."
            onSubmitEditing={submit}
          />
        </View>
        <View style={{ flex: 1 }}>
          <FormTextField
            control={control}
            name="sector.toDeg"
            label="Sector to"
            unit="°"
            inputMode="decimal"
            onSubmitEditing={submit}
          />
        </View>
      </View>
      {isPatrolKind(kind) ? (
        <PatrolFields
          control={control}
          units={units}
          routeValue={watch('route')}
          speedValue={watch('speedMps')}
          cycleValue={watch('cycleMinutes')}
          onRoute={(text) => setValue('route', text, { shouldValidate: false })}
          near={parsed}
          drawContext={{
            site: site.data ?? null,
            posts: (sitePosts.data ?? []).filter((p) => p.id !== post?.id),
            terrain: terrain.data ?? null,
            boundary: site.data?.boundary ?? null,
            zones: site.data?.priorityZones ?? [],
          }}
        />
      ) : null}
      <FormSegmented control={control} name="status" label="Status" options={STATUS_OPTIONS} />
      {/* Beside the button just pressed, so it is seen on a phone too. */}
      {stale ? (
        <Notice tone="danger" title="Not saved: this post changed">
          <AppText>
            Someone else saved this post after you opened it, so your changes were not saved. Reload to see their version, then
            make your change again.
          </AppText>
          {onReload ? <Button kind="secondary" label="Reload the post" onPress={onReload} /> : null}
        </Notice>
      ) : null}
      <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
        <Button label={post ? 'Save changes' : 'Save post'} onPress={submit} busy={saving.isPending} />
        {post ? (
          <Button
            kind="quiet"
            label="Discard changes"
            onPress={() => {
              reset(valuesOf(post, getValues('units')));
              setFormError('');
            }}
          />
        ) : null}
      </View>
    </Card>
  );
}
