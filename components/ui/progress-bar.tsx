import { StyleSheet, View } from 'react-native';
import { AppText } from './app-text';
import { colors, radius, space } from './theme';

/** A labelled bar for work that reports how far it is (0…1); announced to screen readers as a progress bar. */
export function ProgressBar({ label, fraction, detail }: { label: string; fraction: number; detail?: string }) {
  const pct = Math.round(Math.min(1, Math.max(0, fraction)) * 100);
  return (
    <View style={{ gap: space.xs }}>
      <View style={styles.row}>
        <AppText variant="label">{label}</AppText>
        <AppText variant="small" tone="muted" style={{ fontVariant: ['tabular-nums'] }}>
          {detail ?? `${pct} %`}
        </AppText>
      </View>
      <View role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct} style={styles.track}>
        <View style={[styles.fill, { width: `${pct}%` }]} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', justifyContent: 'space-between', gap: space.sm },
  track: { height: 8, borderRadius: radius.pill, backgroundColor: colors.line, overflow: 'hidden' },
  fill: { height: '100%', borderRadius: radius.pill, backgroundColor: colors.moss },
});
