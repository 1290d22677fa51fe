import Head from 'expo-router/head';
import { NavigationContext } from 'expo-router/react-navigation';
import { useContext } from 'react';

/** What every browser tab and bookmark says after the page's own title. */
export const PRODUCT_NAME = 'Kenning';

/** "Fire season cover 2026 · Plans · Kenning": the page's own title first, the product last. */
export function documentTitle(...parts: (string | null | undefined)[]): string {
  return [...parts.filter((p): p is string => !!p && p.trim() !== ''), PRODUCT_NAME].join(' · ');
}

/**
 * Sets the browser tab's title (web; native ignores it) while the page is
 * focused. The deepest one wins, so a route sets a general title and its
 * screen a more precise one once its data has loaded. Outside a navigator
 * (component tests) it renders nothing.
 */
export function PageTitle({ title }: { title: string }) {
  const navigation = useContext(NavigationContext);
  if (!navigation) return null;
  return (
    <Head>
      <title>{title}</title>
    </Head>
  );
}
