import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { AppText } from './app-text';
import { Button } from './button';
import { CautionIcon } from './icons';
import { colors, radius, space } from './theme';

export function LoadingState({ label = 'Loading…' }: { label?: string }) {
  return (
    <View style={styles.center} aria-busy>
      <ActivityIndicator color={colors.ember} />
      <AppText tone="muted">{label}</AppText>
    </View>
  );
}

export function ErrorState({ error, onRetry }: { error: unknown; onRetry?: () => void }) {
  const message = error instanceof Error ? error.message : 'Something went wrong.';
  return (
    <View style={[styles.center, styles.box, { backgroundColor: colors.dangerSoft }]} role="alert">
      <CautionIcon color={colors.danger} />
      <AppText tone="danger">{message}</AppText>
      {onRetry ? <Button kind="secondary" label="Try again" onPress={onRetry} /> : null}
    </View>
  );
}

export function EmptyState({ title, body, action }: { title: string; body: string; action?: React.ReactNode }) {
  return (
    <View style={[styles.center, styles.box, { borderStyle: 'dashed', borderWidth: 1.5, borderColor: colors.lineStrong }]}>
      <AppText variant="heading">{title}</AppText>
      <AppText tone="muted" style={{ textAlign: 'center', maxWidth: 420 }}>
        {body}
      </AppText>
      {action}
    </View>
  );
}

/** A banner for cautions and notices that must stay visible. */
export function Notice({
  tone = 'caution',
  title,
  children,
}: {
  tone?: 'caution' | 'danger' | 'info';
  title?: string;
  children: React.ReactNode;
}) {
  const bg = tone === 'danger' ? colors.dangerSoft : tone === 'info' ? colors.mossSoft : colors.cautionSoft;
  const line = tone === 'danger' ? colors.danger : tone === 'info' ? colors.moss : colors.cautionLine;
  return (
    <View style={[styles.notice, { backgroundColor: bg, borderLeftColor: line }]} role={tone === 'danger' ? 'alert' : 'note'}>
      {title ? <AppText variant="label">{title}</AppText> : null}
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  center: { alignItems: 'center', justifyContent: 'center', gap: space.md, padding: space.xl },
  box: { borderRadius: radius.lg },
  notice: { borderLeftWidth: 4, borderRadius: radius.sm, padding: space.md, gap: space.xs },
});

/** A form-level error above the fields; renders nothing when there is no message. */
export function FormError({ message }: { message?: string | null }) {
  if (!message) return null;
  return (
    <Notice tone="danger">
      <AppText>{message}</AppText>
    </Notice>
  );
}
