// The linter: Next's rules (core web vitals), typescript-eslint, and the import directions of the
// architecture (DEVELOPERS.md): app → lib → db and storage; components never reach the database or
// the object store; lib/calc stays pure; db knows no domain. Formatting is not linted.
import { defineConfig, globalIgnores } from 'eslint/config';
import nextVitals from 'eslint-config-next/core-web-vitals';
import nextTs from 'eslint-config-next/typescript';

const alias = (folder) => [`@/${folder}`, `@/${folder}/*`];
const relative = { group: ['../*'], message: 'Import across folders with the @/ alias.' };

/** no-restricted-imports for one layer: `groups` are alias folders it must not import. */
const forbid = (groups, message, extra = []) => ({
  'no-restricted-imports': ['error', { patterns: [{ group: groups.flatMap(alias), message }, ...extra] }],
});

export default defineConfig([
  ...nextVitals,
  ...nextTs,
  globalIgnores([
    '.next/**',
    '.next-*/**',
    '.data/**',
    'node_modules/**',
    'public/**',
    'next-env.d.ts',
    'db/schema.gen.ts',
    'test-results/**',
  ]),
  {
    rules: {
      // Unused names are errors, except a deliberate `_name` (destructuring out a field, say).
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrorsIgnorePattern: '^_', ignoreRestSiblings: true },
      ],
      // Apostrophes in JSX text render as written; escaping them only makes the copy harder to read.
      'react/no-unescaped-entities': 'off',
      // React Compiler readiness (react-hooks 7). The app does not run the compiler, and these flag
      // working patterns (a ref mirrored during render, a reset in an effect): shown, not fatal.
      'react-hooks/set-state-in-effect': 'warn',
      'react-hooks/refs': 'warn',
      'react-hooks/immutability': 'warn',
    },
  },
  {
    // The house style: only the @/ alias between folders (STYLE.md, rule 23). Tests and scripts run
    // outside Next (Playwright, tsx) and may import their neighbours relatively.
    files: ['app/**', 'components/**', 'lib/**', 'db/**', 'storage/**'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [relative] }],
    },
  },
  {
    // Migrations are typed on Kysely<any> on purpose: frozen in time, independent of schema.gen.ts.
    files: ['db/migrations/**'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    // Offline pages link with plain anchors on purpose: a full page load is what the service worker answers.
    files: ['app/(app)/offline/**'],
    rules: { '@next/next/no-html-link-for-pages': 'off' },
  },
  {
    files: ['lib/**'],
    rules: forbid(['app', 'components'], 'lib/ is below app/ and components/: it never imports them.', [
      relative,
    ]),
  },
  {
    files: ['components/**'],
    rules: forbid(['app', 'db', 'storage'], 'components/ reach data through lib/ (services, hooks, DTOs), never db/, storage/ or app/.', [
      relative,
    ]),
  },
  {
    files: ['lib/calc/**'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^(?!zod(/|$)|@/lib/calc/|\\./)',
              message: 'lib/calc is pure: it imports only itself and zod.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['db/**'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^@/(app|components|storage)(/|$)|^@/lib/(?!env$|logger$)',
              message: 'db/ knows no domain: from lib/ it imports only lib/env and lib/logger.',
            },
            relative,
          ],
        },
      ],
    },
  },
  {
    files: ['storage/**'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^@/(app|components|db)(/|$)|^@/lib/(?!env$|logger$)',
              message: 'storage/ knows no domain: from lib/ it imports only lib/env and lib/logger.',
            },
            relative,
          ],
        },
      ],
    },
  },
]);
