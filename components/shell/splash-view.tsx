import { ActivityIndicator, View } from 'react-native';
import { LogoMark } from '@/components/ui/logo';
import { colors, space } from '@/components/ui/theme';

export function SplashView() {
  return (
    <View
      aria-busy
      aria-label="Loading Kenning"
      style={{ flex: 1, alignItems: 'center', justifyContent: 'center', gap: space.lg, backgroundColor: colors.paper }}
    >
      <LogoMark size={56} />
      <ActivityIndicator color={colors.ember} />
    </View>
  );
}
