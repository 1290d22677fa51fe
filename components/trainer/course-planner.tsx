import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { View } from 'react-native';
import { AVAILABLE_DRILL_KINDS } from '@/shared/schemas/drill';
import { CourseInputSchema, type Course } from '@/shared/schemas/course';
import { usePeople } from '@/components/data/roster';
import { applyServerErrors } from '@/components/data/server-errors';
import { useUnitSystem } from '@/components/data/session';
import { useAssignCourse, useCourseResults, useCreateCourse } from '@/components/data/trainer';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Chip, ChipRow, toggled } from '@/components/ui/chip';
import { FormTextField } from '@/components/ui/form-text-field';
import { ErrorState, FormError, LoadingState, Notice } from '@/components/ui/states';
import { colors, space } from '@/components/ui/theme';
import { FieldRow } from '@/components/ui/field-row';
import { FieldError } from '@/components/ui/field-error';
import { PostPicker } from './post-picker';
import { DRILL_KIND_LABELS } from './trainer-format';

interface CourseFormValues {
  name: string;
  kinds: string[];
  postIds: string[];
  questionCount: string;
  passMarkPct: string;
  validityDays: string;
  assigneeIds: string[];
}

const EMPTY: CourseFormValues = {
  name: '',
  kinds: ['horizon-distance', 'hidden-height'],
  postIds: [],
  questionCount: '4',
  passMarkPct: '75',
  validityDays: '365',
  assigneeIds: [],
};

const FIELDS = ['name', 'kinds', 'postIds', 'questionCount', 'passMarkPct', 'validityDays', 'assigneeIds'] as const;

/** A planner composes a course (kinds, posts, questions, pass mark, validity) and assigns it to people. */
export function CourseComposer() {
  const people = usePeople(true);
  const create = useCreateCourse();
  const units = useUnitSystem();
  const [formError, setFormError] = useState('');
  const [saved, setSaved] = useState('');
  const { control, handleSubmit, setError, clearErrors, reset } = useForm<CourseFormValues>({ defaultValues: EMPTY });

  const save = handleSubmit((values) => {
    setFormError('');
    setSaved('');
    clearErrors();
    const parsed = CourseInputSchema.safeParse({
      ...values,
      questionCount: values.questionCount.trim() === '' ? undefined : Number(values.questionCount),
      passMarkPct: values.passMarkPct.trim() === '' ? undefined : Number(values.passMarkPct),
      validityDays: values.validityDays.trim() === '' ? undefined : Number(values.validityDays),
      units,
    });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const field = FIELDS.find((f) => f === issue.path[0]);
        if (field) setError(field, { type: 'validate', message: issue.message });
        else setFormError(issue.message);
      }
      return;
    }
    create.mutate(parsed.data, {
      onSuccess: ({ course }) => {
        setSaved(
          `“${course.name}” is set for ${course.assignees.length} ${course.assignees.length === 1 ? 'person' : 'people'}.`,
        );
        reset(EMPTY);
      },
      onError: (e) => setFormError(applyServerErrors(e, setError, FIELDS)),
    });
  });

  return (
    <Card accent="ember" aria-label="Compose a course" style={{ gap: space.md }}>
      <AppText variant="heading">Compose a course</AppText>
      <FormError message={formError} />
      {saved ? (
        <Notice tone="info">
          <AppText>{saved}</AppText>
        </Notice>
      ) : null}
      <FormTextField control={control} name="name" label="Name" placeholder="e.g. Spring refresher" />
      <Controller
        control={control}
        name="kinds"
        render={({ field, fieldState }) => (
          <>
            <ChipRow label="Kinds of question (asked in turn)">
              {AVAILABLE_DRILL_KINDS.map((k) => {
                const on = field.value.includes(k);
                return (
                  <Chip key={k} label={DRILL_KIND_LABELS[k]} on={on} onPress={() => field.onChange(toggled(field.value, k))} />
                );
              })}
            </ChipRow>
            <FieldError message={fieldState.error?.message} />
          </>
        )}
      />
      <Controller
        control={control}
        name="postIds"
        render={({ field, fieldState }) => (
          <>
            <PostPicker multiple value={field.value} onChange={field.onChange} />
            <FieldError message={fieldState.error?.message} />
          </>
        )}
      />
      <FieldRow>
        <FormTextField control={control} name="questionCount" label="Questions" inputMode="numeric" />
        <FormTextField control={control} name="passMarkPct" label="Pass mark" unit="%" inputMode="decimal" />
        <FormTextField control={control} name="validityDays" label="Valid for" unit="days" inputMode="numeric" />
      </FieldRow>
      <Controller
        control={control}
        name="assigneeIds"
        render={({ field, fieldState }) => (
          <>
            <ChipRow label="Assign to">
              {(people.data ?? []).map((p) => {
                const on = field.value.includes(p.id);
                return <Chip key={p.id} label={p.name} on={on} onPress={() => field.onChange(toggled(field.value, p.id))} />;
              })}
            </ChipRow>
            <FieldError message={fieldState.error?.message} />
          </>
        )}
      />
      <Button label="Set the course" busy={create.isPending} onPress={() => void save()} style={{ alignSelf: 'flex-start' }} />
    </Card>
  );
}

