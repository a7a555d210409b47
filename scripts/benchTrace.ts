/**
 * How long a 12-megapixel phone photo takes to trace end to end on an image
 * thread (decode, square to the rectangle, separate, contour, simplify,
 * smooth, calibrate to inches, encode the kept photo), and how much memory
 * the process holding the thread reaches at its peak.
 *
 *   npx tsx scripts/benchTrace.ts
 *
 * The photo is made here: a jersey beside a Letter sheet under uneven light,
 * 4000 x 3000 px, seen through a 15 degree tilt. Targets: under 1.5 s and
 * under 600 MB. A second row traces a jersey close in colour to its board
 * (4000 x 3000, blotchy texture) with a rough box, which runs the graph
 * cut; its first run also loads OpenCV into the thread.
 */
import { homographyApply, polygonBounds } from '../geometry';
import { garmentPhoto, jerseyOutline, lowContrastPhoto } from '../server/test/fixtures/garmentPhoto';
import { createImagePool } from '../server/trace/imagePool';

const RUNS = 5;
const BOX_RUNS = 3;

/** Traces the low-contrast photo with a rough box round the jersey, `BOX_RUNS` times. */
async function boxRuns(pool: ReturnType<typeof createImagePool>): Promise<{ times: number[]; area: number }> {
  const photo = await lowContrastPhoto(4000, 3000);
  const seen = polygonBounds(jerseyOutline.map((p) => homographyApply(photo.camera, p)));
  const box = { x: seen.x - 120, y: seen.y - 100, width: seen.w + 220, height: seen.h + 180 };
  const from = homographyApply(photo.camera, { x: 0, y: 0 });
  const to = homographyApply(photo.camera, { x: 36, y: 0 });
  const times: number[] = [];
  let area = 0;
  for (let i = 0; i < BOX_RUNS; i++) {
    const started = performance.now();
    const out = await pool.trace({ photo: new Uint8Array(photo.jpeg), calibration: { kind: 'twoPoints', from, to, distanceIn: 36 }, box }, () => {});
    times.push(performance.now() - started);
    if (!out.ok || out.kind !== 'trace') throw new Error('the boxed bench photo did not trace');
    area = out.result.areaSqIn;
  }
  return { times, area };
}

async function main() {
  const photo = await garmentPhoto(4000, 3000, 15);
  const pool = createImagePool(1);
  await pool.ready();
  const baseline = process.memoryUsage().rss;
  let peak = baseline;
  const sampler = setInterval(() => {
    peak = Math.max(peak, process.memoryUsage().rss);
  }, 5);
  const times: number[] = [];
  let area = 0;
  for (let i = 0; i < RUNS; i++) {
    const started = performance.now();
    const out = await pool.trace({ photo: new Uint8Array(photo.jpeg), calibration: { kind: 'rectangle', corners: photo.sheetCorners, widthIn: 8.5, heightIn: 11 } }, () => {});
    times.push(performance.now() - started);
    if (!out.ok || out.kind !== 'trace') throw new Error('the bench photo did not trace');
    area = out.result.areaSqIn;
  }
  const peakPlain = peak;
  const boxed = await boxRuns(pool);
  clearInterval(sampler);
  await pool.close();
  const boxSorted = [...boxed.times].sort((a, b) => a - b);
  const sorted = [...times].sort((a, b) => a - b);
  const mb = (bytes: number) => (bytes / 1024 / 1024).toFixed(0);
  process.stdout.write(
    [
      `trace a 12 MP photo (4000 x 3000 JPEG, ${(photo.jpeg.length / 1e6).toFixed(1)} MB) end to end on an image thread, ${RUNS} runs:`,
      `  median ${sorted[Math.floor(RUNS / 2)]!.toFixed(0)} ms, fastest ${sorted[0]!.toFixed(0)} ms, slowest ${sorted[RUNS - 1]!.toFixed(0)} ms (target under 1500 ms)`,
      `  peak memory of the process holding the thread: ${mb(peakPlain)} MB resident (${mb(baseline)} MB before the first photo; target under 600 MB)`,
      `  traced area ${area.toFixed(2)} sq in`,
      `trace a 12 MP low-contrast photo with a rough box (graph cut), ${BOX_RUNS} runs:`,
      `  first ${boxed.times[0]!.toFixed(0)} ms (loads OpenCV), then median ${boxSorted[Math.floor(BOX_RUNS / 2)]!.toFixed(0)} ms, slowest ${boxSorted[BOX_RUNS - 1]!.toFixed(0)} ms`,
      `  peak memory with the graph cut: ${mb(peak)} MB resident; traced area ${boxed.area.toFixed(2)} sq in (true 196.42)`,
      '',
    ].join('\n'),
  );
}

main().catch((err) => {
  process.stderr.write(`${err instanceof Error ? err.stack : String(err)}\n`);
  process.exit(1);
});
