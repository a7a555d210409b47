import { describe, expect, it } from 'vitest';
import type { Layout, Mat, Opening } from '../../geometry';
import type { EditorAction, EditorState } from './editorState';
import { canRedo, canUndo, createEditorState, editorReducer } from './editorState';

const sheet = { width: 32, height: 40 };
const mat = (id: string, color: string): Mat => ({ id, name: id, color, coreColor: '#FFFFFF', ply: 4, thickness: 0.055, bevelAngle: 45, sheet });

const square: Opening = { id: 'square', shape: { kind: 'rectangle', width: 4, height: 4 }, center: { x: 10, y: 10 }, rotation: 0, depth: 1, clearance: 0, reveals: [] };
const patch: Opening = { id: 'patch', shape: { kind: 'circle', radius: 1 }, center: { x: 20, y: 30 }, rotation: 0, depth: 1, clearance: 0, reveals: [] };

const layout: Layout = {
  schemaVersion: 2,
  outer: { width: 32, height: 40 },
  mats: [mat('top', '#1D2B4A'), mat('middle', '#A3232B')],
  mountingBoard: { color: '#FFFFFF', cut: false },
  openings: [square, patch],
  checkSettings: { bridgeWarning: 0.5, bridgeError: 0.25, minimumBand: 1 / 16, minimumOverlap: 1 / 8, rabbetAllowance: 1 / 8 },
};

const SIXTEENTH = 1 / 16;

function run(actions: EditorAction[], start: EditorState = createEditorState(layout, SIXTEENTH, 0.25)): EditorState {
  return actions.reduce(editorReducer, start);
}

const openingOf = (state: EditorState, id: string) => state.layout.openings.find((o) => o.id === id)!;

describe('undo and redo', () => {
  it('undo takes back an added opening and redo puts it back', () => {
    const added = run([{ type: 'add', opening: { ...patch, id: 'extra' } }]);
    expect(added.layout.openings.map((o) => o.id)).toEqual(['square', 'patch', 'extra']);
    expect(added.selection).toEqual(['extra']);
    const undone = editorReducer(added, { type: 'undo' });
    expect(undone.layout).toBe(layout);
    expect(canRedo(undone)).toBe(true);
    const redone = editorReducer(undone, { type: 'redo' });
    expect(redone.layout.openings.map((o) => o.id)).toEqual(['square', 'patch', 'extra']);
  });

  it('a new change after undo drops the redo steps', () => {
    const state = run([{ type: 'select', ids: ['square'] }, { type: 'nudge', dx: 1, dy: 0 }, { type: 'undo' }, { type: 'nudge', dx: 0, dy: 1 }]);
    expect(canRedo(state)).toBe(false);
    expect(openingOf(state, 'square').center).toEqual({ x: 10, y: 10 + SIXTEENTH });
  });

  it('undo and redo keep the chosen window chosen, so its read-out stays', () => {
    const moved = run([{ type: 'select', ids: ['square'] }, { type: 'nudge', dx: 1, dy: 0 }, { type: 'patch', id: 'square', changes: { rotation: 15 } }]);
    const undone = editorReducer(moved, { type: 'undo' });
    expect(undone.selection).toEqual(['square']);
    expect(openingOf(undone, 'square').rotation).toBe(0);
    const twice = editorReducer(undone, { type: 'undo' });
    expect(twice.selection).toEqual(['square']);
    expect(openingOf(twice, 'square').center).toEqual(square.center);
    expect(editorReducer(twice, { type: 'redo' }).selection).toEqual(['square']);
  });

  it('undoing a removal brings the removed window back chosen; undoing an addition chooses what was chosen before', () => {
    const removed = run([{ type: 'select', ids: ['patch'] }, { type: 'remove' }]);
    expect(removed.selection).toEqual([]);
    expect(editorReducer(removed, { type: 'undo' }).selection).toEqual(['patch']);
    const added = run([{ type: 'select', ids: ['square'] }, { type: 'add', opening: { ...patch, id: 'extra' } }]);
    const undone = editorReducer(added, { type: 'undo' });
    expect(undone.selection).toEqual(['square']);
    expect(editorReducer(undone, { type: 'redo' }).selection).toEqual(['square']);
  });

  it('undo with nothing to undo leaves the state as it is', () => {
    const start = createEditorState(layout, SIXTEENTH, 0.25);
    expect(editorReducer(start, { type: 'undo' })).toBe(start);
    expect(canUndo(start)).toBe(false);
  });

  it('a replaced document keeps the edited one in the undo history', () => {
    const mine = run([{ type: 'select', ids: ['patch'] }, { type: 'remove' }]);
    const theirs: Layout = { ...layout, outer: { width: 30, height: 38 } };
    const replaced = editorReducer(mine, { type: 'replace', layout: theirs });
    expect(replaced.layout).toBe(theirs);
    expect(editorReducer(replaced, { type: 'undo' }).layout).toBe(mine.layout);
  });
});

