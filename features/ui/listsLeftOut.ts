// What the web build gives react-native-web's own modules in place of its long-list
// components (FlatList, SectionList, VirtualizedList; see metro.config.cjs): the app
// draws its lists with plain views, yet the library's index and Animated import all
// three, about 55 KB of the first download. The app's own imports are not redirected,
// so a screen that does use one gets the real component.
export default function LongListLeftOut(): never {
  throw new Error("React Native's long-list components are not part of Matwright's web build; import them directly from 'react-native'");
}
