import { z } from 'zod';

/**
 * The stored layout document, current version. The server validates with the
 * same schema; older versions are lifted by `parseLayout` before this runs.
 * All lengths are inches.
 */
export const LAYOUT_SCHEMA_VERSION = 2;

/** Common practice: 1/4 in is the usual reveal of a lower mat. */
export const DEFAULT_REVEAL_IN = 0.25;

const length = z.number().finite();
const positiveLength = z.number().finite().positive();
const hexColour = z.string().regex(/^#(?:[0-9a-fA-F]{3}|[0-9a-fA-F]{6})$/, 'a colour such as #1f3a5c');

export const boardPointSchema = z.object({ x: length, y: length });

export const sizeSchema = z.object({
  /** Inches across. */
  width: positiveLength,
  /** Inches down. */
  height: positiveLength,
});

export const shapeSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('rectangle'), width: positiveLength, height: positiveLength }),
  z.object({ kind: z.literal('roundedRectangle'), width: positiveLength, height: positiveLength, cornerRadius: z.number().finite().nonnegative() }),
  z.object({ kind: z.literal('oval'), width: positiveLength, height: positiveLength }),
  z.object({ kind: z.literal('circle'), radius: positiveLength }),
  z.object({ kind: z.literal('regularPolygon'), sides: z.number().int().min(3).max(64), radius: positiveLength }),
  /** Points relative to the opening centre. */
  z.object({ kind: z.literal('polygon'), points: z.array(boardPointSchema).min(3) }),
  /** A traced garment, points relative to the opening centre. */
  z.object({ kind: z.literal('outline'), points: z.array(boardPointSchema).min(3) }),
]);

export const matSchema = z.object({
  id: z.string().min(1),
  name: z.string(),
  /** Face colour. */
  color: hexColour,
  /** Colour of the board's core, seen on the bevel. */
  coreColor: hexColour,
  ply: z.union([z.literal(4), z.literal(6), z.literal(8), z.literal('other')]),
  /** Board thickness in inches (4-ply is about 0.055 in, common practice). */
  thickness: positiveLength,
  /** Bevel angle from the vertical face of the cut, in degrees. */
  bevelAngle: z.number().finite().min(0).max(80).default(45),
  /** The board sheet the mat is cut from. */
  sheet: sizeSchema,
});

export const mountingBoardSchema = z.object({
  color: hexColour,
  /** Whether the cutter also cuts the mounting board's outer edge. */
  cut: z.boolean(),
});

export const openingSchema = z.object({
  id: z.string().min(1),
  shape: shapeSchema,
  /** Centre of the opening on the layout, inches from the top-left of the outer edge. */
  center: boardPointSchema,
  /** Degrees, clockwise on screen. */
  rotation: z.number().finite().default(0),
  pieceId: z.string().optional(),
  /** Real size of the piece shown, when it is a flat rectangle. */
  pieceSize: sizeSchema.optional(),
  /** How many mats the opening cuts, counted from the top. */
  depth: z.number().int().min(1),
  /** Gap from the piece to the sight edge; negative when the mat overlaps the piece. */
  clearance: length.default(0),
  /** reveals[k] is the reveal between mat k+1 and mat k+2 (top first), measured on face-edge lines. */
  reveals: z.array(z.number().finite().nonnegative()).default([]),
});

export const checkSettingsSchema = z.object({
  /** Common practice: bridges under 1/2 in deserve a warning. */
  bridgeWarning: positiveLength.default(0.5),
  /** Common practice: bridges under 1/4 in tear. */
  bridgeError: positiveLength.default(0.25),
  /** Narrowest coloured band of a lower mat worth showing. */
  minimumBand: z.number().finite().nonnegative().default(1 / 16),
  /** Common practice: a mat should overlap a print by at least 1/8 in to hold it. */
  minimumOverlap: z.number().finite().nonnegative().default(1 / 8),
  /** Common practice: the package is cut 1/8 in smaller than the frame's rabbet. */
  rabbetAllowance: z.number().finite().nonnegative().default(1 / 8),
});

export const layoutSchema = z.object({
  schemaVersion: z.literal(LAYOUT_SCHEMA_VERSION),
  /** Outer edge of the mats. */
  outer: sizeSchema,
  /** Top mat first. */
  mats: z.array(matSchema).min(1),
  mountingBoard: mountingBoardSchema,
  /** The frame's rabbet opening, when the frame is known. */
  frameRabbet: sizeSchema.optional(),
  openings: z.array(openingSchema),
  checkSettings: checkSettingsSchema.default({
    bridgeWarning: 0.5,
    bridgeError: 0.25,
    minimumBand: 1 / 16,
    minimumOverlap: 1 / 8,
    rabbetAllowance: 1 / 8,
  }),
});

export type Layout = z.infer<typeof layoutSchema>;
export type LayoutInput = z.input<typeof layoutSchema>;
export type Mat = z.infer<typeof matSchema>;
export type Opening = z.infer<typeof openingSchema>;
export type CheckSettings = z.infer<typeof checkSettingsSchema>;
export type Size = z.infer<typeof sizeSchema>;
