// Tag codes: Crockford Base32 with its mod-37 check symbol (Crockford, "Base 32",
// https://www.crockford.com/base32.html). The worked examples below are the specification's
// algorithm applied by hand (shared TRADE-REFERENCE §9); the error-detection claims are checked
// exhaustively on a sample of codes.
import { describe, expect, it } from 'vitest';
import {
  CHECK_ALPHABET,
  CODE_LENGTH,
  DATA_ALPHABET,
  DATA_LENGTH,
  checkCode,
  checkSymbol,
  codeFromScan,
  formatCode,
  generateCode,
  isValidCode,
  normalizeCode,
  parseCode,
} from '@/lib/tags/code';

/** A small seeded generator so the sample is the same on every run. */
function seededBytes(seed: number) {
  let s = seed >>> 0;
  return (n: number) => {
    const out = new Uint8Array(n);
    for (let i = 0; i < n; i++) {
      s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
      out[i] = s >>> 24;
    }
    return out;
  };
}

function sampleCodes(): string[] {
  const rand = seededBytes(20261201);
  const codes = Array.from({ length: 300 }, () => generateCode(rand));
  // Edges: all zeros, all the last symbol, and codes whose check symbol is one of the extra symbols.
  const edges = ['00000000', 'ZZZZZZZZ', '0000000Z', 'Z0000000'].map((d) => d + checkSymbol(d));
  for (const extra of ['*', '~', '$', '=', 'U']) {
    for (let n = 0; ; n++) {
      const data = n.toString(32).toUpperCase().padStart(DATA_LENGTH, '0').replace(/[0-9A-V]/g, (c) => DATA_ALPHABET[Number.parseInt(c, 32)]!);
      if (checkSymbol(data) === extra) {
        edges.push(data + extra);
        break;
      }
    }
  }
  return [...codes, ...edges];
}

describe('Crockford check symbol', () => {
  // The worked examples of the specification: 1234 = "16J" → 1234 mod 37 = 13 → "D";
  // 32 = "10" → 32 → "*"; 123456789 = "3NQK8N" → 36 → "U".
  it.each([
    ['16J', 'D'],
    ['10', '*'],
    ['3NQK8N', 'U'],
    ['0', '0'],
  ])('check symbol of %s is %s', (data, symbol) => {
    expect(checkSymbol(data)).toBe(symbol);
  });

  it('uses the 32 data symbols without I, L, O, U and 37 check symbols', () => {
    expect(DATA_ALPHABET).toHaveLength(32);
    expect(new Set(DATA_ALPHABET).size).toBe(32);
    expect(DATA_ALPHABET).not.toMatch(/[ILOU]/);
    expect(CHECK_ALPHABET).toBe(`${DATA_ALPHABET}*~$=U`);
  });

  const codes = sampleCodes();

  it('accepts every sample code', () => {
    for (const code of codes) expect(checkCode(code).status, code).toBe('valid');
  });

  it('catches every single-character substitution', () => {
    let tried = 0;
    for (const code of codes) {
      for (let i = 0; i < CODE_LENGTH; i++) {
        const alphabet = i < DATA_LENGTH ? DATA_ALPHABET : CHECK_ALPHABET;
        for (const c of alphabet) {
          if (c === code[i]) continue;
          const typo = code.slice(0, i) + c + code.slice(i + 1);
          tried++;
          if (isValidCode(typo)) throw new Error(`${typo} (from ${code}) passed the check`);
        }
      }
    }
    expect(tried).toBe(codes.length * (DATA_LENGTH * 31 + 36));
  });

  it('catches every adjacent transposition, including the check symbol with its neighbour', () => {
    let tried = 0;
    for (const code of codes) {
      for (let i = 0; i < CODE_LENGTH - 1; i++) {
        if (code[i] === code[i + 1]) continue;
        const swapped = code.slice(0, i) + code[i + 1] + code[i] + code.slice(i + 2);
        tried++;
        if (isValidCode(swapped)) throw new Error(`${swapped} (from ${code}) passed the check`);
      }
    }
    expect(tried).toBeGreaterThan(codes.length * 7);
  });
});

