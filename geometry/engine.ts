import type { Layout, Mat, Opening } from './layoutSchema';
import type { BoardPoint } from './polygon';
import type { Finding, OverlapFace } from './findings';
import { bandFindings, bridgeFinding, outsideFinding, overlapFinding, pieceFinding, shapeFinding, sizeFindings } from './findings';
import type { FindingWords, FindingWordsOptions } from './findingWords';
import { findingWords } from './findingWords';
import { shapeGrownEnclosure } from './enclosure';
import type { OpeningLines, OpeningLinesOptions } from './openingLines';
import { matBevelRun, openingLinesLocal, openingLinesLocalSteps, openingLinesPlaced } from './openingLines';
import type { WorkSteps } from './workSteps';
import type { BridgeSpot, FaceRings } from './bridges';
import { boardSlivers, bridgeSpotsNarrowest, bridgeZones, faceNearsItself, faceRings, sliverBridges, zoneIsNarrow } from './bridges';
import type { Polygon } from './polygon';
import { boxesOverlap, boxExpand, polygonsBounds } from './polygon';

/**
 * Layout checks with a memory. Everything is keyed by what it depends on
 * (an opening's shape, depth, reveals and the bevels it cuts; its position;
 * the lines near a bridge), so while one opening is dragged only its
 * placement, its overlaps and the bridge zones near it are recomputed.
 * The memory lives in the engine object the caller holds; entries unused by
 * the latest call are dropped, so it never grows beyond one layout's worth.
 */
export interface LayoutEngine {
  check(layout: Layout): Finding[];
  /** Every opening's cut lines on the board, by opening id (openings that cannot be cut are left out). */
  lines(layout: Layout): ReadonlyMap<string, OpeningLines>;
  /** Bridges narrower than the probe width (the shop's warning width plus a margin), narrowest first. */
  bridges(layout: Layout): BridgeSpot[];
  /**
   * Works out one opening's lines ahead of `lines(layout)`, which then finds
   * them remembered, yielding after each offset: a caller can spread a
   * layout's first drawing over several tasks. Nothing is forgotten until the
   * next `check`, `lines` or `bridges`. Ends with the opening's lines, or null
   * when the layout has no such opening or its shape cannot be cut.
   */
  prepareLines(layout: Layout, openingId: string): WorkSteps<OpeningLines | null>;
}

export interface LayoutEngineOptions extends OpeningLinesOptions, FindingWordsOptions {
  /** Off to measure the work from scratch every time. */
  readonly cache?: boolean;
}

/**
 * The morphological probe is a little wider than the warning width so that a
 * bridge exactly at the limit still leaves a sliver to measure; whether it
 * is reported is decided on the measured width.
 */
export const BRIDGE_PROBE_FACTOR = 1.25;

class Memo {
  private readonly entries = new Map<string, unknown>();
  private used = new Set<string>();
  private usedBefore = new Set<string>();
  constructor(private readonly enabled: boolean) {}

  has(key: string): boolean {
    return this.enabled && this.entries.has(key);
  }

  get<T>(key: string, compute: () => T): T {
    this.used.add(key);
    if (this.enabled && this.entries.has(key)) return this.entries.get(key) as T;
    const value = compute();
    if (this.enabled) this.entries.set(key, value);
    return value;
  }

  /**
   * Forgets whatever neither of the last two calls asked for, so a caller
   * alternating `check` and `lines` keeps both warm.
   */
  sweep(): void {
    for (const key of this.entries.keys()) if (!this.used.has(key) && !this.usedBefore.has(key)) this.entries.delete(key);
    this.usedBefore = this.used;
    this.used = new Set();
  }
}

