import { Pressable, StyleSheet, View } from 'react-native';
import Svg, { Path } from 'react-native-svg';
import { AppText } from './app-text';
import { colors, radius, space, TOUCH } from './theme';
import { FieldError } from './field-error';

/** One choice: a box (several may be chosen) or a round mark (`single`: one of the group), a label and a detail line. */
export function CheckRow({
  label,
  detail,
  checked,
  onToggle,
  disabled,
  single,
}: {
  label: string;
  detail?: string;
  checked: boolean;
  onToggle: () => void;
  disabled?: boolean;
  single?: boolean;
}) {
  return (
    <Pressable
      role={single ? 'radio' : 'checkbox'}
      aria-checked={checked}
      aria-label={label}
      aria-disabled={disabled}
      disabled={disabled}
      onPress={onToggle}
      style={({ pressed }) => [styles.row, pressed && { backgroundColor: colors.paper }, disabled && { opacity: 0.55 }]}
    >
      <View style={[styles.box, single && { borderRadius: 11 }, checked && styles.boxOn]}>
        {checked ? (
          <Svg width={16} height={16} viewBox="0 0 16 16" aria-hidden>
            <Path d="M3 8.5 6.5 12 13 4.5" stroke={colors.surface} strokeWidth={2.2} fill="none" />
          </Svg>
        ) : null}
      </View>
      <View style={{ flex: 1, gap: 2 }}>
        <AppText variant="label" style={{ fontSize: 16 }}>
          {label}
        </AppText>
        {detail ? (
          <AppText variant="small" tone="muted">
            {detail}
          </AppText>
        ) : null}
      </View>
    </Pressable>
  );
}

/** A labelled group of check rows, with its error under it. */
export function CheckGroup({
  label,
  error,
  single,
  children,
}: {
  label: string;
  error?: string;
  single?: boolean;
  children: React.ReactNode;
}) {
  return (
    <View style={{ gap: space.xs }} role={single ? 'radiogroup' : 'group'} aria-label={label}>
      <AppText variant="label">{label}</AppText>
      <View style={[styles.group, !!error && { borderColor: colors.danger }]}>{children}</View>
      <FieldError message={error} />
    </View>
  );
}

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    minHeight: TOUCH + 4,
    paddingHorizontal: space.md,
    paddingVertical: space.xs,
  },
  box: {
    width: 22,
    height: 22,
    borderRadius: radius.sm,
    borderWidth: 1.8,
    borderColor: colors.lineStrong,
    alignItems: 'center',
    justifyContent: 'center',
    backgroundColor: colors.surface,
  },
  boxOn: { backgroundColor: colors.moss, borderColor: colors.moss },
  group: {
    borderWidth: 1.5,
    borderColor: colors.line,
    borderRadius: radius.md,
    backgroundColor: colors.surface,
    overflow: 'hidden',
  },
});
