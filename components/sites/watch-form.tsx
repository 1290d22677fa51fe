import { useState } from 'react';
import { View } from 'react-native';
import { AssignmentInputSchema, type Roster } from '@/shared/schemas/assignment';
import { ApiRequestError } from '@/components/data/api-client';
import { useCreateAssignment, usePeople } from '@/components/data/roster';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Chip, ChipRow } from '@/components/ui/chip';
import { FormError } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { colors, space } from '@/components/ui/theme';
import { parseWatchTime, WATCH_TIME_FORMAT } from './watch-time';

type Field = 'postId' | 'userId' | 'startsAt' | 'endsAt' | 'note';

/** Puts someone on a post: which post, who, from when to when (the site's local time), and a note. */
export function WatchForm({ posts, timeZone }: { posts: Roster['posts']; timeZone: string }) {
  const people = usePeople(true);
  const create = useCreateAssignment();
  const [postId, setPostId] = useState('');
  const [userId, setUserId] = useState('');
  const [start, setStart] = useState('');
  const [end, setEnd] = useState('');
  const [note, setNote] = useState('');
  const [errors, setErrors] = useState<Partial<Record<Field, string>>>({});
  const [formError, setFormError] = useState('');

  const submit = () => {
    setFormError('');
    const next: Partial<Record<Field, string>> = {};
    const startsAt = parseWatchTime(start, timeZone);
    const endsAt = end.trim() ? parseWatchTime(end, timeZone) : null;
    if (!startsAt) next.startsAt = `Type the start as ${WATCH_TIME_FORMAT}, e.g. 2026-12-03 08:00.`;
    if (end.trim() && !endsAt) next.endsAt = `Type the end as ${WATCH_TIME_FORMAT}, or leave it empty for until further notice.`;
    const parsed = AssignmentInputSchema.safeParse({ postId, userId, startsAt: startsAt ?? '', endsAt, note });
    if (!parsed.success) {
      for (const i of parsed.error.issues) {
        const key = String(i.path[0]) as Field;
        next[key] ??= key === 'postId' ? 'Choose a post.' : key === 'userId' ? 'Choose a person.' : i.message;
      }
    }
    setErrors(next);
    if (Object.keys(next).length || !parsed.success) return;
    create.mutate(parsed.data, {
      onSuccess: () => {
        setStart('');
        setEnd('');
        setNote('');
      },
      onError: (e) => {
        if (e instanceof ApiRequestError && Object.keys(e.fields).length) setErrors(e.fields as Partial<Record<Field, string>>);
        else setFormError(e.message);
      },
    });
  };

  return (
    <View
      style={{ gap: space.md, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.md }}
      aria-label="Put someone on a post"
    >
      <AppText variant="heading">Put someone on a post</AppText>
      <FormError message={formError} />
      <ChipRow label="Post">
        {posts.map((p) => (
          <Chip key={p.postId} label={p.postName} on={postId === p.postId} onPress={() => setPostId(p.postId)} />
        ))}
      </ChipRow>
      {errors.postId ? (
        <AppText variant="small" tone="danger" role="alert">
          {errors.postId}
        </AppText>
      ) : null}
      <ChipRow label="Person">
        {(people.data ?? []).map((p) => (
          <Chip key={p.id} label={p.name} on={userId === p.id} onPress={() => setUserId(p.id)} />
        ))}
      </ChipRow>
      {errors.userId ? (
        <AppText variant="small" tone="danger" role="alert">
          {errors.userId}
        </AppText>
      ) : null}
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <View style={{ flex: 1, minWidth: 160 }}>
          <TextField
            label="From"
            value={start}
            onChangeText={setStart}
            placeholder={WATCH_TIME_FORMAT.toLowerCase()}
            error={errors.startsAt}
          />
        </View>
        <View style={{ flex: 1, minWidth: 160 }}>
          <TextField
            label="To"
            value={end}
            onChangeText={setEnd}
            placeholder="empty: until further notice"
            error={errors.endsAt}
          />
        </View>
      </View>
      <TextField label="Note" value={note} onChangeText={setNote} error={errors.note} />
      <View style={{ alignSelf: 'flex-start' }}>
        <Button label="Put on watch" onPress={submit} busy={create.isPending} />
      </View>
    </View>
  );
}
