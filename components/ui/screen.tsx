import { ScrollView, StyleSheet, View } from 'react-native';
import { AppText } from './app-text';
import { documentTitle, PageTitle } from './page-title';
import { colors, space } from './theme';
import { useLayout } from './use-layout';

/** A scrolling page with a title and a readable maximum width. */
export function Screen({
  title,
  subtitle,
  actions,
  children,
  maxWidth = 1100,
  footer,
}: {
  title: string;
  subtitle?: string;
  actions?: React.ReactNode;
  children: React.ReactNode;
  maxWidth?: number;
  /**
   * A bar kept at the bottom of the page while it scrolls (a phone's
   * decision: submit, approve, return), so the main action is never screens
   * away. Nothing when absent.
   */
  footer?: React.ReactNode;
}) {
  const { wide } = useLayout();
  const page = (
    <ScrollView style={styles.scroll} contentContainerStyle={[styles.content, { padding: wide ? space.xxl : space.lg }]}>
      <PageTitle title={documentTitle(title)} />
      <View style={[styles.inner, { maxWidth }]}>
        <View style={styles.header}>
          <View style={{ flex: 1, gap: space.xs }}>
            <AppText variant={wide ? 'display' : 'title'}>{title}</AppText>
            {subtitle ? <AppText tone="muted">{subtitle}</AppText> : null}
          </View>
          {actions}
        </View>
        {children}
      </View>
    </ScrollView>
  );
  if (!footer) return page;
  return (
    <View style={styles.withFooter}>
      {page}
      <View style={styles.footer} role="toolbar" aria-label="Page actions">
        {footer}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  withFooter: { flex: 1, backgroundColor: colors.paper },
  footer: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: space.sm,
    paddingHorizontal: space.lg,
    paddingVertical: space.sm,
    backgroundColor: colors.surface,
    borderTopWidth: 1,
    borderTopColor: colors.lineStrong,
    shadowColor: colors.ink,
    shadowOpacity: 0.12,
    shadowRadius: 8,
    shadowOffset: { width: 0, height: -2 },
  },
  scroll: { flex: 1, backgroundColor: colors.paper },
  content: { flexGrow: 1, alignItems: 'center' },
  inner: { width: '100%', gap: space.xl },
  header: { flexDirection: 'row', alignItems: 'flex-start', gap: space.md, flexWrap: 'wrap' },
});
