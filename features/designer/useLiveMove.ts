import { useCallback, useRef, useState, useSyncExternalStore, type Dispatch } from 'react';
import type { Layout } from '../../geometry';
import type { EditorAction, EditorState } from './editorState';
import { editorReducer } from './editorState';

/** The state a drag has reached in the canvas, for the few parts of it that follow the pointer. */
export interface LiveMove {
  /** The copy of the state the last move reached, or null when no drag is under way. */
  readonly get: () => EditorState | null;
  readonly subscribe: (listener: () => void) => () => void;
}

export function createLiveMove(): LiveMove & { set: (next: EditorState | null) => void } {
  let current: EditorState | null = null;
  const listeners = new Set<() => void>();
  return {
    get: () => current,
    set: (next) => {
      if (next === current) return;
      current = next;
      for (const listener of listeners) listener();
    },
    subscribe: (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };
}

/**
 * The moves of a drag kept by the canvas itself: each pointer move runs the
 * same editing reducer on a copy of the state the canvas draws from and
 * tells only the parts that subscribe (`useShownState`), so neither the
 * designer around the canvas nor the canvas's own frame is drawn again.
 * Letting go hands the layout the drag reached (the same object, so checks
 * already asked about it count) and the end of the drag to the designer's
 * own state, which records one undo step. `onMove` hears every layout the
 * drag passes through, with `letGo` on the last. Resizes and everything
 * else go straight through.
 */
export function useLiveMove(state: EditorState, dispatch: Dispatch<EditorAction>, onMove?: (layout: Layout, letGo: boolean) => void): {
  live: LiveMove;
  canvasDispatch: Dispatch<EditorAction>;
} {
  const [store] = useState(createLiveMove);
  const current = useRef(state);
  current.current = state;
  const moved = useRef(onMove);
  moved.current = onMove;

  const canvasDispatch = useCallback((action: EditorAction) => {
    const base = current.current;
    const reached = store.get();
    if (action.type === 'gestureMove' && base.gesture?.kind === 'move') {
      const from = reached?.gesture === base.gesture ? reached : base;
      const next = editorReducer(from, action);
      store.set(next);
      moved.current?.(next.layout, false);
      return;
    }
    if (action.type === 'gestureEnd' || action.type === 'gestureCancel') {
      if (action.type === 'gestureEnd' && reached && reached.gesture === base.gesture) {
        dispatch({ type: 'gestureMoved', layout: reached.layout, guides: reached.guides });
        moved.current?.(reached.layout, true);
      }
      store.set(null);
    }
    dispatch(action);
  }, [dispatch, store]);

  return { live: store, canvasDispatch };
}

/** The state to draw: the drag's copy while the designer's state is still in the same drag, otherwise the designer's own. */
export function shownState(reached: EditorState | null, state: EditorState): EditorState {
  return reached && state.gesture && reached.gesture === state.gesture ? reached : state;
}

/** `shownState`, drawn again on every move the drag's copy reaches. */
export function useShownState(live: LiveMove, state: EditorState): EditorState {
  return shownState(useSyncExternalStore(live.subscribe, live.get, live.get), state);
}
