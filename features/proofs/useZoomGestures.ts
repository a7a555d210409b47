import type { RefObject } from 'react';
import type { View } from 'react-native';
import type { ScreenSpot, ZoomKey } from './proofZoom';

export interface ZoomGestureHandlers {
  onTap: (spot: ScreenSpot) => void;
  onPan: (dx: number, dy: number) => void;
  onPinch: (before: readonly [ScreenSpot, ScreenSpot], after: readonly [ScreenSpot, ScreenSpot]) => void;
  onKey: (key: ZoomKey) => void;
}

/** On a phone app the zoom buttons do the work; the browser build (useZoomGestures.web.ts) adds pinch, drag, tap and keys. */
export function useZoomGestures(_frame: RefObject<View | null>, _zoomed: boolean, _handlers: ZoomGestureHandlers): void {}
