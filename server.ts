// The app's HTTP server: Next's own request handler behind two changes to what goes over the wire
// (`next start` gzips everything, on every request):
// - the build's brotli copies of its hashed scripts and stylesheets, compressed once at the highest
//   quality (lib/http/precompressed.ts, docker-free-scripts/precompress-static.ts);
// - brotli (or gzip, for a client without it) for pages and API answers through the compression
//   middleware; brotli's window also folds the stylesheet a page carries twice (in its head and in
//   its data for the client router, next.config.ts inlineCss), which gzip's 32 kB window cannot.
// A phone's first load of a scanned unit fetches about 14 % fewer script bytes.
//   node --import tsx server.ts [-H host] [-p port]      (after rl_build: next build + precompress)
import { createReadStream } from 'node:fs';
import { createServer } from 'node:http';
import path from 'node:path';
import { parseArgs } from 'node:util';
import compression from 'compression';
import next from 'next';
import nextConfig from './next.config';
import { staticSecurityHeaders } from '@/lib/api/security-headers';
import { precompressedFor } from '@/lib/http/precompressed';
import { COMPRESS_FROM_BYTES, sendsSmallAnswer } from '@/lib/http/small-answers';

const { values } = parseArgs({
  options: { hostname: { type: 'string', short: 'H', default: '127.0.0.1' }, port: { type: 'string', short: 'p', default: '3000' } },
});
const hostname = values.hostname;
const port = Number(values.port);
const staticDir = path.resolve(nextConfig.distDir ?? '.next', 'static');

const app = next({ dev: false, hostname, port });
const handle = app.getRequestHandler();
// Small API answers say so (lib/http/small-answers.ts) and go out as they are.
const compress = compression({ threshold: COMPRESS_FROM_BYTES, filter: (req, res) => !sendsSmallAnswer(res) && compression.filter(req, res) });
await app.prepare();

const server = createServer((req, res) => {
  const method = req.method ?? 'GET';
  const wanted = method === 'GET' || method === 'HEAD' ? precompressedFor(req.url ?? '/', req.headers['accept-encoding'], staticDir) : Promise.resolve(null);
  wanted
    .then((hit) => {
      if (!hit) {
        compress(req, res, () => void handle(req, res));
        return;
      }
      res.writeHead(200, {
        ...staticSecurityHeaders,
        'Content-Type': hit.contentType,
        'Content-Encoding': 'br',
        'Content-Length': hit.bytes,
        // What Next sends for these files: their names change with their content.
        'Cache-Control': 'public, max-age=31536000, immutable',
        Vary: 'Accept-Encoding',
      });
      if (method === 'HEAD') return void res.end();
      createReadStream(hit.file)
        .on('error', (error) => res.destroy(error))
        .pipe(res);
    })
    .catch((error: unknown) => {
      console.error('request failed before the app could answer', error);
      if (!res.headersSent) res.writeHead(500);
      res.end();
    });
});

server.listen(port, hostname, () => console.log(`Rimeline listening on http://${hostname}:${port}`));

// As `next start` does: finish open responses, then leave.
for (const signal of ['SIGTERM', 'SIGINT'] as const) {
  process.on(signal, () => {
    server.close(() => process.exit(0));
    setTimeout(() => process.exit(0), 5_000).unref();
  });
}
