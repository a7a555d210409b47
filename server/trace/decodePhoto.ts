import sharp, { type Sharp } from 'sharp';
import { TRACE_MAX_PIXELS } from '../../features/trace/schema';
import { sniffImage } from '../storage/photoImage';
import { TraceInputError, type RgbRaster } from './raster';

/** The photo as decoded for tracing: a downscaled upright copy and how it relates to the full-size photo. */
export interface WorkingPhoto {
  raster: RgbRaster;
  /** Working pixels per pixel of the upright original. */
  scale: number;
  originalWidth: number;
  originalHeight: number;
}

const tooLarge = () =>
  new TraceInputError('too_large', `The photo has more than ${TRACE_MAX_PIXELS / 1e6} megapixels. Save a smaller copy (4000 px on the long side is plenty) and try again.`);

async function heicToRaw(bytes: Buffer): Promise<{ data: Buffer; width: number; height: number }> {
  const { default: decode } = await import('heic-decode');
  try {
    const image = await decode({ buffer: bytes });
    if (image.width * image.height > TRACE_MAX_PIXELS) throw tooLarge();
    return { data: Buffer.from(image.data.buffer, image.data.byteOffset, image.data.byteLength), width: image.width, height: image.height };
  } catch (err) {
    if (err instanceof TraceInputError) throw err;
    throw new TraceInputError('unsupported_type', 'This HEIC photo could not be read. On the phone, share or export it as JPEG ("Most Compatible" in the camera settings) and upload that.');
  }
}

/** A HEIC photo as a JPEG of the same pixels, or a TraceInputError that says how to send a JPEG instead. */
export async function heicToJpeg(bytes: Buffer): Promise<Buffer> {
  const raw = await heicToRaw(bytes);
  return sharp(raw.data, { raw: { width: raw.width, height: raw.height, channels: 4 } }).removeAlpha().jpeg({ quality: 92 }).toBuffer();
}

/**
 * Decodes a photo upright and shrunk so its long side is at most `longSide`
 * pixels, with a light blur against sensor noise. sharp shrinks JPEGs while
 * decoding, so a 12 MP photo never exists at full size in memory. HEIC
 * photos, which sharp's build cannot decode, go through heic-decode first.
 */
export async function decodeForTrace(bytes: Buffer, longSide: number): Promise<WorkingPhoto> {
  const kind = sniffImage(bytes);
  if (!kind) throw new TraceInputError('unsupported_type', 'This file is not a photo Matwright can read. Upload a JPEG, PNG, WebP or AVIF image.');
  let input: Sharp;
  let width: number;
  let height: number;
  try {
    const meta = await sharp(bytes, { limitInputPixels: TRACE_MAX_PIXELS }).metadata();
    if (meta.format === 'heif' && meta.compression !== 'av1') throw new Error('HEVC');
    width = meta.autoOrient.width;
    height = meta.autoOrient.height;
    input = sharp(bytes, { limitInputPixels: TRACE_MAX_PIXELS }).autoOrient();
  } catch (err) {
    if (kind !== 'heif') throw /pixel limit/i.test(String(err)) ? tooLarge() : new TraceInputError('unreadable_image', 'The photo could not be read; the file may be damaged or cut short.');
    const raw = await heicToRaw(bytes);
    width = raw.width;
    height = raw.height;
    input = sharp(raw.data, { raw: { width, height, channels: 4 } });
  }
  if (width * height > TRACE_MAX_PIXELS) throw tooLarge();
  const scale = Math.min(1, longSide / Math.max(width, height));
  const { data, info } = await input
    .resize({ width: Math.round(width * scale), height: Math.round(height * scale), fit: 'fill' })
    .removeAlpha()
    .toColourspace('srgb')
    .blur(0.8)
    .raw()
    .toBuffer({ resolveWithObject: true })
    .catch(() => {
      throw new TraceInputError('unreadable_image', 'The photo could not be read; the file may be damaged or cut short.');
    });
  return {
    raster: { width: info.width, height: info.height, data: new Uint8Array(data.buffer, data.byteOffset, data.byteLength) },
    scale: info.width / width,
    originalWidth: width,
    originalHeight: height,
  };
}
