/**
 * The benchmark's shadowbox, shared by the check and export benchmarks: a
 * 32 x 40 in layout, three mats, a traced jersey, two 4 in patches, an
 * 8 x 10 photo, a 3 x 9 plaque and two small cards; and the timing helpers.
 */
import type { BoardPoint, Layout, LayoutInput } from '../geometry';
import { parseLayout } from '../geometry';

/** An invented folded jersey: a T with sleeves, smoothed, with gentle folds and a little tracing noise. */
export function jerseyOutline(count: number): BoardPoint[] {
  const control: BoardPoint[] = [
    { x: -2.2, y: -10 }, { x: -1.1, y: -9.1 }, { x: 0, y: -8.9 }, { x: 1.1, y: -9.1 }, { x: 2.2, y: -10 },
    { x: 5, y: -9.6 }, { x: 8.4, y: -7.6 }, { x: 9, y: -4.6 }, { x: 6.2, y: -4 }, { x: 6, y: 10 },
    { x: -6, y: 10 }, { x: -6.2, y: -4 }, { x: -9, y: -4.6 }, { x: -8.4, y: -7.6 }, { x: -5, y: -9.6 },
  ];
  let ring = control;
  for (let pass = 0; pass < 4; pass++) ring = chaikin(ring);
  return resample(ring, count).map((p, i, all) => {
    const t = i / all.length;
    const fold = 0.08 * Math.sin(t * 2 * Math.PI * 23);
    const noise = 0.0004 * Math.sin(i * 12.9898);
    const next = all[(i + 1) % all.length]!;
    const prev = all[(i - 1 + all.length) % all.length]!;
    const tx = next.x - prev.x;
    const ty = next.y - prev.y;
    const length = Math.hypot(tx, ty) || 1;
    return { x: p.x + ((fold + noise) * ty) / length, y: p.y - ((fold + noise) * tx) / length };
  });
}

function chaikin(ring: readonly BoardPoint[]): BoardPoint[] {
  return ring.flatMap((p, i) => {
    const q = ring[(i + 1) % ring.length]!;
    return [{ x: 0.75 * p.x + 0.25 * q.x, y: 0.75 * p.y + 0.25 * q.y }, { x: 0.25 * p.x + 0.75 * q.x, y: 0.25 * p.y + 0.75 * q.y }];
  });
}

function resample(ring: readonly BoardPoint[], count: number): BoardPoint[] {
  const lengths = ring.map((p, i) => Math.hypot(ring[(i + 1) % ring.length]!.x - p.x, ring[(i + 1) % ring.length]!.y - p.y));
  const total = lengths.reduce((a, b) => a + b, 0);
  const points: BoardPoint[] = [];
  let segment = 0;
  let walked = 0;
  for (let i = 0; i < count; i++) {
    const target = (total * i) / count;
    while (walked + lengths[segment]! < target) walked += lengths[segment++]!;
    const a = ring[segment]!;
    const b = ring[(segment + 1) % ring.length]!;
    const t = (target - walked) / lengths[segment]!;
    points.push({ x: a.x + t * (b.x - a.x), y: a.y + t * (b.y - a.y) });
  }
  return points;
}

export function benchLayout(vertices: number): Layout {
  const mat = (id: string, color: string) => ({ id, name: id, color, coreColor: '#f4f1e8', ply: 4 as const, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } });
  const input: LayoutInput = {
    schemaVersion: 2,
    outer: { width: 32, height: 40 },
    mats: [mat('top', '#1b2a4a'), mat('middle', '#c8a24a'), mat('bottom', '#9e1b32')],
    mountingBoard: { color: '#ffffff', cut: false },
    openings: [
      { id: 'jersey', shape: { kind: 'outline', points: jerseyOutline(vertices) }, center: { x: 16, y: 14.5 }, depth: 3, clearance: 0.25, reveals: [0.25, 0.25] },
      { id: 'photo', shape: { kind: 'rectangle', width: 9.5, height: 7.5 }, center: { x: 16, y: 30.5 }, depth: 2, clearance: -0.25, reveals: [0.25], pieceSize: { width: 10, height: 8 } },
      { id: 'patch-left', shape: { kind: 'circle', radius: 2 }, center: { x: 6.5, y: 30.5 }, depth: 2, clearance: 0, reveals: [0.25] },
      { id: 'patch-right', shape: { kind: 'circle', radius: 2 }, center: { x: 25.5, y: 30.5 }, depth: 2, clearance: 0, reveals: [0.25] },
      { id: 'plaque', shape: { kind: 'rectangle', width: 8.75, height: 2.75 }, center: { x: 16, y: 37 }, depth: 1, clearance: -0.125, reveals: [], pieceSize: { width: 9, height: 3 } },
      { id: 'card-left', shape: { kind: 'rectangle', width: 2.25, height: 3.25 }, center: { x: 3.5, y: 10 }, depth: 2, clearance: -0.125, reveals: [0.25] },
      { id: 'card-right', shape: { kind: 'rectangle', width: 2.25, height: 3.25 }, center: { x: 28.5, y: 10 }, depth: 2, clearance: -0.125, reveals: [0.25] },
    ],
  };
  const parsed = parseLayout(input);
  if (!parsed.ok) throw new Error(`bench layout is invalid: ${JSON.stringify(parsed.issues)}`);
  return parsed.layout;
}

export function timed(run: () => void): number {
  const start = performance.now();
  run();
  return performance.now() - start;
}

export function quantile(times: readonly number[], q: number): number {
  const sorted = [...times].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]!;
}

export function median(run: () => void, repeats: number): number {
  return quantile(Array.from({ length: repeats }, () => timed(run)), 0.5);
}
