import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { View } from 'react-native';
import { SignInRequestSchema, type SignInRequest } from '@/shared/schemas/auth';
import { useSignIn } from '@/components/data/session';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';
import { applyServerErrors } from './use-server-errors';

export function SignInForm() {
  const signIn = useSignIn();
  const [formError, setFormError] = useState('');
  const { control, handleSubmit, setError, formState } = useForm<SignInRequest>({
    resolver: zodResolver(SignInRequestSchema),
    defaultValues: { email: '', password: '' },
  });

  const submit = handleSubmit((values) => {
    setFormError('');
    signIn.mutate(values, {
      onError: (e) => setFormError(applyServerErrors(e, setError, ['email', 'password'])),
    });
  });

  return (
    <View style={{ gap: space.lg }}>
      <FormError message={formError} />
      <Controller
        control={control}
        name="email"
        render={({ field }) => (
          <TextField
            label="E-mail"
            autoComplete="email"
            inputMode="email"
            autoCapitalize="none"
            value={field.value}
            onChangeText={field.onChange}
            onBlur={field.onBlur}
            error={formState.errors.email?.message}
            onSubmitEditing={submit}
          />
        )}
      />
      <Controller
        control={control}
        name="password"
        render={({ field }) => (
          <TextField
            label="Password"
            secureTextEntry
            autoComplete="current-password"
            value={field.value}
            onChangeText={field.onChange}
            onBlur={field.onBlur}
            error={formState.errors.password?.message}
            onSubmitEditing={submit}
          />
        )}
      />
      <Button label="Sign in" onPress={submit} busy={signIn.isPending} />
    </View>
  );
}
