import Svg, { Path, Rect } from 'react-native-svg';
import { MARK_VIEWBOX, markBevels, markRects } from './markShapes';

/** The mark through react-native-svg. */
export function Mark({ size }: { size: number }) {
  return (
    <Svg width={size} height={size} viewBox={MARK_VIEWBOX} aria-hidden>
      {markRects.map(({ key, ...rect }) => (
        <Rect key={key} {...rect} />
      ))}
      <Path {...markBevels} />
    </Svg>
  );
}
