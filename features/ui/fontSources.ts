import { fonts } from './theme';

/** The shipped faces (SIL Open Font License, see fonts/OFL.txt), keyed by the names theme.ts uses. */
export const fontSources = {
  [fonts.regular]: require('../../fonts/Manrope_400Regular.ttf'),
  [fonts.semibold]: require('../../fonts/Manrope_600SemiBold.ttf'),
  [fonts.bold]: require('../../fonts/Manrope_700Bold.ttf'),
};
