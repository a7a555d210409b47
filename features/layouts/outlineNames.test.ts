import { describe, expect, it } from 'vitest';
import { parseLayout, type Layout } from '../../geometry';
import { openingsMoved } from '../designer/layoutEdits';
import { rememberOutlineNames, withOutlinesByName, type OutlineNames } from './outlineNames';

function layoutWithGarment(): Layout {
  const points = Array.from({ length: 40 }, (_, i) => ({ x: 5 * Math.cos((2 * Math.PI * i) / 40), y: 7 * Math.sin((2 * Math.PI * i) / 40) }));
  const parsed = parseLayout({
    schemaVersion: 2,
    outer: { width: 24, height: 30 },
    mats: [{ id: 'top', name: 'Top', color: '#1f3a5c', coreColor: '#f4f1e8', ply: 4, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } }],
    mountingBoard: { color: '#ffffff', cut: false },
    openings: [
      { id: 'jersey', shape: { kind: 'outline', points }, center: { x: 12, y: 14 }, depth: 1 },
      { id: 'patch', shape: { kind: 'circle', radius: 1.5 }, center: { x: 20, y: 26 }, depth: 1 },
    ],
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
