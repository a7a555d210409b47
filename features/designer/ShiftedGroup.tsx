import { createContext, useContext, type ReactNode } from 'react';
import { G } from 'react-native-svg';
import { shiftTransform, type MovingShift } from './movingShift';

/**
 * The shift of the dragged openings, read only by the few elements that
 * move with them (their hit paths, outline, handles, photos and the masks
 * that cut their holes). Everything else on the canvas is memoised on the
 * layout from before the drag, so a pointer move changes a handful of
 * transforms and draws nothing else again.
 */
export const MovingShiftContext = createContext<MovingShift | null>(null);

/** The transform of opening `id` while it is dragged. */
export function useShiftOf(id: string): string | undefined {
  return shiftTransform(useContext(MovingShiftContext), id);
}

/**
 * A group that follows the drag: every dragged opening's shift, or only
 * `id`'s when given. Its children are made by a memoised parent, so a new
 * shift redraws this group's transform and nothing inside it.
 */
export function ShiftedGroup({ id, children }: { id?: string; children: ReactNode }) {
  const transform = shiftTransform(useContext(MovingShiftContext), id);
  return <G transform={transform}>{children}</G>;
}
