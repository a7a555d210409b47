// The parts of Expo Router the app's own code uses, each from the module that
// defines it. The web build resolves the app's `import ... from 'expo-router'`
// here (metro.config.cjs): the package's main entry also loads its tab bars,
// native tabs, toolbars and link previews, which the app never shows.
// Types still come from 'expo-router' itself.
export { useLocalSearchParams, usePathname, useRouter } from 'expo-router/build/hooks';
export { Link, Redirect } from 'expo-router/build/link/Link';
export { Slot } from 'expo-router/build/views/Navigator';
