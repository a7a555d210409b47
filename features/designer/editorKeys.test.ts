import { describe, expect, it } from 'vitest';
import { keyAction } from './useEditorKeys.web';

const key = (k: string, mods: Partial<Pick<KeyboardEvent, 'ctrlKey' | 'metaKey' | 'shiftKey'>> = {}) =>
  ({ key: k, ctrlKey: false, metaKey: false, shiftKey: false, ...mods }) as KeyboardEvent;

describe('keyboard shortcuts', () => {
  it('Ctrl+Z and Cmd+Z undo; with Shift, or Ctrl+Y, they redo', () => {
    expect(keyAction(key('z', { ctrlKey: true }))).toEqual({ type: 'undo' });
    expect(keyAction(key('z', { metaKey: true }))).toEqual({ type: 'undo' });
    expect(keyAction(key('Z', { ctrlKey: true, shiftKey: true }))).toEqual({ type: 'redo' });
    expect(keyAction(key('y', { ctrlKey: true }))).toEqual({ type: 'redo' });
  });

  it('arrows nudge by one rounding step, and by whole inches with Shift', () => {
    expect(keyAction(key('ArrowLeft'))).toEqual({ type: 'nudge', dx: -1, dy: 0, inches: false });
    expect(keyAction(key('ArrowDown', { shiftKey: true }))).toEqual({ type: 'nudge', dx: 0, dy: 1, inches: true });
  });

  it('Delete removes, Escape lets go of the selection, other keys do nothing', () => {
    expect(keyAction(key('Delete'))).toEqual({ type: 'remove' });
    expect(keyAction(key('Escape'))).toEqual({ type: 'select', ids: [] });
    expect(keyAction(key('q'))).toBeNull();
  });
});
