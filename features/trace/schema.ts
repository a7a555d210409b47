import { z } from 'zod';

/** A traced outline keeps at most this many points; a garment needs a few hundred. */
export const MAX_OUTLINE_POINTS = 4000;
/** Photos larger than this many pixels are refused for tracing (a 48 MP phone photo fits). */
export const TRACE_MAX_PIXELS = 50_000_000;
/** Known rectangles and typed distances are kept within the largest board sheets framers stock. */
export const CALIBRATION_MAX_IN = 120;

const pixel = z.number({ error: 'Corner positions must be numbers of pixels' }).finite().min(-1e5).max(1e5);
export const photoPoint = z.object({ x: pixel, y: pixel });
export type PhotoPoint = z.infer<typeof photoPoint>;

const inches = (name: string) =>
  z
    .number({ error: `${name} must be a number of inches` })
    .gt(0, `${name} must be more than 0`)
    .max(CALIBRATION_MAX_IN, `${name} must be at most ${CALIBRATION_MAX_IN} in`);

/** Four corners of a rectangle of known size, in pixels of the upright photo, in order round it. */
export const rectangleCalibration = z.object({
  kind: z.literal('rectangle'),
  corners: z.array(photoPoint).length(4, 'Mark all four corners of the rectangle'),
  widthIn: inches('The rectangle width'),
  heightIn: inches('The rectangle height'),
});

/** Two points a known distance apart: scale only, no correction for a tilted camera. */
export const twoPointCalibration = z.object({
  kind: z.literal('twoPoints'),
  from: photoPoint,
  to: photoPoint,
  distanceIn: inches('The distance'),
});

export const calibration = z.discriminatedUnion('kind', [rectangleCalibration, twoPointCalibration], { error: 'Choose a rectangle or two points' });
export type Calibration = z.infer<typeof calibration>;

/** A box in pixels of the upright photo. */
export const photoBox = z.object({ x: pixel, y: pixel, width: z.number().finite().gt(0).max(1e5), height: z.number().finite().gt(0).max(1e5) });

export const traceRequest = z.object({
  photoId: z.string().uuid('Choose one of the piece’s photos'),
  calibration,
  /** A point on the bare background the framer tapped, to take its colour from. */
  background: photoPoint.nullish(),
  /** A rough box around the garment, for separating it where its colour is close to the board's. */
  box: photoBox.nullish(),
});
export type TraceRequest = z.input<typeof traceRequest>;

export const traceStatuses = ['queued', 'running', 'done', 'failed'] as const;
export const traceStages = ['waiting', 'reading', 'rectifying', 'separating', 'outlining', 'saving', 'finished'] as const;
export type TraceStage = (typeof traceStages)[number];

export const traceStageLabels: Record<TraceStage, string> = {
  waiting: 'Waiting for a tracing worker',
  reading: 'Reading the photo',
  rectifying: 'Squaring the photo to the rectangle',
  separating: 'Separating the garment from the board',
  outlining: 'Drawing the outline',
  saving: 'Keeping the result',
  finished: 'Done',
};

export const inchPoint = z.object({ x: z.number().finite(), y: z.number().finite() });
export type InchPoint = z.infer<typeof inchPoint>;

/** What a finished trace gives: the outline in inches from the top-left of its rectified photo, and that photo's size. */
export const traceResult = z.object({
  points: z.array(inchPoint),
  imageWidthIn: z.number(),
  imageHeightIn: z.number(),
  areaSqIn: z.number(),
});
export type TraceResult = z.infer<typeof traceResult>;

export const traceRun = z.object({
  id: z.string().uuid(),
  pieceId: z.string().uuid(),
  photoId: z.string().uuid(),
  status: z.enum(traceStatuses),
  stage: z.enum(traceStages),
  progress: z.number(),
  attempts: z.number().int(),
  message: z.string().nullable(),
  result: traceResult.nullable(),
  calibration,
  createdAt: z.string(),
});
export type TraceRun = z.infer<typeof traceRun>;
export const traceRunResponse = z.object({ trace: traceRun });

export const outlineSave = z.object({
  traceId: z.string().uuid('Trace the photo first'),
  points: z
    .array(inchPoint)
    .min(3, 'An outline needs at least 3 points')
    .max(MAX_OUTLINE_POINTS, `An outline may have at most ${MAX_OUTLINE_POINTS} points`),
});
export type OutlineSave = z.input<typeof outlineSave>;

/** The outline kept on a garment piece, with what it was traced from. */
export const pieceOutline = z.object({
  traceId: z.string().uuid(),
  photoId: z.string().uuid(),
  points: z.array(inchPoint),
  imageWidthIn: z.number(),
  imageHeightIn: z.number(),
  calibration,
  savedAt: z.string(),
});
export type PieceOutline = z.infer<typeof pieceOutline>;

export const cornerProposal = z.object({ corners: z.array(photoPoint).length(4).nullable(), widthPx: z.number(), heightPx: z.number() });
export type CornerProposal = z.infer<typeof cornerProposal>;
