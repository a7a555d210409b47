/**
 * How fast the layout checks run on a full shadowbox: a 32 x 40 in layout,
 * three mats, a traced jersey of 200, 2 000 and 20 000 points, two 4 in
 * patches, an 8 x 10 photo, a 3 x 9 plaque and two small cards.
 *
 *   npx tsx scripts/bench.ts
 *
 * "full" is a fresh engine checking the whole layout; "drag" is one patch
 * moving towards the photo (close enough at the end to need bridge checks)
 * while the engine is warm; "naive" offsets the raw trace, chains plain
 * clipper offsets and opens the whole board of every mat, with no
 * simplification and no memory.
 */
import type { BoardPoint, BridgeSpot, Finding, Layout, LayoutInput, Mat, MatCut, Opening, OpeningLines } from '../geometry';
import {
  GARMENT_SMOOTHING_RADIUS_IN, bandFindings, boardSlivers, bridgeFinding, bridgeSpotsNarrowest, createLayoutEngine, faceRings,
  matBevelRun, openingLinesPlaced, outsideFinding, overlapFinding, parseLayout, pieceFinding, polygonOffset, shapeFinding,
  shapeJoin, shapePolygon, sizeFindings, sliverBridges,
} from '../geometry';

/** An invented folded jersey: a T with sleeves, smoothed, with gentle folds and a little tracing noise. */
function jerseyOutline(count: number): BoardPoint[] {
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

function benchLayout(vertices: number): Layout {
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

/**
 * Cut lines the plain way: the raw trace, every line a clipper offset of the
 * one before it (no closed forms, no thinning).
 */
function naiveLines(opening: Opening, mats: readonly Mat[]): OpeningLines {
  const join = shapeJoin(opening.shape);
  const raw = [shapePolygon(opening.shape)];
  const s = GARMENT_SMOOTHING_RADIUS_IN;
  const sight = opening.shape.kind === 'outline'
    ? polygonOffset(polygonOffset(polygonOffset(polygonOffset(polygonOffset(raw, opening.clearance, 'round'), s, 'round'), -s, 'round'), -s, 'round'), s, 'round')
    : raw;
  const cuts: MatCut[] = [];
  let below = sight;
  for (let k = opening.depth - 1; k >= 0; k--) {
    const run = matBevelRun(mats[k]!);
    const lowest = k === opening.depth - 1;
    const reveal = lowest ? null : opening.reveals[k]!;
    const face = polygonOffset(below, lowest ? run : reveal!, join);
    const back = lowest ? sight : polygonOffset(face, -run, join);
    cuts.unshift({ matIndex: k, bevelRun: run, face: { exact: null, polygons: face }, back: { exact: null, polygons: back }, revealBelow: reveal, bandBelow: reveal === null ? null : reveal - run });
    below = face;
  }
  return openingLinesPlaced({ openingId: opening.id, sight: { exact: null, polygons: sight }, mats: cuts }, opening);
}

/** The same checks with nothing skipped, thinned or remembered: every mat's whole board is opened. */
function naiveCheck(layout: Layout): Finding[] {
  const settings = layout.checkSettings;
  const findings: Finding[] = [...sizeFindings(layout)];
  const all: OpeningLines[] = [];
  for (const opening of layout.openings) {
    const problem = shapeFinding(opening);
    if (problem) { findings.push(problem); continue; }
    const lines = naiveLines(opening, layout.mats);
    all.push(lines);
    findings.push(...bandFindings(lines, settings));
    for (const f of [outsideFinding(lines, layout), pieceFinding(opening, settings)]) if (f) findings.push(f);
  }
  all.forEach((a, i) => all.slice(i + 1).forEach((b) => { const f = overlapFinding(a, b); if (f) findings.push(f); }));
  const probe = settings.bridgeWarning * 1.25;
  const whole = { x: 0, y: 0, w: layout.outer.width, h: layout.outer.height };
  const spots: BridgeSpot[] = layout.mats.flatMap((_, matIndex) => {
    const faces = all.flatMap((l) => { const cut = l.mats[matIndex]; const f = cut ? faceRings(l.openingId, cut.face.polygons) : null; return f ? [f] : []; });
    return boardSlivers(layout.outer, faces, whole, probe).flatMap((s) => sliverBridges(layout.outer, faces, s, probe, matIndex));
  });
  for (const spot of bridgeSpotsNarrowest(spots)) { const f = bridgeFinding(spot, settings); if (f) findings.push(f); }
  return findings;
}

function timed(run: () => void): number {
  const start = performance.now();
  run();
  return performance.now() - start;
}

function quantile(times: readonly number[], q: number): number {
  const sorted = [...times].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]!;
}

function median(run: () => void, repeats: number): number {
  return quantile(Array.from({ length: repeats }, () => timed(run)), 0.5);
}

function dragFrames(layout: Layout, frames: number): Layout[] {
  return Array.from({ length: frames }, (_, i) => ({
    ...layout,
    openings: layout.openings.map((o) => (o.id === 'patch-right' ? { ...o, center: { x: 25.5 - 0.035 * i, y: 30.5 + 0.01 * i } } : o)),
  }));
}

function benchRow(vertices: number) {
  const layout = benchLayout(vertices);
  const repeats = vertices >= 20_000 ? 11 : 25;
  const full = median(() => createLayoutEngine().check(layout), repeats);
  const engine = createLayoutEngine();
  engine.check(layout);
  const frames = dragFrames(layout, 60);
  const dragTimes = frames.map((f) => timed(() => engine.check(f)));
  const drag = quantile(dragTimes, 0.5);
  const dragWorst = quantile(dragTimes, 1);
  const naive = median(() => naiveCheck(layout), vertices >= 20_000 ? 1 : 3);
  return { vertices, full, drag, dragWorst, naive, ratio: naive / full };
}

function main(): void {
  // Warm the JIT so the first row is not charged for compilation.
  for (let i = 0; i < 3; i++) createLayoutEngine().check(benchLayout(2000));
  const rows = [200, 2000, 20_000].map(benchRow);
  const line = (cells: string[]) => cells.map((c, i) => (i === 0 ? c.padEnd(10) : c.padStart(12))).join(' ');
  const out = [line(['vertices', 'full ms', 'drag ms', 'drag max ms', 'naive ms', 'naive/full'])];
  for (const r of rows) {
    out.push(line([String(r.vertices), r.full.toFixed(2), r.drag.toFixed(3), r.dragWorst.toFixed(3), r.naive.toFixed(1), `${r.ratio.toFixed(1)}x`]));
  }
  out.push('medians; drag max is the slowest of 60 frames. targets: full < 16 ms at 2 000 and >= 6x naive; full < 50 ms at 20 000; drag < 2 ms');
  process.stdout.write(`${out.join('\n')}\n`);
}

main();