describe('dragging', () => {
  it('a drag of many moves is one undo step back to where it started', () => {
    const dragged = run([
      { type: 'moveStart', ids: ['patch'], at: { x: 20, y: 30 } },
      { type: 'gestureMove', at: { x: 21, y: 30 }, tolerance: 0 },
      { type: 'gestureMove', at: { x: 22, y: 31 }, tolerance: 0 },
      { type: 'gestureMove', at: { x: 23, y: 32 }, tolerance: 0 },
      { type: 'gestureEnd' },
    ]);
    expect(openingOf(dragged, 'patch').center).toEqual({ x: 23, y: 32 });
    expect(dragged.past).toHaveLength(1);
    expect(editorReducer(dragged, { type: 'undo' }).layout).toBe(layout);
  });

  it('a drag that ends where it started adds no undo step', () => {
    const state = run([
      { type: 'moveStart', ids: ['patch'], at: { x: 20, y: 30 } },
      { type: 'gestureMove', at: { x: 25, y: 30 }, tolerance: 0 },
      { type: 'gestureMove', at: { x: 20, y: 30 }, tolerance: 0 },
      { type: 'gestureEnd' },
    ]);
    expect(state.past).toHaveLength(0);
    expect(state.layout).toBe(layout);
  });

  it('a drag worked out on a copy and handed over on letting go keeps that very layout as one undo step', () => {
    const started = run([{ type: 'moveStart', ids: ['patch'], at: { x: 20, y: 30 } }]);
    // The canvas runs the moves on its own copy of the state (common practice for a light drag), then hands over what it reached.
    const copy = [
      { type: 'gestureMove', at: { x: 21, y: 30 }, tolerance: 0 },
      { type: 'gestureMove', at: { x: 23, y: 32 }, tolerance: 0 },
    ] satisfies EditorAction[];
    const reached = copy.reduce(editorReducer, started);
    const ended = run([{ type: 'gestureMoved', layout: reached.layout, guides: reached.guides }, { type: 'gestureEnd' }], started);
    expect(ended.layout).toBe(reached.layout);
    expect(openingOf(ended, 'patch').center).toEqual({ x: 23, y: 32 });
    expect(ended.past).toHaveLength(1);
    expect(ended.gesture).toBeNull();
    expect(editorReducer(ended, { type: 'undo' }).layout).toBe(layout);
    // Without a drag in progress there is nothing to hand over to.
    expect(editorReducer(ended, { type: 'gestureMoved', layout: started.layout, guides: [] })).toBe(ended);
  });

  it('a cancelled drag puts the window back', () => {
    const state = run([{ type: 'moveStart', ids: ['patch'], at: { x: 20, y: 30 } }, { type: 'gestureMove', at: { x: 5, y: 5 }, tolerance: 0 }, { type: 'gestureCancel' }]);
    expect(state.layout).toBe(layout);
    expect(state.gesture).toBeNull();
  });

  it('undo waits until the drag has ended', () => {
    const state = run([{ type: 'select', ids: ['square'] }, { type: 'nudge', dx: 1, dy: 0 }, { type: 'moveStart', ids: ['patch'], at: { x: 20, y: 30 } }, { type: 'undo' }]);
    expect(openingOf(state, 'square').center.x).toBe(10 + SIXTEENTH);
  });
});

