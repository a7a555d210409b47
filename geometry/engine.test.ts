import { describe, expect, it } from 'vitest';
import { createLayoutEngine } from './engine';
import { parseLayout } from './layout';
import type { Layout } from './layoutSchema';
import { openingLines, openingLinesLocal, openingLinesLocalSteps } from './openingLines';
import { workDone } from './workSteps';
import jersey from './fixtures/jersey-with-sleeves.json';
import twoPatches from './fixtures/two-patches-half-inch-bridge.json';
import selfIntersecting from './fixtures/self-intersecting-outline.json';

function layoutFrom(fixture: { layout: unknown }): Layout {
  const result = parseLayout(fixture.layout);
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.layout;
}

describe('engine: lines prepared one opening at a time', () => {
  for (const [name, fixture] of [['jersey-with-sleeves', jersey], ['two-patches-half-inch-bridge', twoPatches]] as const) {
    it(`${name}: each prepared opening's lines are the ones lines() then draws, equal to lines cut from scratch`, () => {
      const layout = layoutFrom(fixture);
      const engine = createLayoutEngine();
      const prepared = new Map(layout.openings.map((o) => [o.id, workDone(engine.prepareLines(layout, o.id))] as const));
      const drawn = engine.lines(layout);
      expect([...drawn.keys()].sort()).toEqual(layout.openings.map((o) => o.id).sort());
      for (const opening of layout.openings) {
        // Handed over, not cut again: the very object prepareLines made.
        expect(drawn.get(opening.id)).toBe(prepared.get(opening.id));
        // No outside value here: the reference is openingLines(), the same cut with no engine in between.
        expect(drawn.get(opening.id)).toEqual(openingLines(opening, layout.mats));
      }
    });
  }

  it('an opening whose outline crosses itself has no lines, as lines() leaves it out', () => {
    const layout = layoutFrom(selfIntersecting);
    const engine = createLayoutEngine();
    const crossing = layout.openings.find((o) => !engine.lines(layout).has(o.id));
    expect(crossing?.shape.kind).toBe('outline');
    expect(workDone(engine.prepareLines(layout, crossing!.id))).toBeNull();
  });

  it('an id the layout does not hold gives null', () => {
    const layout = layoutFrom(twoPatches);
    expect(workDone(createLayoutEngine().prepareLines(layout, 'no-such-opening'))).toBeNull();
  });

  it('lines() keeps prepared lines after a check() in between, and the checks still see every opening', () => {
    const layout = layoutFrom(twoPatches);
    const engine = createLayoutEngine();
    const first = layout.openings[0]!;
    const prepared = workDone(engine.prepareLines(layout, first.id));
    // The fixture's own expectation (a half-inch bridge between the patches) is unchanged by preparing.
    expect(engine.check(layout)).toEqual(createLayoutEngine({ cache: false }).check(layout));
    expect(engine.lines(layout).get(first.id)).toBe(prepared);
  });
});

describe('opening lines in steps', () => {
  it('a garment window through two mats stops between its offsets and ends with the same lines as at once', () => {
    const layout = layoutFrom(jersey);
    const garment = layout.openings.find((o) => o.shape.kind === 'outline')!;
    const steps = openingLinesLocalSteps(garment, layout.mats);
    let stops = 0;
    let step = steps.next();
    for (; !step.done; step = steps.next()) stops += 1;
    // Three offsets make the garment window (clearance and smoothing) and each mat one or two more, one stop between each.
    expect(stops).toBeGreaterThanOrEqual(3 + Math.min(garment.depth, layout.mats.length));
    // No outside value: the reference is the same function run to the end at once.
    expect(step.value).toEqual(openingLinesLocal(garment, layout.mats));
  });

  it('an engine with lines already remembered hands them over without stopping', () => {
    const layout = layoutFrom(jersey);
    const engine = createLayoutEngine();
    const drawn = engine.lines(layout);
    const id = layout.openings[0]!.id;
    const again = engine.prepareLines(layout, id).next();
    expect(again.done).toBe(true);
    expect(again.value).toBe(drawn.get(id));
  });
});
