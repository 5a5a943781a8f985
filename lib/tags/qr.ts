// QR content shaping and symbols for tags: pure (the `qrcode` package's encoder, no I/O).
//
// Facts used (ISO/IEC 18004, summarised in shared TRADE-REFERENCE §9):
// - Alphanumeric mode holds 0–9, A–Z (upper case only), space and $ % * + - . / : at 11 bits per
//   two characters; one lower-case letter forces byte mode at 8 bits per character. Scheme and host
//   are case-insensitive, so the tag URL is written in upper case (HTTPS://HOST/T/K7QM3X9PA) and the
//   app answers the upper-case path /T/<code>. A smaller version means larger modules on a small label.
// - Error correction: L 7 %, M 15 %, Q 25 %, H 30 % of codewords recoverable. Labels on condensing
//   units get dirty and scratched, so the floor is Q; H is used whenever it does not need a larger
//   symbol than Q would (it costs no module size then).
// - Quiet zone: 4 modules of white on every side, always kept (drawn as part of the symbol box).
import * as QRCode from 'qrcode';
import { CODE_LENGTH, DATA_ALPHABET } from '@/lib/tags/code';

export const TAG_PATH = '/T/';
export const QUIET_ZONE_MODULES = 4;
export type ErrorCorrection = 'Q' | 'H';

const ALPHANUMERIC = /^[0-9A-Z $%*+\-./:]*$/;

/** The URL a tag's QR symbol holds: APP_URL's origin in upper case + its base path + /T/ + code. */
export function tagUrl(appUrl: string, code: string): string {
  const url = new URL(appUrl);
  const origin = `${url.protocol}//${url.host}`.toUpperCase();
  // A base path (an app served under /something) keeps its own case: paths are case-sensitive.
  const base = url.pathname.replace(/\/+$/, '');
  return `${origin}${base}${TAG_PATH}${code}`;
}

/** True when every character of the text fits the QR alphanumeric mode. */
export function isAlphanumericMode(text: string): boolean {
  return ALPHANUMERIC.test(text);
}

export interface QrSymbol {
  /** Modules per side, without the quiet zone. */
  size: number;
  version: number;
  errorCorrection: ErrorCorrection;
  /** Row-major, `true` for a dark module. */
  dark: (row: number, col: number) => boolean;
  modes: string[];
}

export function qrSymbol(text: string, errorCorrection: ErrorCorrection): QrSymbol {
  const qr = QRCode.create(text, { errorCorrectionLevel: errorCorrection });
  const { size, data } = qr.modules;
  return {
    size,
    version: qr.version,
    errorCorrection,
    dark: (row, col) => data[row * size + col] === 1,
    modes: qr.segments.map((s) => String((s as unknown as { mode: { id: string } }).mode.id)),
  };
}

/**
 * The error-correction level for a print run: H when it fits the same symbol version as Q for URLs
 * of this shape, else Q. All codes have the same length and alphabet, so one sample decides the run.
 */
export function chooseErrorCorrection(appUrl: string): ErrorCorrection {
  const sample = tagUrl(appUrl, DATA_ALPHABET.slice(0, CODE_LENGTH));
  const q = QRCode.create(sample, { errorCorrectionLevel: 'Q' });
  const h = QRCode.create(sample, { errorCorrectionLevel: 'H' });
  return h.version <= q.version ? 'H' : 'Q';
}

export interface ModuleRun {
  row: number;
  col: number;
  length: number;
  /** Rows covered (identical runs in consecutive rows are merged into one rectangle). */
  height: number;
}

/**
 * Dark modules as rectangles: horizontal runs, then identical runs in the rows below merged into
 * the same rectangle. Far fewer rectangles to draw (and numbers to write) than one per module.
 */
export function darkRuns(symbol: QrSymbol): ModuleRun[] {
  const runs: ModuleRun[] = [];
  // Open rectangles by "col:length", extended while the next row has the same run.
  let open = new Map<string, ModuleRun>();
  for (let row = 0; row < symbol.size; row++) {
    const next = new Map<string, ModuleRun>();
    let start = -1;
    for (let col = 0; col <= symbol.size; col++) {
      const isDark = col < symbol.size && symbol.dark(row, col);
      if (isDark && start < 0) start = col;
      if (!isDark && start >= 0) {
        const key = `${start}:${col - start}`;
        const above = open.get(key);
        if (above) {
          above.height++;
          next.set(key, above);
        } else {
          const run = { row, col: start, length: col - start, height: 1 };
          runs.push(run);
          next.set(key, run);
        }
        start = -1;
      }
    }
    open = next;
  }
  return runs;
}
