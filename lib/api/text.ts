// Text the database cannot store (NUL) or that is not Unicode at all (a lone surrogate) is refused
// at the edge with a clear message, rather than reaching PostgreSQL as a 500. Bidirectional
// control characters are removed from names and captions so `photo\u202egpj.exe` cannot pass
// for "photoexe.jpg". No framework imports: the proxy, withApi, zod schemas and actions share it.

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
// U+202A–U+202E (embeddings, overrides), U+2066–U+2069 (isolates), U+200E/U+200F/U+061C (marks).
const BIDI_CONTROLS = /[\u202A-\u202E\u2066-\u2069\u200E\u200F\u061C]/g;

export const INVALID_TEXT_MESSAGE = 'Text may not contain NUL characters or broken Unicode.';

export function isValidText(value: string): boolean {
  return !value.includes('\u0000') && !LONE_SURROGATE.test(value);
}

export function stripBidiControls(value: string): string {
  return value.replace(BIDI_CONTROLS, '');
}

/** Deeper than any record the app stores; a body nested further is refused before it is walked. */
export const MAX_DEPTH = 32;

/** Whether a parsed JSON value nests arrays or objects deeper than `max` levels. */
export function nestedDeeperThan(value: unknown, max = MAX_DEPTH): boolean {
  const stack: [unknown, number][] = [[value, 0]];
  while (stack.length) {
    const [v, depth] = stack.pop()!;
    if (v === null || typeof v !== 'object') continue;
    if (depth >= max) return true;
    for (const item of Object.values(v)) stack.push([item, depth + 1]);
  }
  return false;
}

/**
 * The path of the first string (value or object key) that is not valid text, walking nested
 * arrays and objects; `null` when all text is valid. Callers refuse deep nesting first
 * (nestedDeeperThan); past MAX_DEPTH the walk stops and counts the rest as invalid.
 */
export function findInvalidText(value: unknown, path: string[] = [], depth = 0): string | null {
  if (depth > MAX_DEPTH) return path.join('.') || '(root)';
  if (typeof value === 'string') return isValidText(value) ? null : path.join('.') || '(root)';
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const found = findInvalidText(value[i], [...path, String(i)], depth + 1);
      if (found !== null) return found;
    }
    return null;
  }
  if (value && typeof value === 'object') {
    for (const [key, item] of Object.entries(value)) {
      if (!isValidText(key)) return [...path, '(key)'].join('.');
      const found = findInvalidText(item, [...path, key], depth + 1);
      if (found !== null) return found;
    }
  }
  return null;
}
