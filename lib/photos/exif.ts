// Reads the few EXIF facts an upload needs (capture time, its offset, whether GPS is present)
// from the TIFF block sharp hands over. A small reader of our own keeps a general metadata
// library out of the server bundle; the tests read our output back with exifr independently.

export interface ExifFacts {
  dateTimeOriginal?: string;
  offsetTimeOriginal?: string;
  createDate?: string;
  hasGps: boolean;
}

const EXIF_POINTER = 0x8769;
const GPS_POINTER = 0x8825;
const DATE_TIME_ORIGINAL = 0x9003;
const CREATE_DATE = 0x9004;
const OFFSET_TIME_ORIGINAL = 0x9011;

/** Never throws: a block it cannot follow yields what was read so far. */
export function readExifFacts(block: Uint8Array): ExifFacts {
  const facts: ExifFacts = { hasGps: false };
  let buf = Buffer.from(block.buffer, block.byteOffset, block.byteLength);
  if (buf.toString('latin1', 0, 6) === 'Exif\0\0') buf = buf.subarray(6);
  try {
    const order = buf.toString('latin1', 0, 2);
    if (order !== 'II' && order !== 'MM') return facts;
    const le = order === 'II';
    const u16 = (o: number) => (le ? buf.readUInt16LE(o) : buf.readUInt16BE(o));
    const u32 = (o: number) => (le ? buf.readUInt32LE(o) : buf.readUInt32BE(o));
    const ascii = (entry: number) => {
      const count = u32(entry + 4);
      const at = count > 4 ? u32(entry + 8) : entry + 8;
      return buf.toString('latin1', at, at + count).replace(/\0+$/, '').trim();
    };
    const entries = (ifd: number) => Array.from({ length: u16(ifd) }, (_, i) => ifd + 2 + i * 12);

    let exifIfd = 0;
    let gpsIfd = 0;
    for (const entry of entries(u32(4))) {
      const tag = u16(entry);
      if (tag === GPS_POINTER) gpsIfd = u32(entry + 8);
      if (tag === EXIF_POINTER) exifIfd = u32(entry + 8);
    }
    // A GPS directory without a latitude or longitude (no fix) says nothing about the place.
    if (gpsIfd) facts.hasGps = entries(gpsIfd).some((entry) => u16(entry) === 2 || u16(entry) === 4);
    if (exifIfd) {
      for (const entry of entries(exifIfd)) {
        const tag = u16(entry);
        if (tag === DATE_TIME_ORIGINAL) facts.dateTimeOriginal = ascii(entry);
        else if (tag === CREATE_DATE) facts.createDate = ascii(entry);
        else if (tag === OFFSET_TIME_ORIGINAL) facts.offsetTimeOriginal = ascii(entry);
      }
    }
  } catch {
    // Out-of-range offsets: keep what was found.
  }
  return facts;
}
