import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { colors, fonts, space } from '../ui/theme';

/** Links to the team and the outbox, for the signed-in header; every member may open both. */
export function ShopMenuLinks() {
  return (
    <View style={styles.row} accessibilityRole="menubar">
      <Link href="/members" style={styles.link} testID="menu-members">
        Team
      </Link>
      <Link href="/outbox" style={styles.link} testID="menu-outbox">
        Outbox
      </Link>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: space.md },
  link: { color: colors.accent, fontFamily: fonts.semibold, fontSize: 15, paddingVertical: space.sm },
});
