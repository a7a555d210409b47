import { describe, expect, it } from 'vitest';
import { demoJerseyLayout } from '../../db/demoLayout';
import type { PieceKind } from '../../features/pieces/schema';
import { quoteLine } from '../../features/quotes/schema';
import { defaultGlazing, defaultMouldings } from '../../features/settings/materials';
import { defaultPriceList, type PriceList } from '../../features/settings/priceList';
import { defaultShopSettings } from '../../features/settings/schema';
import { parseLayout, type Layout } from '../../geometry';
import { blanksPerSheet, layoutQuoteLines, mouldingFeet, percentOf, QuoteProblem, unitedInches, type QuoteSource } from './layoutQuote';
import { quoteSums } from './quoteTotals';

const ids = { jersey: 'p-jersey', patchA: 'p-patch-a', patchB: 'p-patch-b', photo: 'p-photo', plaque: 'p-plaque' };
const kinds = new Map<string, PieceKind>([
  ['p-jersey', 'garment'],
  ['p-patch-a', 'patch'],
  ['p-patch-b', 'patch'],
  ['p-photo', 'photo'],
  ['p-plaque', 'plaque'],
]);

function demoLayout(): Layout {
  const parsed = parseLayout(demoJerseyLayout(ids));
  if (!parsed.ok) throw new Error('demo layout does not parse');
  return parsed.layout;
}

const acrylic = defaultGlazing.find((g) => g.kind === 'acrylic')!;
const deepBlack = defaultMouldings.find((m) => m.code === 'BX-150')!;

function demoSource(overrides: Partial<QuoteSource> = {}): QuoteSource {
  return {
    layout: demoLayout(),
    pieceKinds: kinds,
    frame: { moulding: deepBlack, glazing: acrylic, shadowboxDepthIn: 2 },
    sheets: defaultShopSettings.sheets,
    priceList: defaultPriceList,
    ...overrides,
  };
}

const termsOf = (p: PriceList) => ({ currency: p.currency, markupPercent: p.markupPercent, taxRatePercent: p.taxRatePercent, depositSharePercent: p.depositSharePercent, minimumChargeCents: p.minimumChargeCents });

describe('moulding length and united inches (common practice)', () => {
  it('orders perimeter + 8 x face width, up to the whole foot: a 24 x 20 frame with a 1.5 in face is 88 + 12 = 100 in, 9 ft', () => {
    // Common practice (supplier worked examples): perimeter 2 x (24 + 20) = 88 in, plus 8 x 1.5 = 12 in of mitre allowance.
    expect(mouldingFeet(24, 20, 1.5)).toEqual({ inches: 100, feet: 9 });
    // Exactly 96 in is 8 ft, not 9: a whole foot is not rounded up again.
    expect(mouldingFeet(20, 20, 2)).toEqual({ inches: 96, feet: 8 });
  });

  it('united inches are width + height: 8 x 10 is 18 (common practice)', () => {
    expect(unitedInches(8, 10)).toBe(18);
    expect(unitedInches(32, 40)).toBe(72);
  });
});

