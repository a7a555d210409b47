import * as Linking from 'expo-linking';
import { StyleSheet } from 'react-native';
import { Text } from '../ui/Text';
import { colors } from '../ui/theme';

interface Props {
  href: string;
  label: string;
  mode: 'download' | 'open';
  testID?: string;
}

/** Outside the browser the system opens the file's address; the web build uses DownloadLink.web.tsx. */
export function DownloadLink({ href, label, testID }: Props) {
  return (
    <Text role="link" onPress={() => void Linking.openURL(href)} style={styles.link} testID={testID}>
      {label}
    </Text>
  );
}

const styles = StyleSheet.create({ link: { color: colors.accent, textDecorationLine: 'underline' } });
