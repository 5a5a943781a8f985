// Photo checks and processing without storage: type sniffing, size and pixel limits, decoding,
// orientation, capture time, and location removal read back with an EXIF library.
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { AppError } from '@/lib/errors';
import { readExifFacts } from '@/lib/photos/exif';
import { removeLocation } from '@/lib/photos/location';
import { parseExifTime, processPhoto, sniffPhotoType } from '@/lib/photos/process';
import { DISPLAY_MAX_SIDE, MAX_PHOTO_BYTES, THUMB_SIDE } from '@/lib/photos/schemas';
import { cameraImage, gifImage, hasLocation, heicHeader, isRed, pixelAt, pngBomb, readBack } from '@/tests/helpers/photo-images';

const opts = { keepLocation: false, timeZone: 'America/Chicago' };

async function refusal(promise: Promise<unknown>): Promise<{ code: string; status: number; message: string }> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof AppError) return { code: error.code, status: error.status, message: error.message };
    throw error;
  }
  throw new Error('expected a refusal');
}

describe('type sniffing', () => {
  it('goes by the bytes: a PNG is a PNG whatever it is called', async () => {
    expect(await sniffPhotoType(await cameraImage({ format: 'png' }))).toBe('image/png');
    expect(await sniffPhotoType(await cameraImage({ format: 'webp' }))).toBe('image/webp');
    expect(await sniffPhotoType(await cameraImage())).toBe('image/jpeg');
  });

  it('refuses HEIC with advice, and other files with a plain reason (415)', async () => {
    const heic = await refusal(sniffPhotoType(heicHeader()));
    expect(heic).toMatchObject({ status: 415 });
    expect(heic.message).toMatch(/HEIC.*JPEG/);
    expect(await refusal(sniffPhotoType(await gifImage()))).toMatchObject({ status: 415, message: expect.stringMatching(/GIF/) });
    expect(await refusal(sniffPhotoType(Buffer.from('just some text, not an image at all')))).toMatchObject({ status: 415 });
    const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><script>alert(1)</script></svg>');
    expect(await refusal(sniffPhotoType(svg))).toMatchObject({ status: 415 });
  });
});

