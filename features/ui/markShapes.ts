import { colors } from './theme';

/**
 * Matwright's mark, drawn once here and rendered by Mark.tsx (react-native-svg)
 * and Mark.web.tsx (the page's own SVG elements): two stacked mat windows with
 * a reveal, from plain rectangles, and the bevel corners as short strokes.
 */
export const MARK_VIEWBOX = '0 0 32 32';

export const markRects = [
  { key: 'board', x: 1, y: 1, width: 30, height: 30, rx: 4, fill: colors.accent },
  { key: 'reveal', x: 7, y: 7, width: 18, height: 18, rx: 0, fill: colors.warn },
  { key: 'window', x: 9, y: 9, width: 14, height: 14, rx: 0, fill: colors.paper },
] as const;

export const markBevels = { d: 'M7 7 L9 9 M25 7 L23 9 M7 25 L9 23 M25 25 L23 23', stroke: colors.card, strokeWidth: 0.8 } as const;
