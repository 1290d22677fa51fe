import { AuthFrame } from '@/components/auth/auth-frame';
import { SignInForm } from '@/components/auth/sign-in-form';

export default function SignInScreen() {
  return (
    <AuthFrame title="Sign in" subtitle="Use the account your agency gave you.">
      <SignInForm />
    </AuthFrame>
  );
}
