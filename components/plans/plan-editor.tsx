import { useQuery } from '@tanstack/react-query';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { Controller, useForm, type Path } from 'react-hook-form';
import { View } from 'react-native';
import { TARGET_KIND_LABELS } from '@/shared/schemas/library';
import { PlanInputSchema, type Plan } from '@/shared/schemas/plan';
import { POST_KIND_LABELS } from '@/shared/schemas/site';
import { Segmented } from '@/components/check/unit-switch';
import { ApiRequestError } from '@/components/data/api-client';
import { useConditionSets, useTargets } from '@/components/data/library';
import { useCreatePlan, useUpdatePlan } from '@/components/data/plans';
import { sitePostsQuery, useSites } from '@/components/data/sites';
import { describeCondition } from '@/components/library/describe-condition';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { CheckGroup, CheckRow } from '@/components/ui/check-row';
import { FormTextField } from '@/components/ui/form-text-field';
import { ErrorState, FormError, LoadingState } from '@/components/ui/states';
import { space } from '@/components/ui/theme';

interface Values {
  siteId: string;
  title: string;
  postIds: string[];
  targetIds: string[];
  conditionSetIds: string[];
  minSeenPct: string;
  priorityMinPosts: '1' | '2' | '3';
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
};
const fieldOf = (path: string) => FIELD_OF[path] ?? FIELD_OF[path.replace(/\.\d+$/, '')];

const toggled = (list: string[], id: string) => (list.includes(id) ? list.filter((x) => x !== id) : [...list, id]);

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
    },
  });
  const siteId = watch('siteId');
  const sites = useSites(1);
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
        minSeenPct: v.minSeenPct.trim() === '' ? NaN : Number(v.minSeenPct.replace(',', '.')),
        priorityMinPosts: Number(v.priorityMinPosts),
      },
    };
    const parsed = PlanInputSchema.safeParse(candidate);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const field = fieldOf(issue.path.join('.'));
        if (field) setError(field, { type: 'schema', message: issue.message });
      }
      return;
    }
    const onError = (e: unknown) => {
      if (e instanceof ApiRequestError) {
        let placed = 0;
        for (const [path, message] of Object.entries(e.fields)) {
          const field = fieldOf(path);
          if (field) {
            setError(field, { type: 'server', message });
            placed++;
          }
        }
        if (placed === 0 || placed < Object.keys(e.fields).length) setFormError(e.message);
      } else setFormError(e instanceof Error ? e.message : 'Something went wrong.');
    };
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
                    detail={`${POST_KIND_LABELS[p.kind]} · ${p.status} · eye ${(p.groundElevationM + p.structureHeightM + p.eyeHeightM).toFixed(1)} m above datum`}
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
                  detail={`${TARGET_KIND_LABELS[t.kind]} · ${t.heightM} m high, ${t.widthM} m wide · ${t.period}`}
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
                  detail={`${s.conditions.map(describeCondition).join(' · ')}${s.visibilityM ? ` · visibility ${(s.visibilityM / 1000).toFixed(1)} km` : ''}`}
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
              {fieldState.error ? (
                <AppText variant="small" tone="danger" role="alert">
                  {fieldState.error.message}
                </AppText>
              ) : null}
            </View>
          )}
        />
      </View>

      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button label={plan ? 'Save changes' : 'Create draft'} onPress={submit} busy={create.isPending || update.isPending} />
        <Button kind="quiet" label="Cancel" onPress={() => (router.canGoBack() ? router.back() : router.replace('/plans'))} />
      </View>
    </Card>
  );
}
