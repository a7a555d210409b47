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
import { benchLayout, median, quantile, timed } from './benchLayout';
import {
  GARMENT_SMOOTHING_RADIUS_IN, bandFindings, boardSlivers, bridgeFinding, bridgeSpotsNarrowest, createLayoutEngine, faceRings,
  findingWords, matBevelRun, openingLinesPlaced, polygonsBounds, outsideFinding, overlapFinding, parseLayout, pieceFinding, polygonOffset, shapeFinding,
  shapeJoin, shapePolygon, sizeFindings, sliverBridges,
} from '../geometry';

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
    cuts.unshift({ matIndex: k, bevelRun: run, face: { exact: null, polygons: face }, faceGrowth: 0, back: { exact: null, polygons: back }, revealBelow: reveal, bandBelow: reveal === null ? null : reveal - run });
    below = face;
  }
  return openingLinesPlaced({ openingId: opening.id, sight: { exact: null, polygons: sight }, mats: cuts }, opening);
}

/** The same checks with nothing skipped, thinned or remembered: every mat's whole board is opened. */
function naiveCheck(layout: Layout): Finding[] {
  const settings = layout.checkSettings;
  const words = findingWords(layout);
  const findings: Finding[] = [...sizeFindings(layout, words)];
  const all: OpeningLines[] = [];
  for (const opening of layout.openings) {
    const problem = shapeFinding(opening, words);
    if (problem) { findings.push(problem); continue; }
    const lines = naiveLines(opening, layout.mats);
    all.push(lines);
    findings.push(...bandFindings(lines, settings, words));
    for (const f of [outsideFinding(lines, layout, words), pieceFinding(opening, settings, words)]) if (f) findings.push(f);
  }
  all.forEach((a, i) => all.slice(i + 1).forEach((b) => { const face = (l: OpeningLines) => { const rings = l.mats[0]?.face.polygons ?? []; return { openingId: l.openingId, rings, box: polygonsBounds(rings) ?? { x: 0, y: 0, w: 0, h: 0 } }; }; const f = overlapFinding(face(a), face(b), words); if (f) findings.push(f); }));
  const probe = settings.bridgeWarning * 1.25;
  const whole = { x: 0, y: 0, w: layout.outer.width, h: layout.outer.height };
  const spots: BridgeSpot[] = layout.mats.flatMap((_, matIndex) => {
    const faces = all.flatMap((l) => { const cut = l.mats[matIndex]; const f = cut ? faceRings(l.openingId, cut.face.polygons) : null; return f ? [f] : []; });
    return boardSlivers(layout.outer, faces, whole, probe).flatMap((s) => sliverBridges(layout.outer, faces, s, probe, matIndex));
  });
  for (const spot of bridgeSpotsNarrowest(spots)) { const f = bridgeFinding(spot, settings, words); if (f) findings.push(f); }
  return findings;
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
