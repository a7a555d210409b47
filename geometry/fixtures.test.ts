import { describe, expect, it } from 'vitest';
import { checkLayout, matBridgeWidths } from './checks';
import { openingLines } from './openingLines';
import { parseLayout } from './layout';
import type { Layout } from './layoutSchema';
import { polygonArea, polygonBoundaryDistance, polygonBounds, polygonContainsPoint } from './polygon';
import jersey from './fixtures/jersey-with-sleeves.json';
import twoPatches from './fixtures/two-patches-half-inch-bridge.json';
import photo from './fixtures/photo-8x10-window.json';
import plaque from './fixtures/plaque-3x9-window.json';
import narrowBridge from './fixtures/narrow-bridge.json';
import selfIntersecting from './fixtures/self-intersecting-outline.json';

function layoutFrom(fixture: { layout: unknown }): Layout {
  const result = parseLayout(fixture.layout);
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  expect(result.repairs).toEqual([]);
  return result.layout;
}

const count = (layout: Layout, severity: string) => checkLayout(layout).filter((f) => f.severity === severity).length;

describe('fixture: jersey-with-sleeves', () => {
  const layout = layoutFrom(jersey);

  it('passes every check', () => {
    expect(count(layout, 'error')).toBe(jersey.expect.errors);
    expect(count(layout, 'warning')).toBe(jersey.expect.warnings);
  });

  it('is about 18 x 20 in, and its sight line keeps the clearance all round', () => {
    const opening = layout.openings[0]!;
    if (opening.shape.kind !== 'outline') throw new Error('expected an outline');
    const box = polygonBounds(opening.shape.points);
    expect(box.w).toBeCloseTo(jersey.expect.outlineWidth, 0);
    expect(box.h).toBeCloseTo(jersey.expect.outlineHeight, 0);
    const [sight] = openingLines(opening, layout.mats).sight.polygons;
    for (const p of opening.shape.points) {
      const onBoard = { x: p.x + opening.center.x, y: p.y + opening.center.y };
      expect(polygonContainsPoint(sight!, onBoard)).toBe(true);
      expect(polygonBoundaryDistance(sight!, onBoard)).toBeGreaterThanOrEqual(jersey.expect.clearance - jersey.expect.clearanceTolerance);
    }
  });
});

describe('fixture: two-patches-half-inch-bridge', () => {
  const layout = layoutFrom(twoPatches);

  it('measures 1/2 in between the face-edge lines, midway between the patches', () => {
    const [spot, ...others] = matBridgeWidths(layout);
    expect(others).toEqual([]);
    expect(Math.abs(spot!.measured - twoPatches.expect.bridge)).toBeLessThanOrEqual(twoPatches.expect.bridgeTolerance);
    expect(Math.abs(spot!.at.x - twoPatches.expect.at.x)).toBeLessThanOrEqual(twoPatches.expect.atTolerance);
    expect(Math.abs(spot!.at.y - twoPatches.expect.at.y)).toBeLessThanOrEqual(twoPatches.expect.atTolerance);
  });

  it('does not warn: 1/2 in meets the common-practice minimum', () => {
    expect(checkLayout(layout).filter((f) => f.code === 'bridge-narrow')).toHaveLength(twoPatches.expect.bridgeFindings);
  });
});

describe('fixture: photo-8x10-window', () => {
  const layout = layoutFrom(photo);

  it('passes, with a 7.5 x 9.5 sight and top face line grown by the bevel and the reveal', () => {
    expect(count(layout, 'error')).toBe(photo.expect.errors);
    expect(count(layout, 'warning')).toBe(photo.expect.warnings);
    const lines = openingLines(layout.openings[0]!, layout.mats);
    expect(polygonArea(lines.sight.polygons[0]!)).toBeCloseTo(photo.expect.sightArea, 9);
    const face = polygonBounds(lines.mats[0]!.face.polygons[0]!);
    expect(face.w).toBeCloseTo(photo.expect.topFaceWidth, 9);
    expect(face.h).toBeCloseTo(photo.expect.topFaceHeight, 9);
  });
});

describe('fixture: plaque-3x9-window', () => {
  it('passes with exactly the 1/8 in overlap (common practice minimum)', () => {
    const layout = layoutFrom(plaque);
    expect(count(layout, 'error')).toBe(plaque.expect.errors);
    expect(count(layout, 'warning')).toBe(plaque.expect.warnings);
    const opening = layout.openings[0]!;
    expect((opening.pieceSize!.height - polygonBounds(openingLines(opening, layout.mats).sight.polygons[0]!).h) / 2).toBeCloseTo(plaque.expect.overlap, 9);
  });
});

describe('fixture: narrow-bridge', () => {
  it('reports the bridge at the right spot with the measured width within 0.01 in', () => {
    const findings = checkLayout(layoutFrom(narrowBridge));
    expect(findings).toHaveLength(1);
    const [finding] = findings;
    expect(finding!.severity).toBe(narrowBridge.expect.severity);
    expect(Math.abs(finding!.measured! - narrowBridge.expect.bridge)).toBeLessThanOrEqual(narrowBridge.expect.bridgeTolerance);
    const at = finding!.at;
    expect(Math.abs(at.x - narrowBridge.expect.at.x)).toBeLessThanOrEqual(narrowBridge.expect.atToleranceX);
    expect(at.y).toBeGreaterThan(2.25);
    expect(at.y).toBeLessThan(5.75);
  });
});

describe('fixture: self-intersecting-outline', () => {
  it('yields a finding at the crossing instead of throwing', () => {
    const layout = layoutFrom(selfIntersecting);
    const findings = checkLayout(layout);
    expect(findings.map((f) => f.code)).toEqual([selfIntersecting.expect.code]);
    const at = findings[0]!.at;
    expect(Math.abs(at.x - selfIntersecting.expect.at.x)).toBeLessThanOrEqual(selfIntersecting.expect.atTolerance);
    expect(Math.abs(at.y - selfIntersecting.expect.at.y)).toBeLessThanOrEqual(selfIntersecting.expect.atTolerance);
  });
});
