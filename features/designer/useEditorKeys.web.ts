import { useEffect, type Dispatch } from 'react';
import type { EditorAction } from './editorState';

const ARROWS: Record<string, [number, number]> = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, -1], ArrowDown: [0, 1] };

function isTyping(target: EventTarget | null): boolean {
  const element = target as HTMLElement | null;
  return !!element && (element.tagName === 'INPUT' || element.tagName === 'TEXTAREA' || element.isContentEditable);
}

/** The action a key press asks for, or null; typing in a field is left alone. */
export function keyAction(event: KeyboardEvent): EditorAction | null {
  const command = event.ctrlKey || event.metaKey;
  const key = event.key.toLowerCase();
  if (command && key === 'z') return { type: event.shiftKey ? 'redo' : 'undo' };
  if (command && key === 'y') return { type: 'redo' };
  if (command && key === 'd') return { type: 'duplicate' };
  const arrow = ARROWS[event.key];
  if (arrow && !command) return { type: 'nudge', dx: arrow[0], dy: arrow[1], inches: event.shiftKey };
  if (event.key === 'Delete' || event.key === 'Backspace') return { type: 'remove' };
  if (event.key === 'Escape') return { type: 'select', ids: [] };
  return null;
}

/** Undo, redo, nudge, duplicate and delete from the keyboard while the designer is open. */
export function useEditorKeys(dispatch: Dispatch<EditorAction>, editable: boolean): void {
  useEffect(() => {
    const down = (event: KeyboardEvent) => {
      if (isTyping(event.target)) return;
      const action = keyAction(event);
      if (!action || (!editable && action.type !== 'select')) return;
      event.preventDefault();
      dispatch(action);
    };
    window.addEventListener('keydown', down);
    return () => window.removeEventListener('keydown', down);
  }, [dispatch, editable]);
}
