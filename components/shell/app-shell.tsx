import { Slot, usePathname, useRouter } from 'expo-router';
import { useEffect } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { useSession } from '@/components/data/session';
import { AppText } from '@/components/ui/app-text';
import { Wordmark } from '@/components/ui/logo';
import { colors, radius, space, TOUCH } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { preloadDeferredScreens } from './deferred-screen';
import { isActive, NAV_ITEMS } from './nav-items';

/** After the first signed-in screen is up (its target is 1.2 s), the other screens' chunk is fetched in the background. */
const PRELOAD_SCREENS_AFTER_MS = 1500;

/** Signed-in frame: a bottom bar on phones, a side rail from the wide breakpoint. */
export function AppShell() {
  const { wide } = useLayout();
  const pathname = usePathname();
  const router = useRouter();
  const insets = useSafeAreaInsets();
  const { data: user } = useSession();
  const items = NAV_ITEMS.filter((i) => !i.roles || (user && i.roles.includes(user.role)));
  useEffect(() => {
    const timer = setTimeout(preloadDeferredScreens, PRELOAD_SCREENS_AFTER_MS);
    return () => clearTimeout(timer);
  }, []);

  if (wide) {
    return (
      <View style={styles.wideRoot}>
        <View style={styles.rail} role="navigation" aria-label="Main">
          <View style={{ paddingHorizontal: space.lg, paddingVertical: space.xl }}>
            <Wordmark inverse />
          </View>
          {items.map((item) => {
            const active = isActive(item, pathname);
            return (
              <Pressable
                key={item.label}
                role="link"
                aria-current={active ? 'page' : undefined}
                onPress={() => router.navigate(item.href)}
                style={({ pressed }) => [
                  styles.railItem,
                  active && styles.railItemActive,
                  pressed && { backgroundColor: colors.nightRaised },
                ]}
              >
                <item.Icon color={active ? colors.lantern : colors.railText} />
                <AppText variant="label" style={{ color: active ? colors.lantern : colors.railText, fontSize: 16 }}>
                  {item.label}
                </AppText>
              </Pressable>
            );
          })}
          <View style={{ flex: 1 }} />
          {user ? (
            <View style={styles.railUser}>
              <AppText variant="label" style={{ color: colors.surface }}>
                {user.name}
              </AppText>
              <AppText variant="small" style={{ color: colors.railText }}>
                {user.organization.name}
              </AppText>
            </View>
          ) : null}
        </View>
        <View style={{ flex: 1 }} role="main">
          <Slot />
        </View>
      </View>
    );
  }

  return (
    <View style={styles.phoneRoot}>
      <View style={{ flex: 1 }} role="main">
        <Slot />
      </View>
      <View style={[styles.bar, { paddingBottom: Math.max(insets.bottom, space.xs) }]} role="navigation" aria-label="Main">
        {items.map((item) => {
          const active = isActive(item, pathname);
          return (
            <Pressable
              key={item.label}
              role="link"
              aria-label={item.label}
              aria-current={active ? 'page' : undefined}
              onPress={() => router.navigate(item.href)}
              style={styles.barItem}
            >
              <View style={[styles.barMark, active && { backgroundColor: colors.lantern }]} />
              <item.Icon color={active ? colors.lantern : colors.railText} />
              <AppText variant="small" style={{ color: active ? colors.lantern : colors.railText, fontSize: 12, lineHeight: 15 }}>
                {item.label}
              </AppText>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wideRoot: { flex: 1, flexDirection: 'row', backgroundColor: colors.paper },
  rail: { width: 240, backgroundColor: colors.night, paddingBottom: space.lg, gap: space.xs },
  railItem: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    minHeight: TOUCH + 4,
    paddingHorizontal: space.lg,
    marginHorizontal: space.sm,
    borderRadius: radius.md,
  },
  railItemActive: { backgroundColor: colors.nightRaised, borderLeftWidth: 3, borderLeftColor: colors.lantern },
  railUser: { paddingHorizontal: space.lg, gap: 2, borderTopWidth: 1, borderTopColor: colors.nightRaised, paddingTop: space.md },
  phoneRoot: { flex: 1, backgroundColor: colors.paper },
  bar: { flexDirection: 'row', backgroundColor: colors.night, paddingTop: 2 },
  barItem: { flex: 1, minHeight: TOUCH + 12, alignItems: 'center', justifyContent: 'center', gap: 2 },
  barMark: { position: 'absolute', top: 0, width: 28, height: 3, borderRadius: 2 },
});
