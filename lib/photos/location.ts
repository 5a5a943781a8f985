// Removes location metadata from a stored original without re-encoding it: the pixels stay
// exactly as the camera wrote them, and re-encoding a 12-megapixel JPEG would cost more than
// making both smaller copies. Pure byte work, no I/O.
//
// What counts as location: the EXIF GPS directory, XMP packets that mention a place or GPS
// property, and IPTC blocks (they carry city, region and country fields). Everything is edited in
// place so the file keeps its length: offsets that point past an edited block (a phone JPEG's
// multi-picture index, a WebP's chunk sizes) stay valid. A block that cannot be parsed is blanked
// whole rather than trusted.

export interface LocationResult {
  bytes: Buffer;
  /** True when something was blanked. */
  removed: boolean;
}

type Mime = 'image/jpeg' | 'image/png' | 'image/webp';

/**
 * Removes location from a copy of `input`, or from `input` itself with `inPlace` (for bytes the
 * caller owns and nothing else reads meanwhile: a copy of a 12 MP original is a fresh 4 MB).
 */
export function removeLocation(input: Uint8Array, mime: Mime, { inPlace = false } = {}): LocationResult {
  const bytes = inPlace ? Buffer.from(input.buffer, input.byteOffset, input.byteLength) : Buffer.from(input);
  const removed = mime === 'image/jpeg' ? stripJpeg(bytes) : mime === 'image/png' ? stripPng(bytes) : stripWebp(bytes);
  return { bytes, removed };
}

// ---------------------------------------------------------------------------------- TIFF / EXIF

const GPS_POINTER_TAG = 0x8825;
const TYPE_SIZES: Record<number, number> = { 1: 1, 2: 1, 3: 2, 4: 4, 5: 8, 6: 1, 7: 1, 8: 2, 9: 4, 10: 8, 11: 4, 12: 8, 13: 4 };

/**
 * Blanks the GPS directory of a TIFF structure (an EXIF payload) and removes its pointer from the
 * first directory by shifting the later entries down. Returns true when anything changed.
 * Throws on a structure it cannot follow; callers then blank the whole payload.
 */
export function clearTiffGps(tiff: Buffer): boolean {
  if (tiff.length < 8) throw new Error('EXIF payload too short');
  const order = tiff.toString('latin1', 0, 2);
  if (order !== 'II' && order !== 'MM') throw new Error('EXIF byte order unknown');
  const le = order === 'II';
  const u16 = (o: number) => {
    if (o + 2 > tiff.length) throw new Error('EXIF offset out of range');
    return le ? tiff.readUInt16LE(o) : tiff.readUInt16BE(o);
  };
  const u32 = (o: number) => {
    if (o + 4 > tiff.length) throw new Error('EXIF offset out of range');
    return le ? tiff.readUInt32LE(o) : tiff.readUInt32BE(o);
  };
  const w16 = (o: number, v: number) => (le ? tiff.writeUInt16LE(v, o) : tiff.writeUInt16BE(v, o));
  if (u16(2) !== 42) throw new Error('not a TIFF structure');

  const ifd0 = u32(4);
  const count = u16(ifd0);
  const entriesEnd = ifd0 + 2 + count * 12;
  if (entriesEnd + 4 > tiff.length) throw new Error('EXIF directory out of range');
  let pointerIndex = -1;
  for (let i = 0; i < count; i++) {
    if (u16(ifd0 + 2 + i * 12) === GPS_POINTER_TAG) pointerIndex = i;
  }
  if (pointerIndex < 0) return false;

  const gps = u32(ifd0 + 2 + pointerIndex * 12 + 8);
  const gpsCount = u16(gps);
  const gpsEnd = gps + 2 + gpsCount * 12 + 4;
  if (gpsEnd > tiff.length) throw new Error('GPS directory out of range');
  for (let i = 0; i < gpsCount; i++) {
    const entry = gps + 2 + i * 12;
    const size = (TYPE_SIZES[u16(entry + 2)] ?? 1) * u32(entry + 4);
    if (size > 4) {
      const at = u32(entry + 8);
      if (at + size > tiff.length) throw new Error('GPS value out of range');
      tiff.fill(0, at, at + size);
    }
  }
  tiff.fill(0, gps, gpsEnd);

  // Drop the pointer entry: later entries and the next-directory offset move down 12 bytes.
  const entry = ifd0 + 2 + pointerIndex * 12;
  tiff.copy(tiff, entry, entry + 12, entriesEnd + 4);
  tiff.fill(0, entriesEnd - 8, entriesEnd + 4);
  w16(ifd0, count - 1);
  return true;
}

