import { Slot, usePathname, useRouter } from 'expo-router';
import { useEffect, useState } from 'react';
import { Modal, Pressable, StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { useSession } from '@/components/data/session';
import { AppText } from '@/components/ui/app-text';
import { MoreIcon } from '@/components/ui/icons';
import { Wordmark } from '@/components/ui/logo';
import { colors, radius, space, TOUCH } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { deferredScreen, preloadDeferredScreens } from './deferred-screen';
import { isActive, NAV_ITEMS, phoneBarItems, type NavItem } from './nav-items';

/** Field mode's band and outbox sender, from the deferred chunk (nothing shows until it has loaded). */
const FieldStatus = deferredScreen('FieldStatus', { fallback: null });

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
          {items.map((item) => (
            <NavLink
              key={item.label}
              item={item}
              active={isActive(item, pathname)}
              onPress={() => router.navigate(item.href)}
              style={(pressed, active) => [
                styles.railItem,
                active && styles.railItemActive,
                pressed && { backgroundColor: colors.nightRaised },
              ]}
              labelColor={colors.railText}
              fontSize={16}
            />
          ))}
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
          <FieldStatus part="band" />
          <Slot />
        </View>
        <FieldStatus part="sender" />
      </View>
    );
  }

  return <PhoneShell items={items} pathname={pathname} bottomInset={insets.bottom} />;
}

/**
 * Phones: a bottom bar of at most five places with one-line labels; when a
 * role has more, the last slot is "More", a list of the rest over the page.
 */
function PhoneShell({ items, pathname, bottomInset }: { items: NavItem[]; pathname: string; bottomInset: number }) {
  const router = useRouter();
  const [moreOpen, setMoreOpen] = useState(false);
  const { bar, more } = phoneBarItems(items);
  const moreActive = more.some((i) => isActive(i, pathname));
  const go = (item: NavItem) => {
    setMoreOpen(false);
    router.navigate(item.href);
  };
  return (
    <View style={styles.phoneRoot}>
      <View style={{ flex: 1 }} role="main">
        <FieldStatus part="band" />
        <Slot />
      </View>
      <FieldStatus part="sender" />
      <View style={[styles.bar, { paddingBottom: Math.max(bottomInset, space.xs) }]} role="navigation" aria-label="Main">
        {bar.map((item) => (
          <BarItem
            key={item.label}
            label={item.label}
            Icon={item.Icon}
            active={isActive(item, pathname)}
            role="link"
            onPress={() => go(item)}
          />
        ))}
        {more.length > 0 ? (
          <BarItem label="More" Icon={MoreIcon} active={moreActive} role="button" onPress={() => setMoreOpen(true)} />
        ) : null}
      </View>
      <Modal visible={moreOpen} transparent animationType="none" onRequestClose={() => setMoreOpen(false)}>
        <View style={styles.moreRoot}>
          <Pressable style={styles.moreBackdrop} aria-label="Close the list" onPress={() => setMoreOpen(false)} />
          <View
            style={[styles.moreSheet, { paddingBottom: Math.max(bottomInset, space.md) }]}
            role="navigation"
            aria-label="More places"
          >
            {more.map((item) => (
              <NavLink
                key={item.label}
                item={item}
                active={isActive(item, pathname)}
                onPress={() => go(item)}
                style={(pressed, active) => [styles.moreItem, (active || pressed) && { backgroundColor: colors.nightRaised }]}
                labelColor={colors.surface}
                fontSize={17}
              />
            ))}
          </View>
        </View>
      </Modal>
    </View>
  );
}

function BarItem({
  label,
  Icon,
  active,
  role,
  onPress,
}: {
  label: string;
  Icon: NavItem['Icon'];
  active: boolean;
  role: 'link' | 'button';
  onPress: () => void;
}) {
  return (
    <Pressable
      role={role}
      aria-label={label}
      aria-current={active && role === 'link' ? 'page' : undefined}
      onPress={onPress}
      style={styles.barItem}
    >
      <View style={[styles.barMark, active && { backgroundColor: colors.lantern }]} />
      <Icon color={active ? colors.lantern : colors.railText} />
      <AppText
        variant="small"
        numberOfLines={1}
        style={{ color: active ? colors.lantern : colors.railText, fontSize: 12, lineHeight: 15 }}
      >
        {label}
      </AppText>
    </Pressable>
  );
}

/** One place in a navigation list (the rail, the "more" sheet): its icon and name, lantern-lit when it is the current page. */
function NavLink({
  item,
  active,
  onPress,
  style,
  labelColor,
  fontSize,
}: {
  item: NavItem;
  active: boolean;
  onPress: () => void;
  style: (pressed: boolean, active: boolean) => StyleProp<ViewStyle>;
  /** The name's colour when the place is not the current page. */
  labelColor: string;
  fontSize: number;
}) {
  return (
    <Pressable
      role="link"
      aria-current={active ? 'page' : undefined}
      onPress={onPress}
      style={({ pressed }) => style(pressed, active)}
    >
      <item.Icon color={active ? colors.lantern : colors.railText} />
      <AppText variant="label" style={{ color: active ? colors.lantern : labelColor, fontSize }}>
        {item.label}
      </AppText>
    </Pressable>
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
  moreRoot: { flex: 1, justifyContent: 'flex-end' },
  moreBackdrop: { position: 'absolute', top: 0, right: 0, bottom: 0, left: 0, backgroundColor: 'rgba(23, 37, 43, 0.55)' },
  moreSheet: {
    backgroundColor: colors.night,
    borderTopLeftRadius: radius.lg,
    borderTopRightRadius: radius.lg,
    paddingTop: space.sm,
    paddingHorizontal: space.sm,
    gap: space.xs,
  },
  moreItem: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    minHeight: TOUCH + 4,
    paddingHorizontal: space.lg,
    borderRadius: radius.md,
  },
});
