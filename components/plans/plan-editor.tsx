// Over 300 lines: one plan form (posts, targets, conditions, standard) whose sections share the draft state.
import { useQuery } from '@tanstack/react-query';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { Controller, useForm, type Path } from 'react-hook-form';
import { View } from 'react-native';
import { TARGET_KIND_LABELS } from '@/shared/schemas/library';
import { PlanInputSchema, type Plan } from '@/shared/schemas/plan';
import { POST_KIND_LABELS } from '@/shared/schemas/site';
import { Segmented } from '@/components/check/unit-switch';
import { useConditionSets, useTargets } from '@/components/data/library';
import { useCreatePlan, useUpdatePlan } from '@/components/data/plans';
import { applyServerErrors } from '@/components/data/server-errors';
import { useLengthUnits } from '@/components/data/session';
import { distanceIn, lengthIn } from '@/components/check/format';
import { siteQuery, sitePostsQuery, useSites } from '@/components/data/sites';
import { describeCondition } from '@/components/library/describe-condition';
import { toggled } from '@/components/ui/chip';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { CheckGroup, CheckRow } from '@/components/ui/check-row';
import { FormTextField } from '@/components/ui/form-text-field';
import { ErrorState, FormError, LoadingState } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';
import { FieldRow } from '@/components/ui/field-row';
import { FieldError } from '@/components/ui/field-error';
import { BandRulesField, bandRuleFieldOf, bandRulesOf, bandRuleValues, type BandRuleValues } from './band-rules-field';

interface Values {
  siteId: string;
  title: string;
  postIds: string[];
  targetIds: string[];
  conditionSetIds: string[];
  minSeenPct: string;
  priorityMinPosts: '1' | '2' | '3';
  /** Empty = no cross-bearing rule. */
  crossBearingMinPct: string;
  /** One optional rule per target, keyed by target id. */
  targetRules: Record<string, RuleValues>;
  /** Rules for a coast site's offshore bands. */
  bandRules: BandRuleValues[];
  resolutionArcmin: string;
  magnification: string;
}

interface RuleValues {
  area: 'site' | 'priority-zones';
  minPosts: '1' | '2' | '3';
  minPct: string;
}

/** Where an API or schema field path shows its error on this form. */
const FIELD_OF: Record<string, Path<Values>> = {
  siteId: 'siteId',
  title: 'title',
  postIds: 'postIds',
  targetIds: 'targetIds',
  conditionSetIds: 'conditionSetIds',
  'standard.minSeenPct': 'minSeenPct',
  'standard.priorityMinPosts': 'priorityMinPosts',
  'standard.crossBearingMinPct': 'crossBearingMinPct',
  'standard.targetRules': 'targetRules',
  'lookout.resolutionArcmin': 'resolutionArcmin',
  'lookout.magnification': 'magnification',
};
const fieldOf = (path: string): Path<Values> | undefined =>
  (bandRuleFieldOf(path) as Path<Values> | undefined) ??
  FIELD_OF[path] ??
  FIELD_OF[path.replace(/\.\d+$/, '')] ??
  (path.startsWith('standard.targetRules') ? 'targetRules' : undefined);

const numberOf = (text: string) => (text.trim() === '' ? NaN : Number(text.replace(',', '.')));

/**
 * Creates a plan (pick the site, posts, targets, conditions and the standard)
 * or edits a draft or returned one. Field errors show under each part.
 */
