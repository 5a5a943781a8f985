// The database side of backup and restore: one exported snapshot that pg_dump, the row counts and
// the object references all read, and pg_restore into an empty database. Uses the PostgreSQL client
// tools from Debian's server package (the scripts install it), the newest version present.
import { execFile } from 'node:child_process';
import { existsSync, readdirSync } from 'node:fs';
import { promisify } from 'node:util';
import pg from 'pg';
import { OBJECT_KEY_COLUMNS, objectReferencesSql } from '@/lib/ops/object-references';
import type { ObjectReference } from '@/lib/ops/classify-objects';

const run = promisify(execFile);

/** /usr/lib/postgresql/<newest>/bin/<tool>, else the tool on PATH. */
export function pgTool(tool: 'pg_dump' | 'pg_restore'): string {
  const base = '/usr/lib/postgresql';
  const versions = existsSync(base) ? readdirSync(base).filter((v) => /^\d+$/.test(v)).sort((a, b) => Number(b) - Number(a)) : [];
  for (const v of versions) if (existsSync(`${base}/${v}/bin/${tool}`)) return `${base}/${v}/bin/${tool}`;
  return tool;
}

/** The URL without its password (it goes to the child in PGPASSWORD, not on a command line). */
function splitPassword(url: string): { url: string; env: NodeJS.ProcessEnv } {
  const u = new URL(url);
  const password = decodeURIComponent(u.password);
  u.password = '';
  return { url: u.toString(), env: password ? { ...process.env, PGPASSWORD: password } : process.env };
}

export function databaseName(url: string): string {
  return decodeURIComponent(new URL(url).pathname.replace(/^\//, ''));
}

async function toolMajor(tool: string): Promise<number> {
  const { stdout } = await run(tool, ['--version']);
  const m = /(\d+)(?:\.\d+)?/.exec(stdout);
  if (!m) throw new Error(`Could not read the version of ${tool}: ${stdout.trim()}`);
  return Number(m[1]);
}

export interface Snapshot {
  client: pg.Client;
  id: string;
  takenAt: Date;
  txidSnapshot: string;
  serverVersion: string;
  serverMajor: number;
}

/** Opens a read-only repeatable-read transaction and exports its snapshot; close it with endSnapshot. */
export async function openSnapshot(url: string): Promise<Snapshot> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    await client.query('begin isolation level repeatable read read only');
    const r = await client.query<{ taken_at: Date; txid_snapshot: string; id: string; version: string; num: string }>(
      `select now() as taken_at, pg_current_snapshot()::text as txid_snapshot, pg_export_snapshot() as id,
              current_setting('server_version') as version, current_setting('server_version_num') as num`,
    );
    const row = r.rows[0]!;
    return { client, id: row.id, takenAt: row.taken_at, txidSnapshot: row.txid_snapshot, serverVersion: row.version, serverMajor: Math.floor(Number(row.num) / 10000) };
  } catch (error) {
    await client.end().catch(() => undefined);
    throw error;
  }
}

export async function endSnapshot(s: Snapshot): Promise<void> {
  await s.client.query('rollback').catch(() => undefined);
  await s.client.end();
}

const USER_TABLES = `
  select n.nspname as schema, c.relname as name
  from pg_class c join pg_namespace n on n.oid = c.relnamespace
  where c.relkind in ('r', 'p') and n.nspname not like 'pg\\_%' and n.nspname <> 'information_schema'
  order by 1, 2`;

const quote = (id: string) => `"${id.replace(/"/g, '""')}"`;

/** Rows per "schema.table", every user table (the migration tables too). */
export async function countRows(client: pg.Client | pg.PoolClient): Promise<Record<string, number>> {
  const tables = await client.query<{ schema: string; name: string }>(USER_TABLES);
  const counts: Record<string, number> = {};
  for (const t of tables.rows) {
    const r = await client.query<{ n: string }>(`select count(*)::int8 as n from ${quote(t.schema)}.${quote(t.name)}`);
    counts[`${t.schema}.${t.name}`] = Number(r.rows[0]!.n);
  }
  return counts;
}

