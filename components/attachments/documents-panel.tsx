import { useEffect, useRef, useState } from 'react';
import { Linking, Pressable, View } from 'react-native';
import { ACCEPTS, DOCUMENT_CONTENT_TYPES, DOCUMENT_MAX_BYTES } from '@/shared/schemas/attachment';
import { ApiRequestError } from '@/components/data/api-client';
import {
  attachmentContentUrl,
  useAttachments,
  useDeleteAttachment,
  useUploadAttachment,
  type AttachmentOwner,
} from '@/components/data/attachments';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ProgressBar } from '@/components/ui/progress-bar';
import { ErrorState, FormError, LoadingState } from '@/components/ui/states';
import { colors, space } from '@/components/ui/theme';
import { formatBytes } from './format';
import { pickFile } from '@/components/ui/pick-file';

/**
 * The documents that go with a plan or a site (survey notes, permits,
 * tables): a list to open, and for planners an upload with progress. When
 * `canEdit` is false (a submitted or approved plan) the list is read only,
 * because the files are part of the plan's record.
 */
export function DocumentsPanel({
  owner,
  canEdit,
  frozenNote,
}: {
  owner: AttachmentOwner;
  canEdit: boolean;
  frozenNote?: string;
}) {
  const docs = useAttachments({ ...owner, kind: 'document', pageSize: 100 });
  const upload = useUploadAttachment();
  const remove = useDeleteAttachment();
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState('');
  const [added, setAdded] = useState('');
  const abort = useRef<AbortController | null>(null);
  useEffect(() => () => abort.current?.abort(), []);

  const add = async () => {
    setError('');
    setAdded('');
    const file = await pickFile(DOCUMENT_CONTENT_TYPES);
    if (!file) return;
    if (file.size && file.size > DOCUMENT_MAX_BYTES) {
      setError(`Too large (${formatBytes(file.size)}). Documents: ${ACCEPTS.document}.`);
      return;
    }
    abort.current = new AbortController();
    setProgress(0);
    upload.mutate(
      { ...owner, kind: 'document', file, onProgress: setProgress, signal: abort.current.signal },
      {
        onSuccess: (a) => setAdded(`Added ${a.originalName}.`),
        onError: (e) => setError(e instanceof ApiRequestError ? (e.fields.file ?? e.message) : e.message),
        onSettled: () => setProgress(null),
      },
    );
  };

  return (
    <Card style={{ gap: space.sm }} aria-label="Documents">
      <AppText variant="heading">Documents</AppText>
      {docs.isPending ? (
        <LoadingState label="Loading documents…" />
      ) : docs.isError ? (
        <ErrorState error={docs.error} onRetry={() => void docs.refetch()} />
      ) : docs.data.items.length === 0 ? (
        <AppText tone="muted">No documents.</AppText>
      ) : (
        docs.data.items.map((d) => (
          <View key={d.id} style={{ flexDirection: 'row', alignItems: 'center', gap: space.sm }}>
            <Pressable
              role="link"
              aria-label={`Open ${d.originalName}`}
              onPress={() => void Linking.openURL(attachmentContentUrl(d.id))}
              style={{ flex: 1 }}
            >
              <AppText style={{ color: colors.ember, textDecorationLine: 'underline' }}>{d.originalName}</AppText>
              <AppText variant="small" tone="muted">
                {formatBytes(d.bytes)} · {d.uploadedBy.name} · {d.createdAt.slice(0, 10)}
              </AppText>
            </Pressable>
            {canEdit ? (
              <Button
                kind="quiet"
                label="Remove"
                aria-label={`Remove ${d.originalName}`}
                busy={remove.isPending && remove.variables?.id === d.id}
                onPress={() => remove.mutate(d)}
              />
            ) : null}
          </View>
        ))
      )}
      {!canEdit && frozenNote ? (
        <AppText variant="small" tone="muted">
          {frozenNote}
        </AppText>
      ) : null}
      <FormError message={error || (remove.isError ? remove.error.message : '')} />
      {added ? <AppText variant="small">{added}</AppText> : null}
      {progress !== null ? <ProgressBar fraction={progress} label="Uploading the document" /> : null}
      {canEdit ? (
        <View style={{ alignSelf: 'flex-start' }}>
          <Button kind="secondary" label="Add a document…" onPress={() => void add()} busy={progress !== null} />
        </View>
      ) : null}
      <AppText variant="small" tone="muted">
        {ACCEPTS.document}
      </AppText>
    </Card>
  );
}
