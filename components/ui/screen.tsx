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
}: {
  title: string;
  subtitle?: string;
  actions?: React.ReactNode;
  children: React.ReactNode;
  maxWidth?: number;
}) {
  const { wide } = useLayout();
  return (
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
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.paper },
  content: { flexGrow: 1, alignItems: 'center' },
  inner: { width: '100%', gap: space.xl },
  header: { flexDirection: 'row', alignItems: 'flex-start', gap: space.md, flexWrap: 'wrap' },
});
