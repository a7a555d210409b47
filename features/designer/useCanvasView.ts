import { useCallback, useEffect, useMemo, useState } from 'react';
import type { Box, Size } from '../../geometry';
import type { ScreenPoint, Viewport, ViewTransform } from './viewTransform';
import { viewFitting, viewPanned, viewZoomed } from './viewTransform';

/** One button press zooms by this much. */
const ZOOM_STEP = 1.4;

/** Pan and zoom of the canvas; starts with the whole layout in view. */
export function useCanvasView(outer: Size) {
  const [viewport, setViewport] = useState<Viewport | null>(null);
  const [view, setView] = useState<ViewTransform | null>(null);

  const fit = useCallback(() => {
    if (viewport) setView(viewFitting({ x: 0, y: 0, w: outer.width, h: outer.height }, viewport));
  }, [viewport, outer.width, outer.height]);

  // The first measurement, and every resize of the window, shows the whole layout.
  // Fit again only when the viewport itself changes size, not on every new fit function.
  useEffect(fit, [viewport?.width, viewport?.height]);

  const zoomBy = useCallback(
    (factor: number, about?: ScreenPoint) => {
      if (!viewport) return;
      setView((v) => (v ? viewZoomed(v, factor, about ?? { sx: viewport.width / 2, sy: viewport.height / 2 }) : v));
    },
    [viewport],
  );

  /** Brings a spot of the board into view with some board around it. */
  const zoomTo = useCallback(
    (box: Box) => {
      if (!viewport) return;
      const margin = Math.max(2, box.w, box.h);
      setView(viewFitting({ x: box.x - margin, y: box.y - margin, w: box.w + 2 * margin, h: box.h + 2 * margin }, viewport));
    },
    [viewport],
  );

  const panBy = useCallback((dx: number, dy: number) => setView((v) => (v ? viewPanned(v, dx, dy) : v)), []);
  const zoomIn = useCallback(() => zoomBy(ZOOM_STEP), [zoomBy]);
  const zoomOut = useCallback(() => zoomBy(1 / ZOOM_STEP), [zoomBy]);

  // One object while nothing in it changes, so the canvas is not drawn again when the designer around it is.
  return useMemo(
    () => ({ view, viewport, setViewport, fit, zoomIn, zoomOut, zoomBy, zoomTo, panBy }),
    [view, viewport, fit, zoomIn, zoomOut, zoomBy, zoomTo, panBy],
  );
}

export type CanvasView = ReturnType<typeof useCanvasView>;
