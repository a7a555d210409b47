import { z } from 'zod';
import { pieceKinds, type PieceKind } from '../pieces/schema';
import { cents } from '../quotes/schema';
import { textField } from '../text/schema';

/** Opening shapes grouped the way a framer charges for cutting them; a traced outline takes longest. */
export const labourShapes = ['rectangle', 'roundedRectangle', 'oval', 'polygon', 'outline'] as const;
export type LabourShape = (typeof labourShapes)[number];

export const labourShapeLabels: Record<LabourShape, string> = {
  rectangle: 'Rectangle',
  roundedRectangle: 'Rounded rectangle',
  oval: 'Circle or oval',
  polygon: 'Many-sided shape',
  outline: 'Traced outline',
};

const percent = (label: string, max: number) =>
  z.number({ error: `${label} must be a number` }).min(0, `${label} cannot be negative`).max(max, `${label} is at most ${max} %`);

/** The price of one sheet of mat board of a ply, on one of the shop's sheet sizes (named as in `sheets`). */
export const matBoardPrice = z.object({
  ply: z.union([z.literal(2), z.literal(4), z.literal(6), z.literal(8)]),
  sheetName: textField({ max: 40, required: 'Name the sheet size this price is for' }),
  pricePerSheetCents: cents,
});
export type MatBoardPrice = z.infer<typeof matBoardPrice>;

const centsPerKind = z.object(Object.fromEntries(pieceKinds.map((k) => [k, cents])) as Record<PieceKind, typeof cents>);
const centsPerShape = z.object(Object.fromEntries(labourShapes.map((k) => [k, cents])) as Record<LabourShape, typeof cents>);

/**
 * What the shop charges. Glazing per square foot and moulding per foot live on the
 * `glazing` and `mouldings` lists; everything else is here. Money in whole cents.
 */
export const priceList = z.object({
  /** ISO 4217 code of the shop's currency. */
  currency: textField({ max: 3, required: 'Give a currency code such as USD' }).regex(/^[A-Z]{3}$/, 'Use a three-letter currency code such as USD').default('USD'),
  matBoards: z.array(matBoardPrice).max(100),
  /** Shadowbox spacers, per foot of the frame's perimeter. */
  spacerPerFootCents: cents,
  /** Mounting one piece, by kind; a garment takes more work than a photo. */
  mountingPerPieceCents: centsPerKind,
  /** Cutting one opening, by its shape. */
  labourPerOpeningCents: centsPerShape,
  /** Assembling one frame: glazing, mats, backing, hangers. */
  fittingPerFrameCents: cents,
  /** A quote never comes to less than this before tax. */
  minimumChargeCents: cents,
  /** Added on materials (mat board, glazing, moulding, spacers). */
  markupPercent: percent('Markup', 500),
  taxRatePercent: percent('Tax rate', 50),
  /** Share of the total asked before work starts. */
  depositSharePercent: percent('Deposit share', 100).default(50),
});
export type PriceList = z.infer<typeof priceList>;

/** Invented example prices for a new shop. */
export const defaultPriceList: PriceList = {
  currency: 'USD',
  matBoards: [
    { ply: 4, sheetName: 'Standard 32 x 40', pricePerSheetCents: 3800 },
    { ply: 4, sheetName: 'Oversize 40 x 60', pricePerSheetCents: 7200 },
    { ply: 8, sheetName: 'Standard 32 x 40', pricePerSheetCents: 6400 },
    { ply: 8, sheetName: 'Oversize 40 x 60', pricePerSheetCents: 11800 },
  ],
  spacerPerFootCents: 350,
  mountingPerPieceCents: { garment: 4500, photo: 800, patch: 600, plaque: 1000, card: 500, other: 1200 },
  labourPerOpeningCents: { rectangle: 600, roundedRectangle: 900, oval: 900, polygon: 1200, outline: 2500 },
  fittingPerFrameCents: 3500,
  minimumChargeCents: 7500,
  markupPercent: 40,
  taxRatePercent: 8.25,
  depositSharePercent: 50,
};
