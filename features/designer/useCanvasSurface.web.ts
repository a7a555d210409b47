import { useEffect, useRef, type RefObject } from 'react';
import type { View } from 'react-native';
import type { ScreenPoint } from './viewTransform';

/** One wheel notch (100 px of scroll) zooms by this factor. */
const WHEEL_ZOOM_PER_100PX = 1.2;

/**
 * The canvas in a browser: the wheel zooms about the pointer, and the page
 * does not scroll or pinch-zoom under the finger, so touch drags reach the
 * canvas's own pointer handlers.
 */
export function useCanvasSurface(surface: RefObject<View | null>, onWheelZoom: (factor: number, about: ScreenPoint) => void): void {
  const handler = useRef(onWheelZoom);
  handler.current = onWheelZoom;
  useEffect(() => {
    const element = surface.current as unknown as HTMLElement | null;
    if (!element) return;
    element.style.touchAction = 'none';
    element.style.userSelect = 'none';
    const wheel = (event: WheelEvent) => {
      event.preventDefault();
      const rect = element.getBoundingClientRect();
      const pixels = event.deltaMode === 1 ? event.deltaY * 16 : event.deltaY;
      handler.current(Math.pow(WHEEL_ZOOM_PER_100PX, -pixels / 100), { sx: event.clientX - rect.left, sy: event.clientY - rect.top });
    };
    element.addEventListener('wheel', wheel, { passive: false });
    return () => element.removeEventListener('wheel', wheel);
  }, [surface]);
}
