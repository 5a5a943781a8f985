import { isValidText } from '@/lib/api/text';
import { isWellFormedCallbackUrl } from '@/lib/auth/redirect';

// The address check of every page and route, before anything parses the query: proxy.ts runs it
// for pages and the auth routes, withApi for the API routes it wraps (they skip the proxy).
// No framework imports.

function safeDecode(value: string): string {
  try {
    return decodeURIComponent(value);
  } catch {
    return '\u0000';
  }
}

/**
 * Why an address is refused (400): a bad percent-escape (invalid UTF-8 included), a NUL, a
 * malformed callbackUrl; null when it is fine. `textCheckedLater`: the caller refuses NUL in the
 * query's keys and values itself, naming the field (withApi, 422), so only the rest is checked.
 */
export function badQuery(search: string, pathname: string, textCheckedLater = false): string | null {
  let pairs: [string, string][];
  try {
    // searchParams replaces bad percent-escapes silently; decode by hand to notice them.
    pairs = search
      .slice(1)
      .split('&')
      .filter(Boolean)
      .map((part) => {
        const [k, ...v] = part.split('=');
        return [decodeURIComponent(k!.replace(/\+/g, ' ')), decodeURIComponent(v.join('=').replace(/\+/g, ' '))];
      });
  } catch {
    return 'The address has a malformed percent-escape.';
  }
  for (const [key, value] of pairs) {
    if (!textCheckedLater && (!isValidText(key) || !isValidText(value))) return 'The address contains a NUL character or broken Unicode.';
    if (key === 'callbackUrl' && !isWellFormedCallbackUrl(value)) return 'The callbackUrl is not a valid address.';
  }
  // Plain paths (nearly all) have nothing to decode.
  if (pathname.includes('%') && !isValidText(safeDecode(pathname))) return 'The address contains a NUL character or broken Unicode.';
  return null;
}
