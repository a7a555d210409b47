// The web app's entry. Importing Expo Router's entry at once evaluates the whole
// framework (React DOM, React Native for Web, the navigation code) in a single
// task of several hundred milliseconds on a phone, and the page answers no tap
// meanwhile. Instead each group of modules below is evaluated in a task of its
// own, in the order the framework itself needs them, with the browser free to
// handle input and paint between tasks; the last step is Expo Router's own
// entry, which finds everything already evaluated and mounts the app.
//
// The paths are the ones the framework's modules require each other by, so no
// module is bundled twice (packages with separate CommonJS and ES builds, such
// as zod and TanStack Query, are left to the static imports of their users).
// zod and TanStack Query are not here: the pages before sign-in do without them,
// and the signed-in area's layout evaluates them in steps of its own.
import { inTurns } from './features/ui/inTurns';

// Every page arrives pre-rendered (web output "static"), so the browser paints it
// before any script has run; React then adopts that markup (hydrates) instead of
// drawing the page again. Expo marks such pages with an inline script, which the
// build removes (scripts/webBuildFinish.mjs) so the Content-Security-Policy can keep
// refusing every inline script; the mark is set here instead, from the page itself.
declare namespace globalThis {
  // eslint-disable-next-line no-var
  var __EXPO_ROUTER_HYDRATE__: boolean | undefined;
}
globalThis.__EXPO_ROUTER_HYDRATE__ = typeof document !== 'undefined' && document.getElementById('root')?.firstElementChild != null;