/** Two independent 32-bit hashes of the points; collisions between real traces are not a practical concern. */
function pointsHash(points: readonly BoardPoint[]): string {
  let h1 = 0x811c9dc5;
  let h2 = 0x12345;
  for (const p of points) {
    const x = Math.round(p.x * 1e6);
    const y = Math.round(p.y * 1e6);
    h1 = Math.imul(h1 ^ x, 0x01000193) ^ y;
    h2 = (Math.imul(h2, 31) + x * 7 + y) | 0;
  }
  return `${points.length}:${(h1 >>> 0).toString(36)}:${(h2 >>> 0).toString(36)}`;
}

interface Keys {
  readonly shape: (opening: Opening) => string;
}

function createKeys(): Keys {
  // Traced outlines are hashed once per points array, not on every drag frame.
  const hashes = new WeakMap<readonly BoardPoint[], string>();
  return {
    shape: (opening) => {
      const { shape } = opening;
      if (shape.kind !== 'polygon' && shape.kind !== 'outline') return JSON.stringify(shape);
      let hash = hashes.get(shape.points);
      if (hash === undefined) {
        hash = pointsHash(shape.points);
        hashes.set(shape.points, hash);
      }
      return `${shape.kind}:${hash}`;
    },
  };
}

function localKey(keys: Keys, opening: Opening, mats: readonly Mat[]): string {
  const runs = mats.slice(0, opening.depth).map(matBevelRun).join(',');
  return `${keys.shape(opening)}|d${opening.depth}|c${opening.clearance}|r${opening.reveals.join(',')}|b${runs}`;
}

interface PlacedOpening {
  readonly opening: Opening;
  readonly key: string;
  readonly lines: OpeningLines;
  /** Per mat, the face line as rings enclosing the true curve (the chords where they are exact); empty where only the lines were asked for. */
  readonly measure: readonly (readonly Polygon[])[];
}

/** What one engine remembers, passed explicitly to the steps below. */
interface EngineState {
  readonly memo: Memo;
  readonly keys: Keys;
  readonly options: LayoutEngineOptions;
}

function placementKey(opening: Opening): string {
  return `${opening.center.x},${opening.center.y},${opening.rotation}`;
}

/** Face lines to measure on: curves by their enclosing tangent polygons, everything else as cut. */
function measureRings(opening: Opening, lines: OpeningLines): Polygon[][] {
  return lines.mats.map((cut) => {
    if (cut.face.polygons.length === 0) return [];
    const enclosure = shapeGrownEnclosure(opening.shape, cut.faceGrowth, { center: opening.center, rotation: opening.rotation });
    return enclosure ? [enclosure] : [...cut.face.polygons];
  });
}

/**
 * Whether a shape can be cut does not depend on where it sits, so the
 * check (a self-intersection sweep over a traced outline) is remembered by
 * the shape alone and its mark moved to the opening's centre: dragging a
 * garment does not sweep its outline again on every frame.
 */
function placedShapeFinding(memo: Memo, opening: Opening, local: string, words: FindingWords): Finding | null {
  const { center } = opening;
  if (!Number.isFinite(center.x) || !Number.isFinite(center.y) || !Number.isFinite(opening.rotation)) return shapeFinding(opening, words);
  const atOrigin = memo.get(`shape|${opening.id}|${local}|${words.key}`, () => shapeFinding({ ...opening, center: { x: 0, y: 0 } }, words));
  if (!atOrigin) return null;
  const at = atOrigin.at as BoardPoint;
  return { ...atOrigin, at: { x: at.x + center.x, y: at.y + center.y } };
}

/**
 * One opening's lines on the board, or why its shape cannot be cut. The
 * rings the checks measure on are made only when `measured` (drawing the
 * lines does not need them).
 */
