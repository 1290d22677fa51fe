import { Link, usePathname, useRouter } from 'expo-router';
import { View } from 'react-native';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Wordmark } from '@/components/ui/logo';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { colors, radius, space } from '@/components/ui/theme';

/** Any address no route matches: what happened, and two ways back. */
export default function NotFound() {
  const pathname = usePathname();
  const router = useRouter();
  return (
    <View style={{ flex: 1, alignItems: 'center', justifyContent: 'center', backgroundColor: colors.paper, padding: space.xl }}>
      <PageTitle title={documentTitle('Page not found')} />
      <View
        style={{
          width: '100%',
          maxWidth: 520,
          gap: space.lg,
          backgroundColor: colors.surface,
          borderRadius: radius.lg,
          padding: space.xl,
        }}
      >
        <Wordmark />
        <AppText variant="title">No page at this address</AppText>
        <AppText selectable style={{ fontVariant: ['tabular-nums'] }} tone="muted">
          {pathname}
        </AppText>
        <AppText>
          Kenning has no page here. The address may be mistyped or cut short, or it may come from an older link. Nothing was
          changed.
        </AppText>
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
          {router.canGoBack() ? <Button kind="secondary" label="Go back" onPress={() => router.back()} /> : null}
          <Link href="/" asChild>
            <Button role="link" label="Go to the home page" />
          </Link>
        </View>
      </View>
    </View>
  );
}
