import { fontFaces } from './theme';

/** The shipped faces (SIL Open Font License, see fonts/OFL.txt), keyed by the names theme.ts uses. */
export const fontSources = {
  [fontFaces.regular]: require('../../fonts/Manrope_400Regular.ttf'),
  [fontFaces.semibold]: require('../../fonts/Manrope_600SemiBold.ttf'),
  [fontFaces.bold]: require('../../fonts/Manrope_700Bold.ttf'),
};
