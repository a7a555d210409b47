import type { Layout, Opening } from './layoutSchema';
import type { Box } from './polygon';
import { boxUnion } from './polygon';
import type { CutPlan } from './cutPlan';
import type { CutProfile } from './cutPlan';
import { cutPathBounds, cutPlan } from './cutPlan';
import { numberText } from './writers/text';
import type { LengthRounding } from './units';
import { formatLength, millimetresFromInches } from './units';
import { cutPlanSvg } from './writers/svg';
import { markupEscape as esc } from './writers/text';

/**
 * The printable sheet that goes to the cutter with the file: per board its
 * colour, ply, thickness and outer size, and per opening its shape, the size
 * of the line the blade follows and where that line's box sits, measured
 * from the left and top edges as seen from the face.
 */

export interface CutSheetInput {
  readonly layout: Layout;
  readonly jobTitle: string;
  readonly layoutName: string;
  readonly version: number;
  /** Printed as given, e.g. 2026-03-14; the caller decides the day. */
  readonly date: string;
  readonly rounding: LengthRounding;
  /** Which bevel edge the sizes describe: the one the cutter profile follows. */
  readonly pathEdge: 'face' | 'back';
  /** The cutter profile the file is made for: its cut order numbers the sheet. The face view's own order when absent. */
  readonly profile?: CutProfile | null;
  /** Piece names by opening id; an opening without one is "Opening 3", its place in the layout. */
  readonly openingNames?: ReadonlyMap<string, string>;
  /** Who approved this version for cutting, in plain words; printed under the title. */
  readonly approvalNote?: string;
}

export interface CutSheetOpening {
  /** 1 for the first cut on that board, in the order the cut file runs. */
  readonly order: number;
  readonly openingId: string;
  /** The piece the opening shows, or "Opening 3". */
  readonly name: string;
  readonly shape: string;
  /** Bounding box of the cut line in face-view inches. */
  readonly box: Box;
}

export interface CutSheetBoard {
  readonly label: string;
  readonly name: string;
  readonly color: string | null;
  readonly ply: string | null;
  /** Inches; null for the mounting board, whose thickness the layout does not record. */
  readonly thickness: number | null;
  readonly openings: readonly CutSheetOpening[];
}

const SHAPE_WORDS: Record<Opening['shape']['kind'], string> = {
  rectangle: 'Rectangle',
  roundedRectangle: 'Rounded rectangle',
  oval: 'Oval',
  circle: 'Circle',
  regularPolygon: 'Regular polygon',
  polygon: 'Polygon',
  outline: 'Traced outline',
};

/** A face-up plan in inches with its origin top-left: its numbers are the face view's. */
function faceViewPlan(layout: Layout, pathEdge: 'face' | 'back'): CutPlan {
  return cutPlan(layout, {
    units: 'in', mirrored: false, origin: 'top-left', arcs: true, pathEdge, chordToleranceIn: 0.005,
    maxSheetWidthIn: Infinity, maxSheetHeightIn: Infinity,
  });
}

/** Opening ids per board in the order the file cuts them. */
function fileOrder(plan: CutPlan): string[][] {
  return plan.boards.map((board) => [...new Set(board.paths.flatMap((p) => (p.openingId === null ? [] : [p.openingId])))]);
}

function openingName(layout: Layout, names: ReadonlyMap<string, string> | undefined, id: string): string {
  const name = names?.get(id)?.trim();
  return name || `Opening ${layout.openings.findIndex((o) => o.id === id) + 1}`;
}

/**
 * Sizes from the face-view plan, numbers from the file's plan: the framer
 * cuts in the order the sheet counts. `filePlan` is the plan the cut file
 * is written from (the face-view plan when there is no cutter profile).
 */
