import type { RefObject } from 'react';
import type { View } from 'react-native';
import type { ScreenPoint } from './viewTransform';

/** Native screens zoom by pinching only; the browser adds the mouse wheel (see the .web file). */
export function useCanvasSurface(_surface: RefObject<View | null>, _onWheelZoom: (factor: number, about: ScreenPoint) => void): void {}
