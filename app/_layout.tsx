import { Barlow_400Regular } from '@expo-google-fonts/barlow/400Regular';
import { Barlow_500Medium } from '@expo-google-fonts/barlow/500Medium';
import { Barlow_600SemiBold } from '@expo-google-fonts/barlow/600SemiBold';
import { Barlow_700Bold } from '@expo-google-fonts/barlow/700Bold';
import { onlineManager, QueryClientProvider } from '@tanstack/react-query';
import { PersistQueryClientProvider } from '@tanstack/react-query-persist-client';
import { useFonts } from 'expo-font';
import { Stack } from 'expo-router';
import { StatusBar } from 'expo-status-bar';
import { useState, type ReactNode } from 'react';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { createQueryClient } from '@/components/data/query-client';
import { meQuery, useSession } from '@/components/data/session';
import { deviceCanKeepCopies, DEVICE_COPY_MAX_AGE_MS, persistOptions } from '@/components/offline/persisted-cache';
import { RootErrorBoundary } from '@/components/shell/root-error-boundary';
import { SplashView } from '@/components/shell/splash-view';
import { ErrorState } from '@/components/ui/states';

export { RootErrorBoundary as ErrorBoundary };

/** The app's one query client; the session question goes out at once, beside the fonts rather than after them. */
function createAppQueryClient() {
  const client = createQueryClient();
  // TanStack Query assumes a network at start and only hears later changes: a cold start in the field must know.
  if (typeof navigator !== 'undefined' && typeof navigator.onLine === 'boolean') onlineManager.setOnline(navigator.onLine);
  if (deviceCanKeepCopies()) {
    // What was fetched stays in memory as long as the device keeps its copy, so the copy is not dropped early.
    const queries = client.getDefaultOptions().queries;
    client.setDefaultOptions({ queries: { ...queries, gcTime: DEVICE_COPY_MAX_AGE_MS } });
  }
  void client.prefetchQuery(meQuery());
  return client;
}

/** On the web the query cache is kept on the device (field mode); elsewhere it lives in memory only. */
function QueryProvider({ client, children }: { client: ReturnType<typeof createQueryClient>; children: ReactNode }) {
  const [persist] = useState(() => (deviceCanKeepCopies() ? persistOptions() : null));
  if (!persist) return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
  return (
    // The device's copy shows at once, and is then asked again: a copy counts as fresh only until the page reloads.
    <PersistQueryClientProvider client={client} persistOptions={persist} onSuccess={() => void client.invalidateQueries()}>
      {children}
    </PersistQueryClientProvider>
  );
}

export default function RootLayout() {
  const [queryClient] = useState(createAppQueryClient);
  const [fontsLoaded, fontError] = useFonts({ Barlow_400Regular, Barlow_500Medium, Barlow_600SemiBold, Barlow_700Bold });
  return (
    <SafeAreaProvider>
      <QueryProvider client={queryClient}>
        <StatusBar style="dark" />
        {fontsLoaded || fontError ? <RootNavigator /> : <SplashView />}
      </QueryProvider>
    </SafeAreaProvider>
  );
}

/** Signed-in users get the (app) group, everyone else the (auth) group. */
function RootNavigator() {
  const session = useSession();
  if (session.isPending) return <SplashView />;
  // A failed refresh keeps the session the device already knows (offline in the field): only no answer at all is an error.
  if (session.isError && session.data === undefined)
    return <ErrorState error={session.error} onRetry={() => void session.refetch()} />;
  const signedIn = session.data != null;
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