const steps: ReadonlyArray<() => unknown> = [
  () => require('@expo/metro-runtime'),
  () => require('react'),
  () => require('react-dom'),
  () => require('react-dom/client'),
  // React Native for Web, piece by piece (its index evaluates every component).
  () => require('react-native-web/dist/modules/prefixStyles'),
  () => require('react-native-web/dist/exports/StyleSheet/compiler'),
  () => require('react-native-web/dist/exports/StyleSheet/dom'),
  () => require('react-native-web/dist/exports/StyleSheet'),
  () => require('react-native-web/dist/exports/createElement'),
  () => require('react-native-web/dist/exports/View'),
  () => require('react-native-web/dist/exports/Text'),
  () => require('react-native-web/dist/exports/TextInput'),
  () => require('react-native-web/dist/exports/ScrollView'),
  () => require('react-native-web/dist/exports/Image'),
  () => require('react-native-web/dist/vendor/react-native/Animated/nodes/AnimatedProps'),
  () => require('react-native-web/dist/vendor/react-native/Animated/AnimatedImplementation'),
  () => require('react-native-web/dist/exports/Animated'),
  () => require('react-native-web/dist/exports/Pressable'),
  () => require('react-native-web/dist/exports/TouchableOpacity'),
  () => require('react-native-web/dist/exports/Modal'),
  () => require('react-native-web/dist/exports/AppRegistry'),
  () => require('react-native-web/dist/exports/ActivityIndicator'),
  () => require('react-native-web/dist/exports/Button'),
  () => require('react-native-web/dist/exports/CheckBox'),
  () => require('react-native-web/dist/exports/Switch'),
  () => require('react-native-web/dist/exports/Picker'),
  () => require('react-native-web/dist/exports/KeyboardAvoidingView'),
  () => require('react-native'),
  () => require('react-native-safe-area-context'),
  () => require('expo'),
  // Pages before sign-in leave the signed-in screens' shared script out; later screens bring it along.
  () => (require('./features/ui/sharedCode') as typeof import('./features/ui/sharedCode')).loadSharedCodeWithScreens(),
  // Expo Router: navigation core, then its state, links and screens.
  () => require('expo-router/build/constants'),
  () => require('expo-router/build/react-navigation/routers'),
  () => require('expo-router/build/react-navigation/core/BaseNavigationContainer'),
  () => require('expo-router/build/react-navigation/core/useNavigationBuilder'),
  () => require('expo-router/build/react-navigation/core'),
  () => require('expo-router/build/react-navigation/native/NavigationContainer'),
  () => require('expo-router/build/react-navigation/native'),
  () => require('expo-router/build/link/href'),
  () => require('expo-router/build/global-state/routing'),
  () => require('expo-linking'),
  () => require('expo-router/build/views/Splash'),
  () => require('expo-router/build/global-state/getRouteInfoFromState'),
  () => require('expo-router/build/global-state/store'),
  () => require('expo-router/build/global-state/router'),
  () => require('expo-router/build/Route'),
  () => require('expo-router/build/getRoutes'),
  () => require('expo-router/build/import-mode'),
  () => require('expo-router/build/views/Try'),
  () => require('expo-router/build/views/SuspenseFallback'),
  () => require('expo-router/build/navigationEvents'),
  () => require('expo-router/build/link/zoom/ZoomTransitionEnabler'),
  () => require('expo-router/build/hooks/useCurrentRouteInfo'),
  () => require('expo-router/build/useScreens'),
  () => require('expo-router/build/hooks/useLoaderData'),
  () => require('expo-router/build/hooks'),
  () => require('expo-router/build/Prefetch'),
  () => require('expo-router/build/ui/Slot'),
  () => require('expo-router/build/link/BaseExpoRouterLink'),
  () => require('expo-router/build/link/preview/useNextScreenId'),
  () => require('expo-router/build/link/LinkWithPreview'),
  () => require('expo-router/build/link/zoom/zoom-transition-context-providers'),
  () => require('expo-router/build/link/ExpoLink'),
  () => require('expo-router/build/link/Link'),
  () => require('expo-router/build/global-state/useStore'),
  () => require('expo-router/build/fork/NavigationContainer'),
  () => require('expo-router/build/global-state/router-store'),
  () => require('expo-router/build/views/Sitemap'),
  () => require('expo-router/build/ExpoRoot'),
  () => require('expo-router/build/views/Navigator'),
  () => require('expo-router/build/qualified-entry'),
  // What the pages before sign-in draw with, here so that it is part of this script and
  // not of the code the signed-in screens share (see sharedCode.ts).
  () => require('./features/ui/theme'),
  () => require('./features/ui/usePageAlive'),
  () => require('./features/ui/Text'),
  () => require('./features/ui/TextField'),
  () => require('./features/ui/AccountFields'),
  () => require('./features/ui/Button'),
  () => require('./features/ui/Notice'),
  () => require('./features/ui/Screen'),
  () => require('./features/ui/Wordmark'),
  () => require('./features/ui/focusFirstInvalid'),
  () => require('./features/ui/usePublicForm'),
  () => require('./features/ui/screenInSteps'),
  () => require('./features/auth/roles'),
  () => require('./features/auth/authStyles'),
  () => require('./features/auth/FrameWaiting'),
  () => require('./app/_layout'),
  // Expo Router sorts its route patterns with String#localeCompare while it mounts, and a page's
  // first comparison loads the browser's collation data (~46 ms on a 4x slowed CPU): here that
  // is a task of its own instead of part of the mount's.
  () => 'a'.localeCompare('b'),
  // A signed-in page the server drew with its data stays on screen while the app draws its own
  // in a hidden root, which then takes its place (features/ui/drawnPage.ts); nothing is adopted.
  () => {
    if ((require('./features/ui/drawnPage') as typeof import('./features/ui/drawnPage')).takeOverDrawnPage()) globalThis.__EXPO_ROUTER_HYDRATE__ = false;
  },
  // Mounting (or adopting the pre-rendered page) inside a transition lets React do it in
  // slices of a few milliseconds with the browser free between them; outside one, React
  // adopts the whole page in a single task (hydration is otherwise not interruptible).
  () => (require('react') as typeof import('react')).startTransition(() => require('expo-router/entry')),
];

inTurns(steps).catch((error: unknown) => reportError(error));
