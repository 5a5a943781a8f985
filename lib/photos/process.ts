import { TZDate } from '@date-fns/tz';
import { fileTypeFromBuffer } from 'file-type';
import sharp, { type Metadata, type Sharp } from 'sharp';
import { AppError } from '@/lib/errors';
import { readExifFacts } from '@/lib/photos/exif';
import { removeLocation } from '@/lib/photos/location';
import {
  acceptedPhotoTypes,
  DISPLAY_MAX_SIDE,
  formatBytes,
  MAX_PHOTO_BYTES,
  MAX_PHOTO_PIXELS,
  THUMB_SIDE,
  type PhotoContentType,
} from '@/lib/photos/schemas';

// The checks and the image work of an upload, with no storage or database: every refusal here
// happens before anything is written. No I/O beyond the CPU work, so the benchmark can time
// exactly this against sharp alone.

// Every upload is a new image; libvips' operation cache would only hold memory.
sharp.cache(false);

export interface ProcessedPhoto {
  contentType: PhotoContentType;
  /** The original bytes, with location metadata blanked unless the company keeps it. */
  original: Buffer;
  display: Buffer;
  thumb: Buffer;
  /** Upright size of the original. */
  width: number;
  height: number;
  takenAt: Date | null;
  /** The file carried GPS or place metadata. */
  hadLocation: boolean;
  /** That metadata is still in the stored original. */
  locationKept: boolean;
}

export interface ProcessOptions {
  keepLocation: boolean;
  /** Where the equipment is: an EXIF time without an offset is read as local time there. */
  timeZone: string;
  /**
   * The caller hands the bytes over (an upload's own buffer): location is removed from them in
   * place instead of from a copy. Otherwise the input is left as it was.
   */
  handedOver?: boolean;
}

/** The settings shared with the benchmark's sharp-alone baseline, so both do the same work. */
export const sharpInputOptions = { limitInputPixels: MAX_PHOTO_PIXELS, failOn: 'truncated' } as const;

/**
 * A new upright image over `bytes`, one per copy made. Not sharp's clone(): for a Buffer input it
 * structured-clones the whole input (a fresh copy of a multi-megabyte photo per copy made, and
 * the collection work after it), where each pipeline decodes the bytes on its own either way.
 */
export function uprightImage(bytes: Buffer): Sharp {
  return sharp(bytes, sharpInputOptions).rotate();
}

/** Turns `image` (not shared with another pipeline) into the display copy. */
export function displayPipeline(image: Sharp): Sharp {
  return image.resize({ width: DISPLAY_MAX_SIDE, height: DISPLAY_MAX_SIDE, fit: 'inside', withoutEnlargement: true }).webp({ quality: 80 });
}

/** Turns `image` (not shared with another pipeline) into the thumbnail. */
export function thumbPipeline(image: Sharp): Sharp {
  return image.resize({ width: THUMB_SIDE, height: THUMB_SIDE, fit: 'cover' }).webp({ quality: 70 });
}

const typeNames: Record<string, string> = {
  'image/heic': 'HEIC',
  'image/heif': 'HEIF',
  'image/heic-sequence': 'HEIC',
  'image/heif-sequence': 'HEIF',
  'image/avif': 'AVIF',
  'image/gif': 'GIF',
  'image/tiff': 'TIFF',
  'image/bmp': 'BMP',
  'image/svg+xml': 'SVG',
  'application/pdf': 'PDF',
};

/** The type the bytes say they are; anything but JPEG, PNG or WebP is a 415 with a reason. */
export async function sniffPhotoType(bytes: Uint8Array): Promise<PhotoContentType> {
  const found = await fileTypeFromBuffer(bytes);
  if (found && (acceptedPhotoTypes as readonly string[]).includes(found.mime)) return found.mime as PhotoContentType;
  const name = found ? (typeNames[found.mime] ?? found.ext.toUpperCase()) : null;
  if (name === 'HEIC' || name === 'HEIF' || name === 'AVIF') {
    // The prebuilt image library here has no HEVC decoder, so HEIC cannot be read; AVIF could be,
    // but stripping location from its container is not supported, so the HEIF family is refused.
    throw new AppError(
      'unsupported_media_type',
      `This photo is a ${name} file, which cannot be stored here. Set the camera to save JPEG ("most compatible"), or share the photo as JPEG, and upload it again.`,
    );
  }
  throw new AppError(
    'unsupported_media_type',
    name ? `This is a ${name} file, not a photo we can store. Upload a JPEG, PNG or WebP image.` : 'This file is not an image we can read. Upload a JPEG, PNG or WebP photo.',
  );
}

export function assertPhotoSize(byteLength: number): void {
  if (byteLength === 0) throw new AppError('validation_failed', 'The file is empty.', [{ path: 'file', message: 'The file is empty.' }]);
  if (byteLength > MAX_PHOTO_BYTES) {
    throw new AppError('payload_too_large', `The photo is ${formatBytes(byteLength)}; the limit is ${formatBytes(MAX_PHOTO_BYTES)}.`);
  }
}

