import { z } from 'zod';

/**
 * The stored layout document, current version. The server validates with the
 * same schema; older versions are lifted by `parseLayout` before this runs.
 * All lengths are inches.
 */
export const LAYOUT_SCHEMA_VERSION = 2;

/** Common practice: 1/4 in is the usual reveal of a lower mat. */
export const DEFAULT_REVEAL_IN = 0.25;

/**
 * What no shop can cut, refused by the schema so no step ever meets it.
 * The designer shows the same numbers beside its fields.
 */
/** Longest side of a layout's outer edge: larger than any mat board sheet sold (40 x 60 in oversize, common practice) with room to spare. */
export const MAX_OUTER_SIDE_IN = 120;
/** Openings in one layout. */
export const MAX_OPENINGS = 200;
/** Mats in one stack. */
export const MAX_MATS = 12;
/** Points of one traced outline or polygon. */
export const MAX_OUTLINE_POINTS = 50_000;
/** Points of every outline and polygon of a layout together, so 200 openings cannot each bring 50 000. */
export const MAX_LAYOUT_POINTS = 100_000;
/** A reveal this wide is a second mat's border, not a reveal. */
export const MAX_REVEAL_IN = 2;
/** Board thickness: 8-ply is about 0.12 in (common practice); nothing cut here is an inch thick. */
export const MAX_THICKNESS_IN = 1;
/** Ids are the program's own short names. */
export const MAX_ID_LENGTH = 80;

const tooLarge = (what: string, max: number) => `${what} must be at most ${max} in`;
/** Any coordinate or size inside the layout: no shop cuts beyond the outer limit. */
const length = z.number().finite().min(-MAX_OUTER_SIDE_IN, `must be within ${MAX_OUTER_SIDE_IN} in of the board`).max(MAX_OUTER_SIDE_IN, tooLarge('A length', MAX_OUTER_SIDE_IN));
const positiveLength = length.positive();
const hexColour = z.string().regex(/^#(?:[0-9a-fA-F]{3}|[0-9a-fA-F]{6})$/, 'a colour such as #1f3a5c');

export const boardPointSchema = z.object({ x: length, y: length });

export const sizeSchema = z.object({
  /** Inches across. */
  width: positiveLength.max(MAX_OUTER_SIDE_IN, tooLarge('A side', MAX_OUTER_SIDE_IN)),
  /** Inches down. */
  height: positiveLength.max(MAX_OUTER_SIDE_IN, tooLarge('A side', MAX_OUTER_SIDE_IN)),
});

/**
 * Point lists this schema has already checked and written: a document that
 * carries one again (a draft save that kept its traced outline) is not
 * walked a second time. Nothing mutates a parsed layout's points in place.
 */
const checkedOutlines = new WeakSet<readonly BoardPoint[]>();

/**
 * Outline points are checked in one loop rather than one zod object per
 * point: 50 000 points parse in a few milliseconds instead of most of a
 * second, and a list already checked costs nothing. The result keeps only
 * x and y.
 */
const outlinePoints = z
  .custom<BoardPoint[]>((value) => Array.isArray(value), 'An outline is a list of points')
  .superRefine((points, context) => {
    if (checkedOutlines.has(points)) return;
    if (points.length < 3) {
      context.addIssue({ code: 'custom', message: `An outline needs at least 3 points; this one has ${points.length}` });
      return;
    }
    if (points.length > MAX_OUTLINE_POINTS) {
      context.addIssue({ code: 'custom', message: `An outline may have at most ${MAX_OUTLINE_POINTS} points` });
      return;
    }
    for (let i = 0; i < points.length; i++) {
      const p = points[i] as { x?: unknown; y?: unknown } | null;
      if (typeof p !== 'object' || p === null || !fine(p.x) || !fine(p.y)) {
        context.addIssue({ code: 'custom', path: [i], message: `Each point needs x and y, numbers within ${MAX_OUTER_SIDE_IN} in of the opening's centre` });
        return;
      }
    }
  })
  .transform((points): BoardPoint[] => {
    if (checkedOutlines.has(points)) return points;
    const written = points.map((p) => ({ x: p.x, y: p.y }));
    checkedOutlines.add(written);
    return written;
  });

/**
 * The same check for one list of points on its own, answering the list as a
 * layout would hold it (already known to the schema), or null when it is not
 * a valid outline.
 */
export function checkedOutline(value: unknown): BoardPoint[] | null {
  const parsed = outlinePoints.safeParse(value);
  return parsed.success ? parsed.data : null;
}

/** A coordinate within reach of the board; outside the loop so no function is made per point. */
function fine(v: unknown): boolean {
  return typeof v === 'number' && Number.isFinite(v) && Math.abs(v) <= MAX_OUTER_SIDE_IN;
}

interface BoardPoint {
  readonly x: number;
  readonly y: number;
}

export const shapeSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('rectangle'), width: positiveLength, height: positiveLength }),
  z.object({ kind: z.literal('roundedRectangle'), width: positiveLength, height: positiveLength, cornerRadius: z.number().finite().nonnegative() }),
  z.object({ kind: z.literal('oval'), width: positiveLength, height: positiveLength }),
  z.object({ kind: z.literal('circle'), radius: positiveLength }),
  z.object({ kind: z.literal('regularPolygon'), sides: z.number().int().min(3).max(64), radius: positiveLength }),
  /** Points relative to the opening centre. */
  z.object({ kind: z.literal('polygon'), points: outlinePoints }),
  /** A traced garment, points relative to the opening centre. */
  z.object({ kind: z.literal('outline'), points: outlinePoints }),
]);

