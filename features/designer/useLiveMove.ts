import { useCallback, useRef, useState, type Dispatch } from 'react';
import type { Layout } from '../../geometry';
import type { EditorAction, EditorState } from './editorState';
import { editorReducer } from './editorState';

/**
 * The moves of a drag kept by the canvas itself: each pointer move runs the
 * same editing reducer on a copy of the state the canvas draws from, so
 * only the canvas is drawn again, not the designer around it. Letting go
 * hands the layout the drag reached (the same object, so checks already
 * asked about it count) and the end of the drag to the designer's own
 * state, which records one undo step. `onMove` hears every layout the drag
 * passes through, with `letGo` on the last. Resizes and everything else go
 * straight through.
 */
export function useLiveMove(state: EditorState, dispatch: Dispatch<EditorAction>, onMove?: (layout: Layout, letGo: boolean) => void): {
  shown: EditorState;
  canvasDispatch: Dispatch<EditorAction>;
} {
  const [live, setLive] = useState<EditorState | null>(null);
  const current = useRef(state);
  current.current = state;
  const liveRef = useRef<EditorState | null>(null);
  const moved = useRef(onMove);
  moved.current = onMove;

  const canvasDispatch = useCallback((action: EditorAction) => {
    const base = current.current;
    if (action.type === 'gestureMove' && base.gesture?.kind === 'move') {
      const from = liveRef.current?.gesture === base.gesture ? liveRef.current : base;
      const next = editorReducer(from, action);
      liveRef.current = next;
      setLive(next);
      moved.current?.(next.layout, false);
      return;
    }
    if (action.type === 'gestureEnd' || action.type === 'gestureCancel') {
      const reached = liveRef.current;
      if (action.type === 'gestureEnd' && reached && reached.gesture === base.gesture) {
        dispatch({ type: 'gestureMoved', layout: reached.layout, guides: reached.guides });
        moved.current?.(reached.layout, true);
      }
      liveRef.current = null;
      setLive(null);
    }
    dispatch(action);
  }, [dispatch]);

  // The copy only counts while the designer's state is still in the same drag.
  const shown = live && state.gesture && live.gesture === state.gesture ? live : state;
  return { shown, canvasDispatch };
}
