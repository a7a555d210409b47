import { describe, expect, it } from 'vitest';
import { createLayoutEngine } from '../engine';
import { parseLayout } from '../layout';
import { matStackLayers, matStackPixelSize, matStackSvg } from './matStackSvg';

const mat = (id: string, color: string) => ({ id, name: id, color, coreColor: '#f6f3ea', ply: 4 as const, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } });
const parsed = parseLayout({
  schemaVersion: 2,
  outer: { width: 20, height: 24 },
  mats: [mat('top', '#1d2b4a'), mat('lower', '#b8902f')],
  mountingBoard: { color: '#ffffff', cut: false },
  openings: [
    { id: 'jersey', shape: { kind: 'rectangle', width: 8, height: 10 }, center: { x: 10, y: 10 }, depth: 2, reveals: [0.25] },
    { id: 'patch', shape: { kind: 'circle', radius: 2 }, center: { x: 10, y: 20 }, depth: 1 },
  ],
});
if (!parsed.ok) throw new Error('test layout is invalid');
const layout = parsed.layout;
const lines = createLayoutEngine().lines(layout);
const rings = (d: string) => (d.match(/M/g) ?? []).length;

describe('the mat stack drawing shared by the proof page and its e-mail picture', () => {
  it('paints the lowest mat first, each with the outer edge plus one hole per opening that cuts it', () => {
    const layers = matStackLayers(layout, lines);
    expect(layers.map((l) => l.matIndex)).toEqual([1, 0]);
    // The lower mat is cut only by the depth-2 jersey opening; the top mat by both.
    expect(rings(layers[0]!.face)).toBe(2);
    expect(rings(layers[1]!.face)).toBe(3);
    expect(rings(layers[1]!.back)).toBe(3);
    expect(layers[1]).toMatchObject({ color: '#1d2b4a', coreColor: '#f6f3ea' });
  });

  it('sizes the picture by its long side in the outer proportion and escapes its title', () => {
    expect(matStackPixelSize(layout, 720)).toEqual({ width: 600, height: 720 });
    expect(matStackPixelSize({ ...layout, outer: { width: 30, height: 10 } }, 720)).toEqual({ width: 720, height: 240 });
    const svg = matStackSvg(layout, lines, { longSidePx: 720, title: 'Mats for <Fenwick & "Gullmarrows">' });
    expect(svg).toContain('width="600" height="720" viewBox="0 0 20 24"');
    expect(svg).toContain('<title>Mats for &lt;Fenwick &amp; &quot;Gullmarrows&quot;&gt;</title>');
    expect(svg).not.toContain('<Fenwick');
    // Two paths per mat: core with back-edge holes, then face with face-edge holes.
    expect((svg.match(/<path /g) ?? []).length).toBe(4);
  });
});
