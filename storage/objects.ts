import 'server-only';
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
} from '@aws-sdk/client-s3';
import { randomUUID } from 'node:crypto';
import { bucket, s3 } from '@/storage/client';

/** Keys carry the company first and a random id last, so they are never guessable. */
export function objectKey(companyId: string, ...parts: string[]): string {
  return [companyId, ...parts, randomUUID()].join('/');
}

export async function putObject(key: string, body: Buffer | Uint8Array, contentType: string): Promise<void> {
  await s3.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: body, ContentType: contentType, ContentLength: body.byteLength }));
}

export async function getObjectBytes(key: string): Promise<Uint8Array> {
  const res = await s3.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
  if (!res.Body) throw new Error(`Object ${key} has no body`);
  return res.Body.transformToByteArray();
}

export async function deleteObject(key: string): Promise<void> {
  await s3.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
}

export async function checkBucket(): Promise<void> {
  await s3.send(new HeadBucketCommand({ Bucket: bucket }));
}

/** Creates the bucket when missing (embedded setup); a managed bucket already exists. */
export async function ensureBucket(): Promise<void> {
  try {
    await checkBucket();
  } catch {
    await s3.send(new CreateBucketCommand({ Bucket: bucket }));
  }
}

export interface StoredObject {
  key: string;
  size: number;
  lastModified: Date | null;
}

/** Every object under a prefix, following continuation tokens. */
export async function listObjects(prefix: string): Promise<StoredObject[]> {
  const out: StoredObject[] = [];
  let token: string | undefined;
  do {
    const res = await s3.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: prefix, ContinuationToken: token, MaxKeys: 1000 }));
    for (const o of res.Contents ?? []) {
      if (o.Key) out.push({ key: o.Key, size: o.Size ?? 0, lastModified: o.LastModified ?? null });
    }
    token = res.IsTruncated ? res.NextContinuationToken : undefined;
  } while (token);
  return out;
}

/** Size and type of an object, or null when it does not exist. */
export async function headObject(key: string): Promise<{ size: number; contentType: string | null } | null> {
  try {
    const res = await s3.send(new HeadObjectCommand({ Bucket: bucket, Key: key }));
    return { size: res.ContentLength ?? 0, contentType: res.ContentType ?? null };
  } catch (error) {
    if (storageErrorKind(error) === 'not_found') return null;
    throw error;
  }
}

/** An object as a web stream, for route handlers that pass the bytes on after an access check. */
export async function getObjectStream(key: string): Promise<{ body: ReadableStream; contentType: string | null; contentLength: number | null }> {
  const res = await s3.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
  if (!res.Body) throw new Error(`Object ${key} has no body`);
  return { body: res.Body.transformToWebStream(), contentType: res.ContentType ?? null, contentLength: res.ContentLength ?? null };
}

/** Sorts S3 failures into "no such object", "store unreachable or failing" and anything else. */
export function storageErrorKind(error: unknown): 'not_found' | 'unavailable' | 'other' {
  const e = error as { name?: string; code?: string; $metadata?: { httpStatusCode?: number }; cause?: { code?: string } } | null;
  if (!e || typeof e !== 'object') return 'other';
  const status = e.$metadata?.httpStatusCode;
  if (e.name === 'NoSuchKey' || e.name === 'NotFound' || status === 404) return 'not_found';
  const code = e.code ?? e.cause?.code;
  if (
    (code && ['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENOTFOUND', 'EPIPE', 'EAI_AGAIN'].includes(code)) ||
    e.name === 'TimeoutError' ||
    (status !== undefined && status >= 500)
  ) {
    return 'unavailable';
  }
  return 'other';
}
