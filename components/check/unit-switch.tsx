import { Pressable, StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/app-text';
import { colors, radius, space, TOUCH } from '@/components/ui/theme';

/** A segmented choice. */
export function Segmented<T extends string>({
  label,
  value,
  options,
  onChange,
}: {
  label: string;
  value: T;
  options: { value: T; label: string }[];
  onChange: (v: T) => void;
}) {
  return (
    <View style={{ gap: space.xs }}>
      <AppText variant="label">{label}</AppText>
      <View role="radiogroup" aria-label={label} style={styles.row}>
        {options.map((o) => {
          const on = o.value === value;
          return (
            <Pressable
              key={o.value}
              role="radio"
              aria-checked={on}
              onPress={() => onChange(o.value)}
              style={[styles.seg, on && styles.on]}
            >
              <AppText variant="label" style={{ color: on ? colors.surface : colors.ink }}>
                {o.label}
              </AppText>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    borderWidth: 1.5,
    borderColor: colors.lineStrong,
    borderRadius: radius.md,
    overflow: 'hidden',
    alignSelf: 'flex-start',
  },
  seg: { minHeight: TOUCH, paddingHorizontal: space.md, justifyContent: 'center', backgroundColor: colors.surface },
  on: { backgroundColor: colors.ink },
});
