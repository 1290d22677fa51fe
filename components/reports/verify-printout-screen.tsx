import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import { z } from 'zod';
import { ContentHashSchema, type RevisionByHash, type RevisionStanding } from '@/shared/schemas/printout';
import { ApiRequestError } from '@/components/data/api-client';
import { useRevisionByHash } from '@/components/data/exports';
import { when } from '@/components/plans/when';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormTextField } from '@/components/ui/form-text-field';
import { Screen } from '@/components/ui/screen';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { EXPORT_CAUTION } from './plan-exports';

const FormSchema = z.object({ hash: ContentHashSchema });
type FormInput = z.input<typeof FormSchema>;
type FormOutput = z.output<typeof FormSchema>;

/** How each standing is said on screen, and how loudly. */
const STANDING: Record<RevisionStanding, { title: string; tone: 'info' | 'caution' | 'danger' }> = {
  'approved-current': { title: 'Current approved revision', tone: 'info' },
  superseded: { title: 'Superseded: do not work from this printout', tone: 'danger' },
  'under-review': { title: 'Not approved yet', tone: 'caution' },
  returned: { title: 'Returned, never approved', tone: 'danger' },
  replaced: { title: 'Replaced by a later revision, never approved', tone: 'danger' },
};

/**
 * "Verify a printout": a person types or pastes the content hash printed on
 * a plan package or crew card, and Kenning says which plan revision it is
 * (hashed again on the server) and whether it is still the approved one.
 */
export function VerifyPrintoutScreen({ initialHash }: { initialHash?: string }) {
  const { wide } = useLayout();
  const [hash, setHash] = useState<string | null>(() => {
    const parsed = ContentHashSchema.safeParse(initialHash ?? '');
    return parsed.success ? parsed.data : null;
  });
  const { control, handleSubmit } = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(FormSchema),
    defaultValues: { hash: initialHash ?? '' },
  });
  const answer = useRevisionByHash(hash);
  const onVerify = handleSubmit(({ hash: typed }) => setHash(typed));

  const form = (
    <Card style={{ gap: space.md }}>
      <AppText>
        Every page of a plan package and every crew card carries the content hash of the plan revision it was printed from. Type
        or paste it here to see which revision it is and whether it is still the approved one.
      </AppText>
      <FormTextField
        control={control}
        name="hash"
        label="Content hash"
        hint="64 characters (0–9, a–f). Spaces and line breaks are ignored."
        autoCapitalize="none"
        autoCorrect={false}
        spellCheck={false}
        onSubmitEditing={() => void onVerify()}
        style={{ fontFamily: 'monospace' }}
      />
      <View style={{ flexDirection: 'row' }}>
        <Button label="Verify" onPress={() => void onVerify()} busy={answer.isFetching} />
      </View>
    </Card>
  );

  const result =
    hash === null ? null : answer.isPending ? (
      <LoadingState label="Looking the revision up…" />
    ) : answer.isError ? (
      answer.error instanceof ApiRequestError && answer.error.status === 404 ? (
        <Notice tone="danger" title="No revision has this hash">
          <AppText>{answer.error.message}</AppText>
        </Notice>
      ) : (
        <ErrorState error={answer.error} onRetry={() => void answer.refetch()} />
      )
    ) : (
      <VerifiedRevision answer={answer.data} />
    );

  return (
    <Screen title="Verify a printout">
      {wide ? (
        <View style={{ flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' }}>
          <View style={{ flex: 1 }}>{form}</View>
          <View style={{ flex: 1, gap: space.md }}>{result}</View>
        </View>
      ) : (
        <>
          {form}
          {result}
        </>
      )}
      <AppText variant="small" tone="muted">
        {EXPORT_CAUTION}
      </AppText>
    </Screen>
  );
}

function VerifiedRevision({ answer }: { answer: RevisionByHash }) {
  const router = useRouter();
  const { title, tone } = STANDING[answer.standing];
  const replacement = answer.currentApproved && !answer.isCurrentApproved ? answer.currentApproved : null;
  return (
    <View style={{ gap: space.md }}>
      <Notice tone={tone} title={title}>
        <AppText>{answer.summary}</AppText>
      </Notice>
      <Card accent={answer.isCurrentApproved ? 'moss' : 'ember'} style={{ gap: space.xs }} aria-label="The printed revision">
        <AppText variant="heading">
          {answer.plan.title} · v{answer.plan.version} · revision {answer.revision.number}
        </AppText>
        <AppText>{answer.plan.siteName}</AppText>
        <AppText variant="small" tone="muted">
          Submitted by {answer.revision.submittedBy.name} · {when(answer.revision.submittedAt)}
        </AppText>
        {answer.approval ? (
          <AppText variant="small" tone="muted">
            Approved by {answer.approval.by.name} · {when(answer.approval.at)}
          </AppText>
        ) : null}
        <AppText variant="small" tone="muted" selectable style={{ fontFamily: 'monospace' }}>
          {answer.contentHash}
        </AppText>
        <AppText variant="small" tone="moss">
          The stored revision was hashed again just now and matches this hash.
        </AppText>
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
          <Button
            label="Open this plan"
            kind="secondary"
            role="link"
            onPress={() => router.navigate({ pathname: '/plans/[planId]', params: { planId: answer.plan.id } })}
          />
        </View>
      </Card>
      {replacement ? (
        <Card accent="moss" style={{ gap: space.xs }} aria-label="The approved revision to work from">
          <AppText variant="label">Work from instead</AppText>
          <AppText variant="heading">
            {replacement.title} · v{replacement.version} · revision {replacement.revision}
          </AppText>
          <AppText variant="small" tone="muted">
            Approved {when(replacement.approvedAt)} · content hash {replacement.contentHash.slice(0, 16)}…
          </AppText>
          <View style={{ flexDirection: 'row' }}>
            <Button
              label="Open the approved plan"
              kind="secondary"
              role="link"
              onPress={() => router.navigate({ pathname: '/plans/[planId]', params: { planId: replacement.planId } })}
            />
          </View>
        </Card>
      ) : null}
    </View>
  );
}