/** Every object key a row names (see lib/ops/object-references.ts). */
export async function objectReferences(client: pg.Client): Promise<ObjectReference[]> {
  const cols = await client.query<{ t: string; c: string }>(
    `select table_name as t, column_name as c from information_schema.columns where table_schema = 'public' and (table_name, column_name) in (${OBJECT_KEY_COLUMNS.map((_, i) => `($${2 * i + 1}, $${2 * i + 2})`).join(', ')})`,
    OBJECT_KEY_COLUMNS.flatMap((c) => [c.table, c.column]),
  );
  const sql = objectReferencesSql(new Set(cols.rows.map((r) => `${r.t}.${r.c}`)));
  if (!sql) return [];
  return (await client.query<ObjectReference>(sql)).rows;
}

/** The keys rows name right now (outside the snapshot): tells a late row's objects from orphans. */
export async function currentReferences(url: string): Promise<Set<string>> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return new Set((await objectReferences(client)).map((r) => r.key));
  } finally {
    await client.end();
  }
}

/** pg_dump in custom format inside the exported snapshot. */
export async function dumpSnapshot(url: string, snapshot: Snapshot, file: string): Promise<void> {
  const tool = pgTool('pg_dump');
  const major = await toolMajor(tool);
  if (major < snapshot.serverMajor) {
    throw new Error(`${tool} is version ${major} but the server runs PostgreSQL ${snapshot.serverVersion}; install the client tools of version ${snapshot.serverMajor} or newer.`);
  }
  const target = splitPassword(url);
  await run(tool, ['--format=custom', `--snapshot=${snapshot.id}`, `--file=${file}`, '--no-password', `--dbname=${target.url}`], {
    env: target.env,
    maxBuffer: 16 * 1024 * 1024,
  });
}

export interface DatabaseState {
  exists: boolean;
  tables: Record<string, number>;
}

/** Whether the database exists, and its tables with their row counts. */
export async function databaseState(url: string): Promise<DatabaseState> {
  const client = new pg.Client({ connectionString: url });
  try {
    await client.connect();
  } catch (error) {
    if ((error as { code?: string }).code === '3D000') return { exists: false, tables: {} };
    throw error;
  }
  try {
    return { exists: true, tables: await countRows(client) };
  } finally {
    await client.end();
  }
}

/** CREATE DATABASE through the server's maintenance database. */
export async function createDatabase(url: string): Promise<void> {
  const admin = new URL(url);
  const name = databaseName(url);
  admin.pathname = '/postgres';
  const client = new pg.Client({ connectionString: admin.toString() });
  await client.connect();
  try {
    await client.query(`create database ${quote(name)}`);
  } finally {
    await client.end();
  }
}

/** --replace: drops every user schema with what is in it and gives back an empty public schema. */
export async function wipeDatabase(url: string): Promise<void> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    // A running app holding locks makes this wait; say so instead of hanging.
    await client.query(`set lock_timeout = '15s'`);
    await client.query('begin');
    const schemas = await client.query<{ name: string }>(`select nspname as name from pg_namespace where nspname not like 'pg\\_%' and nspname <> 'information_schema'`);
    for (const s of schemas.rows) await client.query(`drop schema ${quote(s.name)} cascade`);
    await client.query('create schema public');
    await client.query('commit');
  } catch (error) {
    await client.query('rollback').catch(() => undefined);
    if ((error as { code?: string }).code === '55P03') {
      throw new Error(`The ${databaseName(url)} database is in use (something holds its tables): stop the app that uses it, then run the restore again.`);
    }
    throw error;
  } finally {
    await client.end();
  }
}

/** pg_restore of the whole dump in one transaction: it loads completely or not at all. */
export async function restoreDump(url: string, file: string): Promise<void> {
  const target = splitPassword(url);
  await run(pgTool('pg_restore'), ['--no-owner', '--no-acl', '--exit-on-error', '--single-transaction', '--no-password', `--dbname=${target.url}`, file], {
    env: target.env,
    maxBuffer: 16 * 1024 * 1024,
  });
}
