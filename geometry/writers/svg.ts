import type { BoardPlan, CutPath, CutPlan } from '../cutPlan';
import type { CutSegment, PlanPoint } from '../cutSegments';
import { markupEscape, numberText } from './text';

/**
 * SVG from a cut plan (W3C SVG 1.1). SVG has a single frame, origin top-left
 * and y down, so the writer lays the plan back into it: the drawing shows
 * the board as the cutter sees it (mirrored when cut face down), and the
 * cutter profile's origin corner only changes the DXF's numbers. `width` and
 * `height` carry the unit and the viewBox uses the same unit, so one user
 * unit is one inch or one millimetre.
 */

export interface SvgOptions {
  /** Indexes into plan.boards; every board when absent. */
  readonly boards?: readonly number[];
  /**
   * 'physical' sizes the drawing in inches or millimetres (a cut file);
   * 'fluid' lets a page size it (a preview on the cut sheet).
   */
  readonly size?: 'physical' | 'fluid';
  /** Text for the document's title element. */
  readonly title?: string;
}

/** Stroke width in plan units: a hairline of about 0.01 in. */
const strokeWidth = (plan: CutPlan) => (plan.units === 'mm' ? 0.25 : 0.01);

function svgPoint(plan: CutPlan, p: PlanPoint): PlanPoint {
  return {
    x: plan.frame.origin.endsWith('right') ? plan.width - p.x : p.x,
    y: plan.frame.ySign === -1 ? plan.height - p.y : p.y,
  };
}

/** The plan to SVG flips an axis for a right-hand or bottom origin, each flip turning arcs around. */
function svgTurn(plan: CutPlan): 1 | -1 {
  const right = plan.frame.origin.endsWith('right') ? -1 : 1;
  return (right * plan.frame.ySign) as 1 | -1;
}

function arcCommand(plan: CutPlan, s: Extract<CutSegment, { kind: 'arc' }>, to: PlanPoint, sweep: number): string {
  const r = numberText(s.radius, plan.units);
  const large = Math.abs(sweep) > 180 ? 1 : 0;
  // SVG's sweep flag 1 means the angle grows in SVG's own frame.
  const positive = sweep * svgTurn(plan) > 0 ? 1 : 0;
  const end = svgPoint(plan, to);
  return `A${r} ${r} 0 ${large} ${positive} ${numberText(end.x, plan.units)} ${numberText(end.y, plan.units)}`;
}

/** Path data starting at the path's start; a full circle is drawn as two half turns, which SVG needs. */
export function svgPathData(plan: CutPlan, path: CutPath): string {
  const start = svgPoint(plan, path.start);
  const parts = [`M${numberText(start.x, plan.units)} ${numberText(start.y, plan.units)}`];
  for (const s of path.segments) {
    if (s.kind === 'line') {
      const to = svgPoint(plan, s.to);
      parts.push(`L${numberText(to.x, plan.units)} ${numberText(to.y, plan.units)}`);
    } else if (Math.abs(s.sweep) >= 360 - 1e-9) {
      const halfway = (s.startAngle + s.sweep / 2) * (Math.PI / 180);
      const middle = { x: s.center.x + s.radius * Math.cos(halfway), y: s.center.y + s.radius * Math.sin(halfway) };
      parts.push(arcCommand(plan, s, middle, s.sweep / 2), arcCommand(plan, s, s.to, s.sweep / 2));
    } else {
      parts.push(arcCommand(plan, s, s.to, s.sweep));
    }
  }
  parts.push('Z');
  return parts.join(' ');
}

function boardGroups(plan: CutPlan, board: BoardPlan): string[] {
  const id = board.label.toLowerCase();
  const group = (operation: 'openings' | 'outer', paths: readonly CutPath[]) => {
    const body = paths.map((path) => {
      const order = board.paths.indexOf(path) + 1;
      const opening = path.openingId === null ? '' : ` data-opening="${markupEscape(path.openingId)}"`;
      return `    <path id="${id}-cut${order}" data-order="${order}"${opening} d="${svgPathData(plan, path)}"/>`;
    });
    const label = `${board.label}_${operation.toUpperCase()}`;
    return [
      `  <g id="${id}-${operation}" data-label="${label}" data-board="${markupEscape(board.name)}">`,
      ...body,
      '  </g>',
    ].join('\n');
  };
  return [group('openings', board.paths.filter((p) => p.operation === 'opening')), group('outer', board.paths.filter((p) => p.operation === 'outer'))];
}

/** One SVG document with a group per board and operation (openings, outer edge), strokes only. */
export function cutPlanSvg(plan: CutPlan, options: SvgOptions = {}): string {
  const boards = (options.boards ?? plan.boards.map((_, i) => i)).map((i) => plan.boards[i]!);
  const w = numberText(plan.width, plan.units);
  const h = numberText(plan.height, plan.units);
  const size = options.size === 'fluid' ? 'width="100%"' : `width="${w}${plan.units}" height="${h}${plan.units}"`;
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<svg xmlns="http://www.w3.org/2000/svg" version="1.1" ${size} viewBox="0 0 ${w} ${h}" fill="none" stroke="#000000" stroke-width="${strokeWidth(plan)}" stroke-linejoin="round">`,
    options.title ? `  <title>${markupEscape(options.title)}</title>` : '',
    ...boards.flatMap((board) => boardGroups(plan, board)),
    '</svg>',
    '',
  ]
    .filter((line) => line !== '')
    .join('\n');
}
