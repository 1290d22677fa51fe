import { useLocalSearchParams } from 'expo-router';
import { AuthFrame } from '@/components/auth/auth-frame';
import { deferredScreen } from '@/components/shell/deferred-screen';
import { documentTitle, PageTitle } from '@/components/ui/page-title';

const SetPasswordForm = deferredScreen('SetPasswordForm');

function SetPasswordScreenContent() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  return (
    <AuthFrame title="Choose your password" subtitle="Your administrator invited you to Kenning.">
      <SetPasswordForm token={typeof token === 'string' ? token : ''} />
    </AuthFrame>
  );
}

/** The tab's title until the page below names itself more precisely. */
export default function SetPasswordScreen() {
  return (
    <>
      <PageTitle title={documentTitle('Choose your password')} />
      <SetPasswordScreenContent />
    </>
  );
}
