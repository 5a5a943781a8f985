// The backup's sorting of bucket objects against its database snapshot (lib/ops/classify-objects.ts).
import { describe, expect, it } from 'vitest';
import { classifyObjects, type ObjectReference } from '@/lib/ops/classify-objects';

const ref = (key: string, id = 'p1', column = 'original_key'): ObjectReference => ({ table: 'photos', column, id, key });
const at = (iso: string) => new Date(iso);
const snapshot = at('2026-03-01T10:00:00.700Z');

describe('classifyObjects', () => {
  it('calls an object a row of the snapshot names "referenced", whatever its age', () => {
    const r = classifyObjects([ref('a')], [{ key: 'a', lastModified: at('2026-03-01T11:00:00Z') }], snapshot, new Set());
    expect(r.states.get('a')).toBe('referenced');
    expect(r.orphanObjects).toEqual([]);
    expect(r.afterSnapshot).toEqual([]);
  });

  it('calls an unnamed object older than the snapshot\'s second an orphan', () => {
    const r = classifyObjects([], [{ key: 'old', lastModified: at('2026-03-01T09:59:59Z') }], snapshot, new Set());
    expect(r.states.get('old')).toBe('orphan');
    expect(r.orphanObjects).toEqual(['old']);
  });

  it('counts an unnamed object of the snapshot\'s own second as later (S3 keeps whole seconds)', () => {
    const r = classifyObjects([], [{ key: 'same-second', lastModified: at('2026-03-01T10:00:00Z') }], snapshot, new Set());
    expect(r.states.get('same-second')).toBe('after_snapshot');
    expect(r.afterSnapshot).toEqual(['same-second']);
  });

  it('counts an old object as later when a row committed after the snapshot names it', () => {
    const r = classifyObjects([], [{ key: 'late-row', lastModified: at('2026-03-01T09:00:00Z') }], snapshot, new Set(['late-row']));
    expect(r.states.get('late-row')).toBe('after_snapshot');
    expect(r.orphanObjects).toEqual([]);
  });

  it('treats an object of unknown age as an orphan, so a stuck leftover is still listed', () => {
    const r = classifyObjects([], [{ key: 'ageless', lastModified: null }], snapshot, new Set());
    expect(r.orphanObjects).toEqual(['ageless']);
  });

  it('lists every snapshot row whose object the bucket lacks, with its table, column and id', () => {
    const r = classifyObjects(
      [ref('here', 'p1'), ref('gone-thumb', 'p1', 'thumb_key'), { table: 'visits', column: 'report_key', id: 'v1', key: 'gone-report' }],
      [{ key: 'here', lastModified: null }],
      snapshot,
      new Set(),
    );
    expect(r.missingObjects).toEqual([
      { table: 'photos', column: 'thumb_key', id: 'p1', key: 'gone-thumb' },
      { table: 'visits', column: 'report_key', id: 'v1', key: 'gone-report' },
    ]);
  });
});
