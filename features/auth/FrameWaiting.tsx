import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { colors, space } from '../ui/theme';

/** The signed-in area before it knows who is signed in: a wheel on the page's paper (also what the build pre-renders). */
export function FrameWaiting() {
  return (
    <View style={styles.center}>
      <ActivityIndicator color={colors.accent} />
    </View>
  );
}

const styles = StyleSheet.create({
  center: { flex: 1, alignItems: 'center', justifyContent: 'center', padding: space.xl, backgroundColor: colors.paper },
});
