import type { PointerEvent } from 'react-native';
import type { PointerAt } from './canvasPointer';

export type { PointerAt } from './canvasPointer';

// In the browser the canvas view is a DOM element and its events are DOM pointer events.
function domParts(event: PointerEvent): { element: HTMLElement; native: globalThis.PointerEvent } {
  return { element: event.currentTarget as unknown as HTMLElement, native: event.nativeEvent as unknown as globalThis.PointerEvent };
}

/** Measured from the canvas itself: offsetX would be relative to whichever path was under the pointer. */
export function pointerInView(event: PointerEvent): PointerAt {
  const { element, native } = domParts(event);
  const rect = element.getBoundingClientRect();
  return { id: native.pointerId, sx: native.clientX - rect.left, sy: native.clientY - rect.top, shift: native.shiftKey, alt: native.altKey };
}

/** Keeps a drag going when the pointer leaves the canvas mid-drag. */
export function capturePointer(event: PointerEvent): void {
  const { element, native } = domParts(event);
  element.setPointerCapture?.(native.pointerId);
}
