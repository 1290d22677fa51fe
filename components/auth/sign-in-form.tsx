import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import { SignInRequestSchema, type SignInRequest } from '@/shared/schemas/auth';
import { useSignIn } from '@/components/data/session';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/states';
import { FormTextField } from '@/components/ui/form-text-field';
import { space } from '@/components/ui/theme';
import { applyServerErrors } from '@/components/data/server-errors';

export function SignInForm() {
  const signIn = useSignIn();
  const [formError, setFormError] = useState('');
  const { control, handleSubmit, setError } = useForm<SignInRequest>({
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
      <FormTextField
        control={control}
        name="email"
        label="E-mail"
        autoComplete="email"
        inputMode="email"
        autoCapitalize="none"
        onSubmitEditing={submit}
      />
      <FormTextField
        control={control}
        name="password"
        label="Password"
        secureTextEntry
        autoComplete="current-password"
        onSubmitEditing={submit}
      />
      <Button label="Sign in" onPress={submit} busy={signIn.isPending} />
    </View>
  );
}
