import { useState } from 'react';
import { View } from 'react-native';
import { BACKGROUND_LIGHTING_LABELS, TARGET_KIND_LABELS } from '@/shared/schemas/library';
import { useConditionSets, useRemoveLibraryEntry, useTargets } from '@/components/data/library';
import { useLengthUnits, useSession } from '@/components/data/session';
import { lengthIn } from '@/components/check/format';
import { ConditionSetForm } from './condition-set-form';
import { describeCondition } from './describe-condition';
import { TargetForm } from './target-form';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, FormError, LoadingState } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';

/** The organisation's targets and condition sets, used by every coverage plan. */
export function LibraryScreen() {
  const targets = useTargets();
  const sets = useConditionSets();
  const { data: user } = useSession();
  const { wide } = useLayout();
  const { height, distance } = useLengthUnits();
  const planner = user?.role === 'planner';
  const removeTarget = useRemoveLibraryEntry('targets');
  const removeSet = useRemoveLibraryEntry('conditions');
  const removal = removeTarget.error ?? removeSet.error;
  const [editing, setEditing] = useState<string | null>(null);
  return (
    <Screen
      title="Library"
      subtitle="Targets your lookouts must detect, and the refraction and visibility conditions plans are judged under."
    >
      {removal ? <FormError message={removal.message} /> : null}
      <View style={{ flexDirection: wide ? 'row' : 'column', gap: space.xl, alignItems: 'flex-start' }}>
        <View style={{ flex: wide ? 1 : undefined, width: wide ? undefined : '100%', gap: space.sm }}>
          <AppText variant="heading">Targets</AppText>
          {targets.isPending ? (
            <LoadingState />
          ) : targets.isError ? (
            <ErrorState error={targets.error} onRetry={() => void targets.refetch()} />
          ) : targets.data.length === 0 ? (
            <EmptyState title="No targets" body="Add the objects your posts must detect." />
          ) : (
            targets.data.map((t) =>
              editing === t.id ? (
                <TargetForm key={`${t.id}-${t.version}`} target={t} onDone={() => setEditing(null)} />
              ) : (
                <Card key={t.id} aria-label={t.name} style={{ gap: 2 }}>
                  <EntryHead
                    name={t.name}
                    onEdit={planner ? () => setEditing(t.id) : undefined}
                    onRemove={planner ? () => removeTarget.mutate(t.id) : undefined}
                    busy={removeTarget.isPending && removeTarget.variables === t.id}
                  />
                  <AppText variant="small" tone="muted">
                    {TARGET_KIND_LABELS[t.kind]} · {lengthIn(t.heightM, height)} tall, {lengthIn(t.widthM, height)} wide · top{' '}
                    {lengthIn(t.requiredVisibleM, height)} must show · {t.period}
                    {t.lightIntensityCd !== null ? ` · light ${t.lightIntensityCd.toLocaleString('en')} cd` : ''}
                    {t.onWater ? ' · floats' : ''}
                  </AppText>
                </Card>
              ),
            )
          )}
          {planner ? <TargetForm /> : null}
        </View>
        <View style={{ flex: wide ? 1 : undefined, width: wide ? undefined : '100%', gap: space.sm }}>
          <AppText variant="heading">Condition sets</AppText>
          {sets.isPending ? (
            <LoadingState />
          ) : sets.isError ? (
            <ErrorState error={sets.error} onRetry={() => void sets.refetch()} />
          ) : (
            sets.data.map((s) =>
              editing === s.id ? (
                <ConditionSetForm key={`${s.id}-${s.version}`} set={s} onDone={() => setEditing(null)} />
              ) : (
                <Card key={s.id} aria-label={s.name} style={{ gap: 2 }}>
                  <EntryHead
                    name={s.name}
                    onEdit={planner ? () => setEditing(s.id) : undefined}
                    onRemove={planner ? () => removeSet.mutate(s.id) : undefined}
                    busy={removeSet.isPending && removeSet.variables === s.id}
                  />
                  {s.conditions.map((c, i) => (
                    <AppText key={i} variant="small">
                      • {describeCondition(c)}
                    </AppText>
                  ))}
                  <AppText variant="small" tone="muted">
                    Visibility{' '}
                    {s.visibilityM === null
                      ? 'not stated'
                      : `${lengthIn(s.visibilityM, distance, (m) => `${(m / 1000).toLocaleString('en')} km`)} (${s.visibilityKind === 'mor-5pct' ? 'MOR' : 'met. range'})`}
                    {s.seaState !== null ? ` · sea state ${s.seaState}` : ''}
                    {s.significantWaveHeightM !== null ? ` · waves ${lengthIn(s.significantWaveHeightM, height)}` : ''}
                    {s.backgroundLighting !== 'none'
                      ? ` · ${BACKGROUND_LIGHTING_LABELS[s.backgroundLighting].toLowerCase()} behind`
                      : ''}
                  </AppText>
                </Card>
              ),
            )
          )}
          {planner ? <ConditionSetForm /> : null}
        </View>
      </View>
    </Screen>
  );
}

/** An entry's name and, for planners, its edit and retire buttons. Retiring keeps the entry in the plans that used it. */
function EntryHead({
  name,
  onEdit,
  onRemove,
  busy,
}: {
  name: string;
  onEdit?: () => void;
  onRemove?: () => void;
  busy: boolean;
}) {
  return (
    <View style={{ flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm }}>
      <AppText variant="label" style={{ flexShrink: 1 }}>
        {name}
      </AppText>
      <View style={{ flexDirection: 'row', gap: space.xs }}>
        {onEdit ? <Button kind="quiet" label="Edit" aria-label={`Edit ${name}`} onPress={onEdit} /> : null}
        {onRemove ? <Button kind="quiet" label="Retire" aria-label={`Retire ${name}`} onPress={onRemove} busy={busy} /> : null}
      </View>
    </View>
  );
}