export function PlanEditor({ plan, siteId: presetSite }: { plan?: Plan; siteId?: string }) {
  const router = useRouter();
  const create = useCreatePlan();
  const update = useUpdatePlan(plan?.id ?? '');
  const [formError, setFormError] = useState('');
  const { control, handleSubmit, setError, clearErrors, watch, setValue } = useForm<Values>({
    defaultValues: {
      siteId: plan?.siteId ?? presetSite ?? '',
      title: plan?.title ?? '',
      postIds: plan?.postIds ?? [],
      targetIds: plan?.targetIds ?? [],
      conditionSetIds: plan?.conditionSetIds ?? [],
      minSeenPct: String(plan?.standard.minSeenPct ?? 70),
      priorityMinPosts: String(plan?.standard.priorityMinPosts ?? 2) as Values['priorityMinPosts'],
      crossBearingMinPct: plan?.standard.crossBearingMinPct == null ? '' : String(plan.standard.crossBearingMinPct),
      targetRules: Object.fromEntries(
        (plan?.standard.targetRules ?? []).map((r) => [
          r.targetId,
          { area: r.area, minPosts: String(r.minPosts) as RuleValues['minPosts'], minPct: String(r.minPct) },
        ]),
      ),
      bandRules: (plan?.standard.bandRules ?? []).map(bandRuleValues),
      resolutionArcmin: String(plan?.lookout.resolutionArcmin ?? 1),
      magnification: String(plan?.lookout.magnification ?? 1),
    },
  });
  const siteId = watch('siteId');
  const targetIds = watch('targetIds');
  const sites = useSites(1);
  const chosenSite = useQuery({ ...siteQuery(siteId), enabled: siteId !== '' });
  const { height, distance } = useLengthUnits(chosenSite.data?.defaultUnits);
  const posts = useQuery({ ...sitePostsQuery(siteId), enabled: siteId !== '' });
  const targets = useTargets();
  const sets = useConditionSets();

  const submit = handleSubmit((v) => {
    setFormError('');
    clearErrors();
    const candidate = {
      siteId: v.siteId,
      title: v.title,
      postIds: v.postIds,
      targetIds: v.targetIds,
      conditionSetIds: v.conditionSetIds,
      standard: {
        minSeenPct: numberOf(v.minSeenPct),
        priorityMinPosts: Number(v.priorityMinPosts),
        crossBearingMinPct: v.crossBearingMinPct.trim() === '' ? null : numberOf(v.crossBearingMinPct),
        // Rules of targets no longer in the plan are dropped with them.
        targetRules: Object.entries(v.targetRules)
          .filter(([targetId]) => v.targetIds.includes(targetId))
          .map(([targetId, r]) => ({ targetId, area: r.area, minPosts: Number(r.minPosts), minPct: numberOf(r.minPct) })),
        // A plan that never had band rules (a forest) is sent without any, as before.
        ...((v.bandRules.length > 0 || plan?.standard.bandRules) && { bandRules: bandRulesOf(v.bandRules) }),
      },
      lookout: { resolutionArcmin: numberOf(v.resolutionArcmin), magnification: numberOf(v.magnification) },
    };
    const parsed = PlanInputSchema.safeParse(candidate);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const field = fieldOf(issue.path.join('.'));
        if (field) setError(field, { type: 'schema', message: issue.message });
      }
      return;
    }
    const onError = (e: unknown) => setFormError(applyServerErrors(e, setError, fieldOf));
    const open = (id: string) => router.replace({ pathname: '/plans/[planId]', params: { planId: id } });
    if (plan) {
      const { siteId: _site, ...changes } = parsed.data;
      update.mutate({ ...changes, rowVersion: plan.rowVersion }, { onSuccess: (r) => open(r.plan.id), onError });
    } else create.mutate(parsed.data, { onSuccess: (r) => open(r.plan.id), onError });
  });

  const siteList = sites.data?.items ?? [];
  return (
    <Card accent="ember" style={{ gap: space.lg }}>
      <AppText variant="heading">{plan ? `Edit “${plan.title}”` : 'New coverage plan'}</AppText>
      <FormError message={formError} />
      {plan ? null : (
        <Controller
          control={control}
          name="siteId"
          render={({ field, fieldState }) =>
            sites.isPending ? (
              <LoadingState label="Loading sites…" />
            ) : sites.isError ? (
              <ErrorState error={sites.error} onRetry={() => void sites.refetch()} />
            ) : (
              <CheckGroup label="Site" single error={fieldState.error?.message}>
                {siteList.length === 0 ? (
                  <AppText tone="muted" style={{ padding: space.md }}>
                    No sites yet: a plan is made for a site with posts. Create the site first (Sites, then New site).
                  </AppText>
                ) : null}
                {siteList.map((s) => (
                  <CheckRow
                    key={s.id}
                    label={s.name}
                    detail={`${s.postCount} post${s.postCount === 1 ? '' : 's'}`}
                    single
                    checked={field.value === s.id}
                    onToggle={() => {
                      field.onChange(s.id);
                      setValue('postIds', []);
                    }}
                  />
                ))}
              </CheckGroup>
            )
          }
        />
      )}
      <FormTextField control={control} name="title" label="Title" placeholder="e.g. Fire season cover, north block" />

      <Controller
        control={control}
        name="postIds"
        render={({ field, fieldState }) =>
          !siteId ? (
            <AppText tone="muted">Choose a site to pick its posts.</AppText>
          ) : posts.isPending ? (
            <LoadingState label="Loading posts…" />
          ) : posts.isError ? (
            <ErrorState error={posts.error} onRetry={() => void posts.refetch()} />
          ) : (
            <CheckGroup label="Posts" error={fieldState.error?.message}>
              {posts.data.length === 0 ? (
                <AppText tone="muted" style={{ padding: space.md }}>
                  This site has no posts yet; add them on the site page.
                </AppText>
              ) : (
                posts.data.map((p) => (
                  <CheckRow
                    key={p.id}
                    label={p.name}
                    detail={`${POST_KIND_LABELS[p.kind]} · ${p.status} · eye ${lengthIn(p.groundElevationM + p.structureHeightM + p.eyeHeightM, height, (m) => `${m.toFixed(1)} m`)} above sea level`}
                    checked={field.value.includes(p.id)}
                    onToggle={() => field.onChange(toggled(field.value, p.id))}
                  />
                ))
              )}
            </CheckGroup>
          )
        }
      />

      <Controller
        control={control}
        name="targetIds"
        render={({ field, fieldState }) =>
          targets.isPending ? (
            <LoadingState label="Loading targets…" />
          ) : targets.isError ? (
            <ErrorState error={targets.error} onRetry={() => void targets.refetch()} />
          ) : (
            <CheckGroup label="Targets" error={fieldState.error?.message}>
              {targets.data.map((t) => (
                <CheckRow
                  key={t.id}
                  label={t.name}
                  detail={`${TARGET_KIND_LABELS[t.kind]} · ${lengthIn(t.heightM, height)} high, ${lengthIn(t.widthM, height)} wide · ${t.period}`}
                  checked={field.value.includes(t.id)}
                  onToggle={() => field.onChange(toggled(field.value, t.id))}
                />
              ))}
            </CheckGroup>
          )
        }
      />

      <Controller
        control={control}
        name="conditionSetIds"
        render={({ field, fieldState }) =>
          sets.isPending ? (
            <LoadingState label="Loading conditions…" />
          ) : sets.isError ? (
            <ErrorState error={sets.error} onRetry={() => void sets.refetch()} />
          ) : (
            <CheckGroup label="Condition sets" error={fieldState.error?.message}>
              {sets.data.map((s) => (
                <CheckRow
                  key={s.id}
                  label={s.name}
                  detail={`${s.conditions.map(describeCondition).join(' · ')}${s.visibilityM ? ` · visibility ${distanceIn(s.visibilityM, distance, (m) => `${(m / 1000).toFixed(1)} km`)}` : ''}`}
                  checked={field.value.includes(s.id)}
                  onToggle={() => field.onChange(toggled(field.value, s.id))}
                />
              ))}
            </CheckGroup>
          )
        }
      />

      <View style={{ gap: space.sm }}>
        <AppText variant="heading">Standard to meet</AppText>
        <FormTextField
          control={control}
          name="minSeenPct"
          label="Share of the site seen by at least one post"
          unit="%"
          inputMode="decimal"
        />
        <Controller
          control={control}
          name="priorityMinPosts"
          render={({ field, fieldState }) => (
            <View style={{ gap: space.xs }}>
              <Segmented
                label="Posts that must see each priority zone"
                value={field.value}
                options={[
                  { value: '1', label: '1' },
                  { value: '2', label: '2 (cross-bearings)' },
                  { value: '3', label: '3' },
                ]}
                onChange={field.onChange}
              />
              <FieldError message={fieldState.error?.message} />
            </View>
          )}
        />
        <FormTextField
          control={control}
          name="crossBearingMinPct"
          label="Share of each priority zone with good cross-bearings"
          unit="%"
          inputMode="decimal"
          hint="Empty for no such rule. Good: two bearings crossing steeply enough to fix a smoke."
        />
        <Controller
          control={control}
          name="targetRules"
          render={({ field, fieldState }) => (
            <TargetRulesField
              rules={field.value}
              onChange={field.onChange}
              targets={(targets.data ?? []).filter((t) => targetIds.includes(t.id))}
              error={fieldState.error?.message}
            />
          )}
        />
        <BandRulesField control={control} name="bandRules" bands={(chosenSite.data?.bands ?? []).map((b) => b.name)} />
      </View>

      <View style={{ gap: space.sm }}>
        <AppText variant="heading">The lookout</AppText>
        <AppText variant="small" tone="muted">
          A target is detected only while it looks big enough: its width must subtend at least this angle. 1′ is the normal eye;
          binoculars divide it by their magnification (an ideal instrument — real gain is less, and the narrow field slows the
          search).
        </AppText>
        <FieldRow minWidth={140} gap={space.md}>
          <FormTextField control={control} name="resolutionArcmin" label="Eye’s resolving angle" unit="′" inputMode="decimal" />
          <FormTextField control={control} name="magnification" label="Optics magnification" unit="×" inputMode="decimal" />
        </FieldRow>
      </View>

      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button label={plan ? 'Save changes' : 'Create draft'} onPress={submit} busy={create.isPending || update.isPending} />
        <Button kind="quiet" label="Cancel" onPress={() => (router.canGoBack() ? router.back() : router.replace('/plans'))} />
      </View>
    </Card>
  );
}

