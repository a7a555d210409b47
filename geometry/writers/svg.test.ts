/// <reference lib="dom" />
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CutProfile } from '../cutPlan';
import { cutPlan } from '../cutPlan';
import { parseLayout } from '../layout';
import { cutPlanSvg } from './svg';

/**
 * The SVG is opened in Chromium and measured through the DOM: getBBox in
 * user units (inches here, W3C SVG 1.1 coordinate systems) and
 * getBoundingClientRect in CSS pixels, where 1in = 96px (W3C CSS Values and
 * Units, absolute lengths). Expected sizes are worked out from the layout.
 */

const T = 0.055;
const mat = (id: string) => ({ id, name: id, color: '#a3232b', coreColor: '#f6f3ea', ply: 4 as const, thickness: T, bevelAngle: 45, sheet: { width: 32, height: 40 } });
const parsed = parseLayout({
  schemaVersion: 2,
  outer: { width: 12, height: 10 },
  mats: [mat('top & "best"'), mat('lower')],
  mountingBoard: { color: '#ffffff', cut: false },
  openings: [
    { id: 'photo<1>', shape: { kind: 'rectangle', width: 4, height: 5 }, center: { x: 3.5, y: 4 }, depth: 2, reveals: [0.25] },
    { id: 'patch', shape: { kind: 'circle', radius: 1.5 }, center: { x: 9, y: 6.5 }, depth: 1 },
    { id: 'ticket', shape: { kind: 'roundedRectangle', width: 3, height: 1.5, cornerRadius: 0.4 }, center: { x: 8.5, y: 2 }, depth: 1 },
  ],
});
if (!parsed.ok) throw new Error('test layout is invalid');
const layout = parsed.layout;
const W = 12;

const profile = (over: Partial<CutProfile> = {}): CutProfile => ({
  units: 'in', mirrored: false, pathEdge: 'back', origin: 'bottom-left', arcs: true, chordToleranceIn: 0.005, maxSheetWidthIn: 40, maxSheetHeightIn: 60, ...over,
});

/** Left, top, width, height of each board-1 cut line as seen from the face, worked out from the layout. */
const faceBoxes: Record<string, [number, number, number, number]> = {
  // Mat 1's back edge of the photo: the 4 x 5 sight grown by the 1/4 in reveal on each side.
  'photo<1>': [3.5 - 2.25, 4 - 2.75, 4.5, 5.5],
  patch: [9 - 1.5, 6.5 - 1.5, 3, 3],
  ticket: [8.5 - 1.5, 2 - 0.75, 3, 1.5],
  outer: [0, 0, 12, 10],
};

let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  page = await browser.newPage();
}, 60_000);
afterAll(() => browser?.close());

interface Measured { opening: string | null; label: string; bbox: number[]; rect: number[] }

async function measure(svg: string): Promise<Measured[]> {
  await page.setContent(`<!doctype html><html><body style="margin:0">${svg.replace(/^<\?xml[^>]*>/, '')}</body></html>`);
  return page.$$eval('svg path', (paths) =>
    paths.map((p) => {
      const path = p as SVGPathElement;
      const b = path.getBBox();
      const r = path.getBoundingClientRect();
      return { opening: path.getAttribute('data-opening'), label: path.parentElement!.getAttribute('data-label')!, bbox: [b.x, b.y, b.width, b.height], rect: [r.left, r.top, r.width, r.height] };
    }),
  );
}

const closeAll = (actual: number[], expected: number[], tolerance: number) => actual.every((v, i) => Math.abs(v - expected[i]!) <= tolerance);

describe('SVG cut files in Chromium', () => {
  it('measure each cut line at its layout size and place in inches (getBBox) and at 96 px per inch on screen', async () => {
    const measured = await measure(cutPlanSvg(cutPlan(layout, profile()), { boards: [0] }));
    expect(measured).toHaveLength(4);
    for (const m of measured) {
      const expected = faceBoxes[m.opening ?? 'outer']!;
      expect(closeAll(m.bbox, expected, 0.0005), `${m.opening} bbox ${m.bbox}`).toBe(true);
      expect(closeAll(m.rect, expected.map((v) => v * 96), 0.05), `${m.opening} rect ${m.rect}`).toBe(true);
    }
    expect(new Set(measured.map((m) => m.label))).toEqual(new Set(['MAT1_OPENINGS', 'MAT1_OUTER']));
  });

  it('draw a face-down file as the mirror image: every box moves to width - x, sizes unchanged', async () => {
    const measured = await measure(cutPlanSvg(cutPlan(layout, profile({ mirrored: true })), { boards: [0] }));
    for (const m of measured) {
      const [x, y, w, h] = faceBoxes[m.opening ?? 'outer']!;
      expect(closeAll(m.bbox, [W - x - w, y, w, h], 0.0005), `${m.opening} bbox ${m.bbox}`).toBe(true);
    }
  });

  it('size the document in inches or millimetres with a viewBox in the same unit, and escape the shop\'s own text', async () => {
    const mmSvg = cutPlanSvg(cutPlan(layout, profile({ units: 'mm' })), { title: 'Job <b>& co</b>' });
    expect(mmSvg).toMatch(/width="304\.8mm" height="254mm" viewBox="0 0 304\.8 254"/);
    expect(mmSvg).toContain('<title>Job &lt;b&gt;&amp; co&lt;/b&gt;</title>');
    expect(mmSvg).toContain('data-board="top &amp; &quot;best&quot;"');
    const measured = await measure(mmSvg);
    const outer = measured.find((m) => m.label === 'MAT2_OUTER')!;
    expect(closeAll(outer.rect, [0, 0, W * 96, 10 * 96], 0.05)).toBe(true);
    const patch = measured.find((m) => m.opening === 'patch')!;
    expect(closeAll(patch.bbox, faceBoxes.patch!.map((v) => v * 25.4), 0.0005 * 25.4)).toBe(true);
    expect(await page.$$eval('svg path', (ps) => ps.every((p) => getComputedStyle(p).fill === 'none'))).toBe(true);
  });
});
