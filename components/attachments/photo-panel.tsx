import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useAttachments, type AttachmentOwner } from '@/components/data/attachments';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { PhotoCard } from './photo-card';
import { PhotoUpload } from './photo-upload';

const PAGE_SIZE = 24;

/**
 * The photos of a post (or a site): thumbnails with the direction each one
 * looks and its caption. Planners add, edit and delete; everyone else reads.
 * `columns` is 2 on phones; wider panes pass more. On phones the photos come
 * first and the upload card after them; on wide screens the card leads.
 */
export function PhotoPanel({ owner, canEdit, columns = 2 }: { owner: AttachmentOwner; canEdit: boolean; columns?: number }) {
  const { wide } = useLayout();
  const [page, setPage] = useState(1);
  const photos = useAttachments({ ...owner, kind: 'photo', page, pageSize: PAGE_SIZE });
  const width = `${100 / columns}%` as const;
  const total = photos.data?.total;

  // After a delete empties the last page, step back to the page that still has photos.
  useEffect(() => {
    if (total !== undefined && page > 1 && (page - 1) * PAGE_SIZE >= total) setPage(Math.max(1, Math.ceil(total / PAGE_SIZE)));
  }, [page, total]);

  const body = (() => {
    if (photos.isPending) return <LoadingState label="Loading photos…" />;
    if (photos.isError) return <ErrorState error={photos.error} onRetry={() => void photos.refetch()} />;
    const { items } = photos.data;
    if (photos.data.total === 0)
      return (
        <EmptyState
          title="No photos yet"
          body={
            canEdit
              ? 'Add the view in each direction the lookout watches, with its bearing.'
              : 'A planner can add photos of the view from here.'
          }
        />
      );
    const pages = Math.ceil(photos.data.total / PAGE_SIZE);
    return (
      <View style={{ gap: space.md }}>
        <View style={[styles.grid, { marginHorizontal: -space.xs }]} role="list" aria-label="Photos">
          {items.map((p) => (
            <View key={p.id} role="listitem" style={{ width, padding: space.xs }}>
              <PhotoCard photo={p} canEdit={canEdit} />
            </View>
          ))}
        </View>
        {pages > 1 ? (
          <View style={styles.pager}>
            <Button kind="secondary" label="Previous" disabled={page <= 1} onPress={() => setPage((n) => n - 1)} />
            <AppText variant="small" tone="muted">
              Page {page} of {pages} · {photos.data.total} photos
            </AppText>
            <Button kind="secondary" label="Next" disabled={page >= pages} onPress={() => setPage((n) => n + 1)} />
          </View>
        ) : null}
      </View>
    );
  })();

  return (
    <View style={{ gap: space.md }} aria-label="Photo panel">
      <AppText variant="heading">Photos{total ? ` (${total})` : ''}</AppText>
      {canEdit && wide ? <PhotoUpload owner={owner} /> : null}
      {body}
      {canEdit && !wide ? <PhotoUpload owner={owner} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap' },
  pager: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
});
