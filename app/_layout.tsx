import { Barlow_400Regular } from '@expo-google-fonts/barlow/400Regular';
import { Barlow_500Medium } from '@expo-google-fonts/barlow/500Medium';
import { Barlow_600SemiBold } from '@expo-google-fonts/barlow/600SemiBold';
import { Barlow_700Bold } from '@expo-google-fonts/barlow/700Bold';
import { QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import { Stack } from 'expo-router';
import { StatusBar } from 'expo-status-bar';
import { useState } from 'react';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { createQueryClient } from '@/components/data/query-client';
import { meQuery, useSession } from '@/components/data/session';
import { RootErrorBoundary } from '@/components/shell/root-error-boundary';
import { SplashView } from '@/components/shell/splash-view';
import { ErrorState } from '@/components/ui/states';

export { RootErrorBoundary as ErrorBoundary };

/** The app's one query client; the session question goes out at once, beside the fonts rather than after them. */
function createAppQueryClient() {
  const client = createQueryClient();
  void client.prefetchQuery(meQuery());
  return client;
}

export default function RootLayout() {
  const [queryClient] = useState(createAppQueryClient);
  const [fontsLoaded, fontError] = useFonts({ Barlow_400Regular, Barlow_500Medium, Barlow_600SemiBold, Barlow_700Bold });
  return (
    <SafeAreaProvider>
      <QueryClientProvider client={queryClient}>
        <StatusBar style="dark" />
        {fontsLoaded || fontError ? <RootNavigator /> : <SplashView />}
      </QueryClientProvider>
    </SafeAreaProvider>
  );
}

/** Signed-in users get the (app) group, everyone else the (auth) group. */
function RootNavigator() {
  const session = useSession();
  if (session.isPending) return <SplashView />;
  if (session.isError) return <ErrorState error={session.error} onRetry={() => void session.refetch()} />;
  const signedIn = session.data !== null;
  return (
    <Stack screenOptions={{ headerShown: false, animation: 'none' }}>
      <Stack.Protected guard={signedIn}>
        <Stack.Screen name="(app)" />
      </Stack.Protected>
      <Stack.Protected guard={!signedIn}>
        <Stack.Screen name="(auth)" />
      </Stack.Protected>
    </Stack>
  );
}