/** Clears GPS in an EXIF payload in place; a payload that cannot be parsed is blanked whole. */
function clearExifPayload(buf: Buffer, start: number, end: number): boolean {
  let tiffStart = start;
  if (buf.toString('latin1', start, start + 6) === 'Exif\0\0') tiffStart += 6;
  const tiff = buf.subarray(tiffStart, end);
  try {
    return clearTiffGps(tiff);
  } catch {
    buf.fill(0, start, end);
    return true;
  }
}

// ------------------------------------------------------------------------------------------ XMP

const XMP_LOCATION = /GPS|Latitude|Longitude|Location|photoshop:City|photoshop:State|photoshop:Country|Iptc4xmpCore:CountryCode|Sublocation/i;

/** Blanks an XMP packet that mentions a place (spaces keep the length; readers then find no properties). */
function blankXmpIfLocation(buf: Buffer, start: number, end: number): boolean {
  if (!XMP_LOCATION.test(buf.toString('latin1', start, end))) return false;
  buf.fill(0x20, start, end);
  return true;
}

// ----------------------------------------------------------------------------------------- JPEG

const XMP_MAIN = 'http://ns.adobe.com/xap/1.0/\0';
const XMP_EXTENSION = 'http://ns.adobe.com/xmp/extension/\0';

function stripJpeg(buf: Buffer): boolean {
  let removed = false;
  let pos = 0;
  // A phone JPEG may carry more images after the first one's end (previews, gain maps): walk them all.
  while (pos + 4 <= buf.length && buf[pos] === 0xff && buf[pos + 1] === 0xd8) {
    const result = walkJpegImage(buf, pos + 2);
    removed = result.removed || removed;
    pos = result.end;
    pos = buf.indexOf(0xff, pos);
    if (pos < 0) break;
  }
  return removed;
}

function walkJpegImage(buf: Buffer, from: number): { removed: boolean; end: number } {
  let removed = false;
  let pos = from;
  while (pos + 1 < buf.length) {
    if (buf[pos] !== 0xff) return { removed, end: buf.length };
    const marker = buf[pos + 1]!;
    if (marker === 0xff) {
      pos++;
      continue;
    }
    if (marker === 0xd9) return { removed, end: pos + 2 };
    if (marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) {
      pos += 2;
      continue;
    }
    if (pos + 4 > buf.length) return { removed, end: buf.length };
    const length = buf.readUInt16BE(pos + 2);
    const start = pos + 4;
    const end = pos + 2 + length;
    if (length < 2 || end > buf.length) return { removed, end: buf.length };
    if (marker === 0xe1) {
      if (buf.toString('latin1', start, start + 6) === 'Exif\0\0') removed = clearExifPayload(buf, start, end) || removed;
      else if (buf.toString('latin1', start, start + XMP_MAIN.length) === XMP_MAIN) removed = blankXmpIfLocation(buf, start + XMP_MAIN.length, end) || removed;
      else if (buf.toString('latin1', start, start + XMP_EXTENSION.length) === XMP_EXTENSION) removed = blankXmpIfLocation(buf, start + XMP_EXTENSION.length, end) || removed;
    } else if (marker === 0xed && buf.toString('latin1', start, start + 13) === 'Photoshop 3.0') {
      // IPTC: city, region and country fields; nothing in it is needed to show the photo.
      buf.fill(0, start + 14, end);
      removed = true;
    }
    pos = end;
    if (marker === 0xda) pos = skipEntropyData(buf, pos);
  }
  return { removed, end: buf.length };
}

