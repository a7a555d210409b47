/**
 * The proof e-mail's picture, timed in its two parts: building the mat-stack
 * SVG (on the event loop: opening lines and path text) and sharp's
 * rasterising to PNG (libuv threads). Printed, never asserted.
 *
 *   npx tsx scripts/benchProofPicture.ts
 *
 * Rows: the seven-opening jersey shadowbox with a 2 000-point traced outline,
 * the same with a 50 000-point outline (the schema's limit per outline), and
 * 200 openings (the schema's limit of openings).
 */
import { createLayoutEngine, matStackSvg, parseLayout, type Layout } from '../geometry';
import { PROOF_PICTURE_LONG_SIDE_PX, proofPicturePng } from '../server/services/proofPicture';
import { benchLayout, median } from './benchLayout';
import { manyOpeningsLayout } from './hostileLayouts';

function svgOnly(layout: Layout): string {
  return matStackSvg(layout, createLayoutEngine().lines(layout), { longSidePx: PROOF_PICTURE_LONG_SIDE_PX });
}

async function row(name: string, layout: Layout) {
  svgOnly(layout);
  const svgMs = median(() => svgOnly(layout), 5);
  const kb = Buffer.byteLength(svgOnly(layout)) / 1024;
  await proofPicturePng(layout, name);
  const times: number[] = [];
  let bytes = 0;
  for (let i = 0; i < 5; i += 1) {
    const start = performance.now();
    bytes = (await proofPicturePng(layout, name)).length;
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return `  ${name.padEnd(34)} SVG on the event loop ${svgMs.toFixed(1).padStart(7)} ms (${kb.toFixed(0)} KB)   whole PNG ${times[2]!.toFixed(1).padStart(7)} ms   ${(bytes / 1024).toFixed(1)} KB PNG`;
}

const many = parseLayout(manyOpeningsLayout(200));
if (!many.ok) throw new Error('the 200-opening layout is invalid');
console.log(`Proof e-mail picture, ${PROOF_PICTURE_LONG_SIDE_PX} px long side (median of 5):`);
console.log(await row('jersey shadowbox, 2 000-point outline', benchLayout(2_000)));
console.log(await row('jersey shadowbox, 50 000-point outline', benchLayout(50_000)));
console.log(await row('200 openings', many.layout));
