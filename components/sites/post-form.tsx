import { useState } from 'react';
import { View } from 'react-native';
import { CoordinateError } from '@/shared/geo/coordinate-error';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { parseCoordinate } from '@/shared/geo/parse-coordinate';
import { POST_KIND_LABELS, POST_KINDS, PostInputSchema, type Post, type PostInput } from '@/shared/schemas/site';
import { ApiRequestError } from '@/components/data/api-client';
import { useCreatePost, useUpdatePost } from '@/components/data/sites';
import { Segmented } from '@/components/check/unit-switch';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError, Notice } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';
import { formatPosition } from '@/components/map/map-chrome';
import { GroundFromTerrain } from './ground-from-terrain';

type Kind = (typeof POST_KINDS)[number];
const EMPTY = {
  name: '',
  kind: 'tower' as Kind,
  location: '',
  ground: '',
  structure: '0',
  eye: '1.6',
  status: 'existing' as 'existing' | 'proposed',
  sectorFrom: '',
  sectorTo: '',
};
type Values = typeof EMPTY;
type Errors = Partial<Record<keyof Values, string>>;

/** The form's text values for an existing post. */
function valuesOf(p: Post): Values {
  return {
    name: p.name,
    kind: p.kind,
    location: formatCoordinate(p.location, 'dd'),
    ground: String(p.groundElevationM),
    structure: String(p.structureHeightM),
    eye: String(p.eyeHeightM),
    status: p.status,
    sectorFrom: p.sector ? String(p.sector.fromDeg) : '',
    sectorTo: p.sector ? String(p.sector.toDeg) : '',
  };
}

const FIELD: Record<string, keyof typeof EMPTY> = {
  name: 'name',
  kind: 'kind',
  location: 'location',
  groundElevationM: 'ground',
  structureHeightM: 'structure',
  eyeHeightM: 'eye',
  'sector.fromDeg': 'sectorFrom',
  'sector.toDeg': 'sectorTo',
};

