import { ActivityIndicator, Pressable, StyleSheet } from 'react-native';
import { Text } from './Text';
import { usePageAlive } from './usePageAlive';
import { colors, fonts, radius, space } from './theme';

interface Props {
  label: string;
  onPress: () => void;
  kind?: 'primary' | 'secondary' | 'quiet';
  busy?: boolean;
  disabled?: boolean;
  testID?: string;
}

export function Button({ label, onPress, kind = 'primary', busy = false, disabled = false, testID }: Props) {
  // A pre-rendered page shows its buttons before its script has run; a press then would do
  // nothing, so they show as not yet available until the page is alive.
  const alive = usePageAlive();
  const inactive = disabled || busy || !alive;
  return (
    <Pressable
      role="button"
      aria-disabled={inactive} aria-busy={busy}
      onPress={onPress}
      disabled={inactive}
      testID={testID}
      style={({ pressed }) => [styles.base, styles[kind], pressed && styles.pressed, inactive && styles.inactive]}
    >
      {busy ? <ActivityIndicator color={kind === 'primary' ? colors.accentInk : colors.accent} /> : null}
      <Text style={[styles.label, kind === 'primary' ? styles.primaryLabel : styles.otherLabel]}>{label}</Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    minHeight: 44,
    paddingHorizontal: space.lg,
    borderRadius: radius.md,
    alignItems: 'center',
    justifyContent: 'center',
    flexDirection: 'row',
    gap: space.sm,
  },
  primary: { backgroundColor: colors.accent },
  secondary: { backgroundColor: colors.card, borderWidth: 1, borderColor: colors.accent },
  quiet: { backgroundColor: 'transparent' },
  pressed: { opacity: 0.8 },
  inactive: { opacity: 0.55 },
  label: { fontFamily: fonts.semibold, fontSize: 15 },
  primaryLabel: { color: colors.accentInk },
  otherLabel: { color: colors.accent },
});
