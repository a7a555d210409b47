/**
 * Layouts built to be expensive, shared by the benchmark (`npm run bench`)
 * and the API tests: each must be refused or answered in well under a second.
 */
import type { BoardPoint, LayoutInput } from '../geometry';

const mat = (id: string) => ({ id, name: id, color: '#1b2a4a', coreColor: '#f4f1e8', ply: 4 as const, thickness: 0.055, bevelAngle: 45, sheet: { width: 40, height: 60 } });

function layoutWith(openings: LayoutInput['openings'], outer = { width: 40, height: 40 }): LayoutInput {
  return { schemaVersion: 2, outer, mats: [mat('top'), mat('bottom')], mountingBoard: { color: '#ffffff', cut: false }, openings };
}

/** A star of `points` points alternating between two radii: every spike's segments meet near the middle. */
export function spikyStar(points: number, outer = 12, inner = 11.5): BoardPoint[] {
  return Array.from({ length: points }, (_, i) => {
    const r = i % 2 === 0 ? outer : inner;
    const t = (2 * Math.PI * i) / points;
    return { x: r * Math.cos(t), y: r * Math.sin(t) };
  });
}

/** A comb: `points` points zigzagging along the top of a bar, teeth 1 in deep. */
export function zigzag(points: number, width = 30): BoardPoint[] {
  const teeth = Math.floor((points - 2) / 2);
  const top: BoardPoint[] = [];
  for (let i = 0; i < teeth; i++) {
    const x = -width / 2 + (width * i) / teeth;
    top.push({ x, y: -1 }, { x: x + width / teeth / 2, y: 0 });
  }
  return [...top, { x: width / 2, y: 1 }, { x: -width / 2, y: 1 }];
}

export function spikyStarLayout(points = 50_000): LayoutInput {
  return layoutWith([{ id: 'star', shape: { kind: 'outline', points: spikyStar(points) }, center: { x: 20, y: 20 }, depth: 2, clearance: 0.25, reveals: [0.25] }]);
}

export function zigzagLayout(points = 20_000): LayoutInput {
  return layoutWith([{ id: 'comb', shape: { kind: 'polygon', points: zigzag(points) }, center: { x: 20, y: 20 }, depth: 2, clearance: 0, reveals: [0.25] }]);
}

/** 200 rectangles in a 20 x 10 grid on a 39 x 37 in board, bridges about 3/4 in. */
export function manyOpeningsLayout(count = 200): LayoutInput {
  const openings = Array.from({ length: count }, (_, i) => ({
    id: `card-${i + 1}`,
    shape: { kind: 'rectangle' as const, width: 1, height: 2 },
    center: { x: 1.25 + (i % 20) * 1.9, y: 2 + Math.floor(i / 20) * 3.5 },
    depth: 1,
    clearance: 0,
    reveals: [],
  }));
  return layoutWith(openings, { width: 39, height: 37 });
}

/** Openings sharing one id; more than the layout may hold, so only the id repair is timed on the list alone. */
export function repeatedIdsOpenings(count = 16_000): LayoutInput['openings'] {
  return Array.from({ length: count }, (_, i) => ({
    id: 'patch',
    shape: { kind: 'circle' as const, radius: 0.2 },
    center: { x: 1 + (i % 100) * 0.4, y: 1 + Math.floor(i / 100) * 0.4 },
    depth: 1,
    clearance: 0,
    reveals: [],
  }));
}