describe('processing', () => {
  it('refuses an empty file (422) and one over the size limit (413) before decoding', async () => {
    expect(await refusal(processPhoto(Buffer.alloc(0), opts))).toMatchObject({ status: 422 });
    const big = Buffer.alloc(MAX_PHOTO_BYTES + 1);
    expect(await refusal(processPhoto(big, opts))).toMatchObject({ status: 413, message: expect.stringMatching(/limit is 25 MB/) });
  });

  it('refuses a decompression bomb by its pixel count (422)', async () => {
    const bomb = await pngBomb();
    expect(bomb.length).toBeLessThan(2_000_000);
    const r = await refusal(processPhoto(bomb, opts));
    expect(r).toMatchObject({ status: 422 });
    expect(r.message).toMatch(/megapixels/);
  });

  it('refuses a JPEG cut off part-way (422) and bytes that only start like a JPEG', async () => {
    const whole = await cameraImage({ width: 800, height: 600, grain: 20 });
    expect(await refusal(processPhoto(whole.subarray(0, Math.floor(whole.length * 0.6)), opts))).toMatchObject({ status: 422 });
    const fake = Buffer.concat([whole.subarray(0, 400), Buffer.alloc(4000, 7)]);
    expect(await refusal(processPhoto(fake, opts))).toMatchObject({ status: 422 });
  });

  it('applies the orientation flag to the display copy and thumbnail, and reports the upright size', async () => {
    // Stored sideways (640 × 480) with "turn 90° clockwise": upright it is 480 wide, 640 tall, and
    // the red top-left quarter moves to the top right.
    const photo = await processPhoto(await cameraImage({ orientation: 6 }), opts);
    expect([photo.width, photo.height]).toEqual([480, 640]);
    const display = await sharp(photo.display).metadata();
    expect([display.format, display.width, display.height, display.orientation ?? 1]).toEqual(['webp', 480, 640, 1]);
    expect(isRed(await pixelAt(photo.display, 470, 10))).toBe(true);
    expect(isRed(await pixelAt(photo.display, 10, 10))).toBe(false);
    const thumb = await sharp(photo.thumb).metadata();
    expect([thumb.format, thumb.width, thumb.height]).toEqual(['webp', THUMB_SIDE, THUMB_SIDE]);
    // The original keeps its flag (and its pixels): viewers turn it the same way.
    expect((await sharp(photo.original).metadata()).orientation).toBe(6);
    expect(isRed(await pixelAt(photo.original, 470, 10))).toBe(true);
  });

  it('keeps a small image at its size and shrinks a large one to the display limit', async () => {
    const small = await processPhoto(await cameraImage({ width: 300, height: 200 }), opts);
    expect((await sharp(small.display).metadata()).width).toBe(300);
    const large = await processPhoto(await cameraImage({ width: 3000, height: 2000 }), opts);
    const meta = await sharp(large.display).metadata();
    expect([meta.width, meta.height]).toEqual([DISPLAY_MAX_SIDE, Math.round((2000 * DISPLAY_MAX_SIDE) / 3000)]);
  });

  it('reads the capture time, with its offset or in the site time zone', async () => {
    const withOffset = await processPhoto(await cameraImage({ takenAt: '2024:06:14 09:31:07', offset: '+02:00' }), opts);
    expect(withOffset.takenAt?.toISOString()).toBe('2024-06-14T07:31:07.000Z');
    const local = await processPhoto(await cameraImage({ takenAt: '2024:01:10 08:00:00' }), opts);
    expect(local.takenAt?.toISOString()).toBe('2024-01-10T14:00:00.000Z'); // Chicago is UTC−6 in January
    const none = await processPhoto(await cameraImage(), opts);
    expect(none.takenAt).toBeNull();
  });

  it('reads the same capture time and GPS presence as exifr does', async () => {
    const { default: exifr } = await import('exifr');
    for (const input of [await cameraImage({ gps: true, takenAt: '2025:02:03 04:05:06', offset: '+01:00' }), await cameraImage({ format: 'png', takenAt: '2021:12:31 23:59:58' }), await cameraImage()]) {
      const exif = (await sharp(input).metadata()).exif!;
      const ours = readExifFacts(exif);
      const theirs = ((await exifr.parse(input, { gps: true, reviveValues: false, translateValues: false })) ?? {}) as Record<string, unknown>;
      expect(ours.dateTimeOriginal).toBe(theirs.DateTimeOriginal);
      expect(ours.offsetTimeOriginal).toBe(theirs.OffsetTimeOriginal);
      expect(ours.hasGps).toBe(theirs.GPSLatitude !== undefined);
    }
    expect(readExifFacts(Buffer.from('Exif\0\0garbage that is not TIFF'))).toEqual({ hasGps: false });
  });

  it('ignores unset or impossible camera clocks', () => {
    const now = new Date('2026-12-01T12:00:00Z');
    expect(parseExifTime('0000:00:00 00:00:00', undefined, 'UTC', now)).toBeNull();
    expect(parseExifTime('1980:01:01 00:00:00', undefined, 'UTC', now)).toBeNull();
    expect(parseExifTime('2031:01:01 00:00:00', undefined, 'UTC', now)).toBeNull();
    expect(parseExifTime('2024:13:01 00:00:00', undefined, 'UTC', now)).toBeNull();
    expect(parseExifTime('2026:11:30 23:59:59', '-05:00', 'UTC', now)?.toISOString()).toBe('2026-12-01T04:59:59.000Z');
  });
});

