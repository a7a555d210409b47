import { z } from 'zod';
import { optionalTextField, textField } from '../text/schema';
import { pieceOutline } from '../trace/schema';

export const pieceKinds = ['garment', 'photo', 'patch', 'plaque', 'card', 'other'] as const;
export const pieceKindSchema = z.enum(pieceKinds);
export type PieceKind = z.infer<typeof pieceKindSchema>;

export const pieceKindLabels: Record<PieceKind, string> = {
  garment: 'Garment',
  photo: 'Photo',
  patch: 'Patch',
  plaque: 'Plaque',
  card: 'Card or ticket',
  other: 'Other',
};

/** The largest board sheets are well under 120 in; anything bigger is a typing slip. */
export const PIECE_MAX_IN = 120;

export const pieceSide = (name: string) =>
  z
    .number({ error: `${name} must be a number of inches` })
    .gt(0, `${name} must be more than 0`)
    .lt(PIECE_MAX_IN, `${name} must be under ${PIECE_MAX_IN} in`);

export const optionalNotes = optionalTextField({ max: 2000, multiline: true, tooLong: 'Keep notes under 2000 characters' });

export const pieceInput = z.object({
  kind: z.enum(pieceKinds, { error: 'Choose what kind of piece this is' }),
  label: textField({ max: 120, required: 'Give the piece a short name', tooLong: 'Keep the name under 120 characters' }),
  widthIn: pieceSide('Width'),
  heightIn: pieceSide('Height'),
  notes: optionalNotes,
});
export type PieceInput = z.input<typeof pieceInput>;

/** A change to a piece: any of its fields, at least one. */
export const piecePatch = pieceInput
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Send at least one field to change', path: ['_'] });
export type PiecePatch = z.input<typeof piecePatch>;

export const photoSummary = z.object({
  id: z.string().uuid(),
  mimeType: z.string(),
  widthPx: z.number().int(),
  heightPx: z.number().int(),
  bytes: z.number().int(),
  originalName: z.string().nullable(),
  createdAt: z.string(),
});
export type PhotoSummary = z.infer<typeof photoSummary>;

export const piece = z.object({
  id: z.string().uuid(),
  jobId: z.string().uuid(),
  kind: pieceKindSchema,
  label: z.string(),
  widthIn: z.number(),
  heightIn: z.number(),
  notes: z.string().nullable(),
  /** A garment's saved outline, traced from one of its photos. */
  outline: pieceOutline.nullable().default(null),
  createdAt: z.string(),
  photos: z.array(photoSummary),
});
export type Piece = z.infer<typeof piece>;

export const pieceList = z.object({ pieces: z.array(piece) });
export const pieceResponse = z.object({ piece });
export const photoResponse = z.object({ photo: photoSummary });

/** Uploads larger than this are refused before anything is kept. */
export const PHOTO_MAX_BYTES = 25 * 1024 * 1024;

/**
 * Photos with more pixels than this are refused from their header, before any
 * decoding: 60 megapixels holds any phone or most camera photos (a 9000 x 6000 sensor
 * is 54), while decoding one costs about 240 MB of memory at 4 bytes a pixel.
 */
export const PHOTO_MAX_PIXELS = 60_000_000;
