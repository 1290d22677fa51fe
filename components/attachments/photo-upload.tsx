import { useEffect, useRef, useState } from 'react';
import { Image, StyleSheet, View } from 'react-native';
import { ACCEPTS, AttachmentUploadFieldsSchema, PHOTO_CONTENT_TYPES, PHOTO_MAX_BYTES } from '@/shared/schemas/attachment';
import { ApiRequestError } from '@/components/data/api-client';
import { useUploadAttachment, type AttachmentOwner } from '@/components/data/attachments';
import type { PickedFile } from '@/components/data/file-part';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ProgressBar } from '@/components/ui/progress-bar';
import { FormError, Notice } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { colors, radius, space } from '@/components/ui/theme';
import { CameraBearingField } from './camera-bearing-field';
import { bearingFromText, formatBytes } from './format';
import { pickFile } from '@/components/ui/pick-file';
import { FieldError } from '@/components/ui/field-error';

type Errors = { file?: string; bearingDeg?: string; caption?: string };

/** Choose a photo, say which way it looks, and upload it with a progress bar; Cancel stops the upload. */
export function PhotoUpload({ owner }: { owner: AttachmentOwner }) {
  const [file, setFile] = useState<PickedFile | null>(null);
  const [bearing, setBearing] = useState('');
  const [caption, setCaption] = useState('');
  const [errors, setErrors] = useState<Errors>({});
  const [formError, setFormError] = useState('');
  const [progress, setProgress] = useState<number | null>(null);
  const [added, setAdded] = useState('');
  const abort = useRef<AbortController | null>(null);
  const upload = useUploadAttachment();

  // Leaving the page stops an upload still running.
  useEffect(() => () => abort.current?.abort(), []);

  const choose = async () => {
    setFormError('');
    setAdded('');
    const picked = await pickFile(PHOTO_CONTENT_TYPES);
    if (!picked) return;
    setFile(picked);
    setErrors((e) => ({
      ...e,
      file:
        picked.size && picked.size > PHOTO_MAX_BYTES
          ? `Too large (${formatBytes(picked.size)}). Photos: ${ACCEPTS.photo}.`
          : undefined,
    }));
  };

  const send = () => {
    setFormError('');
    setAdded('');
    const parsed = AttachmentUploadFieldsSchema.safeParse({
      ...owner,
      kind: 'photo',
      caption,
      bearingDeg: bearingFromText(bearing),
    });
    const next: Errors = {};
    if (!file) next.file = 'Choose a photo first.';
    else if (file.size && file.size > PHOTO_MAX_BYTES)
      next.file = `Too large (${formatBytes(file.size)}). Photos: ${ACCEPTS.photo}.`;
    if (!parsed.success) {
      for (const i of parsed.error.issues) {
        const key = i.path[0];
        if ((key === 'bearingDeg' || key === 'caption') && !next[key]) next[key] = i.message;
      }
    }
    setErrors(next);
    if (!parsed.success || !file || Object.keys(next).length) return;

    const controller = new AbortController();
    abort.current = controller;
    setProgress(0);
    upload.mutate(
      {
        ...owner,
        kind: 'photo',
        file,
        caption: parsed.data.caption,
        bearingDeg: parsed.data.bearingDeg,
        onProgress: setProgress,
        signal: controller.signal,
      },
      {
        onSuccess: (a) => {
          setAdded(`Added ${a.originalName}.`);
          setFile(null);
          setBearing('');
          setCaption('');
        },
        onError: (e) => {
          if (e.name === 'AbortError') {
            setFormError('Upload cancelled; nothing was kept.');
            return;
          }
          if (e instanceof ApiRequestError)
            setErrors({ file: e.fields.file, bearingDeg: e.fields.bearingDeg, caption: e.fields.caption });
          setFormError(e.message);
        },
        onSettled: () => {
          abort.current = null;
          setProgress(null);
        },
      },
    );
  };

  const busy = progress !== null;
  return (
    <Card accent="moss" aria-label="Add a photo" style={{ gap: space.md }}>
      <AppText variant="heading">Add a photo</AppText>
      <AppText variant="small" tone="muted">
        {ACCEPTS.photo}. One photo per direction the lookout watches helps reviewers and relief crews.
      </AppText>
      <FormError message={formError} />
      {added ? (
        <Notice tone="info">
          <AppText>{added}</AppText>
        </Notice>
      ) : null}
      <View style={styles.fileRow}>
        {file ? <Image source={{ uri: file.uri }} style={styles.preview} aria-label="Chosen photo" resizeMode="cover" /> : null}
        <View style={{ flex: 1, gap: space.xs, minWidth: 160 }}>
          <AppText variant="label" numberOfLines={1}>
            {file ? file.name : 'No photo chosen'}
          </AppText>
          {file?.size ? (
            <AppText variant="small" tone="muted">
              {formatBytes(file.size)}
            </AppText>
          ) : null}
          <FieldError message={errors.file} />
        </View>
        <Button
          kind="secondary"
          label={file ? 'Choose another' : 'Choose a photo…'}
          onPress={() => void choose()}
          disabled={busy}
        />
      </View>
      <View style={styles.fields}>
        <View style={{ flex: 1, minWidth: 140 }}>
          <CameraBearingField
            value={bearing}
            onChangeText={setBearing}
            error={errors.bearingDeg}
            hint="Which way the camera looks, from true north."
            editable={!busy}
          />
        </View>
        <View style={{ flex: 2, minWidth: 200 }}>
          <TextField label="Caption" value={caption} onChangeText={setCaption} error={errors.caption} editable={!busy} />
        </View>
      </View>
      {busy ? (
        <View style={styles.progress}>
          <ProgressBar
            label={`Uploading ${file?.name ?? 'photo'}`}
            fraction={progress}
            detail={progress >= 1 ? 'Checking the photo…' : undefined}
          />
          <Button kind="quiet" label="Cancel upload" onPress={() => abort.current?.abort()} />
        </View>
      ) : (
        <Button label="Upload photo" onPress={send} disabled={!file} />
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  fileRow: { flexDirection: 'row', alignItems: 'center', gap: space.md, flexWrap: 'wrap' },
  preview: { width: 64, height: 48, borderRadius: radius.sm, backgroundColor: colors.paper },
  fields: { flexDirection: 'row', gap: space.md, flexWrap: 'wrap' },
  progress: { gap: space.sm },
});
