import { z } from 'zod';
import { textField } from '../text/schema';
import { defaultShippingSettings, shippingSettings } from '../shipping/schema';
import { defaultGlazing, defaultMouldings, glazingMaterial, moulding } from './materials';
import { defaultPriceList, priceList } from './priceList';
import { PROOF_DEFAULT_DAYS, proofExpiryDays } from '../proofs/schema';

const inches = (label: string, min: number, max: number) =>
  z.number({ error: `${label} must be a number of inches` }).min(min, `${label} must be at least ${min} in`).max(max, `${label} must be at most ${max} in`);

const hexColour = z.string().regex(/^#[0-9a-fA-F]{6}$/, 'Use a colour like #1F3A5C');

/** A mat board the shop keeps in stock. */
export const stockBoard = z.object({
  id: textField({ max: 40, required: 'Give the board an id' }),
  /** The shop's own name for the board, e.g. "Harbour navy". */
  name: textField({ max: 80, required: 'Name the board' }),
  colour: hexColour,
  /** Colour of the board's core, seen on the bevel. */
  coreColour: hexColour,
  ply: z.union([z.literal(2), z.literal(4), z.literal(6), z.literal(8)]),
  /** Thickness in inches; 4-ply is about 0.055 in (common practice, varies by maker). */
  thicknessIn: inches('Thickness', 0.01, 0.5),
});
export type StockBoard = z.infer<typeof stockBoard>;

export const sheetSize = z.object({
  name: textField({ max: 40, required: 'Name the sheet size' }),
  widthIn: inches('Sheet width', 1, 120),
  heightIn: inches('Sheet height', 1, 120),
});

export const originCorners = ['top-left', 'bottom-left', 'top-right', 'bottom-right'] as const;

/** How one computerized mat cutter wants its files. */
export const cutterProfile = z.object({
  id: textField({ max: 40, required: 'Give the profile an id' }),
  name: textField({ max: 80, required: 'Name the profile' }),
  units: z.enum(['in', 'mm']),
  /** Cut face down: every x becomes width - x. */
  mirrored: z.boolean(),
  /** Which bevel edge the cutting path follows. */
  pathEdge: z.enum(['face', 'back']),
  origin: z.enum(originCorners),
  /** True arcs and circles in the file, or only straight segments. */
  arcs: z.boolean(),
  /** The cutter picks a full circle's direction itself, so circles may be written as DXF CIRCLE entities; otherwise as two half arcs in the cut direction. */
  cutterChoosesCircleDirection: z.boolean().default(false),
  /** Largest distance between a polyline and the true curve, in inches. */
  chordToleranceIn: inches('Chord tolerance', 0.0005, 0.05),
  maxSheetWidthIn: inches('Largest sheet width', 1, 120),
  maxSheetHeightIn: inches('Largest sheet height', 1, 120),
  /** One file per mat, or every mat in one file on its own layers. */
  filePerMat: z.boolean(),
});
export type CutterProfile = z.infer<typeof cutterProfile>;

export const roundingSteps = ['1/8', '1/16', '1/32', '0.5mm'] as const;

export const shopSettings = z.object({
  units: z.enum(['in', 'mm']),
  rounding: z.enum(roundingSteps),
  /** Reveal of each lower mat when a new opening is drawn (1/4 in typical, common practice). */
  defaultRevealIn: inches('Default reveal', 0, 2),
  /** Bridge narrower than this is a warning (1/2 in typical, common practice). */
  bridgeWarnIn: inches('Bridge warning width', 0.05, 4),
  /** Bridge narrower than this is an error (1/4 in, common practice). */
  bridgeErrorIn: inches('Bridge error width', 0.01, 4),
  /** Coloured band of a reveal narrower than this is flagged (1/16 in). */
  minVisibleBandIn: inches('Smallest visible band', 0, 1),
  bevelAngleDeg: z.number().min(30, 'Bevel angle must be 30 to 60 degrees').max(60, 'Bevel angle must be 30 to 60 degrees'),
  stock: z.array(stockBoard).max(500),
  sheets: z.array(sheetSize).max(50),
  cutterProfiles: z.array(cutterProfile).max(20),
  /** Glazing the shop sells, one entry per kind; shops saved before glazing was listed get the defaults. */
  glazing: z.array(glazingMaterial).max(4).default(defaultGlazing),
  mouldings: z.array(moulding).max(500).default(defaultMouldings),
  /** What the shop charges; shops saved before prices were kept get the example prices. */
  priceList: priceList.default(defaultPriceList),
  /** Packing, dimensional weight and carriers; shops saved before shipping was set up get the defaults. */
  shipping: shippingSettings.default(defaultShippingSettings),
  /** Days a proof link stays open when the sender does not choose; shops saved before it read 30. */
  proofExpiryDays: proofExpiryDays.default(PROOF_DEFAULT_DAYS),
}).refine((s) => s.bridgeErrorIn <= s.bridgeWarnIn, { message: 'The error width must not exceed the warning width', path: ['bridgeErrorIn'] });
export type ShopSettings = z.infer<typeof shopSettings>;

/** What a new shop starts with; every number is common practice, not a standard. */
export const defaultShopSettings: ShopSettings = {
  units: 'in',
  rounding: '1/16',
  defaultRevealIn: 0.25,
  bridgeWarnIn: 0.5,
  bridgeErrorIn: 0.25,
  minVisibleBandIn: 0.0625,
  bevelAngleDeg: 45,
  stock: [
    { id: 'warm-white', name: 'Warm white', colour: '#F3EEE2', coreColour: '#FBF8F1', ply: 4, thicknessIn: 0.055 },
    { id: 'harbour-navy', name: 'Harbour navy', colour: '#1D2B4A', coreColour: '#F6F3EA', ply: 4, thicknessIn: 0.055 },
    { id: 'signal-red', name: 'Signal red', colour: '#A3232B', coreColour: '#F6F3EA', ply: 4, thicknessIn: 0.055 },
    { id: 'field-green', name: 'Field green', colour: '#2D5A3A', coreColour: '#F6F3EA', ply: 4, thicknessIn: 0.055 },
    { id: 'charcoal', name: 'Charcoal', colour: '#2E2F31', coreColour: '#121212', ply: 4, thicknessIn: 0.055 },
    { id: 'gold-leaf', name: 'Old gold', colour: '#B8902F', coreColour: '#F6F3EA', ply: 4, thicknessIn: 0.055 },
    { id: 'heavy-white', name: 'Heavy white', colour: '#F7F5EF', coreColour: '#FFFFFF', ply: 8, thicknessIn: 0.12 },
  ],
  sheets: [
    { name: 'Standard 32 x 40', widthIn: 32, heightIn: 40 },
    { name: 'Oversize 40 x 60', widthIn: 40, heightIn: 60 },
  ],
  cutterProfiles: [
    {
      id: 'default',
      name: 'Shop cutter (inches, face up)',
      units: 'in',
      mirrored: false,
      pathEdge: 'back',
      origin: 'bottom-left',
      arcs: true,
      cutterChoosesCircleDirection: false,
      chordToleranceIn: 0.005,
      maxSheetWidthIn: 40,
      maxSheetHeightIn: 60,
      filePerMat: true,
    },
  ],
  glazing: defaultGlazing,
  mouldings: defaultMouldings,
  priceList: defaultPriceList,
  shipping: defaultShippingSettings,
  proofExpiryDays: PROOF_DEFAULT_DAYS,
};
