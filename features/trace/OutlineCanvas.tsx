import { Text } from '../ui/Text';
import type { OutlineCanvasProps } from './outlineCanvasProps';

/** Editing the outline needs a pointer over the photo; this build of the screen runs in the browser. */
export function OutlineCanvas(_props: OutlineCanvasProps) {
  return <Text>Editing the outline works in the browser version of Matwright.</Text>;
}
