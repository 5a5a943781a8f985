// Local S3-compatible object store for the embedded setup (dev, test and bench profiles).
//
// @20minutes/s3rver on 127.0.0.1, objects kept on disk in the data directory so they survive
// restarts. The bucket is created at start-up with a CORS configuration that allows GET, PUT,
// POST and HEAD from any origin (the browser uploads with presigned PUTs).
// allowMismatchedSignatures is needed because the AWS SDK v3 signs bucket-level paths with a
// trailing slash that s3rver canonicalises differently (see shared STACK notes, section 4).
// Clients must use requestChecksumCalculation/responseChecksumValidation "WHEN_REQUIRED".
//
// Run: node_modules/.bin/tsx docker-free-scripts/s3-server.ts
//        [--port 4570] [--dir .data/dev/s3] [--bucket rimeline]
// Defaults come from S3_ENDPOINT, S3_BUCKET and RIMELINE_DATA (see env.sh).
import { mkdirSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { portFromUrl } from './port-from-url';

interface S3rverOptions {
  address: string;
  port: number;
  directory: string;
  silent: boolean;
  allowMismatchedSignatures: boolean;
  vhostBuckets: boolean;
  configureBuckets: { name: string; configs: string[] }[];
}
interface S3rverInstance {
  run(): Promise<{ address: string; port: number }>;
  close(): Promise<void>;
}
type S3rverClass = new (options: S3rverOptions) => S3rverInstance;

// The package ships no type declarations; load it through require with the shape we use.
const S3rver = createRequire(import.meta.url)('@20minutes/s3rver') as S3rverClass;

const HOST = '127.0.0.1';

const { values: args } = parseArgs({
  options: {
    port: { type: 'string' },
    dir: { type: 'string' },
    bucket: { type: 'string', multiple: true },
  },
});

const port = Number(args.port ?? portFromUrl(process.env.S3_ENDPOINT) ?? 4570);
const directory = path.resolve(
  args.dir ?? (process.env.RIMELINE_DATA ? path.join(process.env.RIMELINE_DATA, 's3') : '.data/dev/s3'),
);
const buckets = args.bucket && args.bucket.length > 0 ? args.bucket : [process.env.S3_BUCKET ?? 'rimeline'];

const CORS_XML = `<?xml version="1.0" encoding="UTF-8"?>
<CORSConfiguration xmlns="http://s3.amazonaws.com/doc/2006-03-01/">
  <CORSRule>
    <AllowedOrigin>*</AllowedOrigin>
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedMethod>POST</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <MaxAgeSeconds>3000</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>
`;

function log(message: string): void {
  process.stdout.write(`${new Date().toISOString()} ${message}\n`);
}

mkdirSync(directory, { recursive: true });

const server = new S3rver({
  address: HOST,
  port,
  directory,
  silent: true,
  allowMismatchedSignatures: true,
  vhostBuckets: false,
  configureBuckets: buckets.map((name) => ({ name, configs: [CORS_XML] })),
});

let stopping = false;
function shutdown(signal: string): void {
  if (stopping) return;
  stopping = true;
  log(`received ${signal}, stopping`);
  server.close().finally(() => process.exit(0));
  setTimeout(() => process.exit(0), 2000).unref();
}
process.on('SIGTERM', () => shutdown('SIGTERM'));
process.on('SIGINT', () => shutdown('SIGINT'));

server
  .run()
  .then((addr) => {
    log(`S3 fake on http://${addr.address}:${addr.port}, bucket(s) ${buckets.join(', ')}, data in ${directory}`);
  })
  .catch((err: unknown) => {
    log(`S3 fake failed to start: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  });