describe('snapping', () => {
  it('a dragged window lands with its centre on the rounding step', () => {
    // 20 + 1.03 = 21.03 is nearest 21 in sixteenths; 30 + 0.47 = 30.47 is nearest 30 1/2.
    const state = run([{ type: 'moveStart', ids: ['patch'], at: { x: 20, y: 30 } }, { type: 'gestureMove', at: { x: 21.03, y: 30.47 }, tolerance: 0 }]);
    expect(openingOf(state, 'patch').center).toEqual({ x: 21, y: 30.5 });
  });

  it("a dragged opening's edge jumps to another opening's edge within the tolerance and shows a guide", () => {
    // The square's right edge is at x = 12; the patch's left edge ends up 0.1 in short of it.
    const state = run([{ type: 'moveStart', ids: ['patch'], at: { x: 20, y: 30 } }, { type: 'gestureMove', at: { x: 12.9, y: 30 }, tolerance: 0.2 }]);
    expect(openingOf(state, 'patch').center.x).toBeCloseTo(13, 9);
    expect(state.guides).toContainEqual({ axis: 'x', at: 12 });
  });

  it('a dragged window jumps to the layout centre line', () => {
    const state = run([{ type: 'moveStart', ids: ['patch'], at: { x: 20, y: 30 } }, { type: 'gestureMove', at: { x: 16.15, y: 30 }, tolerance: 0.2 }]);
    expect(openingOf(state, 'patch').center.x).toBe(16);
    expect(state.guides).toContainEqual({ axis: 'x', at: 16 });
  });

  it('resizing from the right handle keeps the left edge and rounds the width to the step', () => {
    const state = run([{ type: 'resizeStart', id: 'square', handle: 'e' }, { type: 'gestureMove', at: { x: 13.01, y: 10 }, tolerance: 0 }, { type: 'gestureEnd' }]);
    const resized = openingOf(state, 'square');
    // The left edge stays at 8; 13.01 - 8 = 5.01 rounds to 5.
    expect(resized.shape).toEqual({ kind: 'rectangle', width: 5, height: 4 });
    expect(resized.center).toEqual({ x: 10.5, y: 10 });
    expect(state.past).toHaveLength(1);
  });
});

describe('nudging', () => {
  it('arrow nudges move by the shop rounding step, and by whole inches with Shift', () => {
    const state = run([{ type: 'select', ids: ['square'] }, { type: 'nudge', dx: 1, dy: 0 }, { type: 'nudge', dx: 0, dy: -1, inches: true }]);
    expect(openingOf(state, 'square').center).toEqual({ x: 10 + SIXTEENTH, y: 9 });
    expect(state.past).toHaveLength(2);
  });

  it('the nudge step follows the configured rounding', () => {
    const state = run([{ type: 'configure', step: 1 / 8, defaultReveal: 0.25 }, { type: 'select', ids: ['patch'] }, { type: 'nudge', dx: -1, dy: 0 }]);
    expect(openingOf(state, 'patch').center.x).toBe(20 - 0.125);
  });

  it('a nudge with nothing selected changes nothing', () => {
    const start = createEditorState(layout, SIXTEENTH, 0.25);
    expect(editorReducer(start, { type: 'nudge', dx: 1, dy: 0 })).toBe(start);
  });
});

describe('refused input', () => {
  it('a negative width leaves the layout unchanged and says why', () => {
    const state = run([{ type: 'patch', id: 'square', changes: { shape: { kind: 'rectangle', width: -2, height: 4 } } }]);
    expect(state.layout).toBe(layout);
    expect(state.past).toHaveLength(0);
    expect(state.refusal).toMatch(/not made/);
  });

  it('a depth beyond the stack is refused', () => {
    const state = run([{ type: 'patch', id: 'square', changes: { depth: 3 } }]);
    expect(state.layout).toBe(layout);
    expect(state.refusal).toBe('The stack has 2 mat(s); an opening cannot cut more.');
  });

  it('removing the only mat is refused', () => {
    const single: Layout = { ...layout, mats: [mat('top', '#1D2B4A')] };
    const state = run([{ type: 'removeMat', index: 0 }], createEditorState(single, SIXTEENTH, 0.25));
    expect(state.layout).toBe(single);
    expect(state.refusal).toBe('A layout needs at least one mat.');
  });
});

