import { lazy, Suspense, type ComponentType } from 'react';
import { LoadingState } from '@/components/ui/states';
import { deferredChunkIfLoaded, loadDeferredChunk } from '@/components/data/deferred-chunk';

type Screens = typeof import('@/components/shell/deferred-screens');

/**
 * Fetches the deferred chunk without showing anything, so the next screen
 * opens without waiting for it. A failure is left to the screen that needs it.
 */
export function preloadDeferredScreens() {
  loadDeferredChunk().catch(() => undefined);
}

/**
 * A screen component from `deferred-screens`, loaded on first use (one async
 * chunk for all of them) and shown behind a loading state meanwhile; typed as
 * the screen itself. A chunk that fails to load throws to the route's error
 * boundary.
 *
 * @example const PlanEditor = deferredScreen('PlanEditor');
 * @example const FieldStatus = deferredScreen('FieldStatus', { fallback: null }); // a part that shows nothing meanwhile
 */
export function deferredScreen<K extends keyof Screens>(
  name: K,
  { fallback = <LoadingState /> }: { fallback?: React.ReactNode } = {},
): Screens[K] {
  const Lazy = lazy(() => loadDeferredChunk().then((m) => ({ default: m[name] as ComponentType<object> })));
  function DeferredScreen(props: object) {
    // Once loaded (e.g. preloaded by the shell), no Suspense round: React holds a revealed
    // fallback for a moment (≈ 300 ms) before it shows the content.
    const Loaded = deferredChunkIfLoaded()?.[name] as ComponentType<object> | undefined;
    if (Loaded) return <Loaded {...props} />;
    return (
      <Suspense fallback={fallback}>
        <Lazy {...props} />
      </Suspense>
    );
  }
  DeferredScreen.displayName = `Deferred(${name})`;
  return DeferredScreen as unknown as Screens[K];
}
