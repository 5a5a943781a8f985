// /api/health is green with every service up, and 503 naming the object store when it stops.
import { createRequire } from 'node:module';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it, vi } from 'vitest';

const require = createRequire(import.meta.url);

async function startStore(port: number, bucket: string): Promise<{ close: () => Promise<void> }> {
  const S3rver = require('@20minutes/s3rver');
  const server = new S3rver({ address: '127.0.0.1', port, silent: true, directory: mkdtempSync(path.join(tmpdir(), 'rl-s3-')), configureBuckets: [{ name: bucket }], allowMismatchedSignatures: true });
  await server.run();
  return { close: () => server.close() };
}

describe('GET /api/health', () => {
  it('answers 200 when database, storage and mail answer', async () => {
    const { GET } = await import('@/app/api/health/route');
    const res = await GET();
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ status: 'ok', checks: { database: 'ok', storage: 'ok', mail: 'ok' } });
  });

  it('answers 503 naming storage while the object store is stopped, and 200 again when it is back', async () => {
    const port = 45_000 + Math.floor(Math.random() * 1000);
    vi.resetModules();
    vi.stubEnv('S3_ENDPOINT', `http://127.0.0.1:${port}`);
    vi.stubEnv('S3_BUCKET', 'health-check');
    delete (globalThis as { rimelineS3?: unknown }).rimelineS3;
    const store = await startStore(port, 'health-check');
    try {
      const { GET } = await import('@/app/api/health/route');
      expect((await GET()).status).toBe(200);
      await store.close();
      const down = await GET();
      expect(down.status).toBe(503);
      expect(await down.json()).toEqual({ status: 'degraded', checks: { database: 'ok', storage: 'failing', mail: 'ok' } });
      const back = await startStore(port, 'health-check');
      expect((await GET()).status).toBe(200);
      await back.close();
    } finally {
      vi.unstubAllEnvs();
      delete (globalThis as { rimelineS3?: unknown }).rimelineS3;
    }
  });
});
