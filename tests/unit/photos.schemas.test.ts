// Upload fields, list filters and the storage check's comparison.
import { describe, expect, it } from 'vitest';
import { comparePhotoStorage, isPhotoObjectKey, repairFor } from '@/lib/photos/compare';
import { cleanFileName, listPhotosQuerySchema, updatePhotoSchema, uploadPhotoFieldsSchema } from '@/lib/photos/schemas';

describe('upload fields', () => {
  it('needs a known kind; an empty caption is no caption', () => {
    expect(uploadPhotoFieldsSchema.parse({ kind: 'nameplate', caption: '  ' })).toEqual({ kind: 'nameplate', caption: null });
    expect(uploadPhotoFieldsSchema.parse({ kind: 'corrosion', caption: ' Coil fins, east side ' }).caption).toBe('Coil fins, east side');
    expect(uploadPhotoFieldsSchema.safeParse({ kind: 'selfie' }).success).toBe(false);
    expect(uploadPhotoFieldsSchema.safeParse({}).success).toBe(false);
    expect(uploadPhotoFieldsSchema.safeParse({ kind: 'damage', caption: 'x'.repeat(501) }).success).toBe(false);
    expect(uploadPhotoFieldsSchema.safeParse({ kind: 'damage', uploadKey: 'not-a-uuid' }).success).toBe(false);
  });

  it('an edit must change something', () => {
    expect(updatePhotoSchema.safeParse({}).success).toBe(false);
    expect(updatePhotoSchema.parse({ caption: '' })).toEqual({ caption: null });
    expect(updatePhotoSchema.parse({ kind: 'after' })).toEqual({ kind: 'after' });
  });

  it('list filters take one kind or several', () => {
    expect(listPhotosQuerySchema.parse({ kind: 'wiring' }).kind).toEqual(['wiring']);
    expect(listPhotosQuerySchema.parse({ kind: ['before', 'after'] }).kind).toEqual(['before', 'after']);
    expect(listPhotosQuerySchema.parse({}).kind).toEqual([]);
    expect(listPhotosQuerySchema.safeParse({ kind: 'other' }).success).toBe(false);
    expect(listPhotosQuerySchema.safeParse({ limit: '500' }).success).toBe(false);
  });

  it('file names lose control characters, quotes and folders', () => {
    expect(cleanFileName('roof/"unit"\u0000 7.jpg')).toBe('roofunit 7.jpg');
    expect(cleanFileName('')).toBeNull();
    expect(cleanFileName('a'.repeat(300) + '.jpg')!.length).toBe(200);
  });
});

describe('storage comparison', () => {
  const now = new Date('2026-12-01T12:00:00Z');
  const old = new Date('2026-12-01T10:00:00Z');
  const fresh = new Date('2026-12-01T11:59:00Z');
  const row = (id: string) => ({ id, original_key: `c/photos/e/${id}/original/k`, display_key: `c/photos/e/${id}/display/k`, thumb_key: `c/photos/e/${id}/thumb/k` });
  const obj = (key: string, lastModified: Date | null = old) => ({ key, size: 10, lastModified });

  it('finds objects with no row, sparing recent ones and other kinds of object', () => {
    const a = row('a');
    const result = comparePhotoStorage(
      [a],
      [obj(a.original_key), obj(a.display_key), obj(a.thumb_key), obj('c/photos/e/x/original/k'), obj('c/photos/e/y/original/k', fresh), obj('c/reports/r.pdf'), obj('c/photos/e/z/thumb/k', null)],
      now,
    );
    expect(result.orphans.map((o) => o.key)).toEqual(['c/photos/e/x/original/k', 'c/photos/e/z/thumb/k']);
    expect(result.recent.map((o) => o.key)).toEqual(['c/photos/e/y/original/k']);
    expect(result.missing).toEqual([]);
  });

  it('finds rows with missing objects and says how each is repaired', () => {
    const a = row('a');
    const b = row('b');
    const c = row('c');
    const result = comparePhotoStorage([a, b, c], [obj(a.original_key), obj(b.display_key), obj(b.thumb_key)], now);
    expect(result.missing).toEqual([
      { id: 'a', missing: ['display', 'thumb'] },
      { id: 'b', missing: ['original'] },
      { id: 'c', missing: ['original', 'display', 'thumb'] },
    ]);
    expect(result.missing.map((m) => repairFor(m.missing))).toEqual(['regenerate', 'restore_original', 'remove_record']);
  });

  it('knows a photo key by its layout', () => {
    expect(isPhotoObjectKey('5f0c/photos/e/p/original/r')).toBe(true);
    expect(isPhotoObjectKey('5f0c/labels/run.pdf')).toBe(false);
    expect(isPhotoObjectKey('/photos/x')).toBe(false);
  });
});
