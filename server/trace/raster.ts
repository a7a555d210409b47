/** An RGB image held as bytes, row by row, three per pixel. */
export interface RgbRaster {
  width: number;
  height: number;
  data: Uint8Array;
}

/** A one-channel image of numbers, row by row. */
export interface FloatRaster {
  width: number;
  height: number;
  data: Float32Array;
}

/** Reports how far a trace has got: a stage name and 0..1 within the whole run. */
export type TraceProgress = (stage: 'reading' | 'rectifying' | 'separating' | 'outlining', progress: number) => void;

/** A mistake in what the framer gave (a photo with no garment, an unreadable file): shown to them as it is. */
export class TraceInputError extends Error {
  constructor(
    readonly code: 'no_garment' | 'unreadable_image' | 'too_large' | 'bad_calibration' | 'unsupported_type',
    message: string,
  ) {
    super(message);
    this.name = 'TraceInputError';
  }
}
