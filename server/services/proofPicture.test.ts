import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';
import { parseLayout, type Layout } from '../../geometry';
import { PROOF_PICTURE_LONG_SIDE_PX, proofPicturePng } from './proofPicture';

/**
 * The e-mail's picture is decoded back to pixels with sharp and sampled where
 * the bands must be, worked out by hand from the layout: at a 45 degree bevel
 * the bevel's horizontal run equals the board's thickness (t * tan 45 = t,
 * trigonometry); a reveal is measured between face edges and the sight line is
 * the lowest mat's back edge (geometry/README.md). 4-ply at 0.055 in is common
 * practice (0.050-0.060 in).
 */

const T = 0.055;
const colours = {
  top: '#1d2b4a',
  topCore: '#f6f3ea',
  lower: '#b8902f',
  lowerCore: '#e05a10',
  board: '#40c040',
};
const mat = (id: string, color: string, coreColor: string) => ({ id, name: id, color, coreColor, ply: 4, thickness: T, bevelAngle: 45, sheet: { width: 32, height: 40 } });

function testLayout(): Layout {
  const parsed = parseLayout({
    schemaVersion: 2,
    outer: { width: 20, height: 24 },
    mats: [mat('top', colours.top, colours.topCore), mat('lower', colours.lower, colours.lowerCore)],
    mountingBoard: { color: colours.board, cut: false },
    openings: [
      { id: 'jersey', shape: { kind: 'rectangle', width: 8, height: 10 }, center: { x: 10, y: 12 }, depth: 2, reveals: [0.25] },
      { id: 'patch', shape: { kind: 'circle', radius: 2 }, center: { x: 10, y: 20 }, depth: 1 },
    ],
  });
  if (!parsed.ok) throw new Error('the test layout is invalid');
  return parsed.layout;
}

const hex = (r: number, g: number, b: number) => `#${[r, g, b].map((v) => v.toString(16).padStart(2, '0')).join('')}`;

async function pixels(png: Buffer) {
  const { data, info } = await sharp(png).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  return {
    width: info.width,
    height: info.height,
    at(x: number, y: number) {
      const i = (y * info.width + x) * 3;
      return hex(data[i]!, data[i + 1]!, data[i + 2]!);
    },
  };
}

describe("the proof e-mail's picture", () => {
  it('is a PNG sized by its long side in the outer size proportion (20 x 24 in: 600 x 720 px)', async () => {
    const png = await proofPicturePng(testLayout(), 'Proposed mats');
    const meta = await sharp(png).metadata();
    expect(meta.format).toBe('png');
    expect(meta.height).toBe(PROOF_PICTURE_LONG_SIDE_PX);
    expect(meta.width).toBe(Math.round((PROOF_PICTURE_LONG_SIDE_PX * 20) / 24));
  });

  // 150 px per inch: a 0.055 in bevel is 8.25 px wide.
  const perInch = 150;
  let img: Awaited<ReturnType<typeof pixels>>;
  beforeAll(async () => {
    img = await pixels(await proofPicturePng(testLayout(), 'Proposed mats', 24 * perInch));
  });

  it('shows each mat in its colour, the core at every bevel, the reveal, and the board in the sight opening', () => {
    const sample = (xIn: number, yIn: number) => img.at(Math.floor(xIn * perInch), Math.floor(yIn * perInch));
    // Left side of the jersey opening, outside in: sight at 6, lower face 6 - t, top face 6 - t - 0.25, top back 6 - 0.25.
    const sight = 6;
    const lowerFace = sight - T;
    const topFace = lowerFace - 0.25;
    const topBack = topFace + T;
    expect(sample(3, 12)).toBe(colours.top);
    expect(sample((topFace + topBack) / 2, 12)).toBe(colours.topCore);
    expect(sample((topBack + lowerFace) / 2, 12)).toBe(colours.lower);
    expect(sample((lowerFace + sight) / 2, 12)).toBe(colours.lowerCore);
    expect(sample(10, 12)).toBe(colours.board);
    // A depth-1 circle cuts only the top mat: its core ring, then the lower mat's face inside.
    expect(sample(10 + 2 + T / 2, 20)).toBe(colours.topCore);
    expect(sample(10, 20)).toBe(colours.lower);
  });

  it("draws the top mat's core band as wide as the board is thick, counted pixel by pixel across the row", () => {
    const row = Math.floor(12 * perInch);
    let core = 0;
    for (let x = Math.floor(5 * perInch); x < Math.floor(6.5 * perInch); x += 1) if (img.at(x, row) === colours.topCore) core += 1;
    // t * tan 45 = 0.055 in = 8.25 px at 150 px/in; the two edge pixels are blended, so up to one and a quarter either way.
    expect(Math.abs(core - T * perInch)).toBeLessThanOrEqual(1.25);
  });
});
