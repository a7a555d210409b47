import { describe, expect, it } from 'vitest';
import { cutSheetHtml } from './cutSheet';
import { cutPlan } from './cutPlan';
import { parseLayout } from './layout';

const T = 0.055;
const mat = (id: string, name: string, color: string) => ({ id, name, color, coreColor: '#f6f3ea', ply: 4 as const, thickness: T, bevelAngle: 45, sheet: { width: 32, height: 40 } });
const parsed = parseLayout({
  schemaVersion: 2,
  outer: { width: 16, height: 20 },
  mats: [mat('top', 'Harbour <navy>', '#1D2B4A'), mat('lower', 'Old gold', '#B8902F')],
  mountingBoard: { color: '#ffffff', cut: false },
  openings: [
    { id: 'photo', shape: { kind: 'rectangle', width: 8, height: 10 }, center: { x: 6, y: 8 }, depth: 2, reveals: [0.25] },
    { id: 'patch "A"', shape: { kind: 'circle', radius: 2 }, center: { x: 12, y: 15 }, depth: 1 },
  ],
});
if (!parsed.ok) throw new Error('test layout is invalid');

const sheet = (over: Partial<Parameters<typeof cutSheetHtml>[0]> = {}) =>
  cutSheetHtml({ layout: parsed.layout, jobTitle: 'Tidewater Brackenwings #44 <script>alert(1)</script>', layoutName: 'Jersey & patches', version: 3, date: '2026-03-14', rounding: '1/16', pathEdge: 'back', ...over });

const ENTITIES: Record<string, string> = { '&quot;': '"', '&amp;': '&', '&lt;': '<', '&gt;': '>', '&#39;': "'" };
/** What a reader sees: entities decoded, tags stripped. */
const text = (html: string) => html.replace(/&(quot|amp|lt|gt|#39);/g, (e) => ENTITIES[e]!);
/** The text of each table row, cells joined by |. */
const rows = (html: string) => [...html.matchAll(/<tr><td>(.*?)<\/tr>/g)].map((m) => text(m[1]!.replace(/<\/?span[^>]*>/g, '').replace(/<[^>]+>/g, '|').replace(/\|+/g, '|')));

describe('cut sheet', () => {
  it('escapes every piece of the shop\'s own text', () => {
    const html = sheet();
    expect(html).not.toContain('<script>');
    expect(html).toContain('Tidewater Brackenwings #44 &lt;script&gt;alert(1)&lt;/script&gt;');
    expect(html).toContain('Jersey &amp; patches');
    expect(html).toContain('Harbour &lt;navy&gt;');
    expect(sheet({ openingNames: new Map([['photo', 'Team <photo>']]) })).toContain('Team &lt;photo&gt;');
  });

  it("lists each mat's colour, ply, thickness and outer size, and each opening's back-edge size and position from the left and top", () => {
    const html = sheet();
    expect(html).toContain('style="background:#1D2B4A"');
    expect(html).toMatch(/<dt>Ply<\/dt><dd>4-ply<\/dd>/);
    expect(text(html)).toMatch(/<dt>Thickness<\/dt><dd>0\.055"<\/dd>/);
    expect(text(html)).toContain('16" × 20"');
    // Mat 1: photo back edge = 8 x 10 sight + 1/4 in reveal each side = 8 1/2 x 10 1/2, its box from (1 3/4, 2 3/4).
    // The patch's 2 in radius circle: 4 x 4 from (10, 13).
    const all = rows(html);
    expect(all).toContainEqual(expect.stringMatching(/Opening 1\|Rectangle\|8 1\/2" × 10 1\/2"\|1 3\/4"\|2 3\/4"/));
    expect(all).toContainEqual(expect.stringMatching(/Opening 2\|Circle\|4" × 4"\|10"\|13"/));
    // Mat 2: only the photo, at the sight size.
    expect(all).toContainEqual(expect.stringMatching(/Opening 1\|Rectangle\|8" × 10"\|2"\|3"/));
    expect(all).toHaveLength(3);
  });

  it('gives face-edge sizes when the profile follows the face edge, and millimetres in a metric shop', () => {
    const face = rows(sheet({ pathEdge: 'face' }));
    // Mat 2 face edge: sight + bevel run (0.055) each side = 8.11 in, shown to the nearest 1/16 as 8 1/8".
    expect(face).toContainEqual(expect.stringMatching(/Opening 1\|Rectangle\|8 1\/8" × 10 1\/8"/));
    const metric = sheet({ rounding: '0.5mm' });
    expect(metric).toContain('406.5 mm × 508 mm');
    expect(metric).toMatch(/<dt>Thickness<\/dt><dd>1\.40 mm<\/dd>/);
  });

  it("numbers the openings in the cut file's order for the chosen cutter, on the table and on the board's picture", () => {
    // A bottom-left origin starts the blade near the patch (lower right of the face view), a top-left one near the photo.
    for (const origin of ['bottom-left', 'top-left'] as const) {
      const profile = { units: 'in', mirrored: false, pathEdge: 'back', origin, arcs: true, chordToleranceIn: 0.005, maxSheetWidthIn: 40, maxSheetHeightIn: 60 } as const;
      const fileOrder = cutPlan(parsed.layout, profile).boards[0]!.paths.flatMap((p) => (p.openingId ? [p.openingId] : []));
      const names = fileOrder.map((id) => (id === 'photo' ? 'Opening 1' : 'Opening 2'));
      const html = sheet({ profile, openingNames: new Map() });
      const matOne = rows(html).slice(0, 2).map((r) => r.split('|').slice(0, 2).join(' '));
      expect(matOne).toEqual(names.map((name, i) => `${i + 1} ${name}`));
      // The drawing of mat 1 shows "1" at the middle of the first opening the file cuts.
      const first = fileOrder[0] === 'photo' ? { x: 6, y: 8 } : { x: 12, y: 15 };
      expect(html).toMatch(new RegExp(`<text class="cut-number" x="${first.x}" y="${first.y}"[^>]*>1</text>`));
    }
    expect(cutPlan(parsed.layout, { units: 'in', mirrored: false, pathEdge: 'back', origin: 'bottom-left', arcs: true, chordToleranceIn: 0.005, maxSheetWidthIn: 40, maxSheetHeightIn: 60 }).boards[0]!.paths[0]!.openingId).toBe('patch "A"');
  });

  it('shows lengths in the shop rounding with the exact decimal on hover', () => {
    // Mat 1 photo back edge 8.5 in wide: 8 1/2" shown, 8.5 in in the title.
    expect(sheet()).toContain('<span title="8.5 in">8 1/2&quot;</span>');
  });

  it('carries the job, layout, version, date, a drawing per mat, print styles and the blade cautions', () => {
    const html = sheet();
    expect(html).toContain('Layout Jersey &amp; patches · version 3 · printed 2026-03-14');
    expect(html.match(/<svg /g)).toHaveLength(2);
    expect(html).toContain('@media print');
    expect(html).toMatch(/sharps container/);
    expect(html).toMatch(/replace dull blades/);
    expect(text(html)).toMatch(/shop's own safety practice/);
  });
});
