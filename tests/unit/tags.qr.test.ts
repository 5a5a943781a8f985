// QR content shaping (ISO/IEC 18004 facts as summarised in shared TRADE-REFERENCE §9): an
// upper-case tag URL stays in alphanumeric mode and so in a smaller symbol; the error-correction
// level never drops below Q; the drawn runs cover exactly the dark modules.
import * as QRCode from 'qrcode';
import { describe, expect, it } from 'vitest';
import { generateCode } from '@/lib/tags/code';
import { chooseErrorCorrection, darkRuns, isAlphanumericMode, qrSymbol, tagUrl } from '@/lib/tags/qr';

describe('tag URL', () => {
  const code = generateCode();

  it('is APP_URL in upper case plus /T/ and the code', () => {
    expect(tagUrl('http://localhost:3100', code)).toBe(`HTTP://LOCALHOST:3100/T/${code}`);
    expect(tagUrl('https://service.example.com/', code)).toBe(`HTTPS://SERVICE.EXAMPLE.COM/T/${code}`);
    // A base path keeps its case (paths are case-sensitive).
    expect(tagUrl('https://example.com/Rime', code)).toBe(`HTTPS://EXAMPLE.COM/Rime/T/${code}`);
  });

  it('encodes in alphanumeric mode only, in a smaller symbol than the same URL in lower case', () => {
    const url = tagUrl('https://service.example.com', code);
    expect(isAlphanumericMode(url)).toBe(true);
    const upper = qrSymbol(url, 'Q');
    expect(upper.modes).toEqual(['Alphanumeric']);
    const lower = QRCode.create(url.toLowerCase(), { errorCorrectionLevel: 'Q' });
    expect(lower.version).toBeGreaterThan(upper.version);
    // 40 characters at level Q: version 3 (29 × 29 modules) in alphanumeric mode.
    expect(upper.version).toBe(3);
    expect(upper.size).toBe(29);
  });
});

describe('error correction for dirty labels', () => {
  it('uses H when it costs no larger symbol than Q, else Q', () => {
    for (const app of ['http://localhost:3100', 'https://service.example.com', 'https://a-rather-long-host-name.service.example.com']) {
      const sample = tagUrl(app, 'K7QM3X9PA');
      const q = QRCode.create(sample, { errorCorrectionLevel: 'Q' }).version;
      const h = QRCode.create(sample, { errorCorrectionLevel: 'H' }).version;
      expect(chooseErrorCorrection(app)).toBe(h <= q ? 'H' : 'Q');
    }
    // A 33-character local URL fits version 3 at H as at Q; a 40-character one needs version 4 at H.
    expect(chooseErrorCorrection('http://localhost:3100')).toBe('H');
    expect(chooseErrorCorrection('https://service.example.com')).toBe('Q');
  });
});

describe('vector drawing', () => {
  it('covers every dark module exactly once with merged rectangles', () => {
    const symbol = qrSymbol(tagUrl('http://localhost:3100', generateCode()), 'H');
    const covered = new Set<string>();
    const runs = darkRuns(symbol);
    for (const r of runs) {
      for (let row = r.row; row < r.row + r.height; row++) {
        for (let c = r.col; c < r.col + r.length; c++) {
          const key = `${row},${c}`;
          expect(covered.has(key)).toBe(false);
          covered.add(key);
        }
      }
    }
    // Merging rows pays: the three finder patterns alone save rectangles.
    expect(runs.some((r) => r.height > 1)).toBe(true);
    let dark = 0;
    for (let row = 0; row < symbol.size; row++) {
      for (let col = 0; col < symbol.size; col++) {
        if (symbol.dark(row, col)) {
          dark++;
          expect(covered.has(`${row},${col}`)).toBe(true);
        }
      }
    }
    expect(covered.size).toBe(dark);
  });
});

describe('company line on labels', () => {
  it('always carries the name and the service phone', async () => {
    const { companyLines } = await import('@/lib/tags/pdf');
    expect(companyLines({ name: 'Brackenfield Refrigeration Service', servicePhone: '555-0100', labelLine: 'Service: 555-0100 · call before opening' })).toEqual([
      'Brackenfield Refrigeration Service',
      'Service: 555-0100 · call before opening',
    ]);
    expect(companyLines({ name: 'Brackenfield', servicePhone: '555-0100', labelLine: 'Call before opening' })).toEqual(['Brackenfield', 'Call before opening · 555-0100']);
    expect(companyLines({ name: 'Brackenfield', servicePhone: '555-0100', labelLine: null })).toEqual(['Brackenfield', 'Service: 555-0100']);
    expect(companyLines({ name: 'Brackenfield', servicePhone: null, labelLine: '' })).toEqual(['Brackenfield']);
  });
});
