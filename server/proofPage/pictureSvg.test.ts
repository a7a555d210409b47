import { selectAll, selectOne } from 'css-select';
import type { Element } from 'domhandler';
import { getAttributeValue } from 'domutils';
import { parseDocument } from 'htmlparser2';
import { describe, expect, it } from 'vitest';
import { createLayoutEngine, matStackPaths } from '../../geometry';
import { parseLayout } from '../../geometry/layout';
import type { PublicProofView } from '../../features/proofs/schema';
import { designSection } from './designSection';
import { escapeHtml, html } from './html';
import { proofPictureSvg } from './pictureSvg';

const mat = (id: string, name: string, color: string) => ({ id, name, color, coreColor: '#F6F3EA', ply: 4, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } });
// A traced garment's outline (points from the opening's centre), turned 15 degrees, and a photo's rectangle beside it.
const outline = [
  { x: -6, y: -7 },
  { x: 6, y: -7 },
  { x: 7, y: 7 },
  { x: -7, y: 7 },
];
const layoutDocument = {
  schemaVersion: 2,
  outer: { width: 30, height: 24 },
  mats: [mat('top', 'Night <b>sky</b>', '#1D2B4A'), mat('middle', 'Old gold', '#B8902F'), mat('bottom', 'Warm white', '#F3EFE4')],
  mountingBoard: { color: '#FFFFFF', cut: false },
  openings: [
    { id: 'garment', pieceId: 'g', shape: { kind: 'outline', points: outline }, center: { x: 11, y: 12 }, rotation: 15, depth: 3, reveals: [0.25, 0.25] },
    { id: 'photo', pieceId: 'p', shape: { kind: 'rectangle', width: 6, height: 8 }, center: { x: 24, y: 12 }, depth: 1 },
  ],
};
const pieces: PublicProofView['pieces'] = [
  { id: 'g', label: 'Home jersey', kind: 'garment', widthIn: 14, heightIn: 14, photo: { url: '/api/proofs/T/pieces/0/photo', widthIn: 20, heightIn: 22, traced: { centreX: 9.5, centreY: 10 } } },
  { id: 'p', label: 'Team photo', kind: 'photo', widthIn: 6.5, heightIn: 8.5, photo: { url: '/api/proofs/T/pieces/1/photo', widthIn: 6.5, heightIn: 8.5, traced: null } },
];

type Root = Parameters<typeof selectOne>[1];
/** css-select over htmlparser2's tree, typed as the elements it finds. */
const one = (selector: string, root: Root) => selectOne(selector, root) as unknown as Element;
const all = (selector: string, root: Root) => selectAll(selector, root) as unknown as Element[];

function drawn() {
  const parsed = parseLayout(layoutDocument);
  if (!parsed.ok) throw new Error('the test layout does not parse');
  const drawing = matStackPaths(parsed.layout, createLayoutEngine().lines(parsed.layout));
  return { layout: parsed.layout, drawing };
}

describe('the picture of a proof, as server-made SVG', () => {
  it('layers the mats from the lowest up, each photo under the lowest mat it shows through, a traced garment placed by its outline at true scale', () => {
    const { layout, drawing } = drawn();
    const dom = parseDocument(proofPictureSvg(layout, drawing, pieces, 'The design').text);
    const groups = all('svg > g', dom);
    expect(groups.map((g) => getAttributeValue(g, 'data-testid'))).toEqual(['mat-layer-3', 'mat-layer-2', 'mat-layer-1']);
    // The face of each mat is its own colour, over its core colour at the bevel.
    expect(groups.map((g) => all('path', g).map((p) => getAttributeValue(p, 'fill')))).toEqual([
      ['#F6F3EA', '#F3EFE4'],
      ['#F6F3EA', '#B8902F'],
      ['#F6F3EA', '#1D2B4A'],
    ]);
    const garment = one('image[data-piece-photo=garment]', dom);
    expect(getAttributeValue(garment.parent as Element, 'data-testid')).toBe('mat-layer-3');
    // The squared photo keeps its own inches (no stretching to the piece), its outline centre on the opening's centre, turned with it.
    expect(['x', 'y', 'width', 'height', 'preserveaspectratio', 'transform'].map((a) => getAttributeValue(garment, a))).toEqual(['1.5', '2', '20', '22', 'none', 'rotate(15 11 12)']);
    const photo = one('image[data-piece-photo=photo]', dom);
    expect(getAttributeValue(photo.parent as Element, 'data-testid')).toBe('mat-layer-1');
    expect(['x', 'y', 'width', 'height', 'preserveaspectratio'].map((a) => getAttributeValue(photo, a))).toEqual(['20.75', '7.75', '6.5', '8.5', 'xMidYMid slice']);
  });

  it('puts the shop\u2019s words in as text only, and the picture\u2019s shape in its width and height before anything loads', () => {
    const { layout, drawing } = drawn();
    const section = designSection(layout, drawing, pieces).text;
    expect(section).toContain('1. Night &lt;b&gt;sky&lt;/b&gt; (dark blue)');
    expect(section).not.toContain('<b>');
    const svg = one('svg[data-testid=proof-picture]', parseDocument(section));
    // 30 x 24 in at 720 px on the long side.
    expect([getAttributeValue(svg, 'width'), getAttributeValue(svg, 'height')]).toEqual(['720', '576']);
    expect(getAttributeValue(svg, 'aria-label')).toBe('Picture of the proposed mats, 30" wide by 24" high: dark blue over orange over cream, with your pieces in their openings');
  });
});

describe('the page templates', () => {
  it('escape the five characters HTML gives meaning to (HTML Living Standard, 13.1.2.6 and 13.1.4) in text and attributes, and nothing else', () => {
    expect(escapeHtml(`<a href="x">Tom & 'Jo'</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;Tom &amp; &#39;Jo&#39;&lt;/a&gt;');
    expect(escapeHtml('Plain words, 8 1/2" — ok')).toBe('Plain words, 8 1/2&quot; — ok');
    const value = '"><script>x</script>';
    expect(html`<input value="${value}">${[html`<b>kept</b>`, '<i>escaped</i>']}${null}${false}${0}`.text).toBe(
      '<input value="&quot;&gt;&lt;script&gt;x&lt;/script&gt;"><b>kept</b>&lt;i&gt;escaped&lt;/i&gt;0',
    );
  });
});
