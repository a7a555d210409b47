import type { Layout } from '../../geometry';
import type { PieceKind } from '../../features/pieces/schema';
import { pieceKindLabels } from '../../features/pieces/schema';
import { centsText, type QuoteLine } from '../../features/quotes/schema';
import { glazingKindLabels, type GlazingMaterial, type Moulding } from '../../features/settings/materials';
import { labourShapeLabels, labourShapes, type LabourShape, type PriceList } from '../../features/settings/priceList';

// Pure arithmetic of a quote: no database, no clock. Money is whole cents; each line
// carries its sum in words so the framer and the customer can check it by hand.

export interface SheetOption {
  name: string;
  widthIn: number;
  heightIn: number;
}

export interface FrameForQuote {
  moulding: Moulding;
  glazing: GlazingMaterial;
  shadowboxDepthIn: number;
}

export interface QuoteSource {
  layout: Pick<Layout, 'outer' | 'mats' | 'openings'>;
  /** Kind of each piece of the job, by id. */
  pieceKinds: ReadonlyMap<string, PieceKind>;
  /** Null for mats only (no frame chosen yet). */
  frame: FrameForQuote | null;
  sheets: readonly SheetOption[];
  priceList: PriceList;
}

/** A framer's mistake or a gap in the price list, in plain words. */
export class QuoteProblem extends Error {
  constructor(message: string, readonly field?: string) {
    super(message);
  }
}

/** Inches for people: 32, 20.25, 7.125. */
export const inchText = (value: number) => String(Number(value.toFixed(3)));

/** Blanks of w x h from a sheet, the better of the two grid orientations (0 when none fits). */
export function blanksPerSheet(w: number, h: number, sheet: { widthIn: number; heightIn: number }): number {
  const fit = (a: number, b: number) => Math.floor((a + 1e-9) / b);
  const upright = fit(sheet.widthIn, w) * fit(sheet.heightIn, h);
  const turned = fit(sheet.widthIn, h) * fit(sheet.heightIn, w);
  return upright > turned ? upright : turned;
}

/** Moulding to order: perimeter + 8 x face width for the mitres, up to the whole foot (common practice). */
export function mouldingFeet(widthIn: number, heightIn: number, faceWidthIn: number): { inches: number; feet: number } {
  const inches = 2 * (widthIn + heightIn) + 8 * faceWidthIn;
  return { inches, feet: Math.ceil(inches / 12 - 1e-9) };
}

/** United inches: width + height, how many shops size frames (common practice). */
export const unitedInches = (widthIn: number, heightIn: number) => widthIn + heightIn;

/** amount x percent / 100 to the nearest cent; the percent is taken to 1/1000 so the sum stays exact in integers. */
export function percentOf(amountCents: number, percent: number): number {
  return Math.round((amountCents * Math.round(percent * 1000)) / 100_000);
}

function matLines(source: QuoteSource): QuoteLine[] {
  const { outer, mats } = source.layout;
  if (mats.length === 0) throw new QuoteProblem('This version has no mats to price; add a mat in the designer first');
  return mats.map((mat) => {
    const ply = mat.ply;
    const priced = source.sheets
      .map((sheet) => ({ sheet, blanks: blanksPerSheet(outer.width, outer.height, sheet), price: source.priceList.matBoards.find((p) => p.ply === ply && p.sheetName === sheet.name) }))
      .filter((c) => c.blanks > 0);
    if (priced.length === 0) throw new QuoteProblem(`No sheet size in the shop's list holds a ${inchText(outer.width)} x ${inchText(outer.height)} in mat`, 'sheets');
    const withPrice = priced.filter((c) => c.price !== undefined);
    if (withPrice.length === 0) throw new QuoteProblem(`The price list has no price for ${ply === 'other' ? 'this' : `${ply}-ply`} board on a sheet that holds ${mat.name || 'a mat'}; add one under mat boards`, 'priceList.matBoards');
    let best = withPrice[0]!;
    for (const c of withPrice) if (c.sheet.widthIn * c.sheet.heightIn < best.sheet.widthIn * best.sheet.heightIn) best = c;
    const sheetPrice = best.price!.pricePerSheetCents;
    const amountCents = Math.round(sheetPrice / best.blanks);
    const name = `${mat.name || 'Mat'} ${ply === 'other' ? '' : `${ply}-ply`}`.trim();
    return {
      kind: 'mat',
      label: `Mat board, ${name}`,
      explanation: `${name}: ${inchText(outer.width)} x ${inchText(outer.height)} in, ${best.blanks} per ${inchText(best.sheet.widthIn)} x ${inchText(best.sheet.heightIn)} sheet at ${centsText(sheetPrice)} = ${centsText(amountCents)}`,
      amountCents,
    };
  });
}

