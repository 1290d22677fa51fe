import { useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { AVAILABLE_DRILL_KINDS, type Drill, type DrillKind } from '@/shared/schemas/drill';
import type { Course } from '@/shared/schemas/course';
import { useSession, useUnitSystem } from '@/components/data/session';
import { useCourses, useCreateDrill, useQualifications, useStartAttempt } from '@/components/data/trainer';
import { OutboxList } from '@/components/offline/field-status';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Chip, ChipRow } from '@/components/ui/chip';
import { EmptyState, ErrorState, FormError, LoadingState, Notice } from '@/components/ui/states';
import { Screen } from '@/components/ui/screen';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { CourseComposer, CourseResultsCard } from './course-planner';
import { DrillCard } from './drill-card';
import { PostPicker } from './post-picker';
import { DRILL_KIND_LABELS, TRAINER_CAUTIONS } from './trainer-format';

/** The cautions of the trainer, always in view. */
export function TrainerCautions() {
  return (
    <Notice title="Before you rely on these numbers">
      {TRAINER_CAUTIONS.map((c) => (
        <AppText key={c} variant="small">
          {c}
        </AppText>
      ))}
    </Notice>
  );
}

/**
 * Training: what is due (assigned courses, qualification and its expiry),
 * the device's outbox, practice drills; planners also compose and assign
 * courses and read results.
 */
export function TrainingScreen() {
  const { wide } = useLayout();
  const { data: user } = useSession();
  const router = useRouter();
  const planner = user?.role === 'planner';
  return (
    <Screen
      title="Training"
      subtitle="Drills on your own posts, scored with the working shown."
      actions={<Button kind="secondary" label="k of the day" onPress={() => router.push('/training/calibration')} />}
    >
      <TrainerCautions />
      <View style={{ flexDirection: wide ? 'row' : 'column', gap: space.xl, alignItems: 'flex-start' }}>
        <View style={{ flex: 1, gap: space.xl, width: '100%' }}>
          {user ? <DueCourses userId={user.id} quietWhenNone={planner} /> : null}
          <OutboxList title="Answers kept on this device" />
          <Practice />
        </View>
        {planner ? (
          <View style={{ flex: 1, gap: space.xl, width: '100%' }}>
            <CourseComposer />
            <PlannerCourses />
          </View>
        ) : null}
      </View>
    </Screen>
  );
}

function DueCourses({ userId, quietWhenNone }: { userId: string; quietWhenNone: boolean }) {
  const courses = useCourses();
  const quals = useQualifications(userId);
  const start = useStartAttempt();
  const router = useRouter();
  const [error, setError] = useState('');
  if (courses.isPending || quals.isPending) return <LoadingState label="Loading your courses…" />;
  if (courses.isError) return <ErrorState error={courses.error} onRetry={() => void courses.refetch()} />;
  if (quals.isError) return <ErrorState error={quals.error} onRetry={() => void quals.refetch()} />;
  const mine = courses.data.filter((c) => c.assignees.some((a) => a.id === userId));
  if (mine.length === 0) {
    if (quietWhenNone) return null;
    return (
      <EmptyState
        title="No course assigned to you"
        body="When a planner assigns you a course it shows here. Practise below meanwhile."
      />
    );
  }
  return (
    <Card aria-label="Your courses" style={{ gap: space.md }}>
      <AppText variant="heading">Your courses</AppText>
      <FormError message={error} />
      {mine.map((c) => {
        const q = quals.data.find((x) => x.course.id === c.id);
        return (
          <View key={c.id} style={{ gap: space.xs }} aria-label={`Course ${c.name}`}>
            <AppText variant="label">{c.name}</AppText>
            <AppText variant="small" tone="muted">
              {c.questionCount} questions · pass mark {c.passMarkPct} % · valid {c.validityDays} days ·{' '}
              {c.kinds.map((k) => DRILL_KIND_LABELS[k]).join(', ')}
            </AppText>
            <AppText variant="small" tone={q?.qualified ? 'moss' : 'ember'}>
              {q?.qualified
                ? `Qualified until ${q.qualifiedUntil?.slice(0, 10) ?? '—'}`
                : q?.qualifiedUntil
                  ? `Due: the qualification ran out on ${q.qualifiedUntil.slice(0, 10)}`
                  : 'Due: not passed yet'}
            </AppText>
            <Button
              label={q?.qualified ? 'Take it again' : 'Start the course'}
              kind={q?.qualified ? 'secondary' : 'primary'}
              busy={start.isPending && start.variables === c.id}
              disabled={start.isPending}
              style={{ alignSelf: 'flex-start' }}
              onPress={() => {
                setError('');
                start.mutate(c.id, {
                  onSuccess: (a) => router.push({ pathname: '/training/attempt', params: { courseId: c.id, attemptId: a.id } }),
                  onError: (e) => setError(e.message),
                });
              }}
            />
          </View>
        );
      })}
    </Card>
  );
}

function Practice() {
  const create = useCreateDrill();
  const units = useUnitSystem();
  const [kind, setKind] = useState<DrillKind>('horizon-distance');
  const [postIds, setPostIds] = useState<string[]>([]);
  const [drill, setDrill] = useState<Drill | null>(null);
  const [error, setError] = useState('');
  const newDrill = () => {
    setError('');
    setDrill(null);
    create.mutate({ kind, postId: postIds[0], units }, { onSuccess: (d) => setDrill(d), onError: (e) => setError(e.message) });
  };
  return (
    <Card aria-label="Practice" style={{ gap: space.md }}>
      <AppText variant="heading">Practice</AppText>
      <AppText variant="small" tone="muted">
        A question outside any course: it counts for nothing but your own practice.
      </AppText>
      <ChipRow label="Kind of question">
        {AVAILABLE_DRILL_KINDS.map((k) => (
          <Chip key={k} label={DRILL_KIND_LABELS[k]} on={k === kind} onPress={() => setKind(k)} />
        ))}
      </ChipRow>
      <PostPicker value={postIds} onChange={setPostIds} />
      <FormError message={error} />
      <Button label="New question" busy={create.isPending} onPress={newDrill} style={{ alignSelf: 'flex-start' }} />
      {drill ? <DrillCard key={drill.id} drill={drill} onNext={newDrill} nextLabel="Another question" /> : null}
    </Card>
  );
}

function PlannerCourses() {
  const courses = useCourses();
  const [open, setOpen] = useState<string | null>(null);
  if (courses.isPending) return <LoadingState label="Loading the courses…" />;
  if (courses.isError) return <ErrorState error={courses.error} onRetry={() => void courses.refetch()} />;
  if (courses.data.length === 0)
    return <EmptyState title="No courses yet" body="Compose one above and assign it to your crews." />;
  return (
    <Card aria-label="Courses" style={{ gap: space.md }}>
      <AppText variant="heading">Courses and results</AppText>
      {courses.data.map((c: Course) => (
        <View key={c.id} style={{ gap: space.sm }}>
          <Button
            kind="quiet"
            label={`${open === c.id ? '▾' : '▸'} ${c.name} · ${c.assignees.length} assigned`}
            onPress={() => setOpen(open === c.id ? null : c.id)}
            style={{ alignSelf: 'flex-start' }}
          />
          {open === c.id ? <CourseResultsCard course={c} /> : null}
        </View>
      ))}
    </Card>
  );
}
