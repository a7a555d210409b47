import { z } from 'zod';
import { cents } from '../quotes/schema';
import { textField } from '../text/schema';

/** The glazing a shop sells; each kind has its own thickness, density and price. */
export const glazingKinds = ['regular_glass', 'uv_glass', 'acrylic', 'uv_acrylic'] as const;
export type GlazingKind = (typeof glazingKinds)[number];

export const glazingKindLabels: Record<GlazingKind, string> = {
  regular_glass: 'Regular glass',
  uv_glass: 'UV-filtering glass',
  acrylic: 'Acrylic',
  uv_acrylic: 'UV-filtering acrylic',
};

/** Glass shatters in a box; acrylic does not. Shipping screens say so beside the choice. */
export const isGlass = (kind: GlazingKind) => kind === 'regular_glass' || kind === 'uv_glass';

export const glazingMaterial = z.object({
  kind: z.enum(glazingKinds),
  thicknessIn: z.number().min(0.04, 'Glazing is at least 0.04 in thick').max(0.5, 'Glazing is at most 0.5 in thick'),
  /** kg/m3; float glass 2500 (EN 572-1), acrylic 1190 (specific gravity 1.19, ASTM D792). */
  densityKgM3: z.number().min(500, 'Density must be at least 500 kg/m3').max(5000, 'Density must be at most 5000 kg/m3'),
  pricePerSqFtCents: cents,
});
export type GlazingMaterial = z.infer<typeof glazingMaterial>;

/** A moulding profile under the shop's own code. */
export const moulding = z.object({
  code: textField({ max: 40, required: 'Give the moulding a code' }),
  name: textField({ max: 80, required: 'Name the moulding' }),
  pricePerFootCents: cents,
  /** Width of the moulding's face seen from the front, in inches. */
  faceWidthIn: z.number().min(0.25, 'Face width is at least 0.25 in').max(12, 'Face width is at most 12 in'),
  /** Depth of the rabbet that holds glazing, mats and backing, in inches. */
  rabbetDepthIn: z.number().min(0.125, 'Rabbet depth is at least 0.125 in').max(6, 'Rabbet depth is at most 6 in'),
  weightLbPerFoot: z.number().min(0, 'Weight cannot be negative').max(20, 'Weight is at most 20 lb a foot'),
});
export type Moulding = z.infer<typeof moulding>;

/**
 * What a new shop starts with. Thicknesses: 2.5 mm (3/32 in) glass is a standard nominal size (ASTM C1036);
 * 0.118 in acrylic is common practice. Densities as noted on glazingMaterial. Prices are invented examples.
 */
export const defaultGlazing: GlazingMaterial[] = [
  { kind: 'regular_glass', thicknessIn: 2.5 / 25.4, densityKgM3: 2500, pricePerSqFtCents: 650 },
  { kind: 'uv_glass', thicknessIn: 2.5 / 25.4, densityKgM3: 2500, pricePerSqFtCents: 1250 },
  { kind: 'acrylic', thicknessIn: 0.118, densityKgM3: 1190, pricePerSqFtCents: 1450 },
  { kind: 'uv_acrylic', thicknessIn: 0.118, densityKgM3: 1190, pricePerSqFtCents: 2200 },
];

/** Invented profiles for the demo shop. */
export const defaultMouldings: Moulding[] = [
  { code: 'BX-150', name: 'Deep box, satin black', pricePerFootCents: 1275, faceWidthIn: 1.5, rabbetDepthIn: 2.5, weightLbPerFoot: 0.9 },
  { code: 'BX-125W', name: 'Deep box, limed oak', pricePerFootCents: 1450, faceWidthIn: 1.25, rabbetDepthIn: 2, weightLbPerFoot: 0.8 },
  { code: 'FL-075', name: 'Flat, brushed silver', pricePerFootCents: 690, faceWidthIn: 0.75, rabbetDepthIn: 0.5, weightLbPerFoot: 0.35 },
];

/** The frame a job will be built in: read by the quote and by the shipping box. */
export const frameChoice = z.object({
  mouldingCode: textField({ max: 40, required: 'Choose a moulding' }),
  glazingKind: z.enum(glazingKinds),
  /** Space behind the mats for a garment or objects; 0 for a flat frame. */
  shadowboxDepthIn: z.number().min(0, 'Depth cannot be negative').max(12, 'A shadowbox is at most 12 in deep'),
});
export type FrameChoice = z.infer<typeof frameChoice>;
