import { ScrollView, View } from 'react-native';
import type { ConditionSet, Target } from '@/shared/schemas/library';
import { useConditionSets, useTargets } from '@/components/data/library';
import { AppText } from '@/components/ui/app-text';
import { Chip } from '@/components/ui/chip';
import { space } from '@/components/ui/theme';

/**
 * The organisation's targets and condition sets as one-tap chips: a tap
 * fills the form from the library entry. Renders nothing while the library
 * loads or when it is empty (the form works without it).
 */
export function LibraryPicks({
  targetId,
  conditionSetId,
  onTarget,
  onConditionSet,
}: {
  targetId: string | null;
  conditionSetId: string | null;
  onTarget: (target: Target) => void;
  onConditionSet: (set: ConditionSet) => void;
}) {
  const targets = useTargets();
  const sets = useConditionSets();
  const targetItems = targets.data ?? [];
  const setItems = sets.data ?? [];
  if (targetItems.length === 0 && setItems.length === 0) return null;
  return (
    <View style={{ gap: space.sm }} aria-label="From your library">
      <AppText variant="label">From your library</AppText>
      {targetItems.length > 0 ? (
        <Row label="Library targets" title="Targets">
          {targetItems.map((t) => (
            <Chip key={t.id} label={t.name} on={t.id === targetId} onPress={() => onTarget(t)} />
          ))}
        </Row>
      ) : null}
      {setItems.length > 0 ? (
        <Row label="Library condition sets" title="Conditions">
          {setItems.map((s) => (
            <Chip key={s.id} label={s.name} on={s.id === conditionSetId} onPress={() => onConditionSet(s)} />
          ))}
        </Row>
      ) : null}
    </View>
  );
}

/** One line of chips that scrolls sideways on a phone. */
function Row({ label, title, children }: { label: string; title: string; children: React.ReactNode }) {
  return (
    <View style={{ gap: 2 }}>
      <AppText variant="small" tone="muted">
        {title}
      </AppText>
      <ScrollView horizontal showsHorizontalScrollIndicator={false} style={{ flexGrow: 0 }}>
        <View role="group" aria-label={label} style={{ flexDirection: 'row', gap: space.xs }}>
          {children}
        </View>
      </ScrollView>
    </View>
  );
}
