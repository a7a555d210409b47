import type { PointerEvent } from 'react-native';
import type { ScreenPoint } from './viewTransform';

/** One pointer on the canvas: where it is in canvas pixels and which finger or button it is. */
export interface PointerAt extends ScreenPoint {
  readonly id: number;
  readonly shift: boolean;
  /** Alt held: place freely on the rounding step without jumping to nearby lines. */
  readonly alt: boolean;
}

export function pointerInView(event: PointerEvent): PointerAt {
  const n = event.nativeEvent;
  return { id: n.pointerId, sx: n.offsetX, sy: n.offsetY, shift: n.shiftKey, alt: n.altKey };
}

/** Native views keep delivering a pointer to the view it started on. */
export function capturePointer(_event: PointerEvent): void {}
