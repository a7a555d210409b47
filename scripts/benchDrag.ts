/**
 * How long one frame of dragging takes in the designer, in Chromium on this
 * machine, on a full-size shadowbox: three mats, a traced garment of 2 000
 * points, two 4 in patches, an 8 x 10 photo, a plaque and two small cards.
 *
 *   SEED_DEMO=1 ... node --import tsx server/main.ts     (a server with the demo shop)
 *   BASE_URL=http://127.0.0.1:8347 npx tsx scripts/benchDrag.ts
 *
 * The pointer moves once per animation frame, as a mouse does. Printed per
 * drag: the main thread's busy time per frame (Chromium's own TaskDuration
 * over the drag, divided by the frames), the spacing of animation frames
 * (mean and 95th percentile; 16.7 ms is a full 60 Hz), and the time to the
 * finished checks after letting go. Nothing is asserted: it is a measurement.
 */
import { chromium, type Page } from '@playwright/test';
import type { BoardPoint, LayoutInput } from '../geometry';

const base = process.env.BASE_URL ?? 'http://127.0.0.1:8181';
const FRAMES = 120;

/** An invented folded garment: a T with sleeves, resampled to `count` points with gentle fold ripples. */
function garmentOutline(count: number): BoardPoint[] {
  const corners: BoardPoint[] = [
    { x: -2, y: -9.5 }, { x: 0, y: -8.6 }, { x: 2, y: -9.5 }, { x: 5.2, y: -9 }, { x: 8.6, y: -6.8 }, { x: 6.6, y: -3.6 },
    { x: 5.6, y: -4.4 }, { x: 5.8, y: 9.5 }, { x: -5.8, y: 9.5 }, { x: -5.6, y: -4.4 }, { x: -6.6, y: -3.6 }, { x: -8.6, y: -6.8 }, { x: -5.2, y: -9 },
  ];
  const edges = corners.map((p, i) => ({ p, q: corners[(i + 1) % corners.length]! }));
  const lengths = edges.map(({ p, q }) => Math.hypot(q.x - p.x, q.y - p.y));
  const total = lengths.reduce((a, b) => a + b, 0);
  const points: BoardPoint[] = [];
  for (let i = 0; i < count; i++) {
    let along = (total * i) / count;
    let e = 0;
    while (along > lengths[e]!) along -= lengths[e++]!;
    const { p, q } = edges[e]!;
    const t = along / lengths[e]!;
    // Ripples fade out towards each corner so neighbouring edges never cross.
    const ripple = 0.05 * Math.sin((i / count) * 2 * Math.PI * 31) * Math.sin(Math.PI * t);
    const nx = (q.y - p.y) / lengths[e]!;
    const ny = -(q.x - p.x) / lengths[e]!;
    points.push({ x: p.x + t * (q.x - p.x) + ripple * nx, y: p.y + t * (q.y - p.y) + ripple * ny });
  }
  return points;
}

function benchLayout(): LayoutInput {
  const sheet = { width: 32, height: 40 };
  const mat = (id: string, name: string, color: string) => ({ id, name, color, coreColor: '#F6F3EA', ply: 4 as const, thickness: 0.055, bevelAngle: 45, sheet });
  const rect = (id: string, width: number, height: number, x: number, y: number, depth: number, clearance: number) => ({
    id, shape: { kind: 'rectangle' as const, width, height }, center: { x, y }, rotation: 0, depth, clearance, reveals: depth === 2 ? [0.25] : [],
  });
  return {
    schemaVersion: 2,
    outer: { width: 32, height: 40 },
    mats: [mat('top', 'Deep teal', '#1F4E52'), mat('middle', 'Brick', '#8E3B2E'), mat('bottom', 'Cream', '#F1EBDD')],
    mountingBoard: { color: '#FFFFFF', cut: false },
    openings: [
      { id: 'garment', shape: { kind: 'outline', points: garmentOutline(2000) }, center: { x: 16, y: 11 }, rotation: 0, depth: 3, clearance: 0.25, reveals: [0.25, 0.25] },
      { id: 'patch-left', shape: { kind: 'circle', radius: 1.875 }, center: { x: 6, y: 27.5 }, rotation: 0, depth: 1, clearance: -0.125, reveals: [], pieceSize: { width: 4, height: 4 } },
      { id: 'patch-right', shape: { kind: 'circle', radius: 1.875 }, center: { x: 26, y: 27.5 }, rotation: 0, depth: 1, clearance: -0.125, reveals: [], pieceSize: { width: 4, height: 4 } },
      rect('photo', 7.5, 9.5, 16, 27.5, 2, -0.25),
      rect('plaque', 8.75, 2.75, 16, 35.5, 2, -0.125),
      rect('card-left', 2.25, 3.25, 5, 35.5, 1, -0.125),
      rect('card-right', 2.25, 3.25, 27, 35.5, 1, -0.125),
    ],
  };
}

