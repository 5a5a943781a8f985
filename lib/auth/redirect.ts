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
