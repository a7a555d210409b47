import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { pinched, tapped, ZOOM_MAX, zoomClamped, zoomedAbout, zoomFit, zoomPressed, type ZoomView } from './proofZoom';

const frame = { width: 360, height: 432 };
/** Where a picture point (in unzoomed frame pixels) lands on screen: screen = shift + scale * point (an affine map). */
const onScreen = (v: ZoomView, p: { x: number; y: number }) => ({ x: v.x + v.scale * p.x, y: v.y + v.scale * p.y });
/** The inverse map, written separately: point = (screen - shift) / scale. */
const underSpot = (v: ZoomView, s: { x: number; y: number }) => ({ x: (s.x - v.x) / v.scale, y: (s.y - v.y) / v.scale });

describe("the customer's picture zoom", () => {
  it('a tap zooms in about the tapped spot, keeping the picture point under the finger; a second tap shows the whole picture', () => {
    const spot = { x: 200, y: 250 };
    const point = underSpot(zoomFit, spot);
    const zoomed = tapped(zoomFit, spot, frame);
    expect(zoomed.scale).toBe(2);
    const after = onScreen(zoomed, point);
    expect(after.x).toBeCloseTo(spot.x, 9);
    expect(after.y).toBeCloseTo(spot.y, 9);
    expect(tapped(zoomed, spot, frame)).toEqual(zoomFit);
  });

  it('never leaves a gap between the picture and its frame, whatever the zoom, pan or pinch', () => {
    const spot = fc.record({ x: fc.double({ min: 0, max: frame.width, noNaN: true }), y: fc.double({ min: 0, max: frame.height, noNaN: true }) });
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 20, noNaN: true }), spot, spot, spot, spot, (factor, a, b, c, d) => {
        const v = pinched(zoomedAbout(zoomFit, factor, a, frame), [a, b], [c, d], frame);
        // The picture's corners, (0,0) and the frame's size scaled, must lie outside or on the frame.
        const topLeft = onScreen(v, { x: 0, y: 0 });
        const bottomRight = onScreen(v, { x: frame.width, y: frame.height });
        expect(topLeft.x).toBeLessThanOrEqual(1e-9);
        expect(topLeft.y).toBeLessThanOrEqual(1e-9);
        expect(bottomRight.x).toBeGreaterThanOrEqual(frame.width - 1e-9);
        expect(bottomRight.y).toBeGreaterThanOrEqual(frame.height - 1e-9);
        expect(v.scale).toBeGreaterThanOrEqual(1);
        expect(v.scale).toBeLessThanOrEqual(ZOOM_MAX);
      }),
    );
  });

  it('a pinch that doubles the spread of two fingers doubles the scale about their centre', () => {
    const before = [{ x: 150, y: 200 }, { x: 210, y: 200 }] as const;
    const after = [{ x: 120, y: 200 }, { x: 240, y: 200 }] as const;
    const v = pinched(zoomFit, before, after, frame);
    expect(v.scale).toBeCloseTo(2, 12);
    const centre = onScreen(v, underSpot(zoomFit, { x: 180, y: 200 }));
    expect(centre.x).toBeCloseTo(180, 9);
    expect(centre.y).toBeCloseTo(200, 9);
  });

  it('buttons and keys zoom about the centre, pan by a fifth of the frame, stop at the edges, and fit again', () => {
    let v = zoomPressed(zoomFit, 'in', frame);
    expect(v).toEqual({ scale: 2, x: -180, y: -216 });
    v = zoomPressed(v, 'right', frame);
    expect(v.x).toBeCloseTo(-180 - 72, 9);
    for (let i = 0; i < 10; i += 1) v = zoomPressed(v, 'right', frame);
    expect(v.x).toBe(-360);
    expect(zoomPressed(v, 'out', frame)).toEqual(zoomFit);
    expect(zoomPressed(zoomPressed(zoomFit, 'in', frame), 'fit', frame)).toEqual(zoomFit);
    // Already whole: panning changes nothing.
    expect(zoomPressed(zoomFit, 'left', frame)).toEqual(zoomClamped(zoomFit, frame));
  });
});
