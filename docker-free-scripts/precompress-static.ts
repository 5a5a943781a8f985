// After `next build`: writes a brotli copy (name.js.br) beside every script and stylesheet of the
// build's hashed static files, at the highest quality, for server.ts to send to browsers that take
// br (lib/http/precompressed.ts). Hashed names never change content, so this runs once per build.
//   tsx docker-free-scripts/precompress-static.ts [build folder, default $NEXT_DIST_DIR or .next]
import { readdir, readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { promisify } from 'node:util';
import { brotliCompress, constants } from 'node:zlib';
import { PRECOMPRESSED_TYPES } from '@/lib/http/precompressed';

const compress = promisify(brotliCompress);

async function main(): Promise<void> {
  const dist = process.argv[2] ?? process.env.NEXT_DIST_DIR ?? '.next';
  const dir = path.resolve(dist, 'static');
  const files = (await readdir(dir, { recursive: true })).filter((f) => path.extname(f) in PRECOMPRESSED_TYPES).map((f) => path.join(dir, f));
  let plain = 0;
  let packed = 0;
  // zlib's brotli runs on libuv's thread pool: a few at a time keeps every core busy.
  const queue = [...files];
  await Promise.all(
    Array.from({ length: 4 }, async () => {
      for (let f = queue.shift(); f; f = queue.shift()) {
        const body = await readFile(f);
        const br = await compress(body, { params: { [constants.BROTLI_PARAM_QUALITY]: constants.BROTLI_MAX_QUALITY, [constants.BROTLI_PARAM_SIZE_HINT]: body.length } });
        await writeFile(`${f}.br`, br);
        plain += body.length;
        packed += br.length;
      }
    }),
  );
  console.log(`${files.length} files, ${(plain / 1e6).toFixed(1)} MB → ${(packed / 1e6).toFixed(2)} MB brotli`);
}

await main();
