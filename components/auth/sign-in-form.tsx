import { useEffect, useState } from 'react';
import { useForm, type Resolver } from 'react-hook-form';
import { View } from 'react-native';
import type { SignInRequest } from '@/shared/schemas/auth';
import { loadDeferredChunk, loadFirstScreenSchemas } from '@/components/data/deferred-chunk';
import { useSignIn } from '@/components/data/session';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/states';
import { FormTextField } from '@/components/ui/form-text-field';
import { space } from '@/components/ui/theme';
import { applyServerErrors } from '@/components/data/server-errors';

/**
 * The shared sign-in schema checks the form; it comes with the deferred chunk
 * (zod is not in the first load), which the form starts fetching as soon as it
 * is up, so a first tap rarely waits for it.
 */
const resolveSignIn: Resolver<SignInRequest> = async (values, context, options) =>
  (await loadFirstScreenSchemas()).signInResolver(values, context, options);

/** Runs `task` once the page is idle (the form drawn and answering), and returns how to call it off. */
function whenIdle(task: () => void): () => void {
  if (typeof requestIdleCallback === 'function') {
    const id = requestIdleCallback(task, { timeout: 1000 });
    return () => cancelIdleCallback(id);
  }
  const id = setTimeout(task, 200);
  return () => clearTimeout(id);
}

export function SignInForm() {
  const signIn = useSignIn();
  const [formError, setFormError] = useState('');
  const { control, handleSubmit, setError } = useForm<SignInRequest>({
    resolver: resolveSignIn,
    defaultValues: { email: '', password: '' },
  });

  useEffect(() => whenIdle(() => loadDeferredChunk().catch(() => undefined)), []);

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
