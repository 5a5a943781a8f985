/** Only same-site paths are followed after sign-in, never another origin. */
export function safeReturnPath(value: string | string[] | undefined, fallback = '/'): string {
  const v = Array.isArray(value) ? value[0] : value;
  if (!v) return fallback;
  try {
    const url = new URL(v, 'http://rimeline.invalid');
    if (url.origin !== 'http://rimeline.invalid' && !/^https?:\/\/(localhost|127\.0\.0\.1)(:\d+)?\//.test(v)) return fallback;
    const path = `${url.pathname}${url.search}${url.hash}`;
    return path.startsWith('/') && !path.startsWith('//') ? path : fallback;
  } catch {
    return fallback;
  }
}

/**
 * A callbackUrl the auth routes accept at all: a same-site path or an absolute http(s) URL of
 * valid text. Anything else (`http://[`, `javascript:`, NUL) is a 400, never a thrown error.
 */
export function isWellFormedCallbackUrl(value: string): boolean {
  if (value.includes('\u0000') || value.length > 2000) return false;
  if (value.startsWith('/')) return !value.startsWith('//') && URL.canParse(value, 'http://rimeline.invalid');
  if (!URL.canParse(value)) return false;
  const protocol = new URL(value).protocol;
  return protocol === 'http:' || protocol === 'https:';
}
