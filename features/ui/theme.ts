/** Matwright's palette: warm board white, ink, and a deep green taken from a classic mat colour. */
export const colors = {
  paper: '#F5F1EA',
  card: '#FFFDF9',
  ink: '#1E2629',
  muted: '#5F6A6D',
  line: '#DDD5C8',
  accent: '#24594E',
  accentInk: '#FFFFFF',
  accentSoft: '#DCEAE5',
  warn: '#B5542F',
  warnSoft: '#F7E3D9',
  danger: '#A12D2D',
} as const;

/** The shipped faces, by the names they are loaded under (fontSources.ts, scripts/webBuildFinish.mjs). */
export const fontFaces = {
  regular: 'Manrope_400Regular',
  semibold: 'Manrope_600SemiBold',
  bold: 'Manrope_700Bold',
} as const;

/**
 * What styles name: the shipped face, then the system's sans-serif. On the web a
 * face that misses the first paint is not swapped in later (font-display:
 * optional, so text never shifts), and the text is drawn in the next family
 * named: the system's sans-serif rather than the browser's default serif.
 */
const fallback = 'system-ui, -apple-system, "Segoe UI", Roboto, sans-serif';
export const fonts = {
  regular: `${fontFaces.regular}, ${fallback}`,
  semibold: `${fontFaces.semibold}, ${fallback}`,
  bold: `${fontFaces.bold}, ${fallback}`,
} as const;

export const space = { xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32 } as const;
export const radius = { sm: 6, md: 10, lg: 16 } as const;

/** Windows at least this wide show the shop bar's mark with its word. */
export const BAR_WORD_MIN_WIDTH = 600;

/** Screens at least this wide get side-by-side panels and wider lists. */
export const WIDE_MIN_WIDTH = 900;