describe('mat blanks per sheet', () => {
  it('takes the better of the two grid orientations, counted by hand', () => {
    // 20 x 24 on 32 x 40: upright 1 x 1 = 1, turned (32/24 -> 1) x (40/20 -> 2) = 2.
    expect(blanksPerSheet(20, 24, { widthIn: 32, heightIn: 40 })).toBe(2);
    // 11 x 14 on 32 x 40: upright (2) x (2) = 4, turned (32/14 -> 2) x (40/11 -> 3) = 6.
    expect(blanksPerSheet(11, 14, { widthIn: 32, heightIn: 40 })).toBe(6);
    // A mat larger than the sheet either way: none.
    expect(blanksPerSheet(33, 41, { widthIn: 32, heightIn: 40 })).toBe(0);
  });

  it('prices one mat at the sheet price over its blanks, with the sum in words', () => {
    const layout = { ...demoLayout(), outer: { width: 20, height: 24 }, openings: [] };
    const lines = layoutQuoteLines(demoSource({ layout, frame: null }));
    // 38.00 a 4-ply 32 x 40 sheet (the example price list) / 2 blanks = 19.00.
    expect(lines[0]).toEqual({ kind: 'mat', label: 'Mat board, Harbour navy 4-ply', explanation: 'Harbour navy 4-ply: 20 x 24 in, 2 per 32 x 40 sheet at 38.00 = 19.00', amountCents: 1900 });
  });

  it('uses the smallest sheet that holds the mat, and says so when none does', () => {
    const big = { ...demoLayout(), outer: { width: 36, height: 48 }, openings: [] };
    const [first] = layoutQuoteLines(demoSource({ layout: big, frame: null }));
    // 36 x 48 does not fit 32 x 40; the 40 x 60 oversize holds one (40/36 -> 1, 60/48 -> 1) at 72.00.
    expect(first!.amountCents).toBe(7200);
    const huge = { ...demoLayout(), outer: { width: 50, height: 70 }, openings: [] };
    expect(() => layoutQuoteLines(demoSource({ layout: huge, frame: null }))).toThrow(/No sheet size .* holds a 50 x 70 in mat/);
  });

  it('refuses a layout without mats in plain words', () => {
    const layout = { ...demoLayout(), mats: [] };
    expect(() => layoutQuoteLines(demoSource({ layout }))).toThrow(QuoteProblem);
    expect(() => layoutQuoteLines(demoSource({ layout }))).toThrow('This version has no mats to price; add a mat in the designer first');
  });
});

describe('a quote of the demo layout, every line recomputed by hand', () => {
  it('prices the 32 x 40 jersey shadowbox in acrylic and deep black moulding, 2 in deep', () => {
    const priced = layoutQuoteLines(demoSource());
    const sums = quoteSums(priced, termsOf(defaultPriceList));
    const amounts = Object.fromEntries(sums.lines.map((l) => [l.label, l.amountCents]));

    // Three 4-ply mats, 32 x 40 each: one per 32 x 40 sheet at 38.00.
    expect(amounts['Mat board, Harbour navy 4-ply']).toBe(3800);
    expect(amounts['Mat board, Signal red 4-ply']).toBe(3800);
    expect(amounts['Mat board, Warm white 4-ply']).toBe(3800);
    // Glazing: 32 x 40 = 1280 sq in = 8.888... sq ft x 14.50 = 128.888... -> 128.89.
    expect(amounts['Glazing, acrylic']).toBe(12889);
    expect(sums.lines.find((l) => l.kind === 'glazing')!.explanation).toBe('Glazing, acrylic: 32 x 40 in = 8.89 sq ft x 14.50');
    // Moulding (common practice): 2 x (32 + 40) = 144 in + 8 x 1.5 = 156 in = 13 ft x 12.75 = 165.75.
    expect(amounts['Moulding BX-150, Deep box, satin black']).toBe(16575);
    // Spacers: 144 in = 12 ft x 3.50 = 42.00.
    expect(amounts['Shadowbox spacers, 2 in deep']).toBe(4200);
    // Mounting: one garment 45.00, two patches 2 x 6.00, one photo 8.00, one plaque 10.00.
    expect(amounts['Mounting, garment']).toBe(4500);
    expect(amounts['Mounting, patch']).toBe(1200);
    expect(amounts['Mounting, photo']).toBe(800);
    expect(amounts['Mounting, plaque']).toBe(1000);
    // Cutting: two rectangles 2 x 6.00, two circles 2 x 9.00, one traced outline 25.00.
    expect(amounts['Cutting, rectangle openings']).toBe(1200);
    expect(amounts['Cutting, circle or oval openings']).toBe(1800);
    expect(amounts['Cutting, traced outline openings']).toBe(2500);
    expect(amounts['Fitting']).toBe(3500);
    // Materials 3 x 38.00 + 128.89 + 165.75 + 42.00 = 450.64; 40 % = 180.256 -> 180.26.
    expect(amounts['Markup on materials, 40 %']).toBe(18026);
    expect(sums.lines.some((l) => l.kind === 'minimum')).toBe(false);
    // Subtotal 450.64 + 180.26 + 75.00 mounting + 55.00 cutting + 35.00 fitting = 795.90.
    expect(sums.subtotalCents).toBe(45064 + 18026 + 7500 + 5500 + 3500);
    expect(sums.subtotalCents).toBe(79590);
    // Tax 8.25 % of 795.90 = 65.66175 -> 65.66; total 861.56; deposit 50 % = 430.78.
    expect(sums.taxCents).toBe(6566);
    expect(sums.totalCents).toBe(86156);
    expect(sums.depositCents).toBe(43078);
    // 3 mats + glazing + moulding + spacers + 4 mounting + 3 cutting + fitting + markup = 15 lines.
    expect(sums.lines).toHaveLength(15);
  });

  it('mats only when no frame is chosen: no glazing, moulding, spacers or fitting', () => {
    const kindsSeen = new Set(layoutQuoteLines(demoSource({ frame: null })).map((l) => l.kind));
    expect([...kindsSeen].sort()).toEqual(['labour', 'mat', 'mounting']);
  });

  it('keeps a long mat name within the line limits of the quote schema', () => {
    const layout = demoLayout();
    const named = { ...layout, mats: layout.mats.map((m) => ({ ...m, name: 'N'.repeat(200) })) };
    const sums = quoteSums(layoutQuoteLines(demoSource({ layout: named })), termsOf(defaultPriceList));
    for (const line of sums.lines) expect(quoteLine.safeParse(line).success).toBe(true);
  });

  it('a flat frame (depth 0) has no spacer line', () => {
    const lines = layoutQuoteLines(demoSource({ frame: { moulding: deepBlack, glazing: acrylic, shadowboxDepthIn: 0 } }));
    expect(lines.some((l) => l.kind === 'spacer')).toBe(false);
  });
});

