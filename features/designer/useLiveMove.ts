import { useCallback, useRef, useState, type Dispatch } from 'react';
import type { Layout } from '../../geometry';
import type { EditorAction, EditorState } from './editorState';
import { editorReducer } from './editorState';

/**
 * The moves of a drag kept by the canvas itself: each pointer move runs the
 * same editing reducer on a copy of the state the canvas draws from, so
 * only the canvas is drawn again, not the designer around it. Letting go
 * hands the last move and the end of the drag to the designer's own state,
 * where the reducer reaches the very same layout and records one undo step.
 * Resizes and everything else go straight through.
 */
export function useLiveMove(state: EditorState, dispatch: Dispatch<EditorAction>, onMove?: (layout: Layout) => void): {
  shown: EditorState;
  canvasDispatch: Dispatch<EditorAction>;
} {
  const [live, setLive] = useState<EditorState | null>(null);
  const current = useRef(state);
  current.current = state;
  const liveRef = useRef<EditorState | null>(null);
  const lastMove = useRef<EditorAction | null>(null);
  const moved = useRef(onMove);
  moved.current = onMove;

  const canvasDispatch = useCallback((action: EditorAction) => {
    const base = current.current;
    if (action.type === 'gestureMove' && base.gesture?.kind === 'move') {
      const from = liveRef.current?.gesture === base.gesture ? liveRef.current : base;
      const next = editorReducer(from, action);
      liveRef.current = next;
      lastMove.current = action;
      setLive(next);
      moved.current?.(next.layout);
      return;
    }
    if (action.type === 'gestureEnd' || action.type === 'gestureCancel') {
      if (action.type === 'gestureEnd' && lastMove.current) dispatch(lastMove.current);
      liveRef.current = null;
      lastMove.current = null;
      setLive(null);
    }
    dispatch(action);
  }, [dispatch]);

  // The copy only counts while the designer's state is still in the same drag.
  const shown = live && state.gesture && live.gesture === state.gesture ? live : state;
  return { shown, canvasDispatch };
}
