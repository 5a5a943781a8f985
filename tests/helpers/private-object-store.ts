// A test file's own S3 fake, swapped in for the profile's shared one. Call it inside `vi.hoisted`
// (before the app's storage client is built: lib/env reads the address once); `close` stops it
// and gives later test files in the same worker the shared store back.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Kysely } from 'kysely';
import { afterAll, beforeAll, beforeEach } from 'vitest';
import type { DB } from '@/db/schema.gen';
import { openTestObjectStore, type TestObjectStore } from '@/tests/helpers/front-port';

const KEYS = ['S3_ENDPOINT', 'S3_BUCKET', 'S3_FORCE_PATH_STYLE'] as const;

function forgetS3Client(): void {
  delete (globalThis as { rimelineS3?: unknown }).rimelineS3;
}

export interface PrivateObjectStore {
  store: TestObjectStore;
  /** Starts the store (again: a test may stop it) and makes its bucket. */
  start: () => Promise<void>;
  /** Deletes every object, so a test starts from an empty bucket. */
  empty: () => Promise<void>;
  close: () => Promise<void>;
}

export async function openPrivateObjectStore(bucket: string): Promise<PrivateObjectStore> {
  const directory = mkdtempSync(path.join(tmpdir(), `rimeline-${bucket}-s3-`));
  const store = await openTestObjectStore(directory);
  const previous = Object.fromEntries(KEYS.map((k) => [k, process.env[k]]));
  process.env.S3_ENDPOINT = store.endpoint;
  process.env.S3_BUCKET = bucket;
  process.env.S3_FORCE_PATH_STYLE = 'true';
  forgetS3Client();
  // The storage module is imported on call: by then the app reads this store's address.
  return {
    store,
    async start() {
      await store.start();
      await (await import('@/storage/objects')).ensureBucket();
    },
    async empty() {
      const { deleteObject, listObjects } = await import('@/storage/objects');
      for (const o of await listObjects('')) await deleteObject(o.key);
    },
    async close() {
      await store.close();
      rmSync(directory, { recursive: true, force: true });
      for (const [k, v] of Object.entries(previous)) {
        if (v === undefined) delete process.env[k];
        else process.env[k] = v;
      }
      forgetS3Client();
    },
  };
}

/**
 * The hooks of a test file with its own store: the store starts before the file's tests and closes
 * after them (with the file's database pool); each test starts from the demo and an empty bucket.
 * Register it before the file's own beforeEach, which then runs after it.
 */
export function freshDemoAndBucket(objects: PrivateObjectStore, db: Kysely<DB>): void {
  beforeAll(() => objects.start());
  afterAll(async () => {
    await objects.close();
    await db.destroy();
  });
  beforeEach(async () => {
    // Imported here, not at the top: this module runs before the app reads the store's address.
    await (await import('@/tests/helpers/db')).resetToDemo(db);
    await objects.empty();
  });
}