/** Results of one course per person (attempts with their trend, mean score per kind) and more people to assign. */
export function CourseResultsCard({ course }: { course: Course }) {
  const results = useCourseResults(course.id);
  const people = usePeople(true);
  const assign = useAssignCourse();
  const [more, setMore] = useState<string[]>([]);
  if (results.isPending) return <LoadingState label="Loading the results…" />;
  if (results.isError) return <ErrorState error={results.error} onRetry={() => void results.refetch()} />;
  const assigned = new Set(course.assignees.map((a) => a.id));
  return (
    <View style={{ gap: space.md, paddingLeft: space.md, borderLeftWidth: 2, borderLeftColor: colors.line }}>
      <AppText variant="small" tone="muted">
        {course.questionCount} questions · pass mark {course.passMarkPct} % · valid {course.validityDays} days
      </AppText>
      {results.data.people.length === 0 ? <AppText tone="muted">Nobody is assigned yet.</AppText> : null}
      {results.data.people.map((p) => (
        <View key={p.user.id} style={{ gap: 2 }} aria-label={`Results of ${p.user.name}`}>
          <AppText variant="label">
            {p.user.name} · {p.qualified ? `qualified until ${p.qualifiedUntil?.slice(0, 10)}` : 'not qualified'}
          </AppText>
          <AppText variant="small" tone="muted">
            {p.attempts.length === 0
              ? 'No attempt yet.'
              : `Attempts (oldest first): ${[...p.attempts]
                  .sort((a, b) => a.startedAt.localeCompare(b.startedAt))
                  .map((a) => (a.scorePct === null ? 'open' : `${Math.round(a.scorePct)} %${a.passed ? ' ✓' : ''}`))
                  .join(' → ')}`}
            {p.trendPct !== null ? ` · trend ${p.trendPct >= 0 ? '+' : ''}${Math.round(p.trendPct)} points` : ''}
          </AppText>
          {p.byKind.map((k) => (
            <AppText key={k.kind} variant="small">
              {DRILL_KIND_LABELS[k.kind]}: {Math.round(k.meanScore * 100)} % over {k.answered}
            </AppText>
          ))}
        </View>
      ))}
      <ChipRow label="Assign more people">
        {(people.data ?? [])
          .filter((p) => !assigned.has(p.id))
          .map((p) => {
            const on = more.includes(p.id);
            return <Chip key={p.id} label={p.name} on={on} onPress={() => setMore(toggled(more, p.id))} />;
          })}
      </ChipRow>
      {assign.isError ? <FormError message={assign.error.message} /> : null}
      {more.length > 0 ? (
        <Button
          kind="secondary"
          label="Assign"
          busy={assign.isPending}
          style={{ alignSelf: 'flex-start' }}
          onPress={() => assign.mutate({ id: course.id, userIds: more }, { onSuccess: () => setMore([]) })}
        />
      ) : null}
    </View>
  );
}
