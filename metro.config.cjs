// Metro for the web build: Expo's defaults, plus changes to what the first
// download carries. Metro keeps every module a package's entry imports, used or
// not (it cannot drop unused exports), so modules the app never runs are resolved
// to small stand-ins here, each named below; and requires are inlined (Metro's
// inlineRequires), so a module runs when first used instead of at start-up.
// zod's main entry re-exports every one of its ~40 message languages; the app
// speaks English only, so the language list resolves to English alone.
const path = require('node:path');
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(__dirname);
const englishOnly = path.join(__dirname, 'features/api/zodEnglishOnly.ts');
// zod's JSON Schema converters and its compiler, which the app never calls, give way
// to one small module with the same names (features/api/zodLeftOut.ts).
const zodLeftOut = path.join(__dirname, 'features/api/zodLeftOut.ts');
// The app's imports of zod go through features/api/zodJitless.ts, which sets zod up first.
const zodSetUp = path.join(__dirname, 'features/api/zodJitless.ts');
// The app's imports from Expo Router go to the modules that define what it uses (features/ui/routerParts.ts).
const routerParts = path.join(__dirname, 'features/ui/routerParts.ts');
// react-native-web's long lists, imported by its index and by Animated but never drawn by
// the app, give way to features/ui/listsLeftOut.ts for those two importers only.
const listsLeftOut = path.join(__dirname, 'features/ui/listsLeftOut.ts');
const RNW_LONG_LISTS = /[\\/]react-native-web[\\/]dist[\\/]exports[\\/](FlatList|SectionList|VirtualizedList)[\\/]index\.js$/;
// Two of Expo Router's internal modules, for their importers on every page (features/ui/routerInternals.tsx).
const routerInternals = path.join(__dirname, 'features/ui/routerInternals.tsx');
const ROUTER_INTERNALS = [
  { request: '../layouts/StackClient', from: /[\\/]expo-router[\\/]build[\\/]views[\\/]Navigator\.js$/ },
  { request: './Toast', from: /[\\/]expo-router[\\/]build[\\/]views[\\/](SuspenseFallback|EmptyRoute)\.js$/ },
];
const ZOD_LEFT_OUT = new Set(['compile.js', 'to-json-schema.js', 'json-schema-processors.js', 'json-schema-generator.js', 'from-json-schema.js']);

config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (moduleName === '../locales/index.js' && /[\\/]zod[\\/]v4[\\/](classic|core)[\\/]/.test(context.originModulePath)) {
    return { type: 'sourceFile', filePath: englishOnly };
  }
  if (moduleName.startsWith('.') && ZOD_LEFT_OUT.has(path.basename(moduleName)) && /[\\/]zod[\\/]v4[\\/](classic|core)[\\/]/.test(context.originModulePath)) {
    return { type: 'sourceFile', filePath: zodLeftOut };
  }
  if (moduleName === 'zod' && context.originModulePath !== zodSetUp && !/[\\/]node_modules[\\/]/.test(context.originModulePath)) {
    return { type: 'sourceFile', filePath: zodSetUp };
  }
  if (ROUTER_INTERNALS.some((r) => r.request === moduleName && r.from.test(context.originModulePath))) {
    return { type: 'sourceFile', filePath: routerInternals };
  }
  if (moduleName === 'expo-router' && !/[\\/]node_modules[\\/]/.test(context.originModulePath)) {
    return { type: 'sourceFile', filePath: routerParts };
  }
  const resolved = context.resolveRequest(context, moduleName, platform);
  if (resolved.type === 'sourceFile' && RNW_LONG_LISTS.test(resolved.filePath) && /[\\/]react-native-web[\\/]dist[\\/]/.test(context.originModulePath)) {
    return { type: 'sourceFile', filePath: listsLeftOut };
  }
  return resolved;
};

module.exports = config;