describe('reading codes as people type them', () => {
  const code = generateCode(seededBytes(7));

  it('ignores case, hyphens and spaces, and reads O as 0 and I, L as 1', () => {
    expect(normalizeCode('k7q-m3x 9pa')).toBe('K7QM3X9PA');
    expect(normalizeCode('oil')).toBe('011');
    expect(parseCode(formatCode(code).toLowerCase())).toBe(code);
    const withZero = '00000000' + checkSymbol('00000000');
    expect(parseCode(`OOO-OOO-OO${withZero[8]}`)).toBe(withZero);
  });

  it('reports what is wrong while typing', () => {
    expect(checkCode('').status).toBe('empty');
    expect(checkCode(code.slice(0, 5))).toMatchObject({ status: 'incomplete', missing: 4 });
    expect(checkCode(`${code.slice(0, 3)}U${code.slice(4)}`)).toMatchObject({ status: 'bad_character', character: 'U', position: 4 });
    expect(checkCode(`${code}7`).status).toBe('too_long');
    expect(checkCode(formatCode(code)).status).toBe('valid');
  });

  it('groups codes in threes for reading aloud', () => {
    expect(formatCode('K7QM3X9PA')).toBe('K7Q-M3X-9PA');
    expect(formatCode('k7qm')).toBe('K7Q-M');
  });

  it('finds the code in a scanned tag URL, whatever its case, and refuses foreign text', () => {
    expect(codeFromScan(`HTTP://LOCALHOST:3100/T/${code}`)).toBe(code);
    expect(codeFromScan(`https://service.example/t/${code.toLowerCase()}`)).toBe(code);
    expect(codeFromScan(`https://service.example/app/T/${code}?via=camera`)).toBe(code);
    expect(codeFromScan(formatCode(code))).toBe(code);
    expect(codeFromScan('https://example.com/menu')).toBeNull();
    const bad = code.slice(0, 8) + (code[8] === '0' ? '1' : '0');
    expect(codeFromScan(`HTTP://LOCALHOST/T/${bad}`)).toBeNull();
  });
});

describe('issuing codes', () => {
  it('draws 40 random bits per code, letters and digits only, never a guessable sequence', () => {
    const seen = new Set<string>();
    for (let i = 0; i < 20_000; i++) {
      const c = generateCode();
      expect(c).toMatch(/^[0-9A-HJKMNP-TV-Z]{8}[0-9A-Z]$/);
      seen.add(c);
    }
    expect(seen.size).toBe(20_000);
    // Consecutive codes share no structure: the first symbols spread over the whole alphabet.
    const firsts = new Set([...seen].slice(0, 2000).map((c) => c[0]));
    expect(firsts.size).toBe(32);
  });

  it('discards draws whose check symbol would be * ~ $ or =', () => {
    // These bytes give data "00000010" (value 32 → check "*"); the next draw is used instead.
    const draws = [new Uint8Array([0, 0, 0, 0, 32]), new Uint8Array([0, 0, 0, 0, 1])];
    let i = 0;
    const code = generateCode(() => draws[i++]!);
    expect(i).toBe(2);
    expect(code).toBe('000000011');
  });
});

describe('codes in URL paths', () => {
  it('reads percent-encoded segments and refuses malformed ones without throwing', async () => {
    const { codeFromPathSegment } = await import('@/lib/tags/code');
    const code = generateCode();
    expect(codeFromPathSegment(code)).toBe(code);
    expect(codeFromPathSegment(encodeURIComponent(formatCode(code).toLowerCase()))).toBe(code);
    expect(codeFromPathSegment('%E0%A4%A')).toBeNull();
    expect(codeFromPathSegment('')).toBeNull();
  });
});