async function openBenchLayout(page: Page): Promise<void> {
  const signIn = await page.request.post(`${base}/api/auth/sign-in`, { data: { email: 'designer@tallowmere.example', password: 'demo-frames-2026' } });
  if (!signIn.ok()) throw new Error(`sign-in failed (${signIn.status()}); start the server with the demo shop`);
  const customer = await (await page.request.post(`${base}/api/customers`, { data: { name: 'Bench Customer' } })).json();
  const job = await (await page.request.post(`${base}/api/jobs`, { data: { title: 'Frame-time bench shadowbox', customerId: customer.customer.id } })).json();
  const created = await page.request.post(`${base}/api/jobs/${job.job.id}/layouts`, { data: { name: 'Bench layout', document: benchLayout() } });
  if (!created.ok()) throw new Error(`the bench layout was refused: ${await created.text()}`);
  await page.goto(`${base}/layouts/${(await created.json()).layout.id}`);
  await page.getByTestId('mat-canvas').locator('[data-opening="garment"]').waitFor({ state: 'attached' });
}

const nextFrame = (page: Page) => page.evaluate(() => new Promise<void>((resolve) => requestAnimationFrame(() => resolve())));

/** The same pointer moves with no button held: what the measuring itself costs, to set the drags against. */
async function hover(page: Page): Promise<void> {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Performance.enable');
  const box = (await page.getByTestId('mat-canvas').boundingBox())!;
  const task = async () => ((await cdp.send('Performance.getMetrics')).metrics.find((m) => m.name === 'TaskDuration')?.value ?? 0) * 1000;
  const before = await task();
  for (let i = 1; i <= FRAMES; i++) {
    await page.mouse.move(box.x + 20 + i, box.y + 20);
    await nextFrame(page);
  }
  console.log(`no drag (pointer moves only, the measuring's own cost): main thread ${((await task()) - before) / FRAMES > 0 ? (((await task()) - before) / FRAMES).toFixed(1) : '0'} ms per frame`);
  await cdp.detach();
}

async function drag(page: Page, openingId: string, inchesAcross: number, label: string): Promise<void> {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Performance.enable');
  const box = (await page.locator(`[data-opening="${openingId}"]`).boundingBox())!;
  const perInch = await page.evaluate(() => {
    const rect = document.querySelector('[data-testid="mat-canvas"] svg g')?.getBoundingClientRect();
    return rect ? rect.width / 32 : 1;
  });
  const start = { x: box.x + box.width / 2, y: box.y + box.height / 2 };
  // A point inside a traced garment's box may fall outside the garment; its middle is inside this one.
  await page.mouse.move(start.x, start.y);
  await page.mouse.down();
  // A string, so the bundler's helpers for named functions do not leak into the page.
  await page.evaluate(`(() => {
    window.__frames = [];
    window.__stop = false;
    const loop = (t) => { window.__frames.push(t); if (!window.__stop) requestAnimationFrame(loop); };
    requestAnimationFrame(loop);
  })()`);
  const task = async () => ((await cdp.send('Performance.getMetrics')).metrics.find((m) => m.name === 'TaskDuration')?.value ?? 0) * 1000;
  const before = await task();
  for (let i = 1; i <= FRAMES; i++) {
    await page.mouse.move(start.x + (inchesAcross * perInch * i) / FRAMES, start.y);
    await nextFrame(page);
  }
  const during = (await task()) - before;
  const frames = await page.evaluate<number[]>('(() => { window.__stop = true; return window.__frames; })()');
  const released = performance.now();
  await page.mouse.up();
  await page.getByText('Checking again when the window is let go…').waitFor({ state: 'detached' }).catch(() => undefined);
  await nextFrame(page);
  const settle = performance.now() - released;
  const gaps = frames.slice(1).map((t, i) => t - frames[i]!).sort((a, b) => a - b);
  const mean = gaps.reduce((a, b) => a + b, 0) / Math.max(1, gaps.length);
  const p95 = gaps[Math.floor(gaps.length * 0.95)] ?? NaN;
  console.log(
    `${label}: main thread ${(during / FRAMES).toFixed(1)} ms per frame over ${FRAMES} frames; ` +
      `frame spacing mean ${mean.toFixed(1)} ms, p95 ${p95.toFixed(1)} ms; checks done ${settle.toFixed(0)} ms after letting go`,
  );
  console.log(`  moved: ${await page.getByTestId('selection-readout').innerText()}`);
  await cdp.detach();
}

async function main() {
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--headless', '--no-sandbox', '--disable-gpu'] });
  const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
  await openBenchLayout(page);
  await page.getByTestId('tab-checks').click();
  await hover(page);
  await drag(page, 'patch-left', 3, 'drag a 4 in patch 3 in towards the photo');
  await drag(page, 'photo', -1.5, 'drag the 8 x 10 photo window 1 1/2 in');
  await drag(page, 'garment', 1, 'drag the 2 000-point garment 1 in');
  await browser.close();
}

await main();
