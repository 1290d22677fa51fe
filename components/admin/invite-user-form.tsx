import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { View } from 'react-native';
import { InviteUserRequestSchema, type InviteUserRequest } from '@/shared/schemas/auth';
import { applyServerErrors } from '@/components/data/server-errors';
import { useInviteUser } from '@/components/data/users';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError, Notice } from '@/components/ui/states';
import { FormTextField } from '@/components/ui/form-text-field';
import { space } from '@/components/ui/theme';
import { RolePicker } from './role-picker';

export function InviteUserForm() {
  const invite = useInviteUser();
  const [formError, setFormError] = useState('');
  const [link, setLink] = useState('');
  const [mailed, setMailed] = useState(false);
  const { control, handleSubmit, setError, reset } = useForm<InviteUserRequest>({
    resolver: zodResolver(InviteUserRequestSchema),
    defaultValues: { email: '', name: '', role: 'observer' },
  });
  const submit = handleSubmit((values) => {
    setFormError('');
    setLink('');
    invite.mutate(values, {
      onSuccess: (r) => {
        setLink(r.setPasswordUrl);
        setMailed(r.mailed);
        reset();
      },
      onError: (e) => setFormError(applyServerErrors(e, setError, ['email', 'name', 'role'])),
    });
  });
  return (
    <Card accent="moss">
      <AppText variant="heading">Invite someone</AppText>
      <FormError message={formError} />
      <FormTextField control={control} name="name" label="Name" />
      <FormTextField control={control} name="email" label="E-mail" autoCapitalize="none" inputMode="email" />
      <Controller
        control={control}
        name="role"
        render={({ field }) => (
          <View style={{ gap: space.xs }}>
            <AppText variant="label">Role</AppText>
            <RolePicker value={field.value} onChange={field.onChange} />
          </View>
        )}
      />
      <Button label="Create invitation" onPress={submit} busy={invite.isPending} />
      {link ? (
        <Notice tone="info" title="Invitation created">
          <AppText variant="small">
            {mailed
              ? 'We e-mailed this one-time link to the person; it works for 7 days:'
              : 'Send this one-time link to the person; it works for 7 days:'}
          </AppText>
          <AppText variant="small" selectable style={{ fontFamily: 'monospace' }}>
            {link}
          </AppText>
        </Notice>
      ) : null}
    </Card>
  );
}