function frameLines(source: QuoteSource): QuoteLine[] {
  const { frame, priceList } = source;
  if (!frame) return [];
  const { width, height } = source.layout.outer;
  const sqIn = width * height;
  const glazingCents = Math.round((sqIn * frame.glazing.pricePerSqFtCents) / 144);
  const glazingName = glazingKindLabels[frame.glazing.kind];
  const lines: QuoteLine[] = [
    {
      kind: 'glazing',
      label: `Glazing, ${glazingName.toLowerCase()}`,
      explanation: `Glazing, ${glazingName.toLowerCase()}: ${inchText(width)} x ${inchText(height)} in = ${(sqIn / 144).toFixed(2)} sq ft x ${centsText(frame.glazing.pricePerSqFtCents)}`,
      amountCents: glazingCents,
    },
  ];
  const m = frame.moulding;
  const run = mouldingFeet(width, height, m.faceWidthIn);
  lines.push({
    kind: 'moulding',
    label: `Moulding ${m.code}, ${m.name}`,
    explanation: `${inchText(2 * (width + height))} in perimeter + 8 x ${inchText(m.faceWidthIn)} in face = ${inchText(run.inches)} in, ${run.feet} ft x ${centsText(m.pricePerFootCents)}`,
    amountCents: run.feet * m.pricePerFootCents,
  });
  if (frame.shadowboxDepthIn > 0) {
    const perimeterIn = 2 * (width + height);
    const feet = Math.ceil(perimeterIn / 12 - 1e-9);
    lines.push({
      kind: 'spacer',
      label: `Shadowbox spacers, ${inchText(frame.shadowboxDepthIn)} in deep`,
      explanation: `${inchText(perimeterIn)} in perimeter = ${feet} ft x ${centsText(priceList.spacerPerFootCents)}`,
      amountCents: feet * priceList.spacerPerFootCents,
    });
  }
  return lines;
}

/** Which price a shape of opening takes. */
export function labourShapeOf(kind: Layout['openings'][number]['shape']['kind']): LabourShape {
  if (kind === 'circle' || kind === 'oval') return 'oval';
  if (kind === 'regularPolygon') return 'polygon';
  return kind;
}

function countLine(kind: 'mounting' | 'labour', label: string, count: number, each: number, noun: string): QuoteLine {
  return { kind, label, explanation: `${count} ${noun} x ${centsText(each)}`, amountCents: count * each };
}

function workLines(source: QuoteSource): QuoteLine[] {
  const { layout, priceList, pieceKinds } = source;
  const lines: QuoteLine[] = [];
  const mounted = new Map<PieceKind, number>();
  const seen = new Set<string>();
  for (const opening of layout.openings) {
    const kind = opening.pieceId ? pieceKinds.get(opening.pieceId) : undefined;
    if (!kind || seen.has(opening.pieceId!)) continue;
    seen.add(opening.pieceId!);
    mounted.set(kind, (mounted.get(kind) ?? 0) + 1);
  }
  for (const [kind, count] of mounted) {
    lines.push(countLine('mounting', `Mounting, ${pieceKindLabels[kind].toLowerCase()}`, count, priceList.mountingPerPieceCents[kind], count === 1 ? 'piece' : 'pieces'));
  }
  for (const shape of labourShapes) {
    const count = layout.openings.filter((o) => labourShapeOf(o.shape.kind) === shape).length;
    if (count === 0) continue;
    lines.push(countLine('labour', `Cutting, ${labourShapeLabels[shape].toLowerCase()} openings`, count, priceList.labourPerOpeningCents[shape], count === 1 ? 'opening' : 'openings'));
  }
  if (source.frame) {
    lines.push({ kind: 'fitting', label: 'Fitting', explanation: `1 frame x ${centsText(priceList.fittingPerFrameCents)}`, amountCents: priceList.fittingPerFrameCents });
  }
  return lines;
}

/** The priced lines of a layout, before markup, minimum and tax. */
export function layoutQuoteLines(source: QuoteSource): QuoteLine[] {
  return [...matLines(source), ...frameLines(source), ...workLines(source)];
}
