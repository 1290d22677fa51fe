import { lazy, Suspense, type ComponentType } from 'react';
import { LoadingState } from '@/components/ui/states';

type Screens = typeof import('@/components/shell/deferred-screens');

/**
 * A screen component from `deferred-screens`, loaded on first use (one async
 * chunk for all of them) and shown behind a loading state meanwhile; typed as
 * the screen itself. A chunk that fails to load throws to the route's error
 * boundary.
 *
 * @example const SiteMapScreen = deferredScreen('SiteMapScreen');
 */
export function deferredScreen<K extends keyof Screens>(name: K): Screens[K] {
  const Lazy = lazy(() =>
    import('@/components/shell/deferred-screens').then((m) => ({ default: m[name] as ComponentType<object> })),
  );
  function DeferredScreen(props: object) {
    return (
      <Suspense fallback={<LoadingState />}>
        <Lazy {...props} />
      </Suspense>
    );
  }
  DeferredScreen.displayName = `Deferred(${name})`;
  return DeferredScreen as unknown as Screens[K];
}
