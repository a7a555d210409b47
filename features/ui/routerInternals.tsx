// Stand-ins the web build gives two of Expo Router's own modules (metro.config.cjs),
// for the one importer each that the app's pages reach:
//
// - views/Navigator.js (behind every <Slot />) takes only `StackRouter` from
//   layouts/StackClient.js, whose module also loads the native stack navigator, its
//   headers, toolbars and link previews, none of which a page here shows. The app
//   navigates with plain pushes, replaces and going back, which React Navigation's
//   own stack router (the one Expo Router's wraps, adding "singular" screens and link
//   previews the app does not use) handles the same way.
// - views/SuspenseFallback.js and views/EmptyRoute.js show their notes in a toast
//   that loads the tab bar for its height; the notes are for development builds
//   ("Bundling...", "Missing default export"), so here they are plain text.
import type { ReactNode } from 'react';
import { Text, View } from 'react-native';

export { StackRouter } from 'expo-router/build/react-navigation/routers';

export const CODE_FONT = 'monospace';

export function ToastWrapper({ children }: { children?: ReactNode }) {
  return <View>{children}</View>;
}

export function Toast({ children }: { children?: ReactNode; filename?: string; warning?: boolean }) {
  return <Text>{children}</Text>;
}
