import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { View } from 'react-native';
import { z } from 'zod';
import { AssignmentInputSchema, type AssignmentInput, type Roster } from '@/shared/schemas/assignment';
import { useCreateAssignment, usePeople } from '@/components/data/roster';
import { applyServerErrors } from '@/components/data/server-errors';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Chip, ChipRow } from '@/components/ui/chip';
import { FieldRow } from '@/components/ui/field-row';
import { FormTextField } from '@/components/ui/form-text-field';
import { FormError, Notice } from '@/components/ui/states';
import { colors, space } from '@/components/ui/theme';
import { parseWatchTime, WATCH_TIME_FORMAT } from './watch-time';

/** What the form holds: the chosen post and person, the times as typed in the site's local time. */
interface WatchFormValues {
  postId: string;
  userId: string;
  startsAt: string;
  endsAt: string;
  note: string;
}
const EMPTY: WatchFormValues = { postId: '', userId: '', startsAt: '', endsAt: '', note: '' };
const FIELDS = ['postId', 'userId', 'startsAt', 'endsAt', 'note'] as const;

/** The shared assignment schema behind the form's text: times typed in `timeZone` become instants first. */
export function watchFormSchema(timeZone: string) {
  return z.preprocess((form, ctx) => {
    const v = form as WatchFormValues;
    const startsAt = parseWatchTime(v.startsAt, timeZone);
    const endsAt = v.endsAt.trim() ? parseWatchTime(v.endsAt, timeZone) : null;
    if (!startsAt) {
      ctx.addIssue({
        code: 'custom',
        path: ['startsAt'],
        input: v.startsAt,
        message: `Type the start as ${WATCH_TIME_FORMAT}, e.g. 2026-12-03 08:00.`,
      });
    }
    if (v.endsAt.trim() && !endsAt) {
      ctx.addIssue({
        code: 'custom',
        path: ['endsAt'],
        input: v.endsAt,
        message: `Type the end as ${WATCH_TIME_FORMAT}, or leave it empty for until further notice.`,
      });
    }
    return { postId: v.postId, userId: v.userId, startsAt: startsAt ?? '', endsAt, note: v.note };
  }, AssignmentInputSchema);
}

/** An error under a chip row, announced. */
function ChoiceError({ message }: { message?: string }) {
  return message ? (
    <AppText variant="small" tone="danger" role="alert">
      {message}
    </AppText>
  ) : null;
}

/** Puts someone on a post: which post, who, from when to when (the site's local time), and a note. */
export function WatchForm({ posts, timeZone }: { posts: Roster['posts']; timeZone: string }) {
  const people = usePeople(true);
  const create = useCreateAssignment();
  const [formError, setFormError] = useState('');
  const [warnings, setWarnings] = useState<string[]>([]);
  const { control, handleSubmit, setError, reset, getValues } = useForm<WatchFormValues, unknown, AssignmentInput>({
    resolver: zodResolver(watchFormSchema(timeZone) as never) as never,
    defaultValues: EMPTY,
  });

  const save = handleSubmit((input) => {
    setFormError('');
    setWarnings([]);
    create.mutate(input, {
      // The same post and person stay chosen for the next watch.
      onSuccess: (answer) => {
        setWarnings(answer.warnings);
        reset({ ...EMPTY, postId: getValues('postId'), userId: getValues('userId') });
      },
      onError: (e) => setFormError(applyServerErrors(e, setError, FIELDS)),
    });
  });
  const submit = () => void save();

  return (
    <View
      style={{ gap: space.md, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.md }}
      aria-label="Put someone on a post"
    >
      <AppText variant="heading">Put someone on a post</AppText>
      <FormError message={formError} />
      {warnings.length > 0 ? (
        <Notice title="Put on watch, but not qualified">
          {warnings.map((w) => (
            <AppText key={w}>{w}</AppText>
          ))}
        </Notice>
      ) : null}
      <Controller
        control={control}
        name="postId"
        render={({ field, fieldState }) => (
          <>
            <ChipRow label="Post">
              {posts.map((p) => (
                <Chip key={p.postId} label={p.postName} on={field.value === p.postId} onPress={() => field.onChange(p.postId)} />
              ))}
            </ChipRow>
            <ChoiceError message={fieldState.error?.message} />
          </>
        )}
      />
      <Controller
        control={control}
        name="userId"
        render={({ field, fieldState }) => (
          <>
            <ChipRow label="Person">
              {(people.data ?? []).map((p) => (
                <Chip key={p.id} label={p.name} on={field.value === p.id} onPress={() => field.onChange(p.id)} />
              ))}
            </ChipRow>
            <ChoiceError message={fieldState.error?.message} />
          </>
        )}
      />
      <FieldRow minWidth={160}>
        <FormTextField
          control={control}
          name="startsAt"
          label="From"
          placeholder={WATCH_TIME_FORMAT.toLowerCase()}
          onSubmitEditing={submit}
        />
        <FormTextField
          control={control}
          name="endsAt"
          label="To"
          placeholder="empty: until further notice"
          onSubmitEditing={submit}
        />
      </FieldRow>
      <FormTextField control={control} name="note" label="Note" onSubmitEditing={submit} />
      <View style={{ alignSelf: 'flex-start' }}>
        <Button label="Put on watch" onPress={submit} busy={create.isPending} disabled={create.isPending} />
      </View>
    </View>
  );
}
