// Reading a backup's manifest.json (lib/ops/backup-manifest.ts): a wrong file is refused with a reason.
import { describe, expect, it } from 'vitest';
import { parseManifest } from '@/lib/ops/backup-manifest';

const sha = 'a'.repeat(64);
const good = {
  format: 'rimeline-backup',
  version: 1,
  startedAt: '2026-03-01T10:00:00.000Z',
  finishedAt: '2026-03-01T10:00:05.000Z',
  source: { database: 'database rimeline on 127.0.0.1:54329', bucket: 'rimeline', endpoint: 'http://127.0.0.1:4570' },
  snapshot: { takenAt: '2026-03-01T10:00:00.100Z', txidSnapshot: '800:800:', serverVersion: '17.6' },
  database: { file: 'database.dump', format: 'custom', sha256: sha, bytes: 1000, tables: { 'public.companies': 1 } },
  objects: { count: 1, bytes: 3, items: [{ key: 'c/photos/e/p/original/u', file: `objects/${sha}`, sha256: sha, size: 3, contentType: 'image/jpeg', lastModified: null, state: 'referenced' }] },
  problems: { orphanObjects: [], missingObjects: [], afterSnapshot: [] },
};

describe('parseManifest', () => {
  it('reads a manifest as the backup writes it', () => {
    expect(parseManifest(JSON.stringify(good))).toEqual(good);
  });

  it('refuses text that is not JSON', () => {
    expect(() => parseManifest('{ nope')).toThrow('manifest.json is not valid JSON.');
  });

  it('names the field that is wrong', () => {
    const bad = { ...good, database: { ...good.database, tables: { 'public.companies': -1 } } };
    expect(() => parseManifest(JSON.stringify(bad))).toThrow(/database\.tables\.public\.companies/);
  });

  it('refuses an object file outside objects/ (a restore reads only what it wrote)', () => {
    const bad = { ...good, objects: { ...good.objects, items: [{ ...good.objects.items[0], file: '../../etc/passwd' }] } };
    expect(() => parseManifest(JSON.stringify(bad))).toThrow(/objects\.items\.0\.file/);
  });
});
