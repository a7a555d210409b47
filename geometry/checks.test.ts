import { describe, expect, it } from 'vitest';
import type { Layout, Mat, Opening } from './layoutSchema';
import { checkLayout, matBridgeWidths } from './checks';
import { createLayoutEngine } from './engine';

function fourPly(id: string, sheet = { width: 32, height: 40 }): Mat {
  // Common practice: 4-ply board about 0.055 in thick, cut at 45 degrees.
  return { id, name: id, color: '#1b2a4a', coreColor: '#ffffff', ply: 4, thickness: 0.055, bevelAngle: 45, sheet };
}

function layoutOf(openings: Opening[], extra: Partial<Layout> = {}): Layout {
  return {
    schemaVersion: 2,
    outer: { width: 20, height: 16 },
    mats: [fourPly('top'), fourPly('inner')],
    mountingBoard: { color: '#ffffff', cut: false },
    openings,
    checkSettings: { bridgeWarning: 0.5, bridgeError: 0.25, minimumBand: 1 / 16, minimumOverlap: 1 / 8, rabbetAllowance: 1 / 8 },
    ...extra,
  };
}

function circle(id: string, x: number, y: number, radius = 2, depth = 1): Opening {
  return { id, shape: { kind: 'circle', radius }, center: { x, y }, rotation: 0, depth, clearance: 0, reveals: depth > 1 ? [0.25] : [] };
}

function rect(id: string, x: number, y: number, width: number, height: number, more: Partial<Opening> = {}): Opening {
  return { id, shape: { kind: 'rectangle', width, height }, center: { x, y }, rotation: 0, depth: 1, clearance: 0, reveals: [], ...more };
}

const codes = (layout: Layout) => checkLayout(layout).map((f) => `${f.code}:${f.severity}`);

