// `npm run restore <folder>`: loads a backup into an empty database and bucket, then runs the photo
// storage check. Verifies the folder against its manifest before changing anything; refuses a
// target that holds anything unless told to replace it.
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import type * as Minio from 'minio';
import pg from 'pg';
import { parseManifest, type BackupManifest } from '@/lib/ops/backup-manifest';
import { mapLimit } from '@/lib/ops/map-limit';
import { bucketClient, etagMatches, hashFile, listAll, type BucketConfig } from './bucket';
import { countRows, createDatabase, databaseState, restoreDump, wipeDatabase } from './postgres';
import { describeDatabase } from './profile-env';

export interface RestoreOptions {
  archive: string;
  databaseUrl: string;
  bucket: BucketConfig;
  /** Delete what the target database and bucket hold first. */
  replace: boolean;
  log?: (line: string) => void;
}

/** A refusal: nothing was changed. */
export class RestoreRefused extends Error {}

const PUT_CONCURRENCY = 8;

export async function readArchive(archive: string): Promise<BackupManifest> {
  const dir = path.resolve(archive);
  const text = await readFile(path.join(dir, 'manifest.json'), 'utf8').catch(() => {
    throw new RestoreRefused(`${dir} is not a backup folder: it has no manifest.json.`);
  });
  try {
    return parseManifest(text);
  } catch (error) {
    throw new RestoreRefused(error instanceof Error ? error.message : String(error));
  }
}

/** Every file the restore will read, checked against the manifest's sha256. */
async function verifyArchive(dir: string, manifest: BackupManifest, restored: BackupManifest['objects']['items']): Promise<void> {
  const dump = await hashFile(path.join(dir, manifest.database.file)).catch(() => null);
  if (!dump || dump.sha256 !== manifest.database.sha256) throw new RestoreRefused(`${manifest.database.file} is missing or damaged (its sha256 differs from the manifest); nothing was restored.`);
  const files = [...new Set(restored.map((o) => o.file))];
  const bad: string[] = [];
  await mapLimit(files, PUT_CONCURRENCY, async (file) => {
    const h = await hashFile(path.join(dir, file)).catch(() => null);
    if (!h || `objects/${h.sha256}` !== file) bad.push(file);
  });
  if (bad.length) throw new RestoreRefused(`${bad.length} object file(s) are missing or damaged, e.g. ${bad[0]}; nothing was restored.`);
}

async function bucketObjects(client: Minio.Client, bucket: string): Promise<{ exists: boolean; keys: string[] }> {
  if (!(await client.bucketExists(bucket))) return { exists: false, keys: [] };
  return { exists: true, keys: (await listAll(client, bucket)).map((o) => o.key) };
}

export interface RestoreResult {
  manifest: BackupManifest;
  tables: Record<string, number>;
  objectsRestored: number;
  objectsSkipped: number;
}

export async function restoreBackup(opts: RestoreOptions): Promise<RestoreResult> {
  const log = opts.log ?? (() => undefined);
  const dir = path.resolve(opts.archive);
  const manifest = await readArchive(dir);
  // Objects written after the snapshot belong to rows the dump does not hold.
  const toRestore = manifest.objects.items.filter((o) => o.state !== 'after_snapshot');
  log(`Checking ${dir} against its manifest (${Object.keys(manifest.database.tables).length} tables, ${toRestore.length} objects) …`);
  await verifyArchive(dir, manifest, toRestore);

  const client = bucketClient(opts.bucket);
  const [db, objects] = await Promise.all([databaseState(opts.databaseUrl), bucketObjects(client, opts.bucket.bucket)]);
  const tableCount = Object.keys(db.tables).length;
  const rowCount = Object.values(db.tables).reduce((a, n) => a + n, 0);
  if ((tableCount > 0 || objects.keys.length > 0) && !opts.replace) {
    const held = [
      tableCount > 0 ? `the ${describeDatabase(opts.databaseUrl)} holds ${tableCount} tables (${rowCount} rows)` : null,
      objects.keys.length > 0 ? `bucket ${opts.bucket.bucket} holds ${objects.keys.length} objects` : null,
    ].filter(Boolean);
    throw new RestoreRefused(
      `Refused: the target is not empty: ${held.join(' and ')}. A restore loads only into an empty database and bucket, ` +
        'and nothing was changed. Restore into a fresh profile, or pass --replace to delete everything in both first.',
    );
  }

  if (!db.exists) {
    log(`Creating the ${describeDatabase(opts.databaseUrl)} …`);
    await createDatabase(opts.databaseUrl);
  } else if (tableCount > 0) {
    log(`--replace: emptying the ${describeDatabase(opts.databaseUrl)} …`);
    await wipeDatabase(opts.databaseUrl);
  }
  if (!objects.exists) {
    await client.makeBucket(opts.bucket.bucket, opts.bucket.region);
  } else if (objects.keys.length > 0) {
    log(`--replace: deleting the ${objects.keys.length} objects of bucket ${opts.bucket.bucket} …`);
    for (let i = 0; i < objects.keys.length; i += 1000) await client.removeObjects(opts.bucket.bucket, objects.keys.slice(i, i + 1000));
  }

  log(`Loading ${manifest.database.file} (pg_restore, one transaction) …`);
  await restoreDump(opts.databaseUrl, path.join(dir, manifest.database.file));
  const conn = new pg.Client({ connectionString: opts.databaseUrl });
  await conn.connect();
  const tables = await countRows(conn).finally(() => conn.end());
  const differ = [...new Set([...Object.keys(tables), ...Object.keys(manifest.database.tables)])].filter((t) => tables[t] !== manifest.database.tables[t]);
  if (differ.length) {
    throw new Error(`The restored row counts differ from the manifest in ${differ.map((t) => `${t} (${tables[t] ?? 'absent'} vs ${manifest.database.tables[t] ?? 'absent'})`).join(', ')}.`);
  }
  log(`  ${Object.keys(tables).length} tables, ${Object.values(tables).reduce((a, n) => a + n, 0)} rows, as in the manifest`);

  log(`Putting back ${toRestore.length} objects into bucket ${opts.bucket.bucket} …`);
  await mapLimit(toRestore, PUT_CONCURRENCY, async (o) => {
    const file = path.join(dir, o.file);
    const put = await client.fPutObject(opts.bucket.bucket, o.key, file, o.contentType ? { 'Content-Type': o.contentType } : {});
    const { md5 } = await hashFile(file);
    if (!etagMatches(put.etag?.replace(/"/g, '') ?? null, md5)) throw new Error(`The store reported other bytes for ${o.key} than were sent.`);
  }).catch((error: unknown) => {
    const why = error instanceof Error ? error.message : String(error);
    throw new Error(`${why}\nThe database is loaded but the bucket is not complete; once the cause is fixed, run the restore again with --replace.`);
  });
  const skipped = manifest.objects.items.length - toRestore.length;
  if (skipped) log(`  ${skipped} object(s) written after the snapshot stay in the folder only (no restored row refers to them)`);
  return { manifest, tables, objectsRestored: toRestore.length, objectsSkipped: skipped };
}
