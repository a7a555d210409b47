import { useEffect, useRef, type RefObject } from 'react';
import type { View } from 'react-native';
import type { ScreenSpot, ZoomKey } from './proofZoom';
import type { ZoomGestureHandlers } from './useZoomGestures';

/** A press that moves less than this and ends within TAP_MS is a tap, not a drag. */
const TAP_SLOP_PX = 8;
const TAP_MS = 350;

const keys: Record<string, ZoomKey> = {
  '+': 'in', '=': 'in', '-': 'out', '0': 'fit', ArrowLeft: 'left', ArrowRight: 'right', ArrowUp: 'up', ArrowDown: 'down',
};

/**
 * Pointer events on the picture's frame: two pointers pinch, one pointer drags
 * once zoomed, a short press taps; + - 0 and the arrows work when the frame has
 * focus. Before zooming in the page keeps vertical scrolling under a finger.
 */
export function useZoomGestures(frame: RefObject<View | null>, zoomed: boolean, handlers: ZoomGestureHandlers): void {
  const latest = useRef(handlers);
  latest.current = handlers;
  useEffect(() => {
    const element = frame.current as unknown as HTMLElement | null;
    if (element) element.style.touchAction = zoomed ? 'none' : 'pan-y';
  }, [frame, zoomed]);
  useEffect(() => {
    const element = frame.current as unknown as HTMLElement | null;
    if (!element) return;
    const pointers = new Map<number, ScreenSpot>();
    let press: { spot: ScreenSpot; at: number; moved: boolean } | null = null;
    const spotOf = (e: PointerEvent): ScreenSpot => {
      const rect = element.getBoundingClientRect();
      return { x: e.clientX - rect.left, y: e.clientY - rect.top };
    };
    const down = (e: PointerEvent) => {
      pointers.set(e.pointerId, spotOf(e));
      press = pointers.size === 1 ? { spot: spotOf(e), at: performance.now(), moved: false } : null;
      element.setPointerCapture?.(e.pointerId);
    };
    const move = (e: PointerEvent) => {
      const before = pointers.get(e.pointerId);
      if (!before) return;
      const now = spotOf(e);
      if (pointers.size === 2) {
        const [a, b] = [...pointers.entries()];
        const other = a![0] === e.pointerId ? b![1] : a![1];
        latest.current.onPinch([before, other], [now, other]);
      } else if (pointers.size === 1) {
        if (press && Math.hypot(now.x - press.spot.x, now.y - press.spot.y) > TAP_SLOP_PX) press.moved = true;
        if (!press || press.moved) latest.current.onPan(now.x - before.x, now.y - before.y);
      }
      pointers.set(e.pointerId, now);
    };
    const up = (e: PointerEvent) => {
      const wasTap = pointers.size === 1 && press !== null && !press.moved && performance.now() - press.at < TAP_MS;
      pointers.delete(e.pointerId);
      if (wasTap && e.type === 'pointerup') latest.current.onTap(press!.spot);
      press = null;
    };
    const key = (e: KeyboardEvent) => {
      const action = keys[e.key];
      if (!action) return;
      e.preventDefault();
      latest.current.onKey(action);
    };
    element.addEventListener('pointerdown', down);
    element.addEventListener('pointermove', move);
    element.addEventListener('pointerup', up);
    element.addEventListener('pointercancel', up);
    element.addEventListener('keydown', key);
    return () => {
      element.removeEventListener('pointerdown', down);
      element.removeEventListener('pointermove', move);
      element.removeEventListener('pointerup', up);
      element.removeEventListener('pointercancel', up);
      element.removeEventListener('keydown', key);
    };
  }, [frame]);
}
