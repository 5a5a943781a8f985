import type { PhotoVariant } from '@/lib/photos/schemas';

// The consistency check's arithmetic, without storage or database: which objects have no photo
// row, and which rows lack an object. Kept pure so its edge cases are unit-tested.

export interface PhotoKeys {
  id: string;
  original_key: string;
  display_key: string;
  thumb_key: string;
}

export interface ListedObject {
  key: string;
  size: number;
  lastModified: Date | null;
}

export interface Comparison {
  /** No row refers to them and they are older than the grace period. */
  orphans: ListedObject[];
  /** No row refers to them yet, but they are recent: an upload may be between its writes. */
  recent: ListedObject[];
  missing: { id: string; missing: PhotoVariant[] }[];
}

/** An upload writes its objects, then its row, within seconds; a quarter of an hour is ample. */
export const ORPHAN_GRACE_MS = 15 * 60_000;

/** Photo objects live under "<companyId>/photos/…"; nothing else in the bucket is ours to judge. */
export function isPhotoObjectKey(key: string): boolean {
  const parts = key.split('/');
  return parts.length >= 3 && parts[1] === 'photos' && parts[0] !== '';
}

export function comparePhotoStorage(rows: PhotoKeys[], objects: ListedObject[], now: Date, graceMs = ORPHAN_GRACE_MS): Comparison {
  const present = new Set(objects.map((o) => o.key));
  const referenced = new Set<string>();
  const missing: Comparison['missing'] = [];
  for (const row of rows) {
    const variants: [PhotoVariant, string][] = [
      ['original', row.original_key],
      ['display', row.display_key],
      ['thumb', row.thumb_key],
    ];
    const gone: PhotoVariant[] = [];
    for (const [variant, key] of variants) {
      referenced.add(key);
      if (!present.has(key)) gone.push(variant);
    }
    if (gone.length) missing.push({ id: row.id, missing: gone });
  }
  const orphans: ListedObject[] = [];
  const recent: ListedObject[] = [];
  for (const o of objects) {
    if (referenced.has(o.key) || !isPhotoObjectKey(o.key)) continue;
    // An unknown age counts as old: the store did not say, and a stuck object must still be found.
    if (o.lastModified && now.getTime() - o.lastModified.getTime() < graceMs) recent.push(o);
    else orphans.push(o);
  }
  return { orphans, recent, missing };
}

/** What a repair will do for a row whose objects are partly or wholly gone. */
export function repairFor(missing: PhotoVariant[]): 'regenerate' | 'restore_original' | 'remove_record' {
  if (!missing.includes('original')) return 'regenerate';
  if (!missing.includes('display')) return 'restore_original';
  return 'remove_record';
}
