import { IncomingMessage, ServerResponse } from 'node:http';
import { Socket } from 'node:net';
import { describe, expect, it } from 'vitest';
import { BODY_BYTES_HEADER, COMPRESS_FROM_BYTES, sendsSmallAnswer } from '@/lib/http/small-answers';

function response(headers: Record<string, string>): ServerResponse {
  const res = new ServerResponse(new IncomingMessage(new Socket()));
  for (const [k, v] of Object.entries(headers)) res.setHeader(k, v);
  return res;
}

describe('sendsSmallAnswer', () => {
  it('sends an answer under the threshold as it is, with its length, and drops the size header', () => {
    const res = response({ [BODY_BYTES_HEADER]: '230', 'content-type': 'application/json' });
    expect(sendsSmallAnswer(res)).toBe(true);
    expect(res.getHeader('content-length')).toBe(230);
    expect(res.getHeader(BODY_BYTES_HEADER)).toBeUndefined();
  });

  it('leaves an answer of the threshold or more to the compressor, without a length', () => {
    for (const bytes of [COMPRESS_FROM_BYTES, 50_000]) {
      const res = response({ [BODY_BYTES_HEADER]: String(bytes) });
      expect(sendsSmallAnswer(res)).toBe(false);
      expect(res.getHeader('content-length')).toBeUndefined();
      expect(res.getHeader(BODY_BYTES_HEADER)).toBeUndefined();
    }
  });

  it('ignores answers that do not state a size, and sizes that are not a byte count', () => {
    expect(sendsSmallAnswer(response({ 'content-type': 'text/html' }))).toBe(false);
    for (const bad of ['', '-1', '12.5', 'abc']) {
      const res = response({ [BODY_BYTES_HEADER]: bad });
      expect(sendsSmallAnswer(res), bad).toBe(false);
      expect(res.getHeader('content-length'), bad).toBeUndefined();
      expect(res.getHeader(BODY_BYTES_HEADER), bad).toBeUndefined();
    }
  });
});
