import { Link, Stack } from 'expo-router';
import { View } from 'react-native';
import { AppText } from '@/components/ui/app-text';
import { colors, space } from '@/components/ui/theme';

export default function NotFound() {
  return (
    <View
      style={{
        flex: 1,
        alignItems: 'center',
        justifyContent: 'center',
        gap: space.lg,
        backgroundColor: colors.paper,
        padding: space.xl,
      }}
    >
      <Stack.Screen options={{ title: 'Not found' }} />
      <AppText variant="title">Beyond the horizon</AppText>
      <AppText tone="muted">There is no page at this address.</AppText>
      <Link href="/" style={{ color: colors.ember, fontSize: 16, minHeight: 44, paddingVertical: 12 }}>
        Back to your sites
      </Link>
    </View>
  );
}
