// The object-store side of backup and restore, with the `minio` client: its listing and its
// file-based get and put copy objects to and from disk without holding them in memory. Reads the
// app's S3_* variables, so the same code copies the local S3 fake and a real bucket.
import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import * as Minio from 'minio';

export interface BucketConfig {
  endpoint: string | null;
  region: string;
  bucket: string;
  accessKey: string;
  secretKey: string;
  pathStyle: boolean;
}

export function bucketConfigFromEnv(env: NodeJS.ProcessEnv = process.env): BucketConfig {
  const bucket = env.S3_BUCKET;
  if (!bucket) throw new Error('S3_BUCKET is not set: say which bucket to copy (env.sh sets it for a local profile).');
  return {
    endpoint: env.S3_ENDPOINT || null,
    region: env.S3_REGION || 'us-east-1',
    bucket,
    accessKey: env.S3_ACCESS_KEY_ID ?? '',
    secretKey: env.S3_SECRET_ACCESS_KEY ?? '',
    pathStyle: env.S3_FORCE_PATH_STYLE === 'true' || env.S3_FORCE_PATH_STYLE === '1',
  };
}

export function describeBucket(c: BucketConfig): string {
  return `bucket ${c.bucket} at ${c.endpoint ?? `AWS S3 (${c.region})`}`;
}

export function bucketClient(c: BucketConfig): Minio.Client {
  // No endpoint means AWS itself, as the app's S3 client does without S3_ENDPOINT.
  const url = new URL(c.endpoint ?? 'https://s3.amazonaws.com');
  return new Minio.Client({
    endPoint: url.hostname,
    ...(url.port ? { port: Number(url.port) } : {}),
    useSSL: url.protocol === 'https:',
    accessKey: c.accessKey,
    secretKey: c.secretKey,
    region: c.region,
    pathStyle: c.pathStyle,
  });
}

export interface BucketObject {
  key: string;
  size: number;
  lastModified: Date | null;
  etag: string | null;
}

/** Every object of the bucket (the client follows continuation itself). */
export async function listAll(client: Minio.Client, bucket: string): Promise<BucketObject[]> {
  const out: BucketObject[] = [];
  const stream = client.listObjects(bucket, '', true);
  for await (const item of stream) {
    if (!item.name) continue; // prefixes only appear in non-recursive listings
    out.push({ key: item.name, size: item.size ?? 0, lastModified: item.lastModified ?? null, etag: item.etag ? item.etag.replace(/"/g, '') : null });
  }
  return out.sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
}

/** sha256 and md5 of a file, read once. */
export async function hashFile(file: string): Promise<{ sha256: string; md5: string; size: number }> {
  const sha = createHash('sha256');
  const md5 = createHash('md5');
  let size = 0;
  for await (const chunk of createReadStream(file)) {
    sha.update(chunk as Buffer);
    md5.update(chunk as Buffer);
    size += (chunk as Buffer).length;
  }
  return { sha256: sha.digest('hex'), md5: md5.digest('hex'), size };
}

/** A single-part upload's ETag is the MD5 of its bytes; multipart ETags ("…-N") say nothing checkable. */
export function etagMatches(etag: string | null, md5: string): boolean {
  if (!etag || !/^[0-9a-f]{32}$/i.test(etag)) return true;
  return etag.toLowerCase() === md5;
}

export function isNotFound(error: unknown): boolean {
  const code = (error as { code?: string } | null)?.code;
  return code === 'NoSuchKey' || code === 'NotFound' || code === 'NoSuchBucket';
}
