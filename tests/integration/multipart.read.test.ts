// The multipart reader (lib/api/multipart.ts) parses the body while it arrives: fields and files
// come out exactly as sent whatever the chunking, a body cut off inside a part is a 400, and a
// body that passes the limit without declaring its length is refused as soon as it does.
import { randomBytes } from 'node:crypto';
import { NextRequest } from 'next/server';
import { describe, expect, it } from 'vitest';
import { readMultipart, readMultipartParts } from '@/lib/api/multipart';
import { AppError } from '@/lib/errors';

const tooLarge = () => new AppError('payload_too_large', 'too large');

async function encoded(form: FormData): Promise<{ type: string; body: Buffer }> {
  const req = new Request('http://localhost/', { method: 'POST', body: form });
  return { type: req.headers.get('content-type')!, body: Buffer.from(await req.arrayBuffer()) };
}

/** A request whose body arrives in chunks of `size` bytes, with no declared length. */
function chunked(type: string, body: Buffer, size: number): NextRequest {
  let at = 0;
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (at >= body.length) return controller.close();
      controller.enqueue(new Uint8Array(body.subarray(at, at + size)));
      at += size;
    },
  });
  const init = { method: 'POST', body: stream, headers: { 'content-type': type }, duplex: 'half' };
  return new NextRequest('http://localhost/api/x', init as ConstructorParameters<typeof NextRequest>[1]);
}

describe('reading a multipart body', () => {
  it('gives back every field and file exactly, however the body is split', async () => {
    const bytes = randomBytes(300_000);
    const form = new FormData();
    form.set('caption', 'Kühlraum 😀 "north" door');
    form.set('file', new File([bytes], 'Kühl 😀.jpg', { type: 'image/jpeg' }));
    form.set('kind', 'nameplate');
    const { type, body } = await encoded(form);
    for (const size of [7, 1000, 65_536, body.length]) {
      const parsed = await readMultipart(chunked(type, body, size), 1_000_000, tooLarge);
      expect([...parsed.keys()]).toEqual(['caption', 'file', 'kind']);
      expect(parsed.get('caption')).toBe('Kühlraum 😀 "north" door');
      expect(parsed.get('kind')).toBe('nameplate');
      const file = parsed.get('file') as File;
      expect(file.name).toBe('Kühl 😀.jpg');
      expect(file.type).toBe('image/jpeg');
      expect(Buffer.from(await file.arrayBuffer()).equals(bytes)).toBe(true);
    }
  });

  it('a body cut off inside a part is a 400, not a shorter file', async () => {
    const form = new FormData();
    form.set('file', new File([randomBytes(50_000)], 'plate.jpg', { type: 'image/jpeg' }));
    const { type, body } = await encoded(form);
    await expect(readMultipart(chunked(type, body.subarray(0, 30_000), 4096), 1_000_000, tooLarge)).rejects.toMatchObject({ code: 'bad_request' });
    await expect(readMultipart(chunked('multipart/form-data', body, 4096), 1_000_000, tooLarge)).rejects.toMatchObject({ code: 'bad_request' });
  });

  it('refuses a body over the limit that declared no length', async () => {
    const form = new FormData();
    form.set('file', new File([randomBytes(200_000)], 'plate.jpg', { type: 'image/jpeg' }));
    const { type, body } = await encoded(form);
    await expect(readMultipart(chunked(type, body, 16_384), 100_000, tooLarge)).rejects.toMatchObject({ code: 'payload_too_large' });
    expect((await readMultipart(chunked(type, body, 16_384), 300_000, tooLarge)).get('file')).toBeInstanceOf(File);
  });

  it('gives each file as one Buffer with the same bytes, names and checks (readMultipartParts)', async () => {
    const bytes = randomBytes(300_000);
    const form = new FormData();
    form.set('caption', 'Kühlraum 😀');
    form.set('file', new File([bytes], 'plate\u202egpj.exe', { type: 'image/jpeg' }));
    form.set('kind', '');
    const { type, body } = await encoded(form);
    for (const size of [7, 65_536, body.length]) {
      const parsed = await readMultipartParts(chunked(type, body, size), 1_000_000, tooLarge);
      expect(parsed.fields).toEqual([
        ['caption', 'Kühlraum 😀'],
        ['kind', ''],
      ]);
      expect(parsed.files).toHaveLength(1);
      const [name, file] = parsed.files[0]!;
      expect(name).toBe('file');
      // Bidirectional controls removed from the name, as readMultipart does.
      expect(file).toMatchObject({ fileName: 'plategpj.exe', type: 'image/jpeg' });
      expect(Buffer.isBuffer(file.bytes) && file.bytes.equals(bytes)).toBe(true);
    }
    await expect(readMultipartParts(chunked(type, body, 16_384), 100_000, tooLarge)).rejects.toMatchObject({ code: 'payload_too_large' });
    await expect(readMultipartParts(chunked(type, body.subarray(0, 30_000), 4096), 1_000_000, tooLarge)).rejects.toMatchObject({ code: 'bad_request' });
    const nul = new FormData();
    nul.set('caption', 'a\u0000b');
    const withNul = await encoded(nul);
    await expect(readMultipartParts(chunked(withNul.type, withNul.body, 4096), 1_000_000, tooLarge)).rejects.toMatchObject({ code: 'validation_failed' });
  });
});
