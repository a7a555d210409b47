import type { ErrorBoundaryProps } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { Button } from './Button';
import { Notice } from './Notice';
import { colors, space } from './theme';

/**
 * What a page that failed to draw shows instead (Expo Router's ErrorBoundary
 * export of the root layout): the reason in the app's words and a way to try
 * again. Nothing typed elsewhere is lost: drafts save as they change.
 */
export function PageError({ error, retry }: ErrorBoundaryProps) {
  return (
    <View style={styles.page}>
      <Notice title="This page could not be drawn" testID="page-error">
        {`${error.message || 'Something went wrong.'} Try again; if it keeps happening, reload the page.`}
      </Notice>
      <Button label="Try again" onPress={() => void retry()} testID="page-error-retry" />
    </View>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, padding: space.lg, gap: space.md, backgroundColor: colors.paper, justifyContent: 'center' },
});
