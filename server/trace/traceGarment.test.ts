import { describe, expect, it } from 'vitest';
import { homographyApply, polygonArea, polygonBounds } from '../../geometry';
import { hausdorff } from '../test/fixtures/outlineDistance';
import { garmentPhoto, jerseyOutline, letterSheet } from '../test/fixtures/garmentPhoto';
import { traceGarment } from './runTrace';

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
    const distanceIn = Math.hypot(8.5, 11);
    const out = await traceGarment({ photo: photo.jpeg, calibration: { kind: 'twoPoints', from: from!, to: to!, distanceIn }, box, background });
    const trueArea = polygonArea(jerseyOutline);
    expect(Math.abs(out.result.areaSqIn - trueArea) / trueArea).toBeLessThan(0.01);
    // The graph cut takes in the jersey's soft shadow; Otsu's edge inside the cut's region leaves it out again.
    const inchesPerPx = distanceIn / Math.hypot(to!.x - from!.x, to!.y - from!.y);
    const expected = jerseyOutline.map((p) => {
      const q = homographyApply(photo.camera, p);
      return { x: q.x * inchesPerPx, y: q.y * inchesPerPx };
    });
    const traced = out.result.points.map((p) => ({ x: p.x + out.originIn.x, y: p.y + out.originIn.y }));
    expect(hausdorff(traced, expected)).toBeLessThan(SIXTEENTH);
  }, 60000);
});
