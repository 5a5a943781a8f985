import { mkdtempSync, mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { acceptsBrotli, precompressedFor } from '@/lib/http/precompressed';

let root: string;
let staticDir: string;

beforeAll(() => {
  root = mkdtempSync(path.join(tmpdir(), 'rl-static-'));
  staticDir = path.join(root, 'static');
  mkdirSync(path.join(staticDir, 'chunks'), { recursive: true });
  writeFileSync(path.join(staticDir, 'chunks', 'a.js'), 'console.log(1)');
  writeFileSync(path.join(staticDir, 'chunks', 'a.js.br'), 'xx');
  writeFileSync(path.join(staticDir, 'chunks', 'b.css'), 'p{}');
  writeFileSync(path.join(staticDir, 'chunks', 'b.css.br'), 'y');
  writeFileSync(path.join(staticDir, 'chunks', 'plain.js'), 'no brotli copy');
  writeFileSync(path.join(staticDir, 'chunks', 'font.woff2.br'), 'z');
  writeFileSync(path.join(staticDir, 'chunks', 'font.woff2'), 'z');
  // Outside the static folder: must never be reachable.
  writeFileSync(path.join(root, 'secret.js'), 'secret');
  writeFileSync(path.join(root, 'secret.js.br'), 'secret');
});

describe('Accept-Encoding (RFC 9110 §12.5.3)', () => {
  it.each([
    ['gzip, deflate, br, zstd', true],
    ['br;q=0.5, gzip', true],
    ['br;q=0, gzip', false],
    ['gzip, deflate', false],
    ['*', true],
    ['', false],
    [undefined, false],
  ])('%s → %s', (header, expected) => {
    expect(acceptsBrotli(header)).toBe(expected);
  });
});

describe('precompressedFor', () => {
  it('finds the brotli copy of a script and a stylesheet, with their types and sizes', async () => {
    await expect(precompressedFor('/_next/static/chunks/a.js', 'gzip, br', staticDir)).resolves.toEqual({
      file: path.join(staticDir, 'chunks', 'a.js.br'),
      bytes: 2,
      contentType: 'application/javascript; charset=UTF-8',
    });
    await expect(precompressedFor('/_next/static/chunks/b.css?v=1', 'br', staticDir)).resolves.toMatchObject({ contentType: 'text/css; charset=UTF-8', bytes: 1 });
  });

  it.each([
    ['a browser that does not take br', '/_next/static/chunks/a.js', 'gzip'],
    ['a file without a brotli copy', '/_next/static/chunks/plain.js', 'br'],
    ['a missing file', '/_next/static/chunks/none.js', 'br'],
    ['a type the build does not compress', '/_next/static/chunks/font.woff2', 'br'],
    ['a path outside /_next/static/', '/chunks/a.js', 'br'],
    ['a path that climbs out', '/_next/static/../secret.js', 'br'],
    ['an encoded climb', '/_next/static/%2e%2e/secret.js', 'br'],
    ['a malformed escape', '/_next/static/%E0%A4%A.js', 'br'],
  ])('leaves %s to the framework', async (_what, url, accept) => {
    await expect(precompressedFor(url, accept, staticDir)).resolves.toBeNull();
  });
});