describe('bridge checks', () => {
  it('warns about a 0.4 in bridge between two patches and says where it is', () => {
    // Face lines have radius 2.055 (4-ply at 45 degrees), so centres 4.51 apart leave 0.4 in.
    const findings = checkLayout(layoutOf([circle('a', 7, 8), circle('b', 11.51, 8)]));
    expect(findings).toHaveLength(1);
    const [bridge] = findings;
    expect(bridge).toMatchObject({ code: 'bridge-narrow', severity: 'warning', required: 0.5, openingIds: ['a', 'b'], matIndex: 0 });
    // Closed form: centre distance less both radii, 4.51 - 2 x 2.055 = 0.4; never read wider, within 0.001.
    expect(bridge!.measured!).toBeLessThanOrEqual(0.4 + 1e-9);
    expect(bridge!.measured!).toBeGreaterThan(0.4 - 0.001);
    expect(bridge!.at).toMatchObject({ x: expect.closeTo(9.255, 2), y: expect.closeTo(8, 2) });
    // The shop's 1/16 in rounding: 0.4 in reads 3/8"; openings are named by their place in the layout.
    expect(bridge!.message).toMatch(/between opening 1 and opening 2 in mat 1 is only 3\/8" wide/);
  });

  it('calls a bridge under 1/4 in an error (common practice)', () => {
    const findings = checkLayout(layoutOf([rect('a', 5, 8, 4, 4), rect('b', 9.31, 8, 4, 4)]));
    expect(findings.map((f) => [f.code, f.severity])).toEqual([['bridge-narrow', 'error']]);
    expect(findings[0]!.measured!).toBeCloseTo(0.2, 2);
  });

  it('measures the board between an opening and the outer edge', () => {
    // 4 x 4 sight at x = 2.3 has its face edge at 0.245 from the left edge.
    const findings = checkLayout(layoutOf([rect('a', 2.3, 8, 4, 4)]));
    expect(findings).toHaveLength(1);
    expect(findings[0]).toMatchObject({ code: 'bridge-narrow', severity: 'error', openingIds: ['a'] });
    expect(findings[0]!.measured!).toBeCloseTo(0.245, 2);
    expect(findings[0]!.at).toMatchObject({ x: expect.closeTo(0.1225, 2), y: expect.closeTo(8, 1) });
  });

  it('reports each mat it measures in matBridgeWidths, narrowest first', () => {
    const spots = matBridgeWidths(layoutOf([circle('a', 7, 8, 2, 2), circle('b', 11.8, 8, 2, 2)]));
    // Face lines: top mat 2 + 0.055 + 0.25 = 2.305 (gap 4.8 - 4.61 = 0.19); inner mat 2.055 (gap 0.69, wider than the probe).
    expect(spots.map((s) => s.matIndex)).toEqual([0]);
    expect(spots[0]!.measured).toBeCloseTo(0.19, 2);
  });
});

describe('other checks', () => {
  it('finds nothing wrong with a well-made double mat', () => {
    const layout = layoutOf([rect('photo', 10, 7.5, 7.5, 9.5, { depth: 2, reveals: [0.25], clearance: -0.25, pieceSize: { width: 8, height: 10 } })]);
    expect(checkLayout(layout)).toEqual([]);
  });

  it('warns when a reveal leaves under 1/16 in of colour', () => {
    // 0.1 in reveal - 0.055 in bevel run = 0.045 in of colour.
    const findings = checkLayout(layoutOf([rect('photo', 10, 8, 6, 6, { depth: 2, reveals: [0.1] })]));
    expect(findings).toHaveLength(1);
    expect(findings[0]).toMatchObject({ code: 'band-narrow', severity: 'warning', matIndex: 1, required: 1 / 16 });
    expect(findings[0]!.measured!).toBeCloseTo(0.045, 9);
  });

  it('flags overlapping openings and openings past the edge', () => {
    expect(codes(layoutOf([circle('a', 7, 8), circle('b', 9, 8)]))).toContain('openings-overlap:error');
    expect(codes(layoutOf([circle('a', 1, 8)]))).toContain('opening-outside-mat:error');
  });

  it('checks that the mat holds its piece', () => {
    const tooLarge = rect('photo', 10, 8, 8.5, 10.5, { clearance: -0.25, pieceSize: { width: 8, height: 10 } });
    expect(codes(layoutOf([tooLarge]))).toEqual(['piece-not-covered:error']);
    // Common practice: at least 1/8 in of overlap holds a print; 1/16 in does not.
    const thin = rect('photo', 10, 8, 7.875, 9.875, { clearance: -0.0625, pieceSize: { width: 8, height: 10 } });
    const [finding] = checkLayout(layoutOf([thin]));
    expect(finding).toMatchObject({ code: 'overlap-small', severity: 'warning', required: 0.125 });
    expect(finding!.measured!).toBeCloseTo(0.0625, 9);
  });

  it('checks the sheet size and the rabbet less 1/8 in', () => {
    const small = layoutOf([], { mats: [fourPly('top', { width: 16, height: 20 })], outer: { width: 20, height: 16 } });
    expect(codes(small)).toEqual([]);
    const tooBig = layoutOf([], { mats: [fourPly('top', { width: 16, height: 20 })], outer: { width: 21, height: 16 } });
    expect(codes(tooBig)).toEqual(['layout-larger-than-sheet:error']);
    // Common practice: the package is cut 1/8 in under the rabbet.
    expect(codes(layoutOf([], { frameRabbet: { width: 20.125, height: 16.125 } }))).toEqual([]);
    expect(codes(layoutOf([], { frameRabbet: { width: 20, height: 16 } }))).toEqual(['layout-larger-than-rabbet:error']);
  });

  it('reports unusable shapes instead of throwing', () => {
    const broken: Opening[] = [
      circle('nan', Number.NaN, 8),
      { ...circle('flat', 10, 8), shape: { kind: 'polygon', points: [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 2, y: 0 }] } },
      { ...circle('two', 10, 8), shape: { kind: 'outline', points: [{ x: 0, y: 0 }, { x: 1, y: 1 }] } },
      { ...circle('zero', 10, 8), shape: { kind: 'circle', radius: 0 } },
      { ...circle('eight', 10, 8), shape: { kind: 'outline', points: [{ x: -4, y: -2 }, { x: 2, y: 1.5 }, { x: 2, y: -1.5 }, { x: -4, y: 2 }] } },
    ];
    const findings = checkLayout(layoutOf(broken));
    expect(findings.map((f) => `${f.openingIds?.[0]}:${f.code}`)).toEqual([
      'nan:shape-degenerate', 'flat:shape-degenerate', 'two:shape-degenerate', 'zero:shape-degenerate', 'eight:shape-self-intersecting',
    ]);
  });
});

describe('createLayoutEngine', () => {
  it('gives the same findings while an opening is dragged as checking each frame from scratch', () => {
    const engine = createLayoutEngine();
    const fixed = [circle('a', 7, 8, 2, 2), rect('photo', 15, 8, 5, 7, { depth: 2, reveals: [0.25] })];
    for (let frame = 0; frame < 12; frame++) {
      const layout = layoutOf([...fixed, circle('b', 12.2 - 0.05 * frame, 8 + 0.02 * frame, 2, 2)]);
      expect(engine.check(layout)).toEqual(checkLayout(layout));
    }
  });

  it('notices a change of piece size between two checks', () => {
    const engine = createLayoutEngine();
    const photo = rect('photo', 10, 8, 7.5, 9.5, { clearance: -0.25, pieceSize: { width: 8, height: 10 } });
    expect(engine.check(layoutOf([photo]))).toEqual([]);
    const smallerPiece = { ...photo, pieceSize: { width: 7, height: 9 } };
    expect(engine.check(layoutOf([smallerPiece])).map((f) => f.code)).toEqual(['piece-not-covered']);
  });

  it('returns placed lines for every cuttable opening', () => {
    const engine = createLayoutEngine();
    const lines = engine.lines(layoutOf([circle('a', 7, 8, 2, 2), circle('nan', Number.NaN, 8)]));
    expect([...lines.keys()]).toEqual(['a']);
    expect(lines.get('a')?.mats.map((m) => m.face.exact)).toEqual([{ kind: 'circle', radius: 2.305 }, { kind: 'circle', radius: 2.055 }]);
  });
});
