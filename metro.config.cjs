// Metro for the web build: Expo's defaults, plus one change to what zod brings
// along. zod's main entry re-exports every one of its ~40 message languages
// (about 300 KB of the first download), and Metro keeps all of them because it
// cannot drop unused exports; the app speaks English only, so the language
// list resolves to a module with English alone.
const path = require('node:path');
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(__dirname);
const englishOnly = path.join(__dirname, 'features/api/zodEnglishOnly.ts');

config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (moduleName === '../locales/index.js' && /[\\/]zod[\\/]v4[\\/](classic|core)[\\/]/.test(context.originModulePath)) {
    return { type: 'sourceFile', filePath: englishOnly };
  }
  return context.resolveRequest(context, moduleName, platform);
};

module.exports = config;
