// When a photo put may leave its body out of the signature (storage/payload-signing.ts): only
// where the connection protects the bytes itself.
import { describe, expect, it } from 'vitest';
import { mayLeavePayloadUnsigned } from '@/storage/payload-signing';

describe('leaving the put payload unsigned', () => {
  it('over HTTPS, and with no endpoint (the provider default is HTTPS)', () => {
    expect(mayLeavePayloadUnsigned('https://objects.example.test')).toBe(true);
    expect(mayLeavePayloadUnsigned('https://10.0.0.5:9000')).toBe(true);
    expect(mayLeavePayloadUnsigned(undefined)).toBe(true);
  });

  it('over plain HTTP only to a loopback address', () => {
    for (const endpoint of ['http://127.0.0.1:4571', 'http://127.4.0.9', 'http://localhost:4570', 'http://LOCALHOST', 'http://[::1]:4571']) {
      expect(mayLeavePayloadUnsigned(endpoint)).toBe(true);
    }
    for (const endpoint of ['http://10.0.0.5:9000', 'http://objects.example.test', 'http://localhost.example.test', 'http://127.0.0.1.example.test', 'http://[::2]']) {
      expect(mayLeavePayloadUnsigned(endpoint)).toBe(false);
    }
  });

  it('never for an endpoint it cannot read or another scheme', () => {
    expect(mayLeavePayloadUnsigned('not a url')).toBe(false);
    expect(mayLeavePayloadUnsigned('ftp://127.0.0.1')).toBe(false);
  });
});
