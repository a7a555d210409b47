import { describe, expect, it } from 'vitest';
import { parseLayout } from './layout';

function mat(id: string) {
  return { id, name: id, color: '#1b2a4a', coreColor: '#ffffff', ply: 4, thickness: 0.055, sheet: { width: 32, height: 40 } };
}

function version2(overrides: Record<string, unknown> = {}) {
  return {
    schemaVersion: 2,
    outer: { width: 16, height: 20 },
    mats: [mat('top'), mat('inner')],
    mountingBoard: { color: '#ffffff', cut: false },
    openings: [{ id: 'photo', shape: { kind: 'rectangle', width: 7.5, height: 9.5 }, center: { x: 8, y: 10 }, depth: 2, clearance: -0.25, reveals: [0.25] }],
    ...overrides,
  };
}

describe('parseLayout', () => {
  it('accepts a current layout and fills the defaults', () => {
    const result = parseLayout(version2());
    if (!result.ok) throw new Error(JSON.stringify(result.issues));
    expect(result.repairs).toEqual([]);
    expect(result.layout.mats[0]?.bevelAngle).toBe(45);
    expect(result.layout.openings[0]?.rotation).toBe(0);
    // Common practice: bridge warning 1/2 in, error 1/4 in, band 1/16 in, overlap 1/8 in, rabbet allowance 1/8 in.
    expect(result.layout.checkSettings).toEqual({ bridgeWarning: 0.5, bridgeError: 0.25, minimumBand: 0.0625, minimumOverlap: 0.125, rabbetAllowance: 0.125 });
  });

  it('lifts a version 1 layout, whose openings had one reveal, to a reveal per lower mat', () => {
    const v1 = { ...version2(), schemaVersion: 1, openings: [{ id: 'photo', shape: { kind: 'circle', radius: 2 }, center: { x: 8, y: 10 }, depth: 2, reveal: 0.375 }] };
    const result = parseLayout(v1);
    if (!result.ok) throw new Error(JSON.stringify(result.issues));
    expect(result.layout.schemaVersion).toBe(2);
    expect(result.layout.openings[0]?.reveals).toEqual([0.375]);
    expect(result.layout.openings[0]).not.toHaveProperty('reveal');
  });

  it('clamps a depth beyond the stack, fills missing reveals with 1/4 in and renames repeated ids', () => {
    const input = version2({
      openings: [
        { id: 'patch', shape: { kind: 'circle', radius: 2 }, center: { x: 5, y: 5 }, depth: 5 },
        { id: 'patch', shape: { kind: 'circle', radius: 2 }, center: { x: 11, y: 5 }, depth: 1 },
      ],
    });
    const result = parseLayout(input);
    if (!result.ok) throw new Error(JSON.stringify(result.issues));
    const [first, second] = result.layout.openings;
    expect(first?.depth).toBe(2);
    // Common practice: 1/4 in is the usual reveal.
    expect(first?.reveals).toEqual([0.25]);
    expect(second?.id).toBe('patch-2');
    expect(result.repairs).toHaveLength(3);
    expect(result.repairs.join(' ')).toMatch(/now cuts 2/);
  });

  it('lists what is wrong with a layout it cannot repair, by path', () => {
    const result = parseLayout(version2({ outer: { width: -3, height: 20 }, mats: [] }));
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues.map((i) => i.path)).toEqual(expect.arrayContaining(['outer.width', 'mats']));
  });

  it('refuses layouts from a newer version and documents without one', () => {
    expect(parseLayout({ ...version2(), schemaVersion: 9 })).toEqual({ ok: false, issues: [{ path: 'schemaVersion', message: expect.stringContaining('newer') }] });
    expect(parseLayout({ outer: {} })).toEqual({ ok: false, issues: [{ path: 'schemaVersion', message: expect.any(String) }] });
    expect(parseLayout('a layout')).toEqual({ ok: false, issues: [{ path: '', message: 'A layout must be an object.' }] });
  });
});
