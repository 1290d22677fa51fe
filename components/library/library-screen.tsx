import { useState } from 'react';
import { View } from 'react-native';
import { TARGET_KIND_LABELS, TARGET_KINDS, TargetInputSchema } from '@/shared/schemas/library';
import { Segmented } from '@/components/check/unit-switch';
import { useConditionSets, useCreateTarget, useTargets } from '@/components/data/library';
import { useSession } from '@/components/data/session';
import { describeCondition } from './describe-condition';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, FormError, LoadingState } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';

/** The organisation's targets and condition sets, used by every coverage plan. */
export function LibraryScreen() {
  const targets = useTargets();
  const sets = useConditionSets();
  const { data: user } = useSession();
  const { wide } = useLayout();
  return (
    <Screen
      title="Library"
      subtitle="Targets your lookouts must detect, and the refraction and visibility conditions plans are judged under."
    >
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
            targets.data.map((t) => (
              <Card key={t.id} aria-label={t.name} style={{ gap: 2 }}>
                <AppText variant="label">{t.name}</AppText>
                <AppText variant="small" tone="muted">
                  {TARGET_KIND_LABELS[t.kind]} · {t.heightM} m tall, {t.widthM} m wide · top {t.requiredVisibleM} m must show ·{' '}
                  {t.period}
                </AppText>
              </Card>
            ))
          )}
          {user?.role === 'planner' ? <TargetForm /> : null}
        </View>
        <View style={{ flex: wide ? 1 : undefined, width: wide ? undefined : '100%', gap: space.sm }}>
          <AppText variant="heading">Condition sets</AppText>
          {sets.isPending ? (
            <LoadingState />
          ) : sets.isError ? (
            <ErrorState error={sets.error} onRetry={() => void sets.refetch()} />
          ) : (
            sets.data.map((s) => (
              <Card key={s.id} aria-label={s.name} style={{ gap: 2 }}>
                <AppText variant="label">{s.name}</AppText>
                {s.conditions.map((c, i) => (
                  <AppText key={i} variant="small">
                    • {describeCondition(c)}
                  </AppText>
                ))}
                <AppText variant="small" tone="muted">
                  Visibility{' '}
                  {s.visibilityM === null
                    ? 'not stated'
                    : `${(s.visibilityM / 1000).toLocaleString('en')} km (${s.visibilityKind === 'mor-5pct' ? 'MOR' : 'met. range'})`}
                </AppText>
              </Card>
            ))
          )}
        </View>
      </View>
    </Screen>
  );
}

function TargetForm() {
  const create = useCreateTarget();
  const [v, setV] = useState({
    name: '',
    kind: 'smoke-column' as (typeof TARGET_KINDS)[number],
    height: '',
    width: '',
    required: '0',
  });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [failed, setFailed] = useState('');
  const set = (k: keyof typeof v) => (t: string) => setV((f) => ({ ...f, [k]: t }));
  const submit = () => {
    const n = (t: string) => (t.trim() === '' ? undefined : Number(t));
    const r = TargetInputSchema.safeParse({
      name: v.name,
      kind: v.kind,
      heightM: n(v.height),
      widthM: n(v.width),
      requiredVisibleM: n(v.required),
    });
    if (!r.success) {
      setErrors(Object.fromEntries(r.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setErrors({});
    create.mutate(r.data, {
      onSuccess: () => setV({ ...v, name: '', height: '', width: '', required: '0' }),
      onError: (e) => setFailed(e.message),
    });
  };
  return (
    <Card accent="moss" aria-label="New target">
      <AppText variant="heading">Add a target</AppText>
      <FormError message={failed} />
      <TextField label="Name" value={v.name} onChangeText={set('name')} error={errors.name} />
      <Segmented
        label="Kind"
        value={v.kind}
        onChange={(k) => setV((f) => ({ ...f, kind: k }))}
        options={TARGET_KINDS.slice(0, 4).map((k) => ({ value: k, label: TARGET_KIND_LABELS[k] }))}
      />
      <View style={{ flexDirection: 'row', gap: space.md }}>
        <View style={{ flex: 1 }}>
          <TextField
            label="Height"
            unit="m"
            inputMode="decimal"
            value={v.height}
            onChangeText={set('height')}
            error={errors.heightM}
          />
        </View>
        <View style={{ flex: 1 }}>
          <TextField
            label="Width"
            unit="m"
            inputMode="decimal"
            value={v.width}
            onChangeText={set('width')}
            error={errors.widthM}
          />
        </View>
      </View>
      <TextField
        label="Top part that must show"
        unit="m"
        inputMode="decimal"
        value={v.required}
        onChangeText={set('required')}
        error={errors.requiredVisibleM}
      />
      <Button label="Save target" onPress={submit} busy={create.isPending} />
    </Card>
  );
}