describe('location metadata', () => {
  for (const format of ['jpeg', 'png', 'webp'] as const) {
    it(`is removed from every stored copy of a ${format.toUpperCase()} (read back with exifr)`, async () => {
      const input = await cameraImage({ format, gps: true, takenAt: '2024:06:14 09:31:07', xmpPlace: format !== 'png' });
      expect(hasLocation(await readBack(input))).toBe(true);
      const photo = await processPhoto(input, opts);
      expect(photo.hadLocation).toBe(true);
      expect(photo.locationKept).toBe(false);
      for (const copy of [photo.original, photo.display, photo.thumb]) {
        expect(hasLocation(await readBack(copy))).toBe(false);
      }
      // Only location went: the original still says which camera took it, and when.
      const tags = (await readBack(photo.original)).tags;
      expect(tags.Make).toBe('Kelvrin Optics');
      expect(photo.takenAt).not.toBeNull();
      // And its pixels are untouched: same length, and it decodes to the same image.
      expect(photo.original.length).toBe(input.length);
      const [a, b] = await Promise.all([sharp(input).raw().toBuffer(), sharp(photo.original).raw().toBuffer()]);
      expect(a.equals(b)).toBe(true);
    });
  }

  it('is kept in the original when the company keeps it (the smaller copies never carry it)', async () => {
    const input = await cameraImage({ gps: true });
    const photo = await processPhoto(input, { ...opts, keepLocation: true });
    expect(photo.locationKept).toBe(true);
    expect(photo.original.equals(input)).toBe(true);
    expect((await readBack(photo.original)).tags.latitude).toBeCloseTo(41.875, 3);
    expect(hasLocation(await readBack(photo.display))).toBe(false);
    expect(hasLocation(await readBack(photo.thumb))).toBe(false);
  });

  it('is removed from the upload\'s own bytes when they are handed over, and from a copy otherwise', async () => {
    const input = await cameraImage({ gps: true, orientation: 6, takenAt: '2024:06:14 09:31:07' });
    const before = Buffer.from(input);
    const copied = await processPhoto(input, opts);
    // Not handed over: the caller's bytes are left as they were.
    expect(input.equals(before)).toBe(true);
    expect(copied.original.buffer).not.toBe(input.buffer);
    const handed = await processPhoto(input, { ...opts, handedOver: true });
    // Handed over: the same memory, edited, with the same result as the copy (so the smaller
    // copies were made from the stored bytes: same size, turn and time).
    expect(handed.original.buffer).toBe(input.buffer);
    expect(hasLocation(await readBack(input))).toBe(false);
    expect(handed.original.equals(copied.original)).toBe(true);
    expect(handed).toMatchObject({ width: copied.width, height: copied.height, takenAt: copied.takenAt, hadLocation: true, locationKept: false });
    expect(handed.display.equals(copied.display)).toBe(true);
    expect(handed.thumb.equals(copied.thumb)).toBe(true);
  });

  it('leaves a file without location byte for byte as it was', async () => {
    const input = await cameraImage({ takenAt: '2024:06:14 09:31:07' });
    const out = removeLocation(input, 'image/jpeg');
    expect(out.removed).toBe(false);
    expect(out.bytes.equals(input)).toBe(true);
  });

  it('also clears GPS in a second image appended after the first (multi-picture JPEG)', async () => {
    const first = await cameraImage({ width: 64, height: 48 });
    const second = await cameraImage({ width: 32, height: 24, gps: true });
    const out = removeLocation(Buffer.concat([first, second]), 'image/jpeg');
    expect(out.removed).toBe(true);
    const tail = out.bytes.subarray(first.length);
    expect(hasLocation(await readBack(tail))).toBe(false);
    expect((await sharp(tail).metadata()).width).toBe(32);
  });

  it('blanks an EXIF block it cannot parse rather than trusting it', () => {
    // A JPEG whose EXIF segment has a GPS pointer to nowhere.
    const exif = Buffer.alloc(6 + 8 + 2 + 12 + 4);
    exif.write('Exif\0\0', 0, 'latin1');
    exif.write('II', 6, 'latin1');
    exif.writeUInt16LE(42, 8);
    exif.writeUInt32LE(8, 10);
    exif.writeUInt16LE(1, 14);
    exif.writeUInt16LE(0x8825, 16);
    exif.writeUInt16LE(4, 18);
    exif.writeUInt32LE(1, 20);
    exif.writeUInt32LE(0xfff0, 24);
    const segment = Buffer.concat([Buffer.from([0xff, 0xe1, 0, 0]), exif]);
    segment.writeUInt16BE(exif.length + 2, 2);
    const jpeg = Buffer.concat([Buffer.from([0xff, 0xd8]), segment, Buffer.from([0xff, 0xd9])]);
    const out = removeLocation(jpeg, 'image/jpeg');
    expect(out.removed).toBe(true);
    expect(out.bytes.length).toBe(jpeg.length);
    expect(out.bytes.subarray(6, 6 + exif.length).every((b) => b === 0)).toBe(true);
  });
});
