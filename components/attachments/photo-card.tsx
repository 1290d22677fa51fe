import { useState } from 'react';
import { Image, StyleSheet, View } from 'react-native';
import { AttachmentUpdateSchema, type Attachment } from '@/shared/schemas/attachment';
import { ApiRequestError } from '@/components/data/api-client';
import { attachmentContentUrl, useDeleteAttachment, useUpdateAttachment } from '@/components/data/attachments';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { colors, radius, space } from '@/components/ui/theme';
import { BearingDial } from './bearing-dial';
import { CameraBearingField } from './camera-bearing-field';
import { bearingFromText, formatBearing } from './format';

type Mode = 'view' | 'edit' | 'confirm-delete';

/** One photo: the picture, which way it looks, its caption; planners edit or delete it in place. */
export function PhotoCard({ photo, canEdit }: { photo: Attachment; canEdit: boolean }) {
  const [mode, setMode] = useState<Mode>('view');
  const [broken, setBroken] = useState(false);
  const label = photo.caption || photo.originalName;
  return (
    <Card aria-label={`Photo ${label}`} style={styles.card}>
      <View style={styles.frame}>
        {broken ? (
          <View style={[styles.image, styles.missing]}>
            <AppText variant="small" tone="muted">
              The picture could not be loaded.
            </AppText>
          </View>
        ) : (
          <Image
            source={{ uri: attachmentContentUrl(photo.id) }}
            style={styles.image}
            resizeMode="cover"
            aria-label={
              photo.bearingDeg === null ? `View: ${label}` : `View towards ${formatBearing(photo.bearingDeg)}: ${label}`
            }
            onError={() => setBroken(true)}
          />
        )}
        {photo.bearingDeg !== null ? (
          <View style={styles.badge}>
            <BearingDial bearingDeg={photo.bearingDeg} size={22} />
            <AppText variant="label" style={{ fontVariant: ['tabular-nums'] }}>
              {formatBearing(photo.bearingDeg)}
            </AppText>
          </View>
        ) : null}
      </View>
      {mode === 'edit' ? (
        <EditPhoto photo={photo} onDone={() => setMode('view')} />
      ) : (
        <View style={{ gap: 2 }}>
          <AppText variant="label">{photo.caption || 'No caption'}</AppText>
          <AppText variant="small" tone="muted">
            {photo.bearingDeg === null ? 'No bearing · ' : ''}
            {photo.widthPx && photo.heightPx ? `${photo.widthPx} × ${photo.heightPx} px · ` : ''}
            {photo.uploadedBy.name}, {new Date(photo.createdAt).toLocaleDateString()}
          </AppText>
        </View>
      )}
      {canEdit && mode === 'view' ? (
        <View style={styles.actions}>
          <Button
            kind="quiet"
            label="Edit"
            aria-label={`Edit photo ${label}`}
            onPress={() => setMode('edit')}
            style={styles.compact}
          />
          <Button
            kind="quiet"
            label="Delete"
            aria-label={`Delete photo ${label}`}
            onPress={() => setMode('confirm-delete')}
            style={styles.compact}
          />
        </View>
      ) : null}
      {mode === 'confirm-delete' ? <ConfirmDelete photo={photo} onCancel={() => setMode('view')} /> : null}
    </Card>
  );
}

function EditPhoto({ photo, onDone }: { photo: Attachment; onDone: () => void }) {
  const [bearing, setBearing] = useState(photo.bearingDeg === null ? '' : String(photo.bearingDeg));
  const [caption, setCaption] = useState(photo.caption);
  const [errors, setErrors] = useState<{ bearingDeg?: string; caption?: string }>({});
  const [formError, setFormError] = useState('');
  const update = useUpdateAttachment();

  const save = () => {
    setFormError('');
    const parsed = AttachmentUpdateSchema.safeParse({ caption, bearingDeg: bearingFromText(bearing), version: photo.version });
    if (!parsed.success) {
      const next: typeof errors = {};
      for (const i of parsed.error.issues) {
        const key = i.path[0];
        if ((key === 'bearingDeg' || key === 'caption') && !next[key]) next[key] = i.message;
      }
      setErrors(next);
      return;
    }
    setErrors({});
    update.mutate(
      { id: photo.id, ...parsed.data },
      {
        onSuccess: onDone,
        onError: (e) => {
          if (e instanceof ApiRequestError) setErrors({ bearingDeg: e.fields.bearingDeg, caption: e.fields.caption });
          setFormError(
            e instanceof ApiRequestError && e.code === 'stale_version'
              ? 'Someone else changed this photo after you opened it; your change was not saved. Cancel to see theirs, then edit again.'
              : e.message,
          );
        },
      },
    );
  };

  return (
    <View style={{ gap: space.sm }} aria-label="Edit photo">
      <FormError message={formError} />
      <CameraBearingField
        value={bearing}
        onChangeText={setBearing}
        error={errors.bearingDeg}
        hint="Which way the camera looks, degrees from true north. Empty for none."
      />
      <TextField label="Caption" value={caption} onChangeText={setCaption} error={errors.caption} />
      <View style={styles.actions}>
        <Button label="Save" onPress={save} busy={update.isPending} />
        <Button kind="quiet" label="Cancel" onPress={onDone} />
      </View>
    </View>
  );
}

function ConfirmDelete({ photo, onCancel }: { photo: Attachment; onCancel: () => void }) {
  const remove = useDeleteAttachment();
  return (
    <View style={styles.confirm} role="alert">
      <AppText>Delete this photo? It leaves the post; plans that already refer to it keep their record.</AppText>
      <FormError message={remove.error?.message ?? ''} />
      <View style={styles.actions}>
        <Button kind="danger" label="Delete photo" busy={remove.isPending} onPress={() => remove.mutate(photo)} />
        <Button kind="quiet" label="Keep it" onPress={onCancel} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  card: { padding: space.md, gap: space.sm },
  frame: { borderRadius: radius.md, overflow: 'hidden', backgroundColor: colors.paper },
  image: { width: '100%', aspectRatio: 4 / 3 },
  missing: { alignItems: 'center', justifyContent: 'center', padding: space.md },
  badge: {
    position: 'absolute',
    left: space.sm,
    bottom: space.sm,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.xs,
    paddingLeft: 3,
    paddingRight: space.sm,
    paddingVertical: 3,
    borderRadius: radius.pill,
    backgroundColor: 'rgba(255,255,255,0.92)',
  },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  compact: { paddingHorizontal: space.sm },
  confirm: { gap: space.sm, padding: space.md, borderRadius: radius.md, backgroundColor: colors.dangerSoft },
});
