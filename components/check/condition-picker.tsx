import { Pressable, StyleSheet, View } from 'react-native';
import { REFRACTION_PRESETS, type RefractionPresetId } from '@/shared/sightline/refraction-presets';
import { AppText } from '@/components/ui/app-text';
import { colors, radius, space, TOUCH } from '@/components/ui/theme';

/** Named conditions as toggles; each shows its k, its definition on the second line. */
export function ConditionPicker({
  value,
  onChange,
}: {
  value: RefractionPresetId[];
  onChange: (v: RefractionPresetId[]) => void;
}) {
  const toggle = (id: RefractionPresetId) =>
    onChange(
      value.includes(id)
        ? value.filter((v) => v !== id)
        : REFRACTION_PRESETS.map((p) => p.id).filter((p) => p === id || value.includes(p)),
    );
  return (
    <View style={styles.wrap} role="group" aria-label="Refraction conditions">
      {REFRACTION_PRESETS.map((p) => {
        const on = value.includes(p.id);
        return (
          <Pressable
            key={p.id}
            role="checkbox"
            aria-checked={on}
            aria-label={p.label}
            onPress={() => toggle(p.id)}
            style={[styles.chip, on && styles.on]}
          >
            <View style={[styles.box, on && styles.boxOn]}>{on ? <View style={styles.tick} /> : null}</View>
            <AppText variant="small" style={{ flexShrink: 1, color: colors.ink }}>
              {p.label}
            </AppText>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  chip: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    minHeight: TOUCH,
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.surface,
  },
  on: { borderColor: colors.ink, backgroundColor: colors.paper },
  box: {
    width: 20,
    height: 20,
    borderRadius: 4,
    borderWidth: 1.5,
    borderColor: colors.lineStrong,
    alignItems: 'center',
    justifyContent: 'center',
  },
  boxOn: { backgroundColor: colors.ink, borderColor: colors.ink },
  tick: { width: 8, height: 8, backgroundColor: colors.lantern, borderRadius: 1 },
});
