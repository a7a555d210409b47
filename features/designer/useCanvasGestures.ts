import { useRef, type Dispatch } from 'react';
import type { PointerEvent } from 'react-native';
import type { BoardPoint, Layout, OpeningLines } from '../../geometry';
import { capturePointer, pointerInView } from './canvasPointer';
import { handleAt, openingAt } from './canvasHits';
import type { EditorAction, EditorState } from './editorState';
import type { CanvasView } from './useCanvasView';
import type { ScreenPoint } from './viewTransform';
import { screenLengthInches, screenToBoard } from './viewTransform';

/** An edge this many pixels from a line jumps to it. */
const SNAP_REACH_PX = 8;

type Mode = 'none' | 'pan' | 'edit' | 'pinch';

interface Options {
  state: EditorState;
  lines: ReadonlyMap<string, OpeningLines>;
  dispatch: Dispatch<EditorAction>;
  canvas: CanvasView;
  editable: boolean;
}

function spread(points: ScreenPoint[]): { distance: number; mid: ScreenPoint } {
  const [a, b] = points as [ScreenPoint, ScreenPoint];
  return { distance: Math.hypot(a.sx - b.sx, a.sy - b.sy), mid: { sx: (a.sx + b.sx) / 2, sy: (a.sy + b.sy) / 2 } };
}

/**
 * Pointer handling for the canvas: one finger or the mouse selects, drags a
 * opening or one of its handles, or pans empty board; two fingers pinch to
 * zoom. Moves reach the editor at most once per animation frame.
 */
export function useCanvasGestures({ state, lines, dispatch, canvas, editable }: Options) {
  const pointers = useRef(new Map<number, ScreenPoint>());
  const mode = useRef<Mode>('none');
  const pinch = useRef<{ distance: number; mid: ScreenPoint } | null>(null);
  const pending = useRef<{ at: BoardPoint; free: boolean } | null>(null);
  const frame = useRef<number | null>(null);
  const live = useRef({ state, lines, canvas });
  live.current = { state, lines, canvas };

  const flushMove = () => {
    frame.current = null;
    const move = pending.current;
    const view = live.current.canvas.view;
    if (!move || !view) return;
    pending.current = null;
    dispatch({ type: 'gestureMove', at: move.at, tolerance: move.free ? 0 : screenLengthInches(view, SNAP_REACH_PX) });
  };

  const startOne = (at: ScreenPoint, shift: boolean) => {
    const { state: s, lines: l, canvas: c } = live.current;
    if (!c.view) return;
    const board = screenToBoard(c.view, at);
    const only = s.selection.length === 1 ? s.layout.openings.find((o) => o.id === s.selection[0]) : undefined;
    const handle = editable && only ? handleAt(only, c.view, at) : null;
    if (handle && only) {
      dispatch({ type: 'resizeStart', id: only.id, handle });
      mode.current = 'edit';
      return;
    }
    const hit = openingAt(s.layout, l, board);
    if (hit && shift) {
      dispatch({ type: 'toggleSelect', id: hit });
      mode.current = 'none';
    } else if (hit && editable) {
      dispatch({ type: 'moveStart', ids: s.selection.includes(hit) ? s.selection : [hit], at: board });
      mode.current = 'edit';
    } else {
      dispatch({ type: 'select', ids: hit ? [hit] : [] });
      mode.current = 'pan';
    }
  };

  const onPointerDown = (event: PointerEvent) => {
    const p = pointerInView(event);
    capturePointer(event);
    pointers.current.set(p.id, p);
    if (pointers.current.size === 2) {
      if (mode.current === 'edit') dispatch({ type: 'gestureCancel' });
      mode.current = 'pinch';
      pinch.current = spread([...pointers.current.values()]);
      return;
    }
    if (pointers.current.size === 1) startOne(p, p.shift);
  };

  const onPointerMove = (event: PointerEvent) => {
    const p = pointerInView(event);
    const before = pointers.current.get(p.id);
    if (!before) return;
    pointers.current.set(p.id, p);
    const c = live.current.canvas;
    if (mode.current === 'pan') c.panBy(p.sx - before.sx, p.sy - before.sy);
    else if (mode.current === 'pinch' && pinch.current && pointers.current.size === 2) {
      const next = spread([...pointers.current.values()]);
      c.panBy(next.mid.sx - pinch.current.mid.sx, next.mid.sy - pinch.current.mid.sy);
      c.zoomBy(next.distance / Math.max(1, pinch.current.distance), next.mid);
      pinch.current = next;
    } else if (mode.current === 'edit' && c.view) {
      pending.current = { at: screenToBoard(c.view, p), free: p.alt };
      frame.current ??= requestAnimationFrame(flushMove);
    }
  };

  const onPointerUp = (event: PointerEvent) => {
    const p = pointerInView(event);
    pointers.current.delete(p.id);
    if (mode.current === 'edit') {
      if (frame.current !== null) cancelAnimationFrame(frame.current);
      flushMove();
      dispatch({ type: 'gestureEnd' });
    }
    mode.current = pointers.current.size === 0 ? 'none' : mode.current === 'pinch' ? 'pan' : mode.current;
    if (pointers.current.size < 2) pinch.current = null;
  };

  return { onPointerDown, onPointerMove, onPointerUp, onPointerCancel: onPointerUp };
}
