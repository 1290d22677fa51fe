import { Pressable, StyleSheet, View } from 'react-native';
import { AppText } from './app-text';
import { colors, radius, space, TOUCH } from './theme';

/** A toggle for filters: pressed chips are filled with ink. */
export function Chip({ label, on, onPress, count }: { label: string; on: boolean; onPress: () => void; count?: number }) {
  return (
    <Pressable
      role="checkbox"
      aria-checked={on}
      aria-label={count === undefined ? label : `${label} (${count})`}
      onPress={onPress}
      style={({ pressed }) => [styles.chip, on && styles.on, pressed && !on && { backgroundColor: colors.paper }]}
    >
      <AppText variant="label" style={{ color: on ? colors.surface : colors.ink }}>
        {label}
        {count === undefined ? '' : ` · ${count}`}
      </AppText>
    </Pressable>
  );
}

/** A wrapping row of chips with a label. */
/** The list with `item` taken out if it is in it, added at the end if not (a chip of a multiple choice pressed). */
export function toggled<T>(list: readonly T[], item: T): T[] {
  return list.includes(item) ? list.filter((x) => x !== item) : [...list, item];
}

export function ChipRow({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <View style={{ gap: space.xs }} role="group" aria-label={label}>
      <AppText variant="label" tone="muted">
        {label}
      </AppText>
      <View style={styles.row}>{children}</View>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  chip: {
    // A long label wraps inside the chip instead of running off a narrow screen.
    maxWidth: '100%',
    minHeight: TOUCH - 6,
    justifyContent: 'center',
    paddingHorizontal: space.md,
    borderRadius: radius.pill,
    borderWidth: 1.5,
    borderColor: colors.lineStrong,
    backgroundColor: colors.surface,
  },
  on: { backgroundColor: colors.ink, borderColor: colors.ink },
});
