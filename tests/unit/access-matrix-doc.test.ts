// DEVELOPERS.md states the access matrix; it must be the one the server enforces.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { renderAccessMatrix } from '@/lib/auth/matrix-doc';

describe('DEVELOPERS.md access matrix', () => {
  it('matches lib/auth/permissions.ts (regenerate with npm run docs:access-matrix)', () => {
    const doc = readFileSync(path.resolve(import.meta.dirname, '../../DEVELOPERS.md'), 'utf8');
    const block = /<!-- access-matrix:start -->\n([\s\S]*?)\n<!-- access-matrix:end -->/.exec(doc)?.[1];
    expect(block).toBeDefined();
    expect(block!.trim()).toBe(renderAccessMatrix());
  });
});
