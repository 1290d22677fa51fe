import { ActivityIndicator, Pressable, StyleSheet, View, type PressableProps } from 'react-native';
import { AppText } from './app-text';
import { colors, radius, space, TOUCH } from './theme';

export interface ButtonProps extends Omit<PressableProps, 'children'> {
  label: string;
  kind?: 'primary' | 'secondary' | 'quiet' | 'danger';
  busy?: boolean;
  icon?: React.ReactNode;
}

export function Button({ label, kind = 'primary', busy, disabled, icon, style, ...rest }: ButtonProps) {
  const off = disabled || busy;
  return (
    <Pressable
      role="button"
      aria-disabled={off}
      aria-busy={busy}
      disabled={off}
      style={(state) => [
        styles.base,
        styles[kind],
        state.pressed && pressed[kind],
        off && styles.off,
        typeof style === 'function' ? style(state) : style,
      ]}
      {...rest}
    >
      <View style={styles.row}>
        {busy ? (
          <ActivityIndicator size="small" color={kind === 'primary' || kind === 'danger' ? colors.surface : colors.ink} />
        ) : (
          icon
        )}
        <AppText variant="label" style={{ color: textColor[kind], fontSize: 16 }}>
          {label}
        </AppText>
      </View>
    </Pressable>
  );
}

const textColor = { primary: colors.surface, secondary: colors.ink, quiet: colors.ember, danger: colors.surface } as const;

const styles = StyleSheet.create({
  base: {
    minHeight: TOUCH,
    minWidth: TOUCH,
    paddingHorizontal: space.lg,
    borderRadius: radius.md,
    justifyContent: 'center',
    alignItems: 'center',
  },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  primary: { backgroundColor: colors.ember },
  secondary: { backgroundColor: colors.surface, borderWidth: 1.5, borderColor: colors.lineStrong },
  quiet: { backgroundColor: 'transparent' },
  danger: { backgroundColor: colors.danger },
  off: { opacity: 0.55 },
});

const pressed = StyleSheet.create({
  primary: { backgroundColor: colors.emberDeep },
  secondary: { backgroundColor: colors.paper },
  quiet: { backgroundColor: colors.emberSoft },
  danger: { backgroundColor: '#7E1C16' },
});