/**
 * A post's form: a new post, or — given `post` — an edit of that post saved
 * with the version it was loaded at. Coordinates in any usual format (DD,
 * DDM, DMS, UTM), heights in metres. When someone else saved the post first
 * the form says so and offers `onReload` (the parent remounts the form with
 * the new version).
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
  const initial = post ? valuesOf(post) : EMPTY;
  const [v, setV] = useState(initial);
  const [errors, setErrors] = useState<Errors>({});
  const [formError, setFormError] = useState('');
  const [stale, setStale] = useState(false);
  const create = useCreatePost(siteId);
  const update = useUpdatePost(siteId, post?.id ?? '');
  const saving = post ? update : create;
  const set = (k: keyof typeof EMPTY) => (text: string) => setV((f) => ({ ...f, [k]: text }));

  let parsed: ReturnType<typeof parseCoordinate> | null = null;
  let locationError = '';
  if (v.location.trim()) {
    try {
      parsed = parseCoordinate(v.location);
    } catch (e) {
      locationError = e instanceof CoordinateError ? e.message : 'Not a coordinate.';
    }
  }

  const submit = () => {
    setFormError('');
    setStale(false);
    const num = (t: string) => (t.trim() === '' ? undefined : Number(t.replace(',', '.')));
    const candidate = {
      name: v.name,
      kind: v.kind,
      // An untouched location keeps its full precision (the text shows it rounded to about a metre).
      location:
        post && v.location === initial.location
          ? post.location
          : parsed
            ? { latDeg: parsed.latDeg, lonDeg: parsed.lonDeg }
            : undefined,
      groundElevationM: num(v.ground),
      structureHeightM: num(v.structure),
      eyeHeightM: num(v.eye),
      status: v.status,
      sector: v.sectorFrom || v.sectorTo ? { fromDeg: num(v.sectorFrom), toDeg: num(v.sectorTo) } : null,
    };
    const result = PostInputSchema.safeParse(candidate);
    const next: Errors = {};
    if (!parsed) next.location = locationError || 'Enter where the post is.';
    if (!result.success) {
      for (const i of result.error.issues) {
        const key = FIELD[i.path.join('.')] ?? FIELD[String(i.path[0])];
        if (key && !next[key]) next[key] = i.message;
      }
    }
    setErrors(next);
    if (!result.success || Object.keys(next).length) return;
    const onError = (e: Error) => {
      if (e instanceof ApiRequestError) {
        if (e.code === 'stale_version') {
          setStale(true);
          return;
        }
        const fromServer: Errors = {};
        for (const [path, msg] of Object.entries(e.fields)) {
          const key = FIELD[path] ?? FIELD[path.split('.')[0] ?? ''];
          if (key) fromServer[key] = msg;
        }
        setErrors(fromServer);
      }
      setFormError(e.message);
    };
    if (post) {
      // The saved post comes back with a new version, which remounts this form (its key) before a
      // per-call onSuccess could run; the promise resolves regardless, so the page learns of the save.
      update.mutateAsync({ ...(result.data as PostInput), version: post.version }).then(() => onDone?.(), onError);
    } else {
      create.mutate(result.data as PostInput, {
        onSuccess: () => {
          setV(EMPTY);
          onDone?.();
        },
        onError,
      });
    }
  };

  return (
    <Card accent="moss" aria-label={post ? 'Edit post' : 'New post'}>
      <AppText variant="heading">{post ? 'Edit this post' : 'Add a post'}</AppText>
      <FormError message={formError} />
      <TextField label="Name" value={v.name} onChangeText={set('name')} error={errors.name} />
      <Segmented<Kind>
        label="Kind"
        value={v.kind}
        onChange={(k) => setV((f) => ({ ...f, kind: k }))}
        options={POST_KINDS.map((k) => ({ value: k, label: POST_KIND_LABELS[k] }))}
      />
      <TextField
        label="Location"
        value={v.location}
        onChangeText={set('location')}
        error={errors.location ?? (locationError || undefined)}
        hint={
          parsed
            ? `Read as ${formatCoordinate(parsed, 'dd')} · ${formatCoordinate(parsed, 'utm')} · ${formatPosition(parsed, 'mgrs')} (WGS 84)`
            : 'WGS 84: decimal degrees, degrees-minutes, DMS, UTM (e.g. 33U 516200 5741300) or MGRS (33U WT 16200 41300).'
        }
        autoCapitalize="characters"
      />
      <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
        <View style={{ flex: 1, minWidth: 140 }}>
          <TextField
            label="Ground elevation"
            unit="m"
            inputMode="decimal"
            value={v.ground}
            onChangeText={set('ground')}
            error={errors.ground}
          />
          <GroundFromTerrain siteId={siteId} location={parsed} onElevation={(m) => setV((f) => ({ ...f, ground: String(m) }))} />
        </View>
        <View style={{ flex: 1, minWidth: 140 }}>
          <TextField
            label="Structure height"
            unit="m"
            inputMode="decimal"
            value={v.structure}
            onChangeText={set('structure')}
            error={errors.structure}
          />
        </View>
        <View style={{ flex: 1, minWidth: 140 }}>
          <TextField
            label="Eye above platform"
            unit="m"
            inputMode="decimal"
            value={v.eye}
            onChangeText={set('eye')}
            error={errors.eye}
          />
        </View>
      </View>
      <View style={{ flexDirection: 'row', gap: space.md }}>
        <View style={{ flex: 1 }}>
          <TextField
            label="Sector from"
            unit="°"
            inputMode="decimal"
            value={v.sectorFrom}
            onChangeText={set('sectorFrom')}
            error={errors.sectorFrom}
            hint="Leave both empty for all round."
          />
        </View>
        <View style={{ flex: 1 }}>
          <TextField
            label="Sector to"
            unit="°"
            inputMode="decimal"
            value={v.sectorTo}
            onChangeText={set('sectorTo')}
            error={errors.sectorTo}
          />
        </View>
      </View>
      <Segmented
        label="Status"
        value={v.status}
        onChange={(s) => setV((f) => ({ ...f, status: s }))}
        options={[
          { value: 'existing', label: 'Existing' },
          { value: 'proposed', label: 'Proposed' },
        ]}
      />
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
              setV(initial);
              setErrors({});
              setFormError('');
            }}
          />
        ) : null}
      </View>
    </Card>
  );
}
