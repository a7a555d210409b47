import DxfParser from 'dxf-parser';
import { describe, expect, it } from 'vitest';
import type { CutProfile } from '../cutPlan';
import { cutPlan } from '../cutPlan';
import { parseLayout } from '../layout';
import { cutPlanDxf, dxfBulge } from './dxf';

/**
 * Files are read back with dxf-parser, a general-purpose DXF reader, and
 * compared with sizes worked out here from the layout. Header codes and the
 * bulge definition are those of the Autodesk DXF reference: $INSUNITS 1 =
 * inches, 4 = millimetres; $MEASUREMENT 0 = imperial, 1 = metric; bulge =
 * tan(included angle / 4), negative when the arc runs clockwise.
 */

const TOLERANCE_IN = 0.0005;
const T = 0.055; // at 45 degrees the bevel run equals the thickness
const mat = (id: string) => ({ id, name: id, color: '#2d5a3a', coreColor: '#f6f3ea', ply: 4 as const, thickness: T, bevelAngle: 45, sheet: { width: 32, height: 40 } });
const parsed = parseLayout({
  schemaVersion: 2,
  outer: { width: 20, height: 24 },
  mats: [mat('top'), mat('lower')],
  mountingBoard: { color: '#ffffff', cut: false },
  openings: [
    { id: 'photo', shape: { kind: 'rectangle', width: 8, height: 10 }, center: { x: 6, y: 8 }, depth: 2, reveals: [0.25] },
    { id: 'patch', shape: { kind: 'circle', radius: 2 }, center: { x: 15, y: 18 }, depth: 2, reveals: [0.25] },
    { id: 'ticket', shape: { kind: 'roundedRectangle', width: 3, height: 2, cornerRadius: 0.5 }, center: { x: 15, y: 4 }, depth: 1 },
  ],
});
if (!parsed.ok) throw new Error('test layout is invalid');
const layout = parsed.layout;
const H = 24;

const profile = (over: Partial<CutProfile> = {}): CutProfile => ({
  units: 'in', mirrored: false, pathEdge: 'back', origin: 'bottom-left', arcs: true, chordToleranceIn: 0.005, maxSheetWidthIn: 40, maxSheetHeightIn: 60, ...over,
});

interface Vertex { x: number; y: number; bulge?: number }
interface Entity { type: string; layer: string; vertices?: Vertex[]; center?: { x: number; y: number }; radius?: number; shape?: boolean }
interface Parsed { header: Record<string, unknown>; tables: { layer: { layers: Record<string, unknown> } }; entities: Entity[] }

/**
 * Signed area of a closed polyline with bulges, worked out here: the
 * shoelace sum of the chords plus, for each bulged vertex, the circular
 * segment r^2 (theta - sin theta) / 2 with theta = 4 atan(bulge), signed as
 * the bulge (positive: counterclockwise, DXF reference). Positive means
 * counterclockwise in the file's own axes.
 */
function bulgedArea(vertices: readonly Vertex[]): number {
  let area = 0;
  vertices.forEach((a, i) => {
    const b = vertices[(i + 1) % vertices.length]!;
    area += (a.x * b.y - b.x * a.y) / 2;
    if (!a.bulge) return;
    const theta = 4 * Math.atan(Math.abs(a.bulge));
    const chord = Math.hypot(b.x - a.x, b.y - a.y);
    const r = chord / (2 * Math.sin(theta / 2));
    area += Math.sign(a.bulge) * (r * r * (theta - Math.sin(theta))) / 2;
  });
  return area;
}

const read = (text: string) => new DxfParser().parseSync(text) as unknown as Parsed;
const near = (a: number, b: number, tolerance = TOLERANCE_IN) => Math.abs(a - b) <= tolerance;

