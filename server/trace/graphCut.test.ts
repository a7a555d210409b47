import { describe, expect, it } from 'vitest';
import { homographyApply, polygonArea, polygonBounds } from '../../geometry';
import { jerseyOutline, lowContrastPhoto } from '../test/fixtures/garmentPhoto';
import { hausdorff } from '../test/fixtures/outlineDistance';
import { traceGarment, type TraceInput } from './runTrace';

/** The made-up jersey's own area, by the shoelace formula on its corners: the truth the traces are held to. */
const trueArea = polygonArea(jerseyOutline);

/**
 * The texture's grain is 12 photo pixels across; the untilted camera puts
 * 2000 x 0.86 / 36 = 47.8 pixels on an inch of board, so one grain is
 * 0.25 in. Where garment and board differ by less than the texture, a
 * grain lying on the edge can go to either side, so the outline is held to
 * one grain: 1/4 in (four times the 1/16 in held on a high-contrast photo).
 */
const ONE_GRAIN_IN = 0.25;

async function lowContrastScene() {
  const photo = await lowContrastPhoto(2000, 1500);
  const from = homographyApply(photo.camera, { x: 0, y: 0 });
  const to = homographyApply(photo.camera, { x: 36, y: 0 });
  const calibration: TraceInput['calibration'] = { kind: 'twoPoints', from, to, distanceIn: 36 };
  // The untilted camera is a scale and a shift, so the true outline in plane inches is the board outline seen and rescaled.
  const inchesPerPx = 36 / Math.hypot(to.x - from.x, to.y - from.y);
  const expected = jerseyOutline.map((p) => {
    const q = homographyApply(photo.camera, p);
    return { x: q.x * inchesPerPx, y: q.y * inchesPerPx };
  });
  const seen = polygonBounds(jerseyOutline.map((p) => homographyApply(photo.camera, p)));
  // A rough box: uneven bare board on each side, 1 to 1.3 in of it.
  const box = { x: seen.x - 60, y: seen.y - 50, width: seen.w + 110, height: seen.h + 90 };
  return { photo, calibration, expected, box };
}

async function outlineError(input: TraceInput, expected: { x: number; y: number }[]) {
  const out = await traceGarment(input);
  const traced = out.result.points.map((p) => ({ x: p.x + out.originIn.x, y: p.y + out.originIn.y }));
  return { areaError: Math.abs(polygonArea(traced) - trueArea) / trueArea, hausdorff: hausdorff(traced, expected) };
}

describe('separating a garment close in colour to its board, inside a rough box (GrabCut, Rother, Kolmogorov and Blake 2004)', () => {
  it('traces the true outline with a box, where the board-contrast threshold alone finds nothing or worse', async () => {
    const { photo, calibration, expected, box } = await lowContrastScene();
    const withBox = await outlineError({ photo: photo.jpeg, calibration, box }, expected);
    expect(withBox.areaError).toBeLessThan(0.02);
    expect(withBox.hausdorff).toBeLessThan(ONE_GRAIN_IN);
    // The same photo without the box goes through Otsu's threshold on the difference from the board.
    const withoutBox = await outlineError({ photo: photo.jpeg, calibration }, expected).catch((err: Error) => err);
    if (withoutBox instanceof Error) {
      expect(withoutBox.message).toMatch(/No garment stands out/);
    } else {
      expect(withoutBox.hausdorff).toBeGreaterThan(2 * withBox.hausdorff);
    }
  }, 120000);

  it('says in plain words when the box holds only bare board', async () => {
    const { photo, calibration } = await lowContrastScene();
    // 8 x 10 in of the board to the right of the jersey, nothing on it but the texture.
    const a = homographyApply(photo.camera, { x: 25, y: 12 });
    const b = homographyApply(photo.camera, { x: 33, y: 22 });
    const bareBoard = { x: a.x, y: a.y, width: b.x - a.x, height: b.y - a.y };
    await expect(traceGarment({ photo: photo.jpeg, calibration, box: bareBoard })).rejects.toThrow(/No garment was found inside the box/);
  }, 60000);
});
