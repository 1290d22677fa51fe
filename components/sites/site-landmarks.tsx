import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { LandmarkInputSchema, type LandmarkInput } from '@/shared/schemas/landmark';
import { useCreateLandmark, useDeleteLandmark, useSiteLandmarks } from '@/components/data/landmarks';
import { applyServerErrors } from '@/components/data/server-errors';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormTextField } from '@/components/ui/form-text-field';
import { ErrorState, FormError, LoadingState } from '@/components/ui/states';
import { space } from '@/components/ui/theme';

interface LandmarkForm {
  name: string;
  latDeg: string;
  lonDeg: string;
  heightM: string;
}

const FIELDS = ['name', 'latDeg', 'lonDeg', 'heightM'] as const;
const numberOrAbsent = (text: string) => (text.trim() === '' ? undefined : Number(text.trim().replace(',', '.')));

/**
 * The site's landmarks (named reference marks): everyone sees the list;
 * planners add and remove them. Reports can give a position from one, and
 * landmark-range drills ask the range to them.
 */
export function SiteLandmarks({ siteId, canWrite }: { siteId: string; canWrite: boolean }) {
  const landmarks = useSiteLandmarks(siteId);
  const create = useCreateLandmark(siteId);
  const remove = useDeleteLandmark(siteId);
  const [formError, setFormError] = useState('');
  const { control, handleSubmit, setError, reset } = useForm<LandmarkForm>({
    defaultValues: { name: '', latDeg: '', lonDeg: '', heightM: '' },
  });
  const onSubmit = handleSubmit((values) => {
    setFormError('');
    const parsed = LandmarkInputSchema.safeParse({
      name: values.name,
      latDeg: numberOrAbsent(values.latDeg),
      lonDeg: numberOrAbsent(values.lonDeg),
      heightM: numberOrAbsent(values.heightM) ?? null,
    });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const field = issue.path[0] as (typeof FIELDS)[number];
        if (FIELDS.includes(field)) setError(field, { message: issue.message });
      }
      return;
    }
    const input: LandmarkInput = parsed.data;
    create.mutate(input, {
      onSuccess: () => reset(),
      onError: (e) => setFormError(applyServerErrors(e, setError, FIELDS)),
    });
  });

  if (landmarks.isPending) return <LoadingState label="Loading the landmarks…" />;
  if (landmarks.isError) return <ErrorState error={landmarks.error} onRetry={() => void landmarks.refetch()} />;
  return (
    <Card style={{ gap: space.md }} aria-label="Landmarks">
      <AppText variant="heading">Landmarks</AppText>
      <AppText variant="small" tone="muted">
        Named reference marks: a report can give a position as a distance and bearing from one, and landmark-range drills ask the
        range to them. A landmark is only as good as its stored position.
      </AppText>
      {landmarks.data.length === 0 ? <AppText tone="muted">No landmarks yet.</AppText> : null}
      <View role="list" style={{ gap: space.xs }}>
        {landmarks.data.map((m) => (
          <View
            key={m.id}
            role="listitem"
            style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' }}
          >
            <AppText variant="label">{m.name}</AppText>
            <AppText variant="small" selectable>
              {formatCoordinate(m, 'dd')}
              {m.heightM !== null ? ` · ${m.heightM} m high` : ''}
            </AppText>
            {canWrite ? (
              <Button
                kind="quiet"
                label={`Remove ${m.name}`}
                busy={remove.isPending && remove.variables === m.id}
                onPress={() => remove.mutate(m.id)}
              />
            ) : null}
          </View>
        ))}
      </View>
      {canWrite ? (
        <View style={{ gap: space.sm }} aria-label="Add a landmark">
          <FormTextField control={control} name="name" label="Landmark name" placeholder="e.g. a hut, a cairn, a mast" />
          <FormTextField
            control={control}
            name="latDeg"
            label="Latitude"
            unit="°"
            inputMode="decimal"
            hint="WGS 84, north positive."
          />
          <FormTextField
            control={control}
            name="lonDeg"
            label="Longitude"
            unit="°"
            inputMode="decimal"
            hint="WGS 84, east positive."
          />
          <FormTextField control={control} name="heightM" label="Height (optional)" unit="m" inputMode="decimal" />
          <FormError message={formError} />
          <Button
            label="Add the landmark"
            busy={create.isPending}
            onPress={() => void onSubmit()}
            style={{ alignSelf: 'flex-start' }}
          />
        </View>
      ) : null}
    </Card>
  );
}
