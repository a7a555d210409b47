import { StyleSheet } from 'react-native';
import { colors, space } from '../ui/theme';

/** The look the pages before sign-in share: the mark above one card. */
export const authStyles = StyleSheet.create({
  head: { alignItems: 'center', gap: space.sm, marginTop: space.xxl },
  card: { backgroundColor: colors.card, borderRadius: 16, padding: space.xl, gap: space.lg, borderWidth: 1, borderColor: colors.line },
  center: { textAlign: 'center' },
  link: { color: colors.accent, textDecorationLine: 'underline' },
});
