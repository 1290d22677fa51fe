import { StyleSheet, View, type ViewProps } from 'react-native';
import { colors, radius, space } from './theme';

/** A surface panel; `accent` draws Kenning's horizon rule along its top edge. */
export function Card({ style, accent, ...rest }: ViewProps & { accent?: 'ember' | 'moss' | 'none' }) {
  return (
    <View
      style={[styles.card, accent && accent !== 'none' && { borderTopColor: colors[accent], borderTopWidth: 3 }, style]}
      {...rest}
    />
  );
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: colors.surface,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    padding: space.lg,
    gap: space.md,
  },
});
