/**
 * How fast a full shadowbox becomes cut files: the 32 x 40 in layout with
 * three mats, a traced jersey of 2 000 points (scripts/benchLayout.ts), two 4 in patches, an 8 x 10
 * photo window, a 3 x 9 plaque and two small windows, planned for the
 * shop's default cutter and written as SVG and as DXF.
 *
 *   npx tsx scripts/benchExport.ts
 *
 * Prints medians; the target is under 30 ms for both files together.
 */
import { pathToFileURL } from 'node:url';
import { defaultShopSettings } from '../features/settings/schema';
import { cutPlan, cutPlanDxf, cutPlanSvg } from '../geometry';
import { benchLayout, median } from './benchLayout';

/** Medians in milliseconds: the plan alone, each writer on a ready plan, and everything from layout to both files. */
export function benchExport(repeats = 25) {
  const layout = benchLayout(2000);
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
