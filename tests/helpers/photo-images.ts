// Test images made at test time with sharp, so no binaries are committed. Every name and text in
// them is invented.
import { createDeflate } from 'node:zlib';
import sharp from 'sharp';
import { crc32 } from '@/lib/photos/location';

export interface CameraOptions {
  width?: number;
  height?: number;
  /** EXIF orientation flag (1–8); 6 means "turn 90° clockwise to view". */
  orientation?: number;
  gps?: boolean;
  /** Adds an XMP packet naming a place (city and GPS), as some phone apps write. */
  xmpPlace?: boolean;
  takenAt?: string;
  offset?: string;
  format?: 'jpeg' | 'png' | 'webp';
  quality?: number;
  /** Noise strength: higher gives larger, camera-like files. */
  grain?: number;
}

export const TEST_LATITUDE = 41.875;

/**
 * A picture whose top-left quarter is red on a blue field, so orientation can be checked by
 * sampling pixels, with the requested camera metadata.
 */
export async function cameraImage(options: CameraOptions = {}): Promise<Buffer> {
  const { width = 640, height = 480, orientation = 1, gps = false, xmpPlace = false, format = 'jpeg', quality = 88, grain = 0 } = options;
  const marker = await sharp({ create: { width: Math.floor(width / 2), height: Math.floor(height / 2), channels: 3, background: '#e01010' } })
    .png()
    .toBuffer();
  let image = sharp({
    create: {
      width,
      height,
      channels: 3,
      background: '#1040c0',
      ...(grain > 0 ? { noise: { type: 'gaussian' as const, mean: 110, sigma: grain } } : {}),
    },
  }).composite([{ input: marker, left: 0, top: 0 }]);
  // Flatten first so the metadata options apply to the encoded output.
  const flat = await image.raw().toBuffer({ resolveWithObject: true });
  image = sharp(flat.data, { raw: { width: flat.info.width, height: flat.info.height, channels: flat.info.channels } });
  const exif: Record<string, Record<string, string>> = { IFD0: { Make: 'Kelvrin Optics', Model: 'Fieldcam 3' } };
  if (options.takenAt) exif.IFD2 = { DateTimeOriginal: options.takenAt, ...(options.offset ? { OffsetTimeOriginal: options.offset } : {}) };
  if (gps) exif.IFD3 = { GPSLatitudeRef: 'N', GPSLatitude: '41/1 52/1 3000/100', GPSLongitudeRef: 'W', GPSLongitude: '87/1 37/1 4200/100' };
  const encoded = format === 'jpeg' ? image.jpeg({ quality }) : format === 'png' ? image.png() : image.webp({ quality });
  let out = encoded.withExif(exif);
  if (orientation !== 1) out = out.withMetadata({ orientation });
  if (xmpPlace) out = out.withXmp(placeXmp);
  return out.toBuffer();
}

const placeXmp = `<?xpacket begin="" id="W5M0MpCehiHzreSzNTczkc9d"?>
<x:xmpmeta xmlns:x="adobe:ns:meta/"><rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#">
<rdf:Description rdf:about="" xmlns:photoshop="http://ns.adobe.com/photoshop/1.0/" xmlns:exif="http://ns.adobe.com/exif/1.0/"
 photoshop:City="Frostbury" exif:GPSLatitude="41,52.5N" exif:GPSLongitude="87,37.7W"/>
</rdf:RDF></x:xmpmeta><?xpacket end="w"?>`;

/** A nameplate-like picture with invented text, for browser tests. */
export async function nameplateImage(label: string, background = '#c9ced6'): Promise<Buffer> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="1200" height="800">
    <rect width="1200" height="800" fill="${background}"/>
    <rect x="60" y="60" width="1080" height="680" fill="#eef0f3" stroke="#333" stroke-width="6"/>
    <text x="110" y="180" font-family="DejaVu Sans, sans-serif" font-size="72" font-weight="bold">${label}</text>
    <text x="110" y="300" font-family="DejaVu Sans, sans-serif" font-size="48">MODEL KCU-300  SERIAL CU-7Q4-88213</text>
    <text x="110" y="400" font-family="DejaVu Sans, sans-serif" font-size="48">230 V  3 PH  60 HZ  RLA 14.2  LRA 88</text>
    <text x="110" y="500" font-family="DejaVu Sans, sans-serif" font-size="48">REFRIGERANT R-448A  6.8 KG</text>
  </svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 90 }).withExif({ IFD0: { Make: 'Kelvrin Optics' } }).toBuffer();
}

