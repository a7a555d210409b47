import { Text } from '../ui/Text';
import type { CornerMarksProps } from './cornerMarksProps';

/** Marking corners needs a pointer over the photo; this build of the screen runs in the browser. */
export function CornerMarks(_props: CornerMarksProps) {
  return <Text>Marking corners works in the browser version of Matwright.</Text>;
}
