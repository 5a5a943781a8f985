import 'server-only';
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  PutObjectCommand,
} from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
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

export function presignDownload(key: string, filename?: string, expiresIn = 300): Promise<string> {
  return getSignedUrl(
    s3,
    new GetObjectCommand({
      Bucket: bucket,
      Key: key,
      ...(filename ? { ResponseContentDisposition: `attachment; filename="${filename.replace(/"/g, '')}"` } : {}),
    }),
    { expiresIn },
  );
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