export function cutSheetBoards(layout: Layout, plan: CutPlan, filePlan: CutPlan = plan, names?: ReadonlyMap<string, string>): CutSheetBoard[] {
  const shapes = new Map(layout.openings.map((o) => [o.id, o.shape]));
  const orders = fileOrder(filePlan);
  return plan.boards.map((board, boardIndex) => {
    const boxes = new Map<string, Box>();
    for (const path of board.paths) {
      if (path.openingId === null) continue;
      const box = cutPathBounds(path);
      const before = boxes.get(path.openingId);
      boxes.set(path.openingId, before ? boxUnion(before, box) : box);
    }
    const order = orders[boardIndex] ?? [...boxes.keys()];
    const openings = order.filter((id) => boxes.has(id)).map((openingId, i) => {
      const shape = shapes.get(openingId);
      const words = shape ? SHAPE_WORDS[shape.kind] : 'Opening';
      const name = openingName(layout, names, openingId);
      return { order: i + 1, openingId, name, shape: shape?.kind === 'regularPolygon' ? `${shape.sides}-sided polygon` : words, box: boxes.get(openingId)! };
    });
    const mat = board.board === 'mat' ? layout.mats[board.index] : undefined;
    return {
      label: board.label,
      name: board.name,
      color: mat?.color ?? layout.mountingBoard.color,
      ply: mat ? (mat.ply === 'other' ? 'other' : `${mat.ply}-ply`) : null,
      thickness: mat?.thickness ?? null,
      openings,
    };
  });
}

function thicknessText(inches: number | null, rounding: LengthRounding): string {
  if (inches === null) return '—';
  return rounding === '0.5mm' ? `${millimetresFromInches(inches).toFixed(2)} mm` : `${inches.toFixed(3)}"`;
}

function openingRows(board: CutSheetBoard, rounding: LengthRounding): string {
  if (board.openings.length === 0) return '<p class="quiet">No openings: only the outer edge is cut.</p>';
  // The shop's rounding on the page, the exact decimal on hover.
  const len = (v: number) => `<span title="${numberText(v, 'in')} in">${esc(formatLength(v, rounding))}</span>`;
  const rows = board.openings.map(
    (o) =>
      `<tr><td>${o.order}</td><td>${esc(o.name)}</td><td>${esc(o.shape)}</td>` +
      `<td>${len(o.box.w)} × ${len(o.box.h)}</td><td>${len(o.box.x)}</td><td>${len(o.box.y)}</td></tr>`,
  );
  return [
    '<table><thead><tr><th>Cut</th><th>Opening</th><th>Shape</th><th>Size (w × h)</th><th>From left</th><th>From top</th></tr></thead>',
    `<tbody>${rows.join('')}</tbody></table>`,
  ].join('');
}

function boardSection(input: CutSheetInput, plan: CutPlan, board: CutSheetBoard, index: number): string {
  const { layout, rounding } = input;
  const colour = board.color ? `<span class="swatch" style="background:${esc(board.color)}"></span>${esc(board.color)}` : '—';
  const drawing = numberedDrawing(cutPlanSvg(plan, { boards: [index], size: 'fluid', title: `${board.label} ${board.name}` }).replace(/^<\?xml[^>]*>\n/, ''), board, layout);
  return `<section class="board">
<h2>${esc(board.label)} · ${esc(board.name)}</h2>
<div class="columns"><dl>
<dt>Colour</dt><dd>${colour}</dd>
<dt>Board</dt><dd>${esc(board.name)}</dd>
<dt>Ply</dt><dd>${esc(board.ply ?? '—')}</dd>
<dt>Thickness</dt><dd>${esc(thicknessText(board.thickness, rounding))}</dd>
<dt>Outer size</dt><dd>${esc(formatLength(layout.outer.width, rounding))} × ${esc(formatLength(layout.outer.height, rounding))}</dd>
</dl><figure>${drawing}</figure></div>
${openingRows(board, rounding)}
</section>`;
}

