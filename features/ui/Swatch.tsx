import { StyleSheet, View } from 'react-native';
import { colors, radius } from './theme';

/** A board's face colour with its core as a frame, beside the board's name; decoration only, the name carries the meaning. */
export function Swatch({ face, core, size = 28 }: { face: string; core?: string; size?: number }) {
  return (
    <View
      aria-hidden
      style={[styles.swatch, { width: size, height: size, backgroundColor: face, borderColor: core ?? colors.line, borderWidth: core ? 4 : 1 }]}
    />
  );
}

const styles = StyleSheet.create({ swatch: { borderRadius: radius.sm } });
