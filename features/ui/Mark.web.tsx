import { MARK_VIEWBOX, markBevels, markRects } from './markShapes';

/**
 * The mark on the web, as the page's own SVG elements: every screen before
 * sign-in shows it, and drawing it with react-native-svg would bring that
 * library (and its colour parsing) into the first download; the designer
 * loads it when it opens.
 */
export function Mark({ size }: { size: number }) {
  return (
    <svg width={size} height={size} viewBox={MARK_VIEWBOX} aria-hidden="true" focusable="false">
      {markRects.map(({ key, ...rect }) => (
        <rect key={key} {...rect} />
      ))}
      <path {...markBevels} />
    </svg>
  );
}
