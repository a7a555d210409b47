import sharp, { type Metadata } from 'sharp';
import { PHOTO_MAX_PIXELS } from '../../features/pieces/schema';
import { HttpError } from '../errors';

/** What an accepted upload turned out to be, read from its bytes. */
export interface PhotoImage {
  mimeType: 'image/jpeg' | 'image/png' | 'image/webp' | 'image/avif';
  extension: 'jpg' | 'png' | 'webp' | 'avif';
  /** Size as a person sees it, after the camera's orientation tag is applied. */
  widthPx: number;
  heightPx: number;
}

export const ACCEPTED_FORMATS_TEXT = 'JPEG, PNG, WebP or AVIF';

/** Long side of the preview: sharp on a phone or a desktop screen, a fraction of a camera original. */
export const PREVIEW_LONG_SIDE_PX = 1600;

const formats = {
  jpeg: { mimeType: 'image/jpeg', extension: 'jpg' },
  png: { mimeType: 'image/png', extension: 'png' },
  webp: { mimeType: 'image/webp', extension: 'webp' },
  avif: { mimeType: 'image/avif', extension: 'avif' },
} as const;
type Sniffed = keyof typeof formats | 'heif';

const notAPhoto = () =>
  new HttpError(415, 'unsupported_type', `This file is not a photo Matwright can read. Upload a ${ACCEPTED_FORMATS_TEXT} image.`);

// HEIC photos are HEVC-coded, and the image library here has no HEVC decoder.
const heicRefused = () =>
  new HttpError(
    415,
    'unsupported_type',
    `HEIC photos cannot be read here. Save or share the photo as JPEG first; accepted formats are ${ACCEPTED_FORMATS_TEXT}.`,
  );

const damaged = () => new HttpError(415, 'unreadable_image', 'The photo could not be read; the file may be damaged or cut short. Try exporting it again.');

/** The container named by the first bytes, whatever the file name or declared type say. */
export function sniffImage(bytes: Buffer): Sniffed | null {
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return 'jpeg';
  if (bytes.length >= 8 && bytes.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))) return 'png';
  if (bytes.length >= 12 && bytes.toString('latin1', 0, 4) === 'RIFF' && bytes.toString('latin1', 8, 12) === 'WEBP') return 'webp';
  if (bytes.length >= 12 && bytes.toString('latin1', 4, 8) === 'ftyp') {
    const brand = bytes.toString('latin1', 8, 12);
    if (brand === 'avif' || brand === 'avis') return 'avif';
    if (['heic', 'heix', 'heim', 'heis', 'hevc', 'hevx', 'hevm', 'hevs', 'mif1', 'msf1'].includes(brand)) return 'heif';
  }
  return null;
}

const tooManyPixels = (width: number, height: number) =>
  new HttpError(
    413,
    'too_many_pixels',
    `The photo is ${width} x ${height} pixels (${(width * height / 1e6).toFixed(0)} megapixels); the most Matwright reads is ${PHOTO_MAX_PIXELS / 1e6} megapixels. Save a smaller copy (4000 px on the long side is plenty) and try again.`,
  );

/**
 * Checks the upload by its content and returns what it is, or throws a 413 / 415
 * in plain words. Only the header is read here (sharp's metadata does not decode
 * pixels), so a huge image is refused before it costs any memory.
 */
export async function inspectPhoto(bytes: Buffer): Promise<PhotoImage> {
  const sniffed = sniffImage(bytes);
  if (!sniffed) throw notAPhoto();
  let metadata: Metadata;
  try {
    metadata = await sharp(bytes, { limitInputPixels: false }).metadata();
  } catch {
    throw sniffed === 'heif' ? heicRefused() : damaged();
  }
  const format = metadata.format === 'heif' ? (metadata.compression === 'av1' ? 'avif' : 'heif') : metadata.format;
  if (format === 'heif') throw heicRefused();
  if (sniffed === 'heif' ? format !== 'avif' : format !== sniffed) throw notAPhoto();
  const kind = formats[format as keyof typeof formats];
  const { width, height } = metadata.autoOrient;
  if (!width || !height) throw damaged();
  if (width * height > PHOTO_MAX_PIXELS) throw tooManyPixels(width, height);
  return { ...kind, widthPx: width, heightPx: height };
}

/**
 * A JPEG no larger than PREVIEW_LONG_SIDE_PX on its long side, turned upright
 * by the EXIF orientation tag (then dropped, with the rest of the metadata, so
 * camera GPS positions never leave the shop). Transparent areas become white.
 */
export async function makePreview(bytes: Buffer): Promise<Buffer> {
  try {
    // The same limit again where pixels are decoded, in case a caller skipped inspectPhoto.
    return await sharp(bytes, { limitInputPixels: PHOTO_MAX_PIXELS })
      .autoOrient()
      .resize({ width: PREVIEW_LONG_SIDE_PX, height: PREVIEW_LONG_SIDE_PX, fit: 'inside', withoutEnlargement: true })
      .flatten({ background: '#ffffff' })
      .jpeg({ quality: 82, mozjpeg: true })
      .toBuffer();
  } catch {
    throw damaged();
  }
}
