import { useRouter } from 'expo-router';
import { useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { DrillResult } from '@/shared/schemas/drill';
import { trainerKeys, useAttempt, useCourses } from '@/components/data/trainer';
import { OutboxList } from '@/components/offline/field-status';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { Screen } from '@/components/ui/screen';
import { space } from '@/components/ui/theme';
import { DrillCard, type DrillOutcome } from './drill-card';
import { TrainerCautions } from './training-screen';

type Attempt = NonNullable<DrillResult['attempt']>;

/** One course attempt, question by question; the verdict once the last answer is scored. */
export function AttemptScreen({ courseId, attemptId }: { courseId: string; attemptId: string }) {
  const attempt = useAttempt(courseId, attemptId);
  const courses = useCourses();
  const router = useRouter();
  const qc = useQueryClient();
  const [index, setIndex] = useState<number | null>(null);
  const [kept, setKept] = useState(0);
  const [verdict, setVerdict] = useState<Attempt | null>(null);
  if (attempt.isPending) return <LoadingState label="Loading the course…" />;
  if (attempt.isError) return <ErrorState error={attempt.error} onRetry={() => void attempt.refetch()} />;
  const a = attempt.data;
  const name = courses.data?.find((c) => c.id === courseId)?.name ?? 'Course';
  const firstOpen = a.drills.findIndex((d) => d.result === null);
  const at = index ?? (firstOpen === -1 ? a.drills.length : firstOpen);
  const drill = a.drills[at];
  const finished =
    verdict ?? (a.completedAt ? { id: a.id, completedAt: a.completedAt, scorePct: a.scorePct, passed: a.passed } : null);

  const onAnswered = (o: DrillOutcome) => {
    if (o.kind === 'kept') setKept((n) => n + 1);
    else if (o.result.attempt?.completedAt) setVerdict(o.result.attempt);
  };

  return (
    <Screen title={name} subtitle={`${a.questionCount} questions · pass mark ${a.passMarkPct} %`}>
      {drill ? (
        <DrillCard
          key={drill.id}
          drill={drill}
          position={`Question ${at + 1} of ${a.drills.length}`}
          onAnswered={onAnswered}
          refreshKeys={[trainerKeys.attempt(courseId, attemptId)]}
          onNext={() => setIndex(at + 1)}
          nextLabel={at + 1 < a.drills.length ? 'Next question' : 'Finish'}
        />
      ) : (
        <Card aria-label="Result" style={{ gap: space.md }}>
          <AppText variant="heading">All questions answered</AppText>
          {finished && finished.scorePct !== null ? (
            <Notice tone={finished.passed ? 'info' : 'danger'} title={finished.passed ? 'Passed' : 'Not passed'}>
              <AppText>
                Score {Math.round(finished.scorePct)} % against a pass mark of {a.passMarkPct} %.
              </AppText>
            </Notice>
          ) : (
            <Notice title="Not scored yet">
              <AppText>
                {kept > 0
                  ? `${kept} ${kept === 1 ? 'answer is' : 'answers are'} kept on this device; the course is scored when they are sent.`
                  : 'The course is scored once every answer has reached the server.'}
              </AppText>
            </Notice>
          )}
          <Button
            label="Back to training"
            style={{ alignSelf: 'flex-start' }}
            onPress={() => {
              void qc.invalidateQueries({ queryKey: trainerKeys.all });
              router.push('/training');
            }}
          />
        </Card>
      )}
      <OutboxList title="Answers kept on this device" />
      <TrainerCautions />
    </Screen>
  );
}
