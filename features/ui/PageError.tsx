import type { ErrorBoundaryProps } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { Button } from './Button';
import { Notice } from './Notice';
import { Text } from './Text';
import { colors, space } from './theme';

/** A screen's script that could not be fetched, as Expo's loader reports it. */
function isDownloadFailure(error: Error): boolean {
  return error.name === 'AsyncRequireError' || /^Loading module .* failed/.test(error.message);
}

/**
 * What a page that failed to draw shows instead (Expo Router's ErrorBoundary
 * export of the root layout): what happened in plain words, a way to try
 * again, and the technical detail underneath for whoever helps. Nothing typed
 * elsewhere is lost: drafts save as they change.
 */
export function PageError({ error, retry }: ErrorBoundaryProps) {
  const words = isDownloadFailure(error)
    ? 'Part of Matwright could not be downloaded. Check the connection, then try again.'
    : 'Something went wrong while drawing it. Try again; if it keeps happening, reload the page.';
  return (
    <View style={styles.page}>
      <Notice title="This page could not be drawn" testID="page-error">
        {words}
      </Notice>
      <Button label="Try again" onPress={() => void retry()} testID="page-error-retry" />
      {error.message ? (
        <Text variant="caption" selectable testID="page-error-detail">
          {`Detail: ${error.message}`}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, padding: space.lg, gap: space.md, backgroundColor: colors.paper, justifyContent: 'center' },
});
