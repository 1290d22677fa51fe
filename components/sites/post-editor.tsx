import { useLocalSearchParams, useRouter } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { POST_KIND_LABELS, type Post } from '@/shared/schemas/site';
import { PhotoPanel } from '@/components/attachments/photo-panel';
import { HistoryLink } from '@/components/audit/history-link';
import { useDuplicatePost } from '@/components/data/placement';
import { CrewCardLinks } from '@/components/reports/crew-card-links';
import { useSession } from '@/components/data/session';
import { formatPosition } from '@/components/map/map-chrome';
import { lengthIn } from '@/components/check/format';
import { useLengthUnits } from '@/components/data/session';
import { useSite } from '@/components/data/sites';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { FormError, Notice } from '@/components/ui/states';
import { colors, space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { PostDelete } from './post-delete';
import { PostForm } from './post-form';

/**
 * One post: what it is and where, its photos, and — for planners — its form.
 * Phones stack the parts (the form opens on demand); wide screens put the post
 * and its form on the left and the photos on the right.
 */
export function PostEditor({ siteId, post, onReload }: { siteId: string; post: Post; onReload: () => void }) {
  const { data: user } = useSession();
  const { wide } = useLayout();
  const router = useRouter();
  // A fresh copy (from “Duplicate”) opens with its form, to change what differs from the original.
  const isCopy = useLocalSearchParams<{ copy?: string }>().copy === '1';
  const [editing, setEditing] = useState(isCopy);
  const [saved, setSaved] = useState(false);
  const canEdit = user?.role === 'planner';
  const duplicate = useDuplicatePost(siteId, post.id);
  const makeCopy = () =>
    duplicate.mutate(undefined, {
      onSuccess: (copy) =>
        router.navigate({ pathname: '/sites/[siteId]/posts/[postId]', params: { siteId, postId: copy.id, copy: '1' } }),
    });
  const showForm = canEdit && (wide || editing);

  const form = showForm ? (
    <PostForm
      // A new version (after a save or a reload) starts the form afresh from it.
      key={post.version}
      siteId={siteId}
      post={post}
      onDone={() => {
        setSaved(true);
        setEditing(false);
      }}
      onReload={onReload}
    />
  ) : null;

  const details = (
    <View style={{ gap: space.lg }}>
      {saved ? (
        <Notice tone="info">
          <AppText>Changes saved.</AppText>
        </Notice>
      ) : null}
      {isCopy && !saved ? (
        <Notice tone="info" title="A copy">
          <AppText>
            This post was made with the same settings as the one you duplicated. Change its name, place or heights below, then
            save.
          </AppText>
        </Notice>
      ) : null}
      <PostSummary post={post} siteId={siteId} />
      <Button
        kind="secondary"
        label="Show on the map"
        role="link"
        onPress={() => router.navigate({ pathname: '/sites/[siteId]/map', params: { siteId, postId: post.id } })}
        style={{ alignSelf: 'flex-start' }}
      />
      <HistoryLink entityType="post" entityId={post.id} />
      <CrewCardLinks siteId={siteId} postId={post.id} />
      {canEdit && !wide && !editing ? (
        <Button
          kind="secondary"
          label="Edit post"
          onPress={() => {
            setSaved(false);
            setEditing(true);
          }}
        />
      ) : null}
      {form}
      {canEdit ? (
        <View style={{ gap: space.xs }}>
          <Button
            kind="secondary"
            label="Duplicate"
            onPress={makeCopy}
            busy={duplicate.isPending}
            style={{ alignSelf: 'flex-start' }}
          />
          <AppText variant="small" tone="muted">
            A new post with the same kind, place, heights, sector and status, named “{post.name} (copy)”. Photos and watches stay
            with this one.
          </AppText>
          <FormError message={duplicate.error?.message ?? ''} />
        </View>
      ) : null}
      {canEdit ? <PostDelete siteId={siteId} post={post} /> : null}
    </View>
  );
  const photos = <PhotoPanel owner={{ ownerType: 'post', ownerId: post.id }} canEdit={canEdit} columns={2} />;

  return (
    <Screen
      title={post.name}
      subtitle={`${POST_KIND_LABELS[post.kind]} · ${post.status === 'existing' ? 'Existing' : 'Proposed'}`}
      actions={<BackToSite siteId={siteId} />}
      maxWidth={1280}
    >
      {wide ? (
        <View style={styles.panes}>
          <View style={{ flex: 2, gap: space.lg }}>{details}</View>
          <View style={{ flex: 3 }}>{photos}</View>
        </View>
      ) : (
        <View style={{ gap: space.xl }}>
          {details}
          {photos}
        </View>
      )}
    </Screen>
  );
}

function PostSummary({ post, siteId }: { post: Post; siteId: string }) {
  const { height } = useLengthUnits(useSite(siteId).data?.defaultUnits);
  const eye = post.groundElevationM + post.structureHeightM + post.eyeHeightM;
  const rows: [string, string][] = [
    [
      'Location (WGS 84)',
      `${formatCoordinate(post.location, 'ddm')}\n${formatCoordinate(post.location, 'utm')}\n${formatPosition(post.location, 'mgrs')} (MGRS)`,
    ],
    ['Eye above sea level', lengthIn(eye, height, (m) => `${m.toFixed(1)} m`)],
    [
      'Made up of',
      `ground ${lengthIn(post.groundElevationM, height)} + structure ${lengthIn(post.structureHeightM, height)} + eye ${lengthIn(post.eyeHeightM, height)}`,
    ],
    ['Sector watched', post.sector ? `${post.sector.fromDeg}° to ${post.sector.toDeg}° (clockwise)` : 'All round'],
    ['Last changed', new Date(post.updatedAt).toLocaleString()],
  ];
  return (
    <Card aria-label="Post details" style={{ gap: space.sm }}>
      {rows.map(([label, value]) => (
        <View key={label} style={styles.row}>
          <AppText variant="label" tone="muted" style={styles.rowLabel}>
            {label}
          </AppText>
          <AppText style={{ flex: 1 }}>{value}</AppText>
        </View>
      ))}
    </Card>
  );
}

function BackToSite({ siteId }: { siteId: string }) {
  const router = useRouter();
  const site = useSite(siteId);
  return (
    <Pressable
      role="link"
      onPress={() => router.navigate({ pathname: '/sites/[siteId]', params: { siteId } })}
      style={({ pressed }) => [styles.back, pressed && { opacity: 0.6 }]}
    >
      <AppText variant="label" tone="ember">
        ‹ {site.data ? site.data.name : 'Back to the site'}
      </AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  panes: { flexDirection: 'row', gap: space.xl, alignItems: 'flex-start' },
  row: { flexDirection: 'row', gap: space.md, flexWrap: 'wrap' },
  rowLabel: { width: 130, paddingTop: 3 },
  back: { minHeight: 44, justifyContent: 'center', paddingHorizontal: space.xs, borderBottomColor: colors.line },
});
