import { describe, expect, it } from 'vitest';
import type { Finding, Layout, Mat, Opening } from '../../geometry';
import { createEditorState, editorReducer, type EditorAction, type EditorState } from './editorState';
import { findingsKept } from './keptFindings';
import { drawnLayout, movingShift, sameShiftKept, shiftTransform } from './movingShift';
import { samePanelReads, type PanelInputs } from './panelReads';
import { guidesSame } from './snapping';
import { createLiveMove, shownState } from './useLiveMove';

// What is kept between pointer moves must never be kept past a change: each check below
// makes the value change and expects the new one, so a memo that serves a stale value fails.
// (React's memo and useMemo skip work only when every input is the same by Object.is: react.dev/reference/react/memo.)

const sheet = { width: 32, height: 40 };
const mat = (id: string): Mat => ({ id, name: id, color: '#1D2B4A', coreColor: '#FFFFFF', ply: 4, thickness: 0.055, bevelAngle: 45, sheet });
const patch: Opening = { id: 'patch', shape: { kind: 'circle', radius: 2 }, center: { x: 6.5, y: 30.5 }, rotation: 0, depth: 1, clearance: 0, reveals: [] };
const photo: Opening = { id: 'photo', shape: { kind: 'rectangle', width: 9.5, height: 7.5 }, center: { x: 16, y: 30.5 }, rotation: 0, depth: 1, clearance: 0, reveals: [] };
const layout: Layout = {
  schemaVersion: 2,
  outer: { width: 32, height: 40 },
  mats: [mat('top')],
  mountingBoard: { color: '#FFFFFF', cut: false },
  openings: [patch, photo],
  checkSettings: { bridgeWarning: 0.5, bridgeError: 0.25, minimumBand: 1 / 16, minimumOverlap: 1 / 8, rabbetAllowance: 1 / 8 },
};
const SIXTEENTH = 1 / 16;
const run = (actions: EditorAction[], start: EditorState = createEditorState(layout, SIXTEENTH, 0.25)) => actions.reduce(editorReducer, start);
// Free moves (tolerance 0): the opening lands on the sixteenth nearest the pointer.
const to = (x: number): EditorAction => ({ type: 'gestureMove', at: { x, y: 30.5 }, tolerance: 0 });

describe('the shift of a dragged opening', () => {
  const started = run([{ type: 'moveStart', ids: ['patch'], at: { x: 6.5, y: 30.5 } }]);

  it('stays the same object while moves land on the same sixteenth, and follows a move to the next one', () => {
    const first = movingShift(editorReducer(started, to(6.52)));
    const sameStep = movingShift(editorReducer(started, to(6.53)));
    expect(first).toEqual({ ids: ['patch'], dx: 0, dy: 0 });
    expect(sameShiftKept(first, sameStep)).toBe(first);
    const nextStep = movingShift(editorReducer(started, to(6.5 + SIXTEENTH)));
    const kept = sameShiftKept(first, nextStep);
    expect(kept).not.toBe(first);
    expect(kept).toEqual({ ids: ['patch'], dx: SIXTEENTH, dy: 0 });
    expect(shiftTransform(kept, 'patch')).toBe(`translate(${SIXTEENTH} 0)`);
  });

  it('shifts only the dragged openings, and nothing once the drag is over', () => {
    const moved = editorReducer(started, to(7.5));
    expect(shiftTransform(movingShift(moved), 'photo')).toBeUndefined();
    expect(shiftTransform(movingShift(moved), 'patch')).toBe('translate(1 0)');
    const ended = editorReducer(moved, { type: 'gestureEnd' });
    expect(movingShift(ended)).toBeNull();
    expect(sameShiftKept(movingShift(moved), movingShift(ended))).toBeNull();
  });

  it('draws the mats from the layout before the drag while it lasts, and from the moved layout after it', () => {
    const moved = editorReducer(started, to(7.5));
    expect(drawnLayout(moved)).toBe(layout);
    const ended = editorReducer(moved, { type: 'gestureEnd' });
    expect(drawnLayout(ended)).toBe(ended.layout);
    expect(drawnLayout(ended).openings[0]!.center).toEqual({ x: 7.5, y: 30.5 });
  });
});