/** Skips compressed scan data up to the next real marker (0xFF followed by neither 0x00 nor a restart). */
function skipEntropyData(buf: Buffer, from: number): number {
  // From one 0xFF to the next (a native search): the scan is most of a photo's bytes, and a byte
  // at a time in JavaScript made this the slowest step of the location removal.
  let pos = buf.indexOf(0xff, from);
  while (pos >= 0 && pos + 1 < buf.length) {
    const next = buf[pos + 1]!;
    if (next !== 0x00 && next !== 0xff && !(next >= 0xd0 && next <= 0xd7)) return pos;
    pos = buf.indexOf(0xff, pos + 1);
  }
  return buf.length;
}

// ------------------------------------------------------------------------------------------ PNG

const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

function stripPng(buf: Buffer): boolean {
  if (!buf.subarray(0, 8).equals(PNG_SIGNATURE)) return false;
  let removed = false;
  let pos = 8;
  while (pos + 12 <= buf.length) {
    const length = buf.readUInt32BE(pos);
    const type = buf.toString('latin1', pos + 4, pos + 8);
    const start = pos + 8;
    const end = start + length;
    if (end + 4 > buf.length) break;
    let changed = false;
    if (type === 'eXIf') {
      changed = clearExifPayload(buf, start, end);
    } else if (type === 'iTXt' || type === 'tEXt' || type === 'zTXt') {
      const keyword = buf.toString('latin1', start, Math.min(end, start + 80)).split('\0')[0] ?? '';
      // XMP and the "raw profile" text chunks hold EXIF, IPTC or XMP as text, possibly compressed:
      // blank the value after the keyword rather than trying to read it.
      if (keyword === 'XML:com.adobe.xmp' || keyword.startsWith('Raw profile type')) {
        buf.fill(0x20, start + keyword.length + 1, end);
        if (type !== 'tEXt') buf[start + keyword.length + 1] = 0; // iTXt/zTXt: mark the value uncompressed
        changed = true;
      }
    }
    if (changed) {
      buf.writeUInt32BE(crc32(buf.subarray(pos + 4, end)), end);
      removed = true;
    }
    if (type === 'IEND') break;
    pos = end + 4;
  }
  return removed;
}

let crcTable: Uint32Array | null = null;

export function crc32(data: Uint8Array): number {
  if (!crcTable) {
    crcTable = new Uint32Array(256);
    for (let n = 0; n < 256; n++) {
      let c = n;
      for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
      crcTable[n] = c >>> 0;
    }
  }
  let crc = 0xffffffff;
  for (const byte of data) crc = crcTable[(crc ^ byte) & 0xff]! ^ (crc >>> 8);
  return (crc ^ 0xffffffff) >>> 0;
}

// ----------------------------------------------------------------------------------------- WebP

function stripWebp(buf: Buffer): boolean {
  if (buf.toString('latin1', 0, 4) !== 'RIFF' || buf.toString('latin1', 8, 12) !== 'WEBP') return false;
  let removed = false;
  let pos = 12;
  while (pos + 8 <= buf.length) {
    const type = buf.toString('latin1', pos, pos + 4);
    const size = buf.readUInt32LE(pos + 4);
    const start = pos + 8;
    const end = start + size;
    if (end > buf.length) break;
    if (type === 'EXIF') removed = clearExifPayload(buf, start, end) || removed;
    else if (type === 'XMP ') removed = blankXmpIfLocation(buf, start, end) || removed;
    pos = end + (size % 2);
  }
  return removed;
}
