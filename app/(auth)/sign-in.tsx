import { AuthFrame } from '@/components/auth/auth-frame';
import { SignInForm } from '@/components/auth/sign-in-form';
import { documentTitle, PageTitle } from '@/components/ui/page-title';

function SignInScreenContent() {
  return (
    <AuthFrame title="Sign in" subtitle="Use the account your agency gave you.">
      <SignInForm />
    </AuthFrame>
  );
}

/** The tab's title until the page below names itself more precisely. */
export default function SignInScreen() {
  return (
    <>
      <PageTitle title={documentTitle('Sign in')} />
      <SignInScreenContent />
    </>
  );
}