/**
 * A genuine decompression bomb: a valid 20000 × 20000 greyscale PNG of zeros (400 megapixels)
 * that compresses to well under a megabyte. Deflated row by row so making it stays cheap.
 */
export async function pngBomb(side = 20_000): Promise<Buffer> {
  const row = Buffer.alloc(side + 1);
  const deflate = createDeflate({ level: 9 });
  const parts: Buffer[] = [];
  deflate.on('data', (c: Buffer) => parts.push(c));
  const done = new Promise<void>((resolve, reject) => {
    deflate.on('end', resolve);
    deflate.on('error', reject);
  });
  for (let y = 0; y < side; y++) {
    if (!deflate.write(row)) await new Promise((r) => deflate.once('drain', r));
  }
  deflate.end();
  await done;
  const chunk = (type: string, data: Buffer) => {
    const head = Buffer.alloc(8);
    head.writeUInt32BE(data.length, 0);
    head.write(type, 4, 'latin1');
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(crc32(Buffer.concat([head.subarray(4), data])), 0);
    return Buffer.concat([head, data, crc]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(side, 0);
  ihdr.writeUInt32BE(side, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 0; // greyscale
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', Buffer.concat(parts)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

/** The first bytes of a HEIC file (an ISO-BMFF "ftyp" box with the heic brand) and some payload. */
export function heicHeader(): Buffer {
  const ftyp = Buffer.alloc(24);
  ftyp.writeUInt32BE(24, 0);
  ftyp.write('ftypheic', 4, 'latin1');
  ftyp.writeUInt32BE(0, 12);
  ftyp.write('mif1heic', 16, 'latin1');
  return Buffer.concat([ftyp, Buffer.alloc(2000, 1)]);
}

export async function gifImage(): Promise<Buffer> {
  return sharp({ create: { width: 32, height: 32, channels: 3, background: '#888' } }).gif().toBuffer();
}

/** Reads the pixel colour at (x, y) of any image sharp can decode, after its orientation flag. */
export async function pixelAt(image: Buffer, x: number, y: number): Promise<[number, number, number]> {
  const { data, info } = await sharp(image).rotate().removeAlpha().raw().toBuffer({ resolveWithObject: true });
  const i = (y * info.width + x) * info.channels;
  return [data[i]!, data[i + 1]!, data[i + 2]!];
}

export function isRed([r, g, b]: [number, number, number]): boolean {
  return r > 180 && g < 90 && b < 90;
}

/**
 * Everything an EXIF library can read back from a stored file, for location checks. exifr reads
 * JPEG and PNG files itself; for WebP it gets the EXIF block sharp finds. XMP text is returned raw.
 */
export async function readBack(image: Buffer): Promise<{ tags: Record<string, unknown>; xmp: string }> {
  const { default: exifr } = await import('exifr');
  const meta = await sharp(image).metadata();
  let tags: Record<string, unknown> = {};
  if (meta.format === 'jpeg' || meta.format === 'png') {
    tags = ((await exifr.parse(image, { tiff: true, exif: true, gps: true, xmp: true, iptc: true, mergeOutput: true })) as Record<string, unknown> | undefined) ?? {};
  } else if (meta.exif) {
    const tiff = meta.exif.toString('latin1', 0, 6) === 'Exif\0\0' ? meta.exif.subarray(6) : meta.exif;
    tags = ((await exifr.parse(tiff, { tiff: true, exif: true, gps: true })) as Record<string, unknown> | undefined) ?? {};
  }
  return { tags, xmp: meta.xmp ? meta.xmp.toString('utf8') : '' };
}

export function hasLocation(read: { tags: Record<string, unknown>; xmp: string }): boolean {
  const keys = Object.keys(read.tags);
  return (
    keys.some((k) => /^GPS|latitude|longitude/i.test(k)) ||
    /GPS|Latitude|City/i.test(read.xmp) ||
    keys.some((k) => k === 'City')
  );
}
