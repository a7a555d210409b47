/**
 * On the web the typeface comes with the page: index.html preloads the regular woff2
 * face and declares all three with font-display: optional (scripts/webBuildFinish.mjs),
 * so the first screen renders at once and text never shifts when a font arrives.
 */
export function useAppFonts(): boolean {
  return true;
}
