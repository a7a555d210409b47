// The web app's entry: zod's settings first (before any schema is built), then Expo Router.
import './features/api/zodJitless';
import 'expo-router/entry';
