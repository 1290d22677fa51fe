import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import { z } from 'zod';
import { NewPasswordSchema } from '@/shared/schemas/auth';
import { useSetPassword } from '@/components/data/session';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { FormError, Notice } from '@/components/ui/states';
import { FormTextField } from '@/components/ui/form-text-field';
import { colors, space } from '@/components/ui/theme';
import { applyServerErrors } from '@/components/data/server-errors';

const FormSchema = z
  .object({ password: NewPasswordSchema, repeat: z.string() })
  .refine((v) => v.password === v.repeat, { message: 'The two passwords differ.', path: ['repeat'] });
type Form = z.infer<typeof FormSchema>;

export function SetPasswordForm({ token }: { token: string }) {
  const setPassword = useSetPassword();
  const [formError, setFormError] = useState('');
  const { control, handleSubmit, setError } = useForm<Form>({
    resolver: zodResolver(FormSchema),
    defaultValues: { password: '', repeat: '' },
  });

  if (!token) {
    return (
      <Notice tone="danger">
        <AppText>This link has no token. Open the full link your administrator sent you.</AppText>
      </Notice>
    );
  }
  if (setPassword.isSuccess) {
    return (
      <Notice tone="info" title="Password set">
        <AppText>
          You can now{' '}
          <Link href="/sign-in" style={{ color: colors.ember }}>
            sign in
          </Link>
          .
        </AppText>
      </Notice>
    );
  }

  const submit = handleSubmit(({ password }) => {
    setFormError('');
    setPassword.mutate({ token, password }, { onError: (e) => setFormError(applyServerErrors(e, setError, ['password'])) });
  });

  return (
    <View style={{ gap: space.lg }}>
      <FormError message={formError} />
      <FormTextField
        control={control}
        name="password"
        label="New password"
        secureTextEntry
        autoComplete="new-password"
        hint="10 to 72 characters (accented letters and emoji count as 2 to 4)."
      />
      <FormTextField
        control={control}
        name="repeat"
        label="Repeat the password"
        secureTextEntry
        autoComplete="new-password"
        onSubmitEditing={submit}
      />
      <Button label="Set password" onPress={submit} busy={setPassword.isPending} />
    </View>
  );
}
