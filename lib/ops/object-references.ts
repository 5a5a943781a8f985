// Which columns hold object-store keys. The database keeps keys, never URLs (see storage/); a new
// column that names an object belongs here, or a backup calls its objects orphans.
// photos.upload_key is an idempotency key, not an object.
export const OBJECT_KEY_COLUMNS: readonly { table: string; column: string }[] = [
  { table: 'photos', column: 'original_key' },
  { table: 'photos', column: 'display_key' },
  { table: 'photos', column: 'thumb_key' },
  { table: 'print_runs', column: 'pdf_key' },
  { table: 'visits', column: 'report_key' },
];

/** One SQL statement listing (table, column, id, key) for every non-null key column present. */
export function objectReferencesSql(present: ReadonlySet<string>): string | null {
  const parts = OBJECT_KEY_COLUMNS.filter((c) => present.has(`${c.table}.${c.column}`)).map(
    (c) => `select '${c.table}' as "table", '${c.column}' as "column", id::text as id, "${c.column}" as key from public."${c.table}" where "${c.column}" is not null`,
  );
  return parts.length ? parts.join('\nunion all\n') : null;
}
