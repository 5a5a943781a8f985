import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

// API routes skip proxy.ts (see its matcher), so the wrapper in lib/api/handler.ts is what gives
// them the address check, the request id and the security headers. A route file that exported a
// bare handler would answer without them; this walk keeps every new route on the wrapper.

const apiDir = path.join(process.cwd(), 'app/api');
// These two still pass through the proxy (its matcher names them; security.api-wrapper.test.ts checks that).
const throughProxy = new Set(['auth/[...nextauth]/route.ts', 'health/route.ts']);

function routeFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return routeFiles(full);
    return entry.name === 'route.ts' ? [path.relative(apiDir, full)] : [];
  });
}

const METHOD_EXPORT = /export\s+(?:const|async\s+function|function)\s+(GET|HEAD|POST|PUT|PATCH|DELETE|OPTIONS)\b([^\n]*)/g;

describe('every API route answers through the wrapper', () => {
  const files = routeFiles(apiDir);

  it('finds the route files', () => {
    expect(files.length).toBeGreaterThan(40);
    for (const name of throughProxy) expect(files).toContain(name);
  });

  it.each(files.filter((f) => !throughProxy.has(f)))('%s', (file) => {
    const source = readFileSync(path.join(apiDir, file), 'utf8');
    expect(source, 'imports withApi or apiRoute').toMatch(/import\s*\{[^}]*\b(withApi|apiRoute)\b[^}]*\}\s*from\s*'@\/lib\/api\/handler'/);
    // Each method is a wrapped value: `export const GET = withApi(…)` or a name bound to one,
    // never a plain function declaration.
    for (const match of source.matchAll(METHOD_EXPORT)) {
      expect(match[0], `${match[1]} is not a bare function`).not.toMatch(/function/);
    }
  });
});
