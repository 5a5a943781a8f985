import { sql, type Kysely } from 'kysely';

// Leak work (inspections, repairs, verification tests) becomes an entry kind of its own, so the
// yearly refrigerant record lists them as records rather than as visit reasons.

const withLeak = sql`kind in ('reading', 'finding', 'action', 'setting_change', 'part', 'refrigerant', 'leak', 'condition', 'note', 'photo')`;
const withoutLeak = sql`kind in ('reading', 'finding', 'action', 'setting_change', 'part', 'refrigerant', 'condition', 'note', 'photo')`;

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('entries').dropConstraint('entries_kind_check').execute();
  await db.schema.alterTable('entries').addCheckConstraint('entries_kind_check', withLeak).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  // Entries are never deleted, so a database that already holds leak work cannot go back.
  const held = await db.selectFrom('entries').select(db.fn.countAll<string>().as('n')).where('kind', '=', 'leak').executeTakeFirstOrThrow();
  if (Number(held.n) > 0) throw new Error(`${held.n} leak work entries exist; they are records and are not deleted, so this migration cannot be reverted.`);
  await db.schema.alterTable('entries').dropConstraint('entries_kind_check').execute();
  await db.schema.alterTable('entries').addCheckConstraint('entries_kind_check', withoutLeak).execute();
}