function placeOpening(state: EngineState, layout: Layout, opening: Opening, words: FindingWords, measured: boolean): PlacedOpening | { readonly problem: Finding } {
  const { memo, keys, options } = state;
  const local = localKey(keys, opening, layout.mats);
  const key = `${opening.id}|${local}|${placementKey(opening)}`;
  const problem = placedShapeFinding(memo, opening, local, words);
  if (problem) return { problem };
  const localLines = memo.get(`local|${opening.id}|${local}`, () => openingLinesLocal(opening, layout.mats, options));
  const lines = memo.get(`placed|${key}`, () => openingLinesPlaced(localLines, { center: opening.center, rotation: opening.rotation }));
  const measure = measured ? memo.get(`measure|${key}`, () => measureRings(opening, lines)) : [];
  return { opening, key, lines, measure };
}

function* prepareOpening(state: EngineState, layout: Layout, openingId: string): WorkSteps<OpeningLines | null> {
  const opening = layout.openings.find((o) => o.id === openingId);
  if (!opening) return null;
  const words = findingWords(layout, state.options);
  if (placedShapeFinding(state.memo, opening, localKey(state.keys, opening, layout.mats), words)) return null;
  const key = `local|${opening.id}|${localKey(state.keys, opening, layout.mats)}`;
  if (!state.memo.has(key)) {
    const local = yield* openingLinesLocalSteps(opening, layout.mats, state.options);
    state.memo.get(key, () => local);
  }
  const one = placeOpening(state, layout, opening, words, false);
  return 'problem' in one ? null : one.lines;
}

function placeAll(state: EngineState, layout: Layout, words: FindingWords, measured = true): { placed: PlacedOpening[]; shapeFindings: Finding[] } {
  const placed: PlacedOpening[] = [];
  const shapeFindings: Finding[] = [];
  for (const opening of layout.openings) {
    const one = placeOpening(state, layout, opening, words, measured);
    if ('problem' in one) shapeFindings.push(one.problem);
    else placed.push(one);
  }
  return { placed, shapeFindings };
}

function matSpots(state: EngineState, layout: Layout, placed: readonly PlacedOpening[], matIndex: number): BridgeSpot[] {
  const probe = layout.checkSettings.bridgeWarning * BRIDGE_PROBE_FACTOR;
  const faces: { face: FaceRings; key: string }[] = [];
  for (const p of placed) {
    const cut = p.lines.mats[matIndex];
    const concaveKind = p.opening.shape.kind === 'outline' || p.opening.shape.kind === 'polygon';
    const concave = !!cut && concaveKind && state.memo.get(`nearsitself|${p.key}|${probe}|${matIndex}`, () => faceNearsItself(cut.face.polygons, probe));
    const face = cut ? faceRings(p.opening.id, cut.face.polygons, p.measure[matIndex], concave) : null;
    if (face) faces.push({ face, key: p.key });
  }
  const outerKey = `${layout.outer.width}x${layout.outer.height}|p${probe}|m${matIndex}`;
  return bridgeZones(layout.outer, faces.map((f) => f.face), probe).flatMap((zone) => {
    // A zone's result depends only on the lines that reach its window.
    const reach = boxExpand(zone.window, 2 * probe + 0.01);
    const near = faces.filter((f) => boxesOverlap(f.face.box, reach));
    const key = `zone|${outerKey}|${zone.key}|${near.map((f) => f.key).join('#')}`;
    return state.memo.get(key, () => {
      const nearFaces = near.map((f) => f.face);
      if (!zone.self && !zoneIsNarrow(layout.outer, nearFaces, zone.window, probe)) return [];
      return boardSlivers(layout.outer, nearFaces, zone.window, probe).flatMap((sliver) => sliverBridges(layout.outer, nearFaces, sliver, probe, matIndex));
    });
  });
}

function allSpots(state: EngineState, layout: Layout, placed: readonly PlacedOpening[]): BridgeSpot[] {
  return bridgeSpotsNarrowest(layout.mats.flatMap((_, matIndex) => matSpots(state, layout, placed, matIndex)));
}

