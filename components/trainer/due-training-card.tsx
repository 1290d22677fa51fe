import { useRouter } from 'expo-router';
import { useSession } from '@/components/data/session';
import { useQualifications } from '@/components/data/trainer';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { space } from '@/components/ui/theme';

/** The briefing's reminder of training courses due (nothing when none is due or it cannot be read). */
export function DueTrainingCard() {
  const { data: user } = useSession();
  const quals = useQualifications(user?.id, !!user);
  const router = useRouter();
  const due = (quals.data ?? []).filter((q) => q.due);
  if (due.length === 0) return null;
  return (
    <Card accent="ember" style={{ gap: space.xs }} aria-label="Training due">
      <AppText variant="heading">Training due</AppText>
      {due.map((q) => (
        <AppText key={q.course.id}>
          {q.course.name}
          {q.qualifiedUntil ? ` · ran out on ${q.qualifiedUntil.slice(0, 10)}` : ' · not passed yet'}
        </AppText>
      ))}
      <Button
        kind="secondary"
        label="Open training"
        onPress={() => router.push('/training')}
        style={{ alignSelf: 'flex-start' }}
      />
    </Card>
  );
}
