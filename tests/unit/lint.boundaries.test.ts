// The import directions of DEVELOPERS.md's architecture, as the linter enforces them: each case is
// a one-line file placed in a folder, linted with the project's own eslint.config.mjs.
import path from 'node:path';
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';

const root = path.resolve(import.meta.dirname, '../..');
const eslint = new ESLint({ cwd: root });

async function blocked(file: string, from: string): Promise<boolean> {
  const code = `import { x } from '${from}';\nexport const y = x;\n`;
  const [result] = await eslint.lintText(code, { filePath: path.join(root, file) });
  return (result?.messages ?? []).some((m) => m.ruleId === 'no-restricted-imports');
}

describe('import boundaries', () => {
  it.each([
    ['lib/sites/example.ts', '@/app/(app)/sites/page'],
    ['lib/sites/example.ts', '@/components/sites/site-card'],
    ['components/sites/example.tsx', '@/db'],
    ['components/sites/example.tsx', '@/db/helpers'],
    ['components/sites/example.tsx', '@/storage/objects'],
    ['lib/calc/example.ts', '@/lib/units/quantities'],
    ['lib/calc/example.ts', 'date-fns'],
    ['lib/calc/example.ts', '../format/dates'],
    ['db/example.ts', '@/lib/auth/access'],
    ['db/example.ts', '@/lib/visits/service'],
    ['db/migrations/2099_01_01_0000_example.ts', '@/lib/sites/schemas'],
    ['storage/example.ts', '@/lib/photos/service'],
    ['lib/sites/example.ts', '../visits/service'],
  ])('%s may not import %s', async (file, from) => {
    expect(await blocked(file, from)).toBe(true);
  });

  it.each([
    ['lib/sites/example.ts', '@/db'],
    ['lib/sites/example.ts', '@/storage/objects'],
    ['components/sites/example.tsx', '@/lib/sites/dto'],
    ['lib/calc/example.ts', '@/lib/calc/units'],
    ['lib/calc/example.ts', './units'],
    ['lib/calc/example.ts', 'zod'],
    ['db/example.ts', '@/lib/env'],
    ['db/example.ts', 'kysely'],
    ['storage/example.ts', '@/lib/env'],
    ['app/api/example/route.ts', '@/lib/sites/service'],
  ])('%s may import %s', async (file, from) => {
    expect(await blocked(file, from)).toBe(false);
  });
});
