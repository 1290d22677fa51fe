import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { View } from 'react-native';
import { zodResolver } from '@hookform/resolvers/zod';
import { MeUpdateSchema, ROLE_LABELS, type MeUpdate, type User } from '@/shared/schemas/auth';
import { UNIT_SYSTEM_IDS, UNIT_SYSTEMS } from '@/shared/units/unit-systems';
import { Segmented } from '@/components/check/unit-switch';
import { applyServerErrors } from '@/components/data/server-errors';
import { useSession, useSignOut, useSignOutEverywhere, useUpdateMe } from '@/components/data/session';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { SignOutIcon } from '@/components/ui/icons';
import { Screen } from '@/components/ui/screen';
import { FormError } from '@/components/ui/states';
import { colors, space } from '@/components/ui/theme';
import { FieldError } from '@/components/ui/field-error';

export function AccountPanel() {
  const { data: user } = useSession();
  const signOut = useSignOut();
  const everywhere = useSignOutEverywhere();
  if (!user) return null;
  const rows: [string, string][] = [
    ['Name', user.name],
    ['E-mail', user.email],
    ['Role', ROLE_LABELS[user.role]],
    ['Organisation', user.organization.name],
  ];
  return (
    <Screen title="Account" maxWidth={640}>
      <Card accent="ember">
        {rows.map(([k, v]) => (
          <View key={k} style={{ gap: 2 }}>
            <AppText variant="label" tone="muted">
              {k}
            </AppText>
            <AppText>{v}</AppText>
          </View>
        ))}
      </Card>
      <UnitPreferenceForm user={user} />
      <Button
        kind="secondary"
        label="Sign out"
        icon={<SignOutIcon color={colors.ink} size={20} />}
        busy={signOut.isPending}
        onPress={() => signOut.mutate()}
        style={{ alignSelf: 'flex-start' }}
      />
      <View style={{ gap: space.xs }}>
        <Button
          kind="secondary"
          label="Sign out everywhere"
          busy={everywhere.isPending}
          onPress={() => everywhere.mutate()}
          style={{ alignSelf: 'flex-start' }}
        />
        <AppText variant="small" tone="muted">
          Ends every session of this account, on other computers and phones too — for a lost phone or a shared computer.
        </AppText>
        {everywhere.isError ? (
          <AppText variant="small" tone="danger">
            Could not sign out everywhere. Try again.
          </AppText>
        ) : null}
      </View>
      <AppText variant="small" tone="muted" style={{ marginTop: space.lg }}>
        Kenning gives estimates for planning. Follow your agency's procedures and local regulations.
      </AppText>
    </Screen>
  );
}

/**
 * The person's own units for every form and read-out, saved on the server;
 * "Each site's default" follows the units each site sets.
 */
function UnitPreferenceForm({ user }: { user: User }) {
  const update = useUpdateMe();
  const [formError, setFormError] = useState('');
  const [saved, setSaved] = useState('');
  const { control, handleSubmit, setError } = useForm<MeUpdate>({
    resolver: zodResolver(MeUpdateSchema),
    defaultValues: { unitPreference: user.unitPreference ?? null },
  });
  const save = handleSubmit((input) => {
    setFormError('');
    setSaved('');
    update.mutate(input, {
      onSuccess: ({ user: u }) =>
        setSaved(u.unitPreference ? `Saved: ${UNIT_SYSTEMS[u.unitPreference].name}.` : "Saved: each site's default units."),
      onError: (e) => setFormError(applyServerErrors(e, setError, ['unitPreference'])),
    });
  });
  return (
    <Card accent="moss" aria-label="Units">
      <AppText variant="heading">Units</AppText>
      <AppText variant="small" tone="muted">
        Heights, distances and visibility in every form and result are shown and typed in these units. Kenning stores metres
        either way.
      </AppText>
      <FormError message={formError} />
      <Controller
        control={control}
        name="unitPreference"
        render={({ field, fieldState }) => (
          <View style={{ gap: space.xs }}>
            <Segmented<string>
              label="Your units"
              value={field.value ?? 'site'}
              onChange={(v) => field.onChange(v === 'site' ? null : v)}
              options={[
                { value: 'site', label: "Each site's default" },
                ...UNIT_SYSTEM_IDS.map((u) => ({ value: u, label: UNIT_SYSTEMS[u].name })),
              ]}
            />
            <FieldError message={fieldState.error?.message} />
          </View>
        )}
      />
      <View aria-live="polite">{saved ? <AppText variant="small">{saved}</AppText> : null}</View>
      <Button
        label="Save units"
        onPress={() => void save()}
        busy={update.isPending}
        disabled={update.isPending}
        style={{ alignSelf: 'flex-start' }}
      />
    </Card>
  );
}
