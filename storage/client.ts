import 'server-only';
import { S3Client } from '@aws-sdk/client-s3';
import { env } from '@/lib/env';
import { mayLeavePayloadUnsigned } from '@/storage/payload-signing';

const globalForS3 = globalThis as unknown as { rimelineS3?: S3Client };

function createS3(): S3Client {
  const client = new S3Client({
    region: env.S3_REGION,
    endpoint: env.S3_ENDPOINT,
    forcePathStyle: env.S3_FORCE_PATH_STYLE,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
    // Checksums only where S3 requires them: the local fake stores aws-chunked framing otherwise.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    maxAttempts: 2,
  });
  if (mayLeavePayloadUnsigned(env.S3_ENDPOINT)) {
    // A put's body is not hashed into its signature where the connection itself protects it
    // (storage/payload-signing.ts); the signer takes the header's value as the payload hash.
    client.middlewareStack.add(
      (next, context) => (args) => {
        const request = args.request as { headers?: Record<string, string> };
        if (context.commandName === 'PutObjectCommand' && request.headers) request.headers['x-amz-content-sha256'] = 'UNSIGNED-PAYLOAD';
        return next(args);
      },
      { step: 'build', name: 'rimelineUnsignedPutPayload' },
    );
  }
  return client;
}

export const s3: S3Client = globalForS3.rimelineS3 ?? createS3();
globalForS3.rimelineS3 = s3;
export const bucket = env.S3_BUCKET;
