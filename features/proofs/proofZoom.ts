/**
 * The zoom of the customer's picture: a scale and a shift in screen pixels of
 * the picture inside its frame (the picture's top-left corner sits at x, y).
 * Pure functions so pinch, taps, buttons and keys all move it the same way.
 */
export interface ZoomView {
  readonly scale: number;
  readonly x: number;
  readonly y: number;
}

export interface FrameSize {
  readonly width: number;
  readonly height: number;
}

export interface ScreenSpot {
  readonly x: number;
  readonly y: number;
}

export const ZOOM_MIN = 1;
export const ZOOM_MAX = 6;
/** One press of a zoom button or key; a tap on the whole picture zooms by the same step. */
export const ZOOM_STEP = 2;
/** One press of a pan button or arrow key moves the picture by this part of the frame. */
export const PAN_STEP = 0.2;

export const zoomFit: ZoomView = { scale: 1, x: 0, y: 0 };

/** Keeps the picture covering its frame: no empty gap opens on any side once zoomed in. */
export function zoomClamped(view: ZoomView, frame: FrameSize): ZoomView {
  const scale = Math.min(ZOOM_MAX, Math.max(ZOOM_MIN, view.scale));
  const minX = frame.width * (1 - scale);
  const minY = frame.height * (1 - scale);
  return { scale, x: Math.min(0, Math.max(minX, view.x)), y: Math.min(0, Math.max(minY, view.y)) };
}

/** Zooms by `factor` keeping the picture's point under `about` where it is on screen (as far as the frame allows). */
export function zoomedAbout(view: ZoomView, factor: number, about: ScreenSpot, frame: FrameSize): ZoomView {
  const scale = Math.min(ZOOM_MAX, Math.max(ZOOM_MIN, view.scale * factor));
  const px = (about.x - view.x) / view.scale;
  const py = (about.y - view.y) / view.scale;
  return zoomClamped({ scale, x: about.x - px * scale, y: about.y - py * scale }, frame);
}

export function pannedBy(view: ZoomView, dx: number, dy: number, frame: FrameSize): ZoomView {
  return zoomClamped({ ...view, x: view.x + dx, y: view.y + dy }, frame);
}

const centreOf = (a: ScreenSpot, b: ScreenSpot): ScreenSpot => ({ x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 });
const distance = (a: ScreenSpot, b: ScreenSpot) => Math.hypot(a.x - b.x, a.y - b.y);

/** Two fingers moved from `before` to `after`: zoom by the change in their spread about their centre, and follow the centre. */
export function pinched(view: ZoomView, before: readonly [ScreenSpot, ScreenSpot], after: readonly [ScreenSpot, ScreenSpot], frame: FrameSize): ZoomView {
  const spread = distance(before[0], before[1]);
  const factor = spread > 0 ? distance(after[0], after[1]) / spread : 1;
  const from = centreOf(before[0], before[1]);
  const to = centreOf(after[0], after[1]);
  const zoomed = zoomedAbout(view, factor, from, frame);
  return pannedBy(zoomed, to.x - from.x, to.y - from.y, frame);
}

/** A tap: zoom in one step about the spot, or back to the whole picture when already zoomed. */
export function tapped(view: ZoomView, spot: ScreenSpot, frame: FrameSize): ZoomView {
  return view.scale > ZOOM_MIN ? zoomFit : zoomedAbout(view, ZOOM_STEP, spot, frame);
}

export type ZoomKey = 'in' | 'out' | 'fit' | 'left' | 'right' | 'up' | 'down';

/** A button or key press; zooming from a button keeps the frame's centre still. */
export function zoomPressed(view: ZoomView, key: ZoomKey, frame: FrameSize): ZoomView {
  const centre = { x: frame.width / 2, y: frame.height / 2 };
  const dx = frame.width * PAN_STEP;
  const dy = frame.height * PAN_STEP;
  switch (key) {
    case 'in':
      return zoomedAbout(view, ZOOM_STEP, centre, frame);
    case 'out':
      return zoomedAbout(view, 1 / ZOOM_STEP, centre, frame);
    case 'fit':
      return zoomFit;
    // The picture moves opposite to where the person wants to look.
    case 'left':
      return pannedBy(view, dx, 0, frame);
    case 'right':
      return pannedBy(view, -dx, 0, frame);
    case 'up':
      return pannedBy(view, 0, dy, frame);
    case 'down':
      return pannedBy(view, 0, -dy, frame);
  }
}
