import { ScrollView, StyleSheet, View } from 'react-native';
import Svg, { Path } from 'react-native-svg';
import { AppText } from '@/components/ui/app-text';
import { Wordmark } from '@/components/ui/logo';
import { colors, radius, space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';

/** The signed-out frame: a night band with the curve of the earth, the form on a card. */
export function AuthFrame({ title, subtitle, children }: { title: string; subtitle: string; children: React.ReactNode }) {
  const { wide } = useLayout();
  return (
    <ScrollView style={{ flex: 1, backgroundColor: colors.paper }} contentContainerStyle={{ flexGrow: 1 }}>
      <View style={[styles.band, { paddingTop: wide ? 72 : 40 }]}>
        <Wordmark inverse />
        <AppText style={{ color: colors.railText, marginTop: space.sm, maxWidth: 460 }}>
          How far your lookouts can see — and what the earth, the air and the terrain hide from them.
        </AppText>
        <Svg width="100%" height={48} viewBox="0 0 400 48" preserveAspectRatio="none" style={styles.curve} aria-hidden>
          <Path d="M0 48 Q200 0 400 48 Z" fill={colors.paper} />
        </Svg>
      </View>
      <View style={[styles.card, { width: wide ? 440 : '92%' }]}>
        <AppText variant="title">{title}</AppText>
        <AppText tone="muted">{subtitle}</AppText>
        {children}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  band: { backgroundColor: colors.night, paddingHorizontal: space.xl, paddingBottom: 88, alignItems: 'center' },
  curve: { position: 'absolute', bottom: 0, left: 0, right: 0 },
  card: {
    alignSelf: 'center',
    marginTop: -56,
    marginBottom: space.xxl,
    backgroundColor: colors.surface,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    padding: space.xl,
    gap: space.lg,
  },
});
