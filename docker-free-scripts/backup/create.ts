// `npm run backup`: one folder holding database.dump (pg_dump, custom format), objects/ (every
// object of the bucket, stored by sha256) and manifest.json (row counts, checksums, problems).
// One point in time: the database snapshot is taken first and held while pg_dump runs; the objects
// are copied afterwards and sorted against it (lib/ops/classify-objects.ts).
import { mkdir, rename, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { classifyObjects } from '@/lib/ops/classify-objects';
import { MANIFEST_FORMAT, MANIFEST_VERSION, type BackupManifest, type BackupObject } from '@/lib/ops/backup-manifest';
import { mapLimit } from '@/lib/ops/map-limit';
import { bucketClient, etagMatches, hashFile, isNotFound, listAll, type BucketConfig } from './bucket';
import { countRows, currentReferences, dumpSnapshot, endSnapshot, objectReferences, openSnapshot } from './postgres';
import { describeDatabase } from './profile-env';

export interface BackupOptions {
  databaseUrl: string;
  bucket: BucketConfig;
  /** The folder to create; it must not exist yet. */
  out: string;
  log?: (line: string) => void;
  /** Runs once the snapshot is dumped and before the bucket is listed (tests write "late" objects here). */
  afterSnapshot?: () => Promise<void>;
}

const COPY_CONCURRENCY = 8;

export async function createBackup(opts: BackupOptions): Promise<BackupManifest> {
  const log = opts.log ?? (() => undefined);
  const out = path.resolve(opts.out);
  if (await stat(out).then(() => true, () => false)) throw new Error(`${out} already exists; choose a new folder for the backup.`);
  // Written under a temporary name and renamed at the end, so a folder with the final name is whole.
  const work = `${out}.partial`;
  await rm(work, { recursive: true, force: true });
  await mkdir(path.join(work, 'objects'), { recursive: true });
  const startedAt = new Date().toISOString();
  try {
    log(`Snapshot of the ${describeDatabase(opts.databaseUrl)} …`);
    const snapshot = await openSnapshot(opts.databaseUrl);
    let tables: Record<string, number>;
    let refs: Awaited<ReturnType<typeof objectReferences>>;
    try {
      tables = await countRows(snapshot.client);
      refs = await objectReferences(snapshot.client);
      await dumpSnapshot(opts.databaseUrl, snapshot, path.join(work, 'database.dump'));
    } finally {
      await endSnapshot(snapshot);
    }
    const dump = await hashFile(path.join(work, 'database.dump'));
    log(`  taken at ${snapshot.takenAt.toISOString()} (snapshot ${snapshot.txidSnapshot}); ${Object.keys(tables).length} tables, ${dump.size} bytes dumped`);

    await opts.afterSnapshot?.();

    const client = bucketClient(opts.bucket);
    log(`Copying the objects of bucket ${opts.bucket.bucket} …`);
    const listed = await listAll(client, opts.bucket.bucket);
    const copied = await mapLimit(listed, COPY_CONCURRENCY, async (o, i): Promise<Omit<BackupObject, 'state'> | null> => {
      const tmp = path.join(work, 'objects', `.download-${i}`);
      let contentType: string | null = null;
      try {
        const st = await client.statObject(opts.bucket.bucket, o.key);
        contentType = (st.metaData?.['content-type'] as string | undefined) ?? null;
        await client.fGetObject(opts.bucket.bucket, o.key, tmp);
      } catch (error) {
        // Deleted between the listing and the copy: a snapshot row naming it shows up as missing.
        if (isNotFound(error)) return null;
        throw error;
      }
      const h = await hashFile(tmp);
      if (!etagMatches(o.etag, h.md5)) throw new Error(`Object ${o.key} arrived with other bytes than the store's checksum says; run the backup again.`);
      const file = `objects/${h.sha256}`;
      await rename(tmp, path.join(work, file));
      return { key: o.key, file, sha256: h.sha256, size: h.size, contentType, lastModified: o.lastModified?.toISOString() ?? null };
    });
    const present = copied.filter((c): c is NonNullable<typeof c> => c !== null);

    const now = await currentReferences(opts.databaseUrl);
    const sorted = classifyObjects(refs, present.map((p) => ({ key: p.key, lastModified: p.lastModified ? new Date(p.lastModified) : null })), snapshot.takenAt, now);
    const items: BackupObject[] = present.map((p) => ({ ...p, state: sorted.states.get(p.key)! }));
    const manifest: BackupManifest = {
      format: MANIFEST_FORMAT,
      version: MANIFEST_VERSION,
      startedAt,
      finishedAt: new Date().toISOString(),
      source: { database: describeDatabase(opts.databaseUrl), bucket: opts.bucket.bucket, endpoint: opts.bucket.endpoint ?? `AWS S3 (${opts.bucket.region})` },
      snapshot: { takenAt: snapshot.takenAt.toISOString(), txidSnapshot: snapshot.txidSnapshot, serverVersion: snapshot.serverVersion },
      database: { file: 'database.dump', format: 'custom', sha256: dump.sha256, bytes: dump.size, tables },
      objects: { count: items.length, bytes: items.reduce((a, o) => a + o.size, 0), items },
      problems: { orphanObjects: sorted.orphanObjects, missingObjects: sorted.missingObjects, afterSnapshot: sorted.afterSnapshot },
    };
    await writeFile(path.join(work, 'manifest.json'), `${JSON.stringify(manifest, null, 2)}\n`);
    await rename(work, out);
    return manifest;
  } catch (error) {
    await rm(work, { recursive: true, force: true });
    throw error;
  }
}