function unreadable(error: unknown): AppError {
  const text = error instanceof Error ? error.message : String(error);
  if (/pixel limit/i.test(text)) return tooManyPixels();
  return new AppError('validation_failed', 'The image could not be read: the file is damaged or was cut off during the upload.', [
    { path: 'file', message: 'The image could not be decoded.' },
  ]);
}

function tooManyPixels(width?: number, height?: number): AppError {
  const size = width && height ? ` (${width} × ${height} pixels)` : '';
  return new AppError('validation_failed', `The image is too large to process${size}; the limit is ${MAX_PHOTO_PIXELS / 1_000_000} megapixels.`, [
    { path: 'file', message: 'Too many pixels.' },
  ]);
}

/** EXIF "YYYY:MM:DD HH:MM:SS" (+ optional offset) → instant; nonsense or unset camera clocks → null. */
export function parseExifTime(value: unknown, offset: unknown, timeZone: string, now = new Date()): Date | null {
  if (typeof value !== 'string') return null;
  const m = /^(\d{4}):(\d{2}):(\d{2})[ T](\d{2}):(\d{2}):(\d{2})/.exec(value.trim());
  if (!m) return null;
  const [y, mo, d, h, mi, s] = m.slice(1).map(Number) as [number, number, number, number, number, number];
  if (y < 1990 || mo < 1 || mo > 12 || d < 1 || d > 31 || h > 23 || mi > 59 || s > 59) return null;
  const zone = typeof offset === 'string' && /^[+-]\d{2}:\d{2}$/.test(offset.trim()) ? offset.trim() : timeZone;
  const date = new Date(new TZDate(y, mo - 1, d, h, mi, s, zone).getTime());
  if (Number.isNaN(date.getTime()) || date.getTime() > now.getTime() + 2 * 86_400_000) return null;
  return date;
}

function readExif(exif: Buffer | undefined, timeZone: string): { takenAt: Date | null; hasGps: boolean } {
  if (!exif || exif.length < 8) return { takenAt: null, hasGps: false };
  const facts = readExifFacts(exif);
  return { takenAt: parseExifTime(facts.dateTimeOriginal ?? facts.createDate, facts.offsetTimeOriginal, timeZone), hasGps: facts.hasGps };
}

export interface CheckedPhoto extends Omit<ProcessedPhoto, 'display'> {
  /** Still being made when the checks are done; rejects (as a 422) if the image fails late. */
  display: Promise<Buffer>;
}

/**
 * Checks one upload: type from the bytes (415), size (413), pixel limit and decoding (422). The
 * thumbnail is made first: making it decodes the whole file, so once it exists every check has
 * passed, and the caller may start storing while the larger display copy is still being made.
 * Throws AppError before anything could be stored.
 */
export async function checkPhoto(input: Uint8Array, options: ProcessOptions): Promise<CheckedPhoto> {
  assertPhotoSize(input.byteLength);
  const bytes = Buffer.isBuffer(input) ? input : Buffer.from(input.buffer, input.byteOffset, input.byteLength);
  const contentType = await sniffPhotoType(bytes);

  // Location goes first, so the image work reads the very bytes that are stored (their pixels and
  // orientation are untouched) and nothing reads them while they change.
  let original = bytes;
  let locationRemoved = false;
  if (!options.keepLocation) {
    const stripped = removeLocation(bytes, contentType, { inPlace: options.handedOver === true });
    original = stripped.bytes;
    locationRemoved = stripped.removed;
  }

  let meta: Metadata;
  try {
    meta = await sharp(original, sharpInputOptions).metadata();
  } catch (error) {
    throw unreadable(error);
  }
  const { width = 0, height = 0 } = meta;
  if (width * height > MAX_PHOTO_PIXELS) throw tooManyPixels(width, height);
  if (!width || !height) throw unreadable(new Error('no size'));
  if ((meta.pages ?? 1) > 1) {
    throw new AppError('unsupported_media_type', 'Animated images are not photos we can store. Upload a still JPEG, PNG or WebP image.');
  }

  // Both start at once; the display copy's failure is reported when it is awaited.
  const display = displayPipeline(uprightImage(original))
    .toBuffer()
    .catch((error: unknown) => {
      throw unreadable(error);
    });
  display.catch(() => undefined);
  let thumb: Buffer;
  try {
    thumb = await thumbPipeline(uprightImage(original)).toBuffer();
  } catch (error) {
    throw unreadable(error);
  }

  const facts = readExif(meta.exif, options.timeZone);
  const turned = (meta.orientation ?? 1) >= 5;
  return {
    contentType,
    original,
    display,
    thumb,
    width: turned ? height : width,
    height: turned ? width : height,
    takenAt: facts.takenAt,
    hadLocation: facts.hasGps || locationRemoved,
    locationKept: options.keepLocation && facts.hasGps,
  };
}

/** checkPhoto, waiting for the display copy too: every output in hand. */
export async function processPhoto(input: Uint8Array, options: ProcessOptions): Promise<ProcessedPhoto> {
  const checked = await checkPhoto(input, options);
  return { ...checked, display: await checked.display };
}