describe("the canvas's own copy of a drag", () => {
  it('is shown only while the designer is still in the drag it came from', () => {
    const first = run([{ type: 'moveStart', ids: ['patch'], at: { x: 6.5, y: 30.5 } }]);
    const reached = editorReducer(first, to(8));
    expect(shownState(reached, first)).toBe(reached);
    // The designer let go and started another drag: the old copy is stale and the designer's state is drawn.
    const second = run([{ type: 'gestureEnd' }, { type: 'moveStart', ids: ['photo'], at: { x: 16, y: 30.5 } }], first);
    expect(shownState(reached, second)).toBe(second);
    expect(shownState(null, second)).toBe(second);
  });

  it('tells its listeners of each new state reached, and of none that is the same', () => {
    const live = createLiveMove();
    const heard: (EditorState | null)[] = [];
    const stop = live.subscribe(() => heard.push(live.get()));
    const reached = run([{ type: 'moveStart', ids: ['patch'], at: { x: 6.5, y: 30.5 } }, to(8)]);
    live.set(reached);
    live.set(reached);
    live.set(null);
    stop();
    live.set(reached);
    expect(heard).toEqual([reached, null]);
  });
});

describe('snap lines', () => {
  it('are the same only when every line is on the same axis at the same place', () => {
    expect(guidesSame([{ axis: 'x', at: 16 }], [{ axis: 'x', at: 16 }])).toBe(true);
    expect(guidesSame([{ axis: 'x', at: 16 }], [{ axis: 'x', at: 16.0625 }])).toBe(false);
    expect(guidesSame([{ axis: 'x', at: 16 }], [{ axis: 'y', at: 16 }])).toBe(false);
    expect(guidesSame([{ axis: 'x', at: 16 }], [])).toBe(false);
  });
});

describe('findings kept between answers of the checks', () => {
  const bridge: Finding = {
    code: 'bridge-narrow', severity: 'warning', message: 'The bridge between opening 1 and opening 2 is 3/8" wide.',
    at: { x: 11, y: 30.5 }, measured: 0.375, required: 0.5, openingIds: ['patch', 'photo'],
  };
  const copy = (f: Finding): Finding => JSON.parse(JSON.stringify(f)) as Finding;

  it('keeps the list shown when an answer says the same things at the same places', () => {
    const shown = [bridge];
    expect(findingsKept(shown, [copy(bridge)])).toBe(shown);
  });

  it('takes the new list when a measure, a message, a place or the number of findings changes', () => {
    const shown = [bridge];
    const narrower = { ...copy(bridge), measured: 0.3125, message: 'The bridge between opening 1 and opening 2 is 5/16" wide.' };
    expect(findingsKept(shown, [narrower])).toEqual([narrower]);
    const moved = { ...copy(bridge), at: { x: 11.0625, y: 30.5 } };
    expect(findingsKept(shown, [moved])).toEqual([moved]);
    expect(findingsKept(shown, [])).toEqual([]);
    expect(findingsKept(shown, [copy(bridge), copy(bridge)])).toHaveLength(2);
  });
});

describe('what each panel reads', () => {
  const inputs = { jobId: 'j', layoutId: 'l', settled: layout, drawn: layout, findings: [], selection: [], dispatch: () => undefined } as unknown as PanelInputs;

  it('new findings redraw the checks and versions panels, not the tools column', () => {
    const answered = { ...inputs, findings: [] };
    expect(samePanelReads(['add', 'arrange'], inputs, answered)).toBe(true);
    expect(samePanelReads(['checks'], inputs, answered)).toBe(false);
    expect(samePanelReads(['versions'], inputs, answered)).toBe(false);
  });

  it('a changed layout redraws the panels that show it', () => {
    const edited = { ...inputs, settled: { ...layout } };
    expect(samePanelReads(['add'], inputs, edited)).toBe(false);
    expect(samePanelReads(['mats'], inputs, edited)).toBe(false);
    expect(samePanelReads(['arrange', 'checks'], inputs, edited)).toBe(true);
  });
});