describe('DXF cut files read back with dxf-parser', () => {
  it('state inches or millimetres in the header ($INSUNITS 1 / 4, $MEASUREMENT 0 / 1)', () => {
    const inches = read(cutPlanDxf(cutPlan(layout, profile())));
    expect([inches.header.$INSUNITS, inches.header.$MEASUREMENT]).toEqual([1, 0]);
    const mm = read(cutPlanDxf(cutPlan(layout, profile({ units: 'mm' }))));
    expect([mm.header.$INSUNITS, mm.header.$MEASUREMENT]).toEqual([4, 1]);
  });

  it('put each mat on its own layers and hold the expected entities per layer', () => {
    const file = read(cutPlanDxf(cutPlan(layout, profile())));
    expect(Object.keys(file.tables.layer.layers).sort()).toEqual(['0', 'MAT1_OPENINGS', 'MAT1_OUTER', 'MAT2_OPENINGS', 'MAT2_OUTER']);
    const count = (layer: string, type: string) => file.entities.filter((e) => e.layer === layer && e.type === type).length;
    // Mat 1: photo, ticket and patch as polylines (the patch as two half arcs). Mat 2: photo and patch. Each mat one outer polyline.
    expect([count('MAT1_OPENINGS', 'LWPOLYLINE'), count('MAT1_OPENINGS', 'CIRCLE'), count('MAT1_OUTER', 'LWPOLYLINE')]).toEqual([3, 0, 1]);
    expect([count('MAT2_OPENINGS', 'LWPOLYLINE'), count('MAT2_OPENINGS', 'CIRCLE'), count('MAT2_OUTER', 'LWPOLYLINE')]).toEqual([2, 0, 1]);
    expect(file.entities).toHaveLength(7);
  });

  it("place each circle's centre and radius within 0.0005 in, in inches and in millimetres, as CIRCLE where the cutter picks the direction", () => {
    // Patch back edges: mat 2 (lowest) is the 2 in sight; mat 1 is 2 + bevel + reveal - bevel = 2.25. y turns up from the bottom.
    for (const [units, scale] of [['in', 1], ['mm', 25.4]] as const) {
      const file = read(cutPlanDxf(cutPlan(layout, profile({ units, cutterChoosesCircleDirection: true }))));
      const circles = file.entities.filter((e) => e.type === 'CIRCLE');
      expect(circles.map((c) => c.layer)).toEqual(['MAT1_OPENINGS', 'MAT2_OPENINGS']);
      const radii = circles.map((c) => c.radius! / scale);
      expect(near(radii[0]!, 2.25) && near(radii[1]!, 2)).toBe(true);
      for (const c of circles) expect(near(c.center!.x / scale, 15) && near(c.center!.y / scale, H - 18)).toBe(true);
    }
  });

  it("place each polyline's vertices on the layout's corners within 0.0005 in, closed, the outer edge on the sheet's corners", () => {
    const file = read(cutPlanDxf(cutPlan(layout, profile())));
    const polylines = file.entities.filter((e) => e.type === 'LWPOLYLINE');
    const photoLower = polylines.find((e) => e.layer === 'MAT2_OPENINGS' && e.vertices!.length > 2)!;
    // Mat 2's photo back edge is the 8 x 10 sight around (6, 8): x 2..10, y 3..13, y up from the bottom edge.
    const expected = [[2, H - 3], [10, H - 3], [10, H - 13], [2, H - 13]];
    for (const [x, y] of expected) expect(photoLower.vertices!.some((v) => near(v.x, x!) && near(v.y, y!))).toBe(true);
    // Every vertex lies on the rectangle's outline (the start sits mid-side).
    for (const v of photoLower.vertices!) expect(near(v.x, 2) || near(v.x, 10) || near(v.y, H - 3) || near(v.y, H - 13)).toBe(true);
    expect(photoLower.shape).toBe(true);
    const outer = polylines.find((e) => e.layer === 'MAT1_OUTER')!;
    for (const [x, y] of [[0, 0], [20, 0], [20, 24], [0, 24]]) expect(outer.vertices!.some((v) => near(v.x, x!) && near(v.y, y!))).toBe(true);
  });

  it('give each quarter-round corner a bulge of tan(90°/4) = 0.414214, its sign following the cut direction', () => {
    expect(dxfBulge(90)).toBeCloseTo(0.414214, 6);
    expect(dxfBulge(-90)).toBeCloseTo(-0.414214, 6);
    // Windows run clockwise seen from the face. With y up (bottom-left origin) that is clockwise on the page: negative bulges.
    // With y down (top-left origin) the same cut is counterclockwise in the file's own axes: positive bulges.
    for (const [origin, sign] of [['bottom-left', -1], ['top-left', 1]] as const) {
      const file = read(cutPlanDxf(cutPlan(layout, profile({ origin }))));
      const ticket = file.entities.find((e) => e.type === 'LWPOLYLINE' && e.vertices!.length > 2 && e.vertices!.some((v) => v.bulge))!;
      const bulges = ticket.vertices!.filter((v) => v.bulge).map((v) => v.bulge!);
      expect(bulges).toHaveLength(4);
      for (const b of bulges) expect(b).toBeCloseTo(sign * 0.414214, 6);
    }
  });

  it('write full circles as two half arcs (bulge 1) of the true radius, running the way every window runs', () => {
    const file = read(cutPlanDxf(cutPlan(layout, profile())));
    const halves = file.entities.filter((e) => e.type === 'LWPOLYLINE' && e.vertices!.length === 2);
    expect(halves.map((e) => e.layer)).toEqual(['MAT1_OPENINGS', 'MAT2_OPENINGS']);
    halves.forEach((e, i) => {
      const radius = [2.25, 2][i]!;
      // Bulge 1 = tan(180 degrees / 4): a half circle (DXF reference); both halves turn the same way.
      expect(e.vertices!.map((v) => v.bulge)).toEqual([-1, -1]);
      // The chord of a half circle is its diameter, through the centre.
      const [a, b] = e.vertices!;
      expect(near(Math.hypot(a!.x - b!.x, a!.y - b!.y), 2 * radius)).toBe(true);
      expect(near((a!.x + b!.x) / 2, 15) && near((a!.y + b!.y) / 2, H - 18)).toBe(true);
    });
  });

  it('run every closed path of the file, circles included, in the cutter profile\'s direction', () => {
    // Seen from the face, windows run clockwise and the outer edge counterclockwise; each flipped axis of the
    // file's frame (y up from a bottom origin, x mirrored for face-down cutting) turns that around once.
    const cases = [
      [{ origin: 'bottom-left' }, -1], [{ origin: 'top-left' }, 1], [{ origin: 'bottom-left', mirrored: true }, 1], [{ origin: 'top-right' }, -1],
    ] as const;
    for (const [over, windowSign] of cases) {
      const file = read(cutPlanDxf(cutPlan(layout, profile(over))));
      const closed = file.entities.filter((e) => e.type === 'LWPOLYLINE');
      expect(closed).toHaveLength(7);
      for (const e of closed) {
        const expected = e.layer.endsWith('_OPENINGS') ? windowSign : -windowSign;
        expect(Math.sign(bulgedArea(e.vertices!))).toBe(expected);
      }
    }
  });

  it('write plain closed polylines within the chord tolerance when the profile forbids arcs', () => {
    const tolerance = 0.002;
    const file = read(cutPlanDxf(cutPlan(layout, profile({ arcs: false, chordToleranceIn: tolerance }))));
    expect(file.entities.filter((e) => e.type === 'CIRCLE' || e.type === 'ARC')).toEqual([]);
    expect(file.entities.flatMap((e) => e.vertices ?? []).filter((v) => v.bulge)).toEqual([]);
    const patch = file.entities.find((e) => e.layer === 'MAT2_OPENINGS' && e.vertices!.length > 8)!;
    for (const v of patch.vertices!) expect(near(Math.hypot(v.x - 15, v.y - (H - 18)), 2, TOLERANCE_IN)).toBe(true);
  });

  it('write the same bytes for the same plan, with no number in exponent form', () => {
    const plan = cutPlan(layout, profile({ mirrored: true }));
    const first = cutPlanDxf(plan);
    expect(cutPlanDxf(plan)).toBe(first);
    expect(first).not.toMatch(/\d[eE][-+]?\d/);
  });

  it('hold only the asked boards when one mat is chosen', () => {
    const file = read(cutPlanDxf(cutPlan(layout, profile()), { boards: [1] }));
    expect(Object.keys(file.tables.layer.layers).sort()).toEqual(['0', 'MAT2_OPENINGS', 'MAT2_OUTER']);
    expect(new Set(file.entities.map((e) => e.layer))).toEqual(new Set(['MAT2_OPENINGS', 'MAT2_OUTER']));
  });
});
