/**
 * On the web the typeface comes with the page: index.html preloads the woff2
 * files and declares them with font-display: optional (scripts/webBuildFinish.mjs),
 * so the first screen renders at once and text never shifts when a font arrives.
 */
export function useAppFonts(): boolean {
  return true;
}
