import { describe, expect, it } from 'vitest';
import { parseLayout, type Layout } from '../../geometry';
import jersey from '../../geometry/fixtures/jersey-with-sleeves.json';
import { openingsMoved } from '../designer/layoutEdits';
import { rememberOutlineNames, withOutlinesByName, type OutlineNames } from './outlineNames';

/** The invented jersey fixture (a 240-point traced outline) with a round patch beside it. */
function layoutWithGarment(): Layout {
  const parsed = parseLayout({
    ...jersey.layout,
    openings: [...jersey.layout.openings, { id: 'patch', shape: { kind: 'circle', radius: 1.5 }, center: { x: 20, y: 26 }, depth: 1 }],
  });
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return parsed.layout;
}

describe('outlines sent by name', () => {
  it('sends a remembered outline as its name and everything else as it is', () => {
    const layout = layoutWithGarment();
    const names: OutlineNames = new WeakMap();
    expect(withOutlinesByName(layout, names)).toBe(layout);
    rememberOutlineNames(names, layout, { jersey: 'n'.repeat(43) });
    const sent = withOutlinesByName(layout, names) as Layout & { openings: { shape: unknown }[] };
    expect(sent.openings[0]!.shape).toEqual({ kind: 'outline', pointsRef: 'n'.repeat(43) });
    expect(sent.openings[1]).toBe(layout.openings[1]);
    expect(sent.mats).toBe(layout.mats);
  });

  it('keeps the name through a move (the editor keeps the list) but not through a new list of points', () => {
    const layout = layoutWithGarment();
    const names: OutlineNames = new WeakMap();
    rememberOutlineNames(names, layout, { jersey: 'n'.repeat(43) });
    const moved = openingsMoved(layout, ['jersey'], 1.25, -0.5);
    expect((withOutlinesByName(moved, names) as { openings: { shape: unknown }[] }).openings[0]!.shape).toEqual({ kind: 'outline', pointsRef: 'n'.repeat(43) });
    const jersey = moved.openings[0]!;
    if (!('points' in jersey.shape)) throw new Error('the garment lost its points');
    const retraced = { ...moved, openings: [{ ...jersey, shape: { kind: 'outline' as const, points: jersey.shape.points.map((p) => ({ x: p.x * 1.1, y: p.y })) } }, moved.openings[1]!] };
    expect((withOutlinesByName(retraced, names) as Layout).openings[0]!.shape).toBe(retraced.openings[0]!.shape);
  });
});