/**
 * One optional rule per chosen target: "this target: x % of the site (or of
 * each priority zone) seen by at least n posts".
 */
function TargetRulesField({
  rules,
  onChange,
  targets,
  error,
}: {
  rules: Record<string, RuleValues>;
  onChange: (next: Record<string, RuleValues>) => void;
  targets: { id: string; name: string }[];
  error?: string;
}) {
  if (targets.length === 0) return null;
  const put = (id: string, rule: RuleValues | null) => {
    const next = { ...rules };
    if (rule) next[id] = rule;
    else delete next[id];
    onChange(next);
  };
  return (
    <View style={{ gap: space.sm }} aria-label="Rules per target">
      <AppText variant="label">Rules per target</AppText>
      {targets.map((t) => {
        const rule = rules[t.id];
        return (
          <View key={t.id} style={{ gap: space.xs }}>
            <CheckRow
              label={t.name}
              detail={rule ? 'Has its own rule' : 'Only the rules above'}
              checked={rule !== undefined}
              onToggle={() => put(t.id, rule ? null : { area: 'site', minPosts: '1', minPct: '50' })}
            />
            {rule ? (
              <View style={{ gap: space.xs, paddingLeft: space.lg }}>
                <TextField
                  label={`Share ${t.name} must be detected over`}
                  unit="%"
                  inputMode="decimal"
                  value={rule.minPct}
                  onChangeText={(minPct) => put(t.id, { ...rule, minPct })}
                />
                <Segmented
                  label="Of"
                  value={rule.area}
                  options={[
                    { value: 'site', label: 'The site' },
                    { value: 'priority-zones', label: 'Each priority zone' },
                  ]}
                  onChange={(area) => put(t.id, { ...rule, area })}
                />
                <Segmented
                  label="By at least"
                  value={rule.minPosts}
                  options={[
                    { value: '1', label: '1 post' },
                    { value: '2', label: '2 posts' },
                    { value: '3', label: '3 posts' },
                  ]}
                  onChange={(minPosts) => put(t.id, { ...rule, minPosts })}
                />
              </View>
            ) : null}
          </View>
        );
      })}
      <FieldError message={error} />
    </View>
  );
}