describe('sums', () => {
  const terms = { currency: 'USD', markupPercent: 0, taxRatePercent: 10, depositSharePercent: 50, minimumChargeCents: 7500 };

  it('adds the minimum charge line when the work comes to less', () => {
    const sums = quoteSums([{ kind: 'fitting', label: 'Fitting', explanation: '', amountCents: 3000 }], terms);
    // 75.00 minimum - 30.00 of work = 45.00 added; tax 10 % of 75.00 = 7.50; total 82.50; deposit 41.25.
    expect(sums.lines.at(-1)).toMatchObject({ kind: 'minimum', amountCents: 4500 });
    expect([sums.subtotalCents, sums.taxCents, sums.totalCents, sums.depositCents]).toEqual([7500, 750, 8250, 4125]);
  });

  it('recomputes markup from changed material amounts and drops stale derived lines', () => {
    const lines = [
      { kind: 'mat' as const, label: 'Mat', explanation: '', amountCents: 5000, computedCents: 3800, note: 'Rush order board' },
      { kind: 'markup' as const, label: 'old', explanation: '', amountCents: 999 },
    ];
    const sums = quoteSums(lines, { ...terms, markupPercent: 40, minimumChargeCents: 0 });
    // 40 % of 50.00 = 20.00; the stale 9.99 markup line is gone.
    expect(sums.lines.map((l) => l.amountCents)).toEqual([5000, 2000]);
  });

  it('rounds half a cent up and keeps fractional rates exact', () => {
    // 8.875 % of 200.00 = 17.75 exactly; 50 % of 0.01 = 0.005 -> 0.01.
    expect(percentOf(20000, 8.875)).toBe(1775);
    expect(percentOf(1, 50)).toBe(1);
    expect(percentOf(79590, 8.25)).toBe(6566);
  });
});
