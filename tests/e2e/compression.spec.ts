// Against the built server (server.ts): an API answer under 1 kB goes out as it is, with its
// length; a larger one is compressed; the size header the app uses between the two never leaves.
import { expect, test } from '@playwright/test';
import { asOffice } from './helpers';

const SIZE_HEADER = 'x-rimeline-body-bytes';

test('small API answers are sent with their length, larger ones compressed', async ({ request }, info) => {
  for (const path of ['/api/me', '/api/health']) {
    const res = await request.get(path, { headers: { 'accept-encoding': 'br, gzip' } });
    const body = await res.body();
    expect(body.byteLength, path).toBeLessThan(1024);
    expect(res.headers()['content-encoding'], path).toBeUndefined();
    expect(res.headers()['content-length'], path).toBe(String(body.byteLength));
    expect(res.headers()[SIZE_HEADER], path).toBeUndefined();
    expect(JSON.parse(body.toString('utf8')), path).toBeTruthy();
  }

  await asOffice(info.project.use.baseURL, async (office) => {
    const res = await office.get('/api/calc/refrigerants', { headers: { 'accept-encoding': 'br, gzip' } });
    expect(res.status()).toBe(200);
    expect((await res.body()).byteLength).toBeGreaterThan(1024);
    expect(res.headers()['content-encoding']).toBe('br');
    expect(res.headers()[SIZE_HEADER]).toBeUndefined();
  });
});
