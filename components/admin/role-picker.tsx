import { Pressable, StyleSheet, View } from 'react-native';
import { ROLES, type Role } from '@/shared/schemas/auth';
import { AppText } from '@/components/ui/app-text';
import { colors, radius, space, TOUCH } from '@/components/ui/theme';

/** A row of role chips; the chosen one is filled. */
export function RolePicker({
  value,
  onChange,
  disabled,
  label = 'Role',
}: {
  value: Role;
  onChange: (r: Role) => void;
  disabled?: boolean;
  label?: string;
}) {
  return (
    <View role="radiogroup" aria-label={label} style={styles.row}>
      {ROLES.map((r) => {
        const on = r === value;
        return (
          <Pressable
            key={r}
            role="radio"
            aria-checked={on}
            disabled={disabled}
            onPress={() => onChange(r)}
            style={[styles.chip, on && styles.on, disabled && { opacity: 0.6 }]}
          >
            <AppText variant="label" style={{ color: on ? colors.surface : colors.ink }}>
              {r}
            </AppText>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  chip: {
    minHeight: TOUCH,
    paddingHorizontal: space.md,
    justifyContent: 'center',
    borderRadius: radius.pill,
    borderWidth: 1.5,
    borderColor: colors.lineStrong,
    backgroundColor: colors.surface,
  },
  on: { backgroundColor: colors.ink, borderColor: colors.ink },
});
