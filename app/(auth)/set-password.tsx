import { useLocalSearchParams } from 'expo-router';
import { AuthFrame } from '@/components/auth/auth-frame';
import { SetPasswordForm } from '@/components/auth/set-password-form';

export default function SetPasswordScreen() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  return (
    <AuthFrame title="Choose your password" subtitle="Your administrator invited you to Kenning.">
      <SetPasswordForm token={typeof token === 'string' ? token : ''} />
    </AuthFrame>
  );
}
