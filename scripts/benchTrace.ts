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
 * under 600 MB.
 */
import { garmentPhoto } from '../server/test/fixtures/garmentPhoto';
import { createImagePool } from '../server/trace/imagePool';

const RUNS = 5;

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
  clearInterval(sampler);
  await pool.close();
  const sorted = [...times].sort((a, b) => a - b);
  const mb = (bytes: number) => (bytes / 1024 / 1024).toFixed(0);
  process.stdout.write(
    [
      `trace a 12 MP photo (4000 x 3000 JPEG, ${(photo.jpeg.length / 1e6).toFixed(1)} MB) end to end on an image thread, ${RUNS} runs:`,
      `  median ${sorted[Math.floor(RUNS / 2)]!.toFixed(0)} ms, fastest ${sorted[0]!.toFixed(0)} ms, slowest ${sorted[RUNS - 1]!.toFixed(0)} ms (target under 1500 ms)`,
      `  peak memory of the process holding the thread: ${mb(peak)} MB resident (${mb(baseline)} MB before the first photo; target under 600 MB)`,
      `  traced area ${area.toFixed(2)} sq in`,
      '',
    ].join('\n'),
  );
}

main().catch((err) => {
  process.stderr.write(`${err instanceof Error ? err.stack : String(err)}\n`);
  process.exit(1);
});