/** The cut numbers drawn on the board's picture, each in the middle of its opening. */
function numberedDrawing(svg: string, board: CutSheetBoard, layout: Layout): string {
  const size = Math.max(0.4, Math.min(layout.outer.width, layout.outer.height) / 14);
  const labels = board.openings.map((o) => {
    const x = numberText(o.box.x + o.box.w / 2, 'in');
    const y = numberText(o.box.y + o.box.h / 2, 'in');
    return `  <text class="cut-number" x="${x}" y="${y}" font-size="${numberText(size, 'in')}" text-anchor="middle" dominant-baseline="central" fill="#b5542f" stroke="none">${o.order}</text>`;
  });
  return svg.replace('</svg>', `${labels.join('\n')}\n</svg>`);
}

const STYLE = `
body{font-family:system-ui,sans-serif;color:#1e2629;margin:24px;font-size:14px}
h1{font-size:22px;margin:0 0 4px}h2{font-size:17px;margin:0 0 8px}
.meta,.quiet{color:#5f6a6d}
.approval{font-weight:600;border-left:4px solid #1f3a5c;padding-left:8px}
.board{border-top:1px solid #ddd5c8;padding-top:12px;margin-top:16px;break-inside:avoid;page-break-inside:avoid}
.columns{display:flex;gap:24px;align-items:flex-start}
dl{display:grid;grid-template-columns:auto 1fr;gap:4px 12px;margin:0;min-width:220px}dt{font-weight:600}dd{margin:0}
figure{margin:0;width:180px;flex:none}figure svg{display:block;border:1px solid #ddd5c8}
figure svg path{vector-effect:non-scaling-stroke;stroke-width:1px}
.swatch{display:inline-block;width:14px;height:14px;border:1px solid #5f6a6d;vertical-align:-2px;margin-right:6px;print-color-adjust:exact;-webkit-print-color-adjust:exact}
table{border-collapse:collapse;margin-top:10px;width:100%}th,td{border:1px solid #ddd5c8;padding:4px 6px;text-align:left}
.caution{border:2px solid #b5542f;padding:8px 12px;margin-top:20px;break-inside:avoid}
@page{margin:12mm}
@media print{body{margin:0;font-size:11pt}.screen-only{display:none}figure{width:150px}}`;

const CAUTIONS = [
  'Mat-cutter blades are razor sharp: keep hands clear of the cutting head while it moves, and cut away from your body when finishing a corner by hand.',
  'Retract or guard the blade whenever it is not cutting, and replace dull blades: a dull blade drags, slips and tears the board.',
  'Put used blades in a sharps container, never loose in the bin.',
  "Follow your shop's own safety practice and the cutter maker's instructions; they come before these notes.",
];

/** The whole printable page; every piece of the shop's own text is escaped. */
export function cutSheetHtml(input: CutSheetInput): string {
  const plan = faceViewPlan(input.layout, input.pathEdge);
  const filePlan = input.profile ? cutPlan(input.layout, input.profile) : plan;
  const boards = cutSheetBoards(input.layout, plan, filePlan, input.openingNames);
  const title = `${input.jobTitle} · ${input.layoutName} v${input.version}`;
  const edge = input.pathEdge === 'face' ? 'face edge (front of the board)' : 'back edge (back of the board)';
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Cut sheet · ${esc(title)}</title>
<meta name="viewport" content="width=device-width, initial-scale=1"><style>${STYLE}</style></head>
<body>
<h1>${esc(input.jobTitle)}</h1>
<p class="meta">Layout ${esc(input.layoutName)} · version ${input.version} · printed ${esc(input.date)}</p>
${input.approvalNote ? `<p class="approval">${esc(input.approvalNote)}</p>\n` : ''}<p class="meta">Sizes are of the ${edge}; positions are from the left and top edges as seen from the face. Cut numbers follow the cut file's order and are drawn on each board's picture.</p>
<p class="screen-only quiet">Print this page from the browser (Ctrl+P or ⌘P); it fits A4 and Letter.</p>
${boards.map((board, i) => boardSection(input, plan, board, i)).join('\n')}
<section class="caution"><h2>Blade safety</h2><ul>${CAUTIONS.map((c) => `<li>${esc(c)}</li>`).join('')}</ul></section>
</body></html>
`;
}
