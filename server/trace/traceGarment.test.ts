import { describe, expect, it } from 'vitest';
import { homographyApply, polygonArea, polygonBounds, segmentPointDistance, type BoardPoint } from '../../geometry';
import { garmentPhoto, jerseyOutline, letterSheet } from '../test/fixtures/garmentPhoto';
import { traceGarment } from './runTrace';

/** Points every `step` along a closed ring, corners included. */
function densify(ring: readonly BoardPoint[], step: number): BoardPoint[] {
  const out: BoardPoint[] = [];
  ring.forEach((a, i) => {
    const b = ring[(i + 1) % ring.length]!;
    const n = Math.max(1, Math.ceil(Math.hypot(b.x - a.x, b.y - a.y) / step));
    for (let k = 0; k < n; k++) out.push({ x: a.x + ((b.x - a.x) * k) / n, y: a.y + ((b.y - a.y) * k) / n });
  });
  return out;
}

function distanceToRing(ring: readonly BoardPoint[], p: BoardPoint): number {
  let best = Infinity;
  ring.forEach((a, i) => {
    best = Math.min(best, segmentPointDistance(a, ring[(i + 1) % ring.length]!, p));
  });
  return best;
}

/** Symmetric Hausdorff distance between two closed outlines, by brute force over points 0.005 in apart on each. */
function hausdorff(a: readonly BoardPoint[], b: readonly BoardPoint[]): number {
  let worst = 0;
  for (const p of densify(a, 0.005)) worst = Math.max(worst, distanceToRing(b, p));
  for (const p of densify(b, 0.005)) worst = Math.max(worst, distanceToRing(a, p));
  return worst;
}

const SIXTEENTH = 1 / 16;

describe('tracing a folded jersey from a photo', () => {
  it('is true to scale through a 15 degree camera tilt, calibrated by the Letter sheet corners', async () => {
    const photo = await garmentPhoto(3000, 2250, 15);
    const out = await traceGarment({
      photo: photo.jpeg,
      calibration: { kind: 'rectangle', corners: photo.sheetCorners, widthIn: 8.5, heightIn: 11 },
    });
    // The calibrated plane has its origin at the sheet's top-left corner.
    const traced = out.result.points.map((p) => ({ x: p.x + out.originIn.x + letterSheet[0]!.x, y: p.y + out.originIn.y + letterSheet[0]!.y }));
    const trueArea = polygonArea(jerseyOutline);
    expect(Math.abs(polygonArea(traced) - trueArea) / trueArea).toBeLessThan(0.01);
    expect(hausdorff(traced, jerseyOutline)).toBeLessThan(SIXTEENTH);
  }, 60000);

  it('gives the same outline from an untilted photo calibrated by two points a known distance apart', async () => {
    const photo = await garmentPhoto(3000, 2250, 0);
    const [from, , to] = photo.sheetCorners;
    const distanceIn = Math.hypot(8.5, 11);
    const out = await traceGarment({ photo: photo.jpeg, calibration: { kind: 'twoPoints', from: from!, to: to!, distanceIn } });
    const inchesPerPx = distanceIn / Math.hypot(to!.x - from!.x, to!.y - from!.y);
    const expected = jerseyOutline.map((p) => {
      const q = homographyApply(photo.camera, p);
      return { x: q.x * inchesPerPx, y: q.y * inchesPerPx };
    });
    const traced = out.result.points.map((p) => ({ x: p.x + out.originIn.x, y: p.y + out.originIn.y }));
    const trueArea = polygonArea(jerseyOutline);
    expect(Math.abs(polygonArea(traced) - trueArea) / trueArea).toBeLessThan(0.01);
    expect(hausdorff(traced, expected)).toBeLessThan(SIXTEENTH);
  }, 60000);

  it('keeps to a rough box round the garment and takes the board colour from a tapped point', async () => {
    const photo = await garmentPhoto(2000, 1500, 0);
    const seen = polygonBounds(jerseyOutline.map((p) => homographyApply(photo.camera, p)));
    const box = { x: seen.x - 40, y: seen.y - 40, width: seen.w + 80, height: seen.h + 80 };
    const [from, , to] = photo.sheetCorners;
    const background = homographyApply(photo.camera, { x: 20, y: 2 });
    const out = await traceGarment({ photo: photo.jpeg, calibration: { kind: 'twoPoints', from: from!, to: to!, distanceIn: Math.hypot(8.5, 11) }, box, background });
    const trueArea = polygonArea(jerseyOutline);
    expect(Math.abs(out.result.areaSqIn - trueArea) / trueArea).toBeLessThan(0.01);
  }, 60000);
});