const idSchema = z.string().min(1).max(MAX_ID_LENGTH);

export const matSchema = z.object({
  id: idSchema,
  name: z.string().max(200),
  /** Face colour. */
  color: hexColour,
  /** Colour of the board's core, seen on the bevel. */
  coreColor: hexColour,
  ply: z.union([z.literal(4), z.literal(6), z.literal(8), z.literal('other')]),
  /** Board thickness in inches (4-ply is about 0.055 in, common practice). */
  thickness: positiveLength.max(MAX_THICKNESS_IN, tooLarge('Thickness', MAX_THICKNESS_IN)),
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
  id: idSchema,
  shape: shapeSchema,
  /** Centre of the opening on the layout, inches from the top-left of the outer edge. */
  center: boardPointSchema,
  /** Degrees, clockwise on screen. */
  rotation: z.number().finite().min(-360).max(360).default(0),
  pieceId: z.string().max(MAX_ID_LENGTH).optional(),
  /** Real size of the piece shown, when it is a flat rectangle. */
  pieceSize: sizeSchema.optional(),
  /** How many mats the opening cuts, counted from the top. */
  depth: z.number().int().min(1).max(MAX_MATS),
  /** Gap from the piece to the sight edge; negative when the mat overlaps the piece. */
  clearance: length.default(0),
  /** reveals[k] is the reveal between mat k+1 and mat k+2 (top first), measured on face-edge lines. */
  reveals: z.array(z.number().finite().nonnegative().lt(MAX_REVEAL_IN, `A reveal must be under ${MAX_REVEAL_IN} in`)).max(MAX_MATS).default([]),
});

export const checkSettingsSchema = z.object({
  /** Common practice: bridges under 1/2 in deserve a warning. */
  bridgeWarning: positiveLength.max(4).default(0.5),
  /** Common practice: bridges under 1/4 in tear. */
  bridgeError: positiveLength.max(4).default(0.25),
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
  mats: z.array(matSchema).min(1).max(MAX_MATS, `A stack may have at most ${MAX_MATS} mats`),
  mountingBoard: mountingBoardSchema,
  /** The frame's rabbet opening, when the frame is known. */
  frameRabbet: sizeSchema.optional(),
  openings: z.array(openingSchema).max(MAX_OPENINGS, `A layout may have at most ${MAX_OPENINGS} openings`),
  checkSettings: checkSettingsSchema.default({
    bridgeWarning: 0.5,
    bridgeError: 0.25,
    minimumBand: 1 / 16,
    minimumOverlap: 1 / 8,
    rabbetAllowance: 1 / 8,
  }),
}).superRefine((layout, context) => {
  let points = 0;
  layout.openings.forEach((opening, i) => {
    if ('points' in opening.shape) points += opening.shape.points.length;
    const reach = openingReach(opening);
    const { x, y } = opening.center;
    const { width, height } = layout.outer;
    if (x + reach < 0 || y + reach < 0 || x - reach > width || y - reach > height) {
      context.addIssue({ code: 'custom', path: ['openings', i, 'center'], message: 'The opening lies outside the outer edge; move it onto the board' });
    }
  });
  if (points > MAX_LAYOUT_POINTS) {
    context.addIssue({ code: 'custom', path: ['openings'], message: `The outlines of a layout may have at most ${MAX_LAYOUT_POINTS} points together; this one has ${points}` });
  }
});

/** Farthest any point of the opening's shape reaches from its centre (a bound, not exact). */
function openingReach(opening: { shape: z.infer<typeof shapeSchema> }): number {
  const { shape } = opening;
  switch (shape.kind) {
    case 'rectangle': case 'roundedRectangle': case 'oval': return Math.hypot(shape.width, shape.height) / 2;
    case 'circle': case 'regularPolygon': return shape.radius;
    default: {
      let reach = 0;
      for (const p of shape.points) reach = Math.max(reach, Math.abs(p.x) + Math.abs(p.y));
      return reach;
    }
  }
}

export type Layout = z.infer<typeof layoutSchema>;
export type LayoutInput = z.input<typeof layoutSchema>;
export type Mat = z.infer<typeof matSchema>;
export type Opening = z.infer<typeof openingSchema>;
export type CheckSettings = z.infer<typeof checkSettingsSchema>;
export type Size = z.infer<typeof sizeSchema>;
