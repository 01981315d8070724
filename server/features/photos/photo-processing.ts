import sharp from 'sharp';
import crypto from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import { AppError } from '../../lib/app-error';

export const MAX_PHOTO_BYTES = 8 * 1024 * 1024;
export const MAX_EDGE_PX = 2048;
export const THUMB_EDGE_PX = 480;
/** decompression-bomb guard: refuse images above this many pixels before decoding them */
export const MAX_INPUT_PIXELS = 60_000_000;
/** a 1 × 59,000,000 px strip is under the pixel limit yet takes tens of seconds to decode row by row */
export const MAX_INPUT_EDGE_PX = 20_000;

const acceptedTypes = new Set(['image/jpeg', 'image/png', 'image/webp']);

export type ProcessedPhoto = { full: Buffer; thumb: Buffer; width: number; height: number; sha256: string };

/**
 * Decides the type from the bytes (never the name or header), then re-encodes with sharp:
 * auto-rotated, every piece of metadata (EXIF, GPS, XMP, ICC) dropped, longest side at most 2048 px.
 */
export async function processPhoto(input: Buffer, field = 'photos'): Promise<ProcessedPhoto> {
  if (input.length === 0) throw new AppError('upload_rejected', 'The file is empty.', 400, { [field]: 'The file is empty.' });
  if (input.length > MAX_PHOTO_BYTES) {
    throw new AppError('upload_rejected', 'A photo may be at most 8 MB.', 413, { [field]: 'A photo may be at most 8 MB.' });
  }
  const detected = await fileTypeFromBuffer(input);
  if (!detected || !acceptedTypes.has(detected.mime)) {
    const message = 'Only JPEG, PNG and WebP photos are accepted.';
    throw new AppError('unsupported_type', message, 415, { [field]: message });
  }
  const unreadable = 'The image could not be read; it may be damaged or not really a photo.';
  // the header alone gives the size, so an image too big to decode is refused before any pixel is read
  const { width = 0, height = 0 } = await sharp(input, { limitInputPixels: false })
    .metadata()
    .catch(() => {
      throw new AppError('upload_rejected', unreadable, 422, { [field]: unreadable });
    });
  if (width * height > MAX_INPUT_PIXELS) {
    const message = 'The image has too many pixels to process.';
    throw new AppError('upload_rejected', message, 422, { [field]: message });
  }
  if (Math.max(width, height) > MAX_INPUT_EDGE_PX) {
    const message = `The image is too large: at most ${MAX_INPUT_EDGE_PX.toLocaleString('en-GB')} px on its longest side.`;
    throw new AppError('upload_rejected', message, 422, { [field]: message });
  }
  try {
    const base = sharp(input, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error' }).rotate();
    const { data: full, info } = await base
      .clone()
      .resize({ width: MAX_EDGE_PX, height: MAX_EDGE_PX, fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 82 })
      .toBuffer({ resolveWithObject: true });
    const thumb = await base
      .clone()
      .resize({ width: THUMB_EDGE_PX, height: THUMB_EDGE_PX, fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 72 })
      .toBuffer();
    return {
      full,
      thumb,
      width: info.width,
      height: info.height,
      sha256: crypto.createHash('sha256').update(full).digest('hex'),
    };
  } catch (err) {
    const message =
      err instanceof Error && /pixel limit/i.test(err.message) ? 'The image has too many pixels to process.' : unreadable;
    throw new AppError('upload_rejected', message, 422, { [field]: message });
  }
}
