import type { ErrorBoundaryProps } from 'expo-router';
import { View } from 'react-native';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { colors, space } from '@/components/ui/theme';

/** Shown by Expo Router when a screen throws while rendering. */
export function RootErrorBoundary({ error, retry }: ErrorBoundaryProps) {
  return (
    <View
      role="alert"
      style={{
        flex: 1,
        alignItems: 'center',
        justifyContent: 'center',
        gap: space.lg,
        padding: space.xl,
        backgroundColor: colors.paper,
      }}
    >
      <AppText variant="title">This screen stopped working</AppText>
      <AppText tone="muted" style={{ textAlign: 'center', maxWidth: 480 }}>
        {error.message || 'An unexpected error occurred.'} Your saved work is not affected.
      </AppText>
      <Button label="Try again" onPress={() => void retry()} />
    </View>
  );
}
