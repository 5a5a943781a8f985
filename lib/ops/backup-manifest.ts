import { z } from 'zod';

// The manifest of a backup folder (`npm run backup`), read back by `npm run restore`. Written as
// manifest.json beside database.dump and objects/; a restore checks every number in it.

export const MANIFEST_FORMAT = 'rimeline-backup';
export const MANIFEST_VERSION = 1;

const sha256Schema = z.string().regex(/^[0-9a-f]{64}$/, 'a sha256 in lower-case hex');

/** Where an object stands against the database snapshot. */
export const OBJECT_STATES = ['referenced', 'orphan', 'after_snapshot'] as const;
export type ObjectState = (typeof OBJECT_STATES)[number];

export const backupObjectSchema = z.object({
  key: z.string().min(1),
  /** Path inside the backup folder: objects are stored by content (objects/<sha256>). */
  file: z.string().regex(/^objects\/[0-9a-f]{64}$/),
  sha256: sha256Schema,
  size: z.number().int().min(0),
  contentType: z.string().nullable(),
  lastModified: z.string().nullable(),
  state: z.enum(OBJECT_STATES),
});
export type BackupObject = z.infer<typeof backupObjectSchema>;

export const missingObjectSchema = z.object({
  table: z.string(),
  column: z.string(),
  id: z.string(),
  key: z.string(),
});
export type MissingObject = z.infer<typeof missingObjectSchema>;

export const backupManifestSchema = z.object({
  format: z.literal(MANIFEST_FORMAT),
  version: z.literal(MANIFEST_VERSION),
  startedAt: z.string(),
  finishedAt: z.string(),
  source: z.object({
    database: z.string(),
    bucket: z.string(),
    endpoint: z.string(),
  }),
  snapshot: z.object({
    /** The snapshot transaction's start (PostgreSQL's now()): objects from this second on count as later. */
    takenAt: z.string(),
    /** pg_current_snapshot(): xmin:xmax:xip-list of the snapshot pg_dump ran in. */
    txidSnapshot: z.string(),
    serverVersion: z.string(),
  }),
  database: z.object({
    file: z.literal('database.dump'),
    format: z.literal('custom'),
    sha256: sha256Schema,
    bytes: z.number().int().min(0),
    /** Rows per table ("schema.table") in the snapshot, counted in the same transaction as the dump. */
    tables: z.record(z.string(), z.number().int().min(0)),
  }),
  objects: z.object({
    count: z.number().int().min(0),
    bytes: z.number().int().min(0),
    items: z.array(backupObjectSchema),
  }),
  /** Listed, never fatal: the backup holds what was there. */
  problems: z.object({
    /** Objects no row referred to at the snapshot, older than it. Restored as they were. */
    orphanObjects: z.array(z.string()),
    /** Rows in the snapshot whose object was not in the bucket. */
    missingObjects: z.array(missingObjectSchema),
    /** Objects written at or after the snapshot that no snapshot row refers to: kept in the folder, not restored. */
    afterSnapshot: z.array(z.string()),
  }),
});
export type BackupManifest = z.infer<typeof backupManifestSchema>;

/** Parses manifest.json text; the error names what is wrong. */
export function parseManifest(text: string): BackupManifest {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    throw new Error('manifest.json is not valid JSON.');
  }
  const parsed = backupManifestSchema.safeParse(json);
  if (!parsed.success) {
    const issues = parsed.error.issues.slice(0, 5).map((i) => `${i.path.join('.') || '(top)'}: ${i.message}`);
    throw new Error(`manifest.json is not a Rimeline backup manifest (version ${MANIFEST_VERSION}):\n  ${issues.join('\n  ')}`);
  }
  return parsed.data;
}
