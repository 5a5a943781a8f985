// Tag codes: pure, no I/O, shared by the server (issuing, lookups) and the browser (typing).
//
// Alphabet: Crockford's Base32, from Douglas Crockford, "Base 32" (https://www.crockford.com/base32.html):
//   data symbols  0123456789ABCDEFGHJKMNPQRSTVWXYZ   (no I, L, O, U)
//   decoding      case-insensitive; O → 0, I and L → 1; hyphens (and here spaces) are ignored
// Check scheme: the same specification's check symbol — the code's value modulo 37, written with the
//   32 data symbols plus * ~ $ = U for the values 32–36.
// Because 37 is prime and larger than the alphabet, one wrong symbol or two neighbours swapped always
// changes the value modulo 37, so the check symbol catches every single substitution and every
// adjacent transposition (tests/unit/tags.code.test.ts tries them all on a sample of codes).
//
// A code is 8 random data symbols (40 bits from the platform's CSPRNG: 1.1 × 10¹² values, so codes
// cannot be guessed or counted up) followed by its check symbol. Issued codes never end in * ~ $ =
// (those random draws are discarded), so every printed code is letters and digits only: it fits the
// QR alphanumeric mode and reads aloud without symbol names. Shown in groups of three: K7Q-M3X-9PA.

export const DATA_ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ';
export const CHECK_ALPHABET = `${DATA_ALPHABET}*~$=U`;
export const DATA_LENGTH = 8;
export const CODE_LENGTH = DATA_LENGTH + 1;

const DATA_VALUES = new Map<string, number>([...DATA_ALPHABET].map((c, i) => [c, i]));
const CHECK_VALUES = new Map<string, number>([...CHECK_ALPHABET].map((c, i) => [c, i]));
const ALIASES: Record<string, string> = { O: '0', I: '1', L: '1' };

/** Upper-cases, drops hyphens and spaces, and maps the look-alikes O → 0 and I, L → 1. */
export function normalizeCode(input: string): string {
  let out = '';
  for (const raw of input.toUpperCase()) {
    if (raw === '-' || raw === ' ' || raw === '\u00a0' || raw === '\t') continue;
    out += ALIASES[raw] ?? raw;
  }
  return out;
}

/** Crockford's check symbol for a string of data symbols (throws on a non-data symbol). */
export function checkSymbol(data: string): string {
  let mod = 0;
  for (const c of data) {
    const v = DATA_VALUES.get(c);
    if (v === undefined) throw new Error(`"${c}" is not a Crockford Base32 data symbol`);
    mod = (mod * 32 + v) % 37;
  }
  return CHECK_ALPHABET[mod]!;
}

export type CodeCheck =
  | { status: 'empty'; normalized: '' }
  | { status: 'incomplete'; normalized: string; missing: number }
  | { status: 'bad_character'; normalized: string; character: string; position: number }
  | { status: 'too_long'; normalized: string }
  | { status: 'check_failed'; normalized: string }
  | { status: 'valid'; normalized: string };

/**
 * Checks a code as a person types it: the state to show under the field. Only a `valid` code is
 * ever looked up, so a typo costs no request.
 */
export function checkCode(input: string): CodeCheck {
  const normalized = normalizeCode(input);
  if (normalized.length === 0) return { status: 'empty', normalized: '' };
  for (let i = 0; i < normalized.length && i < CODE_LENGTH; i++) {
    const c = normalized[i]!;
    const ok = i < DATA_LENGTH ? DATA_VALUES.has(c) : CHECK_VALUES.has(c);
    if (!ok) return { status: 'bad_character', normalized, character: c, position: i + 1 };
  }
  if (normalized.length > CODE_LENGTH) return { status: 'too_long', normalized };
  if (normalized.length < CODE_LENGTH) return { status: 'incomplete', normalized, missing: CODE_LENGTH - normalized.length };
  const data = normalized.slice(0, DATA_LENGTH);
  if (checkSymbol(data) !== normalized[DATA_LENGTH]) return { status: 'check_failed', normalized };
  return { status: 'valid', normalized };
}

/** The canonical code (upper case, no hyphens) when the input is a valid code, else null. */
export function parseCode(input: string): string | null {
  const result = checkCode(input);
  return result.status === 'valid' ? result.normalized : null;
}

export function isValidCode(input: string): boolean {
  return parseCode(input) !== null;
}

/** For people: groups of three, K7Q-M3X-9PA. Partial input is grouped the same way. */
export function formatCode(code: string): string {
  const n = normalizeCode(code);
  return (n.match(/.{1,3}/g) ?? []).join('-');
}

type RandomBytes = (n: number) => Uint8Array;
const cryptoBytes: RandomBytes = (n) => globalThis.crypto.getRandomValues(new Uint8Array(n));

/** A new random code with its check symbol; never one whose check symbol is * ~ $ or =. */
export function generateCode(randomBytes: RandomBytes = cryptoBytes): string {
  for (;;) {
    const bytes = randomBytes(5);
    // 40 random bits → 8 symbols of 5 bits each.
    let bits = 0n;
    for (const b of bytes) bits = (bits << 8n) | BigInt(b);
    let data = '';
    for (let i = DATA_LENGTH - 1; i >= 0; i--) data += DATA_ALPHABET[Number((bits >> BigInt(i * 5)) & 31n)];
    const check = checkSymbol(data);
    if (/^[0-9A-Z]$/.test(check)) return data + check;
  }
}

/** The canonical code from a URL path segment (percent-encoded or not); null when it is not a valid code. */
export function codeFromPathSegment(segment: string): string | null {
  try {
    return parseCode(decodeURIComponent(segment));
  } catch {
    return null;
  }
}

/** The code in a scanned QR text: our tag URL (…/T/CODE, any case, any host) or a bare code. */
export function codeFromScan(text: string): string | null {
  const trimmed = text.trim();
  const match = /\/(?:T|TAG)\/([0-9A-Za-z*~$=-]{9,15})\/?(?:[?#].*)?$/i.exec(trimmed);
  if (match) return codeFromPathSegment(match[1]!);
  return parseCode(trimmed);
}