/** Findings about one opening alone: its bands, its place on the board, its piece. */
function ownFindings(state: EngineState, layout: Layout, p: PlacedOpening, words: FindingWords): Finding[] {
  const settings = layout.checkSettings;
  const key = `own|${p.key}|${JSON.stringify(p.opening.pieceSize ?? null)}|${layout.outer.width}x${layout.outer.height}|${JSON.stringify(settings)}|${words.key}`;
  return state.memo.get(key, () => {
    const own = [...bandFindings(p.lines, settings, words), outsideFinding(p.lines, layout, words, p.measure[0]), pieceFinding(p.opening, settings, words)];
    return own.filter((f): f is Finding => f !== null);
  });
}

function overlapFace(p: PlacedOpening): OverlapFace | null {
  const rings = p.measure[0] ?? [];
  const box = polygonsBounds(rings);
  return box ? { openingId: p.opening.id, rings, box } : null;
}

/** One finding per overlapping pair; returns the pairs so their bridges are not reported as well. */
function overlapFindings(state: EngineState, placed: readonly PlacedOpening[], words: FindingWords): { findings: Finding[]; pairs: Set<string> } {
  const findings: Finding[] = [];
  const pairs = new Set<string>();
  const faces = placed.map((p) => ({ p, face: overlapFace(p) })).filter((f) => f.face !== null);
  // Sorted by left edge, a pair is only tested while the second starts before the first ends: no n^2 box tests for a row of openings.
  faces.sort((a, b) => a.face!.box.x - b.face!.box.x);
  faces.forEach((a, i) => {
    for (let j = i + 1; j < faces.length && faces[j]!.face!.box.x <= a.face!.box.x + a.face!.box.w + 1e-3; j++) {
      const b = faces[j]!;
      const overlap = state.memo.get(`overlap|${a.p.key}|${b.p.key}|${words.key}`, () => overlapFinding(a.face!, b.face!, words));
      if (!overlap) continue;
      findings.push(overlap);
      pairs.add([a.p.opening.id, b.p.opening.id].sort().join('|'));
    }
  });
  return { findings, pairs };
}

function layoutFindings(state: EngineState, layout: Layout): Finding[] {
  const words = findingWords(layout, state.options);
  const { placed, shapeFindings } = placeAll(state, layout, words);
  const findings: Finding[] = [...shapeFindings, ...sizeFindings(layout, words)];
  for (const p of placed) for (const f of ownFindings(state, layout, p, words)) findings.push(f);
  const overlaps = overlapFindings(state, placed, words);
  for (const f of overlaps.findings) findings.push(f);
  // Lines in lower mats sit inside those above, so one pair's narrowest bridge is reported once; an overlapping pair has no bridge.
  const byPair = new Map<string, Finding>();
  for (const spot of allSpots(state, layout, placed)) {
    const pair = `${spot.kind}|${spot.openingIds.join('|')}|${spot.edge ?? ''}`;
    if (spot.kind === 'bridge' && !spot.edge && overlaps.pairs.has(spot.openingIds.join('|'))) continue;
    const finding = bridgeFinding(spot, layout.checkSettings, words);
    if (finding && !byPair.has(pair)) byPair.set(pair, finding);
  }
  for (const f of byPair.values()) findings.push(f);
  return findings;
}

export function createLayoutEngine(options: LayoutEngineOptions = {}): LayoutEngine {
  const state: EngineState = { memo: new Memo(options.cache !== false), keys: createKeys(), options };
  const thenSweep = <T>(value: T): T => {
    state.memo.sweep();
    return value;
  };
  return {
    check: (layout) => thenSweep(layoutFindings(state, layout)),
    lines: (layout) => thenSweep(new Map(placeAll(state, layout, findingWords(layout, options), false).placed.map((p) => [p.opening.id, p.lines] as const))),
    bridges: (layout) => thenSweep(allSpots(state, layout, placeAll(state, layout, findingWords(layout, options)).placed)),
    prepareLines: (layout, openingId) => prepareOpening(state, layout, openingId),
  };
}