describe('mats and depth', () => {
  it('cutting one more mat adds a reveal of the default width', () => {
    const state = run([{ type: 'patch', id: 'square', changes: { depth: 2 } }]);
    expect(openingOf(state, 'square')).toMatchObject({ depth: 2, reveals: [0.25] });
  });

  it('removing a mat a window cuts makes the window one mat shallower', () => {
    const deep = run([{ type: 'patch', id: 'square', changes: { depth: 2, reveals: [0.375] } }, { type: 'removeMat', index: 1 }]);
    expect(deep.layout.mats.map((m) => m.id)).toEqual(['top']);
    expect(openingOf(deep, 'square')).toMatchObject({ depth: 1, reveals: [] });
    expect(openingOf(deep, 'patch')).toMatchObject({ depth: 1, reveals: [] });
  });

  it('moving a mat down swaps it with the one below', () => {
    const state = run([{ type: 'moveMat', index: 0, by: 1 }]);
    expect(state.layout.mats.map((m) => m.id)).toEqual(['middle', 'top']);
  });
});

describe('arranging', () => {
  it('duplicate copies the selection 1 in right and down under a fresh id and selects it', () => {
    const state = run([{ type: 'select', ids: ['patch'] }, { type: 'duplicate' }]);
    const copy = state.layout.openings[2]!;
    expect(copy.id).toBe('patch-1');
    expect(copy.center).toEqual({ x: 21, y: 31 });
    expect(state.selection).toEqual(['patch-1']);
  });

  it('mirror makes the second chosen window the mirror image of the first about the centre line', () => {
    const state = run([{ type: 'select', ids: ['square', 'patch'] }, { type: 'mirrorPair' }]);
    expect(openingOf(state, 'patch').center).toEqual({ x: 32 - 10, y: 10 });
    expect(openingOf(state, 'patch').shape).toEqual(square.shape);
  });

  it('mirror with one window chosen is refused', () => {
    const state = run([{ type: 'select', ids: ['square'] }, { type: 'mirrorPair' }]);
    expect(state.layout).toBe(layout);
    expect(state.refusal).toMatch(/exactly two/);
  });

  it('a quarter turn of one window swaps how it sits across and down', () => {
    const state = run([{ type: 'select', ids: ['square'] }, { type: 'turn', degrees: 90 }, { type: 'turn', degrees: 180 }]);
    expect(openingOf(state, 'square').rotation).toBe(-90);
  });

  it('delete removes the selection and clears it', () => {
    const state = run([{ type: 'select', ids: ['square'] }, { type: 'remove' }]);
    expect(state.layout.openings.map((o) => o.id)).toEqual(['patch']);
    expect(state.selection).toEqual([]);
  });
});

describe('layout limits in the designer', () => {
  it('refuses an opening past the most a layout may have, a mat past the most a stack may have, and an outer side past 120 in', () => {
    // The limits are the layout schema's own constants (MAX_OPENINGS 200, MAX_MATS 12, MAX_OUTER_SIDE_IN 120).
    const many = Array.from({ length: 200 }, (_, i) => ({ ...patch, id: `p${i}`, shape: { kind: 'circle' as const, radius: 0.1 } }));
    const full = run([{ type: 'add', opening: { ...patch, id: 'one-more' } }], createEditorState({ ...layout, openings: many }, SIXTEENTH, 0.25));
    expect(full.layout.openings).toHaveLength(200);
    expect(full.refusal).toMatch(/at most 200 openings/);
    const stack = Array.from({ length: 12 }, (_, i) => mat(`m${i}`, '#1D2B4A'));
    const deep = run([{ type: 'addMat', mat: mat('thirteenth', '#A3232B') }], createEditorState({ ...layout, mats: stack }, SIXTEENTH, 0.25));
    expect(deep.layout.mats).toHaveLength(12);
    expect(deep.refusal).toMatch(/at most 12 mats/);
    const wide = run([{ type: 'resizeOuter', width: 121, height: 40 }]);
    expect(wide.layout.outer.width).toBe(32);
    expect(wide.refusal).toMatch(/at most 120 in/);
  });
});
