import type { MissingObject, ObjectState } from '@/lib/ops/backup-manifest';

// Sorts the bucket's objects against the database snapshot of a backup. Pure, so the edge cases
// (same second, a row committed after the snapshot, unknown ages) are unit-tested.

export interface ObjectReference {
  table: string;
  column: string;
  id: string;
  key: string;
}

export interface ListedObjectInfo {
  key: string;
  lastModified: Date | null;
}

export interface Classification {
  states: Map<string, ObjectState>;
  orphanObjects: string[];
  afterSnapshot: string[];
  missingObjects: MissingObject[];
}

/**
 * - referenced: a row in the snapshot names it (restored);
 * - after_snapshot: no snapshot row names it, and either a row committed since does, or it was
 *   written in the snapshot's second or later (an upload whose row came too late for the dump);
 *   kept in the folder, not restored;
 * - orphan: nothing names it and it is older than the snapshot (restored as it was; the photo
 *   check lists it again).
 * S3 reports times to the second, so the snapshot time is taken down to its second: a leftover of
 * that very second counts as later, never the other way round.
 */
export function classifyObjects(
  snapshotRefs: ObjectReference[],
  objects: ListedObjectInfo[],
  snapshotAt: Date,
  referencedNow: ReadonlySet<string>,
): Classification {
  const snapshotKeys = new Set(snapshotRefs.map((r) => r.key));
  const present = new Set(objects.map((o) => o.key));
  const cutoff = Math.floor(snapshotAt.getTime() / 1000) * 1000;
  const states = new Map<string, ObjectState>();
  const orphanObjects: string[] = [];
  const afterSnapshot: string[] = [];
  for (const o of objects) {
    let state: ObjectState;
    if (snapshotKeys.has(o.key)) state = 'referenced';
    else if (referencedNow.has(o.key) || (o.lastModified !== null && o.lastModified.getTime() >= cutoff)) state = 'after_snapshot';
    else state = 'orphan';
    states.set(o.key, state);
    if (state === 'orphan') orphanObjects.push(o.key);
    if (state === 'after_snapshot') afterSnapshot.push(o.key);
  }
  const missingObjects = snapshotRefs.filter((r) => !present.has(r.key)).map(({ table, column, id, key }) => ({ table, column, id, key }));
  return { states, orphanObjects: orphanObjects.sort(), afterSnapshot: afterSnapshot.sort(), missingObjects };
}
