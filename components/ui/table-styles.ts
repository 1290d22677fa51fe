import { StyleSheet } from 'react-native';
import { colors, radius, space } from './theme';

/** Kenning's tables: a bordered surface, rows with a rule under them, a paper-coloured head. */
export const tableStyles = StyleSheet.create({
  table: {
    flex: 1,
    backgroundColor: colors.surface,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    overflow: 'hidden',
  },
  tr: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.line },
  head: { backgroundColor: colors.paper },
  th: { padding: space.sm, justifyContent: 'flex-end' },
  td: { padding: space.sm, justifyContent: 'center' },
});
