// Whether an S3 request's body needs its SHA-256 in the signature. The SDK hashes every Buffer
// body it signs (a 4 MB original: a full pass over the bytes on the request's path, about 11 ms
// per upload in the app). The hash only protects the body on its way to the store: over HTTPS,
// TLS already does that (which is why S3 accepts UNSIGNED-PAYLOAD there), and a loopback
// connection never leaves the machine. Plain HTTP to another host keeps the hash.

const LOOPBACK = /^(localhost|127(?:\.\d{1,3}){3}|\[::1\])$/i;

/** True when puts to `endpoint` may send UNSIGNED-PAYLOAD (no endpoint: the provider's HTTPS default). */
export function mayLeavePayloadUnsigned(endpoint: string | undefined): boolean {
  if (!endpoint) return true;
  let url: URL;
  try {
    url = new URL(endpoint);
  } catch {
    return false;
  }
  if (url.protocol === 'https:') return true;
  return url.protocol === 'http:' && LOOPBACK.test(url.hostname);
}
