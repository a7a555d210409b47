/**
 * How fast a full shadowbox becomes cut files: the 32 x 40 in layout with
 * three mats, a traced jersey of 2 000 points, two 4 in patches, an 8 x 10
 * photo window, a 3 x 9 plaque and two small windows, planned for the
 * shop's default cutter and written as SVG and as DXF.
 *
 *   npx tsx scripts/benchExport.ts
 *
 * Prints medians; the target is under 30 ms for both files together.
 */
import { pathToFileURL } from 'node:url';
import { defaultShopSettings } from '../features/settings/schema';
import type { BoardPoint, Layout, LayoutInput } from '../geometry';
import { cutPlan, cutPlanDxf, cutPlanSvg, parseLayout } from '../geometry';

/** An invented folded jersey: a T with sleeves, rounded by corner cutting, with small folds along the edge. */
function jerseyOutline(count: number): BoardPoint[] {
  let ring: BoardPoint[] = [
    { x: -2.2, y: -10 }, { x: 0, y: -8.9 }, { x: 2.2, y: -10 }, { x: 5, y: -9.6 }, { x: 8.4, y: -7.6 }, { x: 9, y: -4.6 },
    { x: 6.2, y: -4 }, { x: 6, y: 10 }, { x: -6, y: 10 }, { x: -6.2, y: -4 }, { x: -9, y: -4.6 }, { x: -8.4, y: -7.6 }, { x: -5, y: -9.6 },
  ];
  while (ring.length < count) {
    ring = ring.flatMap((p, i) => {
      const q = ring[(i + 1) % ring.length]!;
      return [{ x: 0.75 * p.x + 0.25 * q.x, y: 0.75 * p.y + 0.25 * q.y }, { x: 0.25 * p.x + 0.75 * q.x, y: 0.25 * p.y + 0.75 * q.y }];
    });
  }
  const step = ring.length / count;
  return Array.from({ length: count }, (_, i) => {
    const p = ring[Math.floor(i * step)]!;
    const fold = 0.05 * Math.sin((i / count) * 2 * Math.PI * 23);
    return { x: p.x * (1 + fold / 10), y: p.y * (1 + fold / 12) };
  });
}

function benchLayout(): Layout {
  const mat = (id: string, color: string) => ({ id, name: id, color, coreColor: '#f4f1e8', ply: 4 as const, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } });
  const input: LayoutInput = {
    schemaVersion: 2,
    outer: { width: 32, height: 40 },
    mats: [mat('top', '#1b2a4a'), mat('middle', '#c8a24a'), mat('bottom', '#9e1b32')],
    mountingBoard: { color: '#ffffff', cut: false },
    openings: [
      { id: 'jersey', shape: { kind: 'outline', points: jerseyOutline(2000) }, center: { x: 16, y: 14.5 }, depth: 3, clearance: 0.25, reveals: [0.25, 0.25] },
      { id: 'photo', shape: { kind: 'rectangle', width: 7.5, height: 9.5 }, center: { x: 16, y: 30.5 }, depth: 2, clearance: -0.25, reveals: [0.25] },
      { id: 'patch-left', shape: { kind: 'circle', radius: 2 }, center: { x: 6.5, y: 30.5 }, depth: 2, reveals: [0.25] },
      { id: 'patch-right', shape: { kind: 'circle', radius: 2 }, center: { x: 25.5, y: 30.5 }, depth: 2, reveals: [0.25] },
      { id: 'plaque', shape: { kind: 'rectangle', width: 8.75, height: 2.75 }, center: { x: 16, y: 37.5 }, depth: 1, clearance: -0.125 },
      { id: 'card-left', shape: { kind: 'rectangle', width: 2.25, height: 3.25 }, center: { x: 3.5, y: 10 }, depth: 2, reveals: [0.25] },
      { id: 'card-right', shape: { kind: 'rectangle', width: 2.25, height: 3.25 }, center: { x: 28.5, y: 10 }, depth: 2, reveals: [0.25] },
    ],
  };
  const parsed = parseLayout(input);
  if (!parsed.ok) throw new Error(`bench layout is invalid: ${JSON.stringify(parsed.issues)}`);
  return parsed.layout;
}

function median(run: () => void, repeats: number): number {
  const times: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const start = performance.now();
    run();
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)]!;
}

/** Medians in milliseconds: the plan alone, each writer on a ready plan, and everything from layout to both files. */
export function benchExport(repeats = 25) {
  const layout = benchLayout();
  const profile = defaultShopSettings.cutterProfiles[0]!;
  const plan = cutPlan(layout, profile);
  for (let i = 0; i < 3; i++) cutPlanDxf(cutPlan(layout, profile)); // warm the JIT
  return {
    plan: median(() => cutPlan(layout, profile), repeats),
    svg: median(() => cutPlanSvg(plan), repeats),
    dxf: median(() => cutPlanDxf(plan), repeats),
    both: median(() => {
      const fresh = cutPlan(layout, profile);
      cutPlanSvg(fresh);
      cutPlanDxf(fresh);
    }, repeats),
    sizes: { svg: cutPlanSvg(plan).length, dxf: cutPlanDxf(plan).length },
  };
}

export function benchExportReport(): string {
  const r = benchExport();
  return [
    'cut files (32 x 40, three mats, 2 000-point jersey, default cutter profile)',
    `  plan ${r.plan.toFixed(2)} ms   svg ${r.svg.toFixed(2)} ms   dxf ${r.dxf.toFixed(2)} ms`,
    `  layout to SVG and DXF: ${r.both.toFixed(2)} ms median (target < 30 ms)   files: svg ${(r.sizes.svg / 1024).toFixed(0)} KiB, dxf ${(r.sizes.dxf / 1024).toFixed(0)} KiB`,
  ].join('\n');
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) process.stdout.write(`${benchExportReport()}\n`);
