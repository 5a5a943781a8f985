// Every POST, PUT and PATCH route under app/api, called with mutations of its own schema (NUL
// and lone surrogates, 1 MB strings, wrong types, deep nesting, non-finite numbers, extra fields,
// hostile ids and query strings): no answer is a 5xx, every one is a refusal (4xx), and no table
// gains or loses a row. fast-check with a fixed seed and a small run count per route, so the
// file takes seconds per route at most and fails the same way every time.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { sql } from 'kysely';
import { NextRequest } from 'next/server';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { z, type ZodType } from 'zod';
import { actorFor, createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';
import { mockAuthModule, session } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());
const db = createTestDb();
const SEED = 20_261_204;
const RUNS = 20;

type Handler = ((req: NextRequest, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>) & {
  apiOptions?: { body?: ZodType; params?: ZodType; query?: ZodType };
};

/** app/api/**\/route.ts as [file, URL template]. */
function routeFiles(dir = path.resolve('app/api')): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return routeFiles(full);
    return name === 'route.ts' ? [full] : [];
  });
}

const routes = routeFiles()
  .filter((f) => !f.includes('[...nextauth]'))
  .map((file) => ({
    file,
    url: '/' + path.relative(path.resolve('app'), path.dirname(file)).split(path.sep).join('/'),
    methods: (['POST', 'PUT', 'PATCH'] as const).filter((m) => new RegExp(`export const ${m}\\b|as ${m}\\b`).test(readFileSync(file, 'utf8'))),
  }))
  .sort((a, b) => a.url.localeCompare(b.url));

let idPool: string[] = [];

beforeAll(async () => {
  await resetToDemo(db);
  session.actor = await actorFor(db, demoEmails.admin);
  const ids = await sql<{ id: string }>`
    select id::text from clients union all select id::text from sites union all select id::text from areas
    union all select id::text from users union all select id::text from client_contacts union all select id::text from systems`.execute(db);
  idPool = ids.rows.map((r) => r.id);
});
afterAll(async () => {
  await db.destroy();
});

/** Row count of every table, by name, in one statement. */
async function rowCounts(): Promise<Record<string, number>> {
  const rows = await sql<{ t: string; n: string }>`
    select tablename as t,
           (xpath('/row/c/text()', query_to_xml(format('select count(*) as c from %I', tablename), false, true, '')))[1]::text as n
      from pg_tables where schemaname = 'public' order by tablename`.execute(db);
  return Object.fromEntries(rows.rows.map((r) => [r.t, Number(r.n)]));
}

interface JsonSchema {
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
}

function propertiesOf(schema: ZodType | undefined): Record<string, JsonSchema> {
  if (!schema) return {};
  try {
    const json = z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as JsonSchema & { anyOf?: JsonSchema[]; oneOf?: JsonSchema[] };
    const variants = [json, ...(json.anyOf ?? []), ...(json.oneOf ?? [])];
    return Object.assign({}, ...variants.map((v) => v.properties ?? {}));
  } catch {
    return {};
  }
}

// Raw JSON text, so non-finite numbers (1e999 parses to Infinity) and lone surrogates travel as sent.
const hostileText = fc.constantFrom('\\u0000', 'a\\u0000b', '\\ud800', '\\udfffx', '\\u202e\\u0000');
const wrongValue = fc.constantFrom('{}', '[]', '{"a":{"b":[]}}', '[[1],[2]]', '1e999', '-1e999');
const jsonString = (s: string) => JSON.stringify(s);
const deep = (n: number) => '['.repeat(n) + ']'.repeat(n);

type Mutation = { kind: string; body: string };

function mutations(props: Record<string, JsonSchema>): fc.Arbitrary<Mutation> {
  const keys = Object.keys(props);
  const fields = keys.length ? keys : ['name', 'siteId', 'description'];
  const object = (entries: [string, string][]) => `{${entries.map(([k, v]) => `${jsonString(k)}:${v}`).join(',')}}`;
  const everyField = (value: fc.Arbitrary<string>) => fc.tuple(...fields.map(() => value)).map((vals) => fields.map((k, i): [string, string] => [k, vals[i]!]));
  return fc.oneof(
    everyField(hostileText.map((t) => `"${t}"`)).map((e) => ({ kind: 'nul or lone surrogate in every field', body: object(e) })),
    everyField(wrongValue).map((e) => ({ kind: 'wrong type or non-finite number in every field', body: object(e) })),
    fc.constantFrom(...fields).map((k) => ({ kind: '1 MB string', body: object([[k, jsonString('x'.repeat(1_048_576))]]) })),
    fc.tuple(fc.constantFrom(...fields), fc.integer({ min: 40, max: 3000 })).map(([k, n]) => ({ kind: 'deep nesting', body: object([[k, deep(n)]]) })),
    everyField(hostileText.map((t) => `"${t}"`)).map((e) => ({
      kind: 'extra fields with a NUL',
      body: object([...e, ['__proto__', '{"admin":true}'], ['constructor', '{"prototype":{}}'], ['companyId', jsonString(crypto.randomUUID())], ...Array.from({ length: 50 }, (_, i): [string, string] => [`extra${i}`, '"\\u0000"'])]),
    })),
    fc.constantFrom('NaN', 'Infinity', '-Infinity', '{"a":NaN}', '[1,', '"\\u0000"', 'null', '[]', '0').map((raw) => ({ kind: 'not an object', body: raw })),
  );
}

const hostileId = fc.constantFrom('not-an-id', '\u0000', '00000000-0000-0000-0000-000000000000', '../../etc', 'ＡＢＣ', '1 OR 1=1', '%00');
const hostileQuery = fc.constantFrom('?q=%00', '?cursor=%00x', '?siteId=%00', '?limit=NaN&x=%00');
const query = fc.oneof(fc.constant(''), hostileQuery);

describe('route fuzzing', () => {
  it('found the routes', () => {
    expect(routes.flatMap((r) => r.methods).length).toBeGreaterThan(40);
  });

  for (const route of routes) {
    for (const method of route.methods) {
      it(`${method} ${route.url}`, async () => {
        const mod = (await import(/* @vite-ignore */ route.file)) as Record<string, Handler | undefined>;
        const handler = mod[method]!;
        expect(handler).toBeTypeOf('function');
        const options = handler.apiOptions ?? {};
        const paramNames = [...route.url.matchAll(/\[(\w+)\]/g)].map((m) => m[1]!);
        // Routes without a body change state from the id alone: only hostile ids reach them.
        const id = options.body ? fc.oneof(fc.constantFrom(...idPool), hostileId) : hostileId;
        const params = fc.tuple(...paramNames.map(() => id)).map((vals) => Object.fromEntries(paramNames.map((n, i) => [n, vals[i]!])));
        const before = await rowCounts();
        const seen: { kind: string; status: number }[] = [];
        await fc.assert(
          // A body-less route with no id (the photo repair) is valid but for its query string.
          fc.asyncProperty(mutations(propertiesOf(options.body)), params, options.body || paramNames.length ? query : hostileQuery, async (mutation, p, q) => {
            const req = new NextRequest(`http://localhost${route.url}${q}`, { method, body: mutation.body, headers: { 'content-type': 'application/json' } });
            const res = await handler(req, { params: Promise.resolve(p) });
            seen.push({ kind: mutation.kind, status: res.status });
            expect(res.status, `${mutation.kind} ${JSON.stringify(p)} ${q}: ${await res.text()}`).toBeGreaterThanOrEqual(400);
            expect(res.status).toBeLessThan(500);
          }),
          { seed: SEED, numRuns: RUNS, endOnFailure: true },
        );
        expect(await rowCounts()).toEqual(before);
        expect(seen.length).toBe(RUNS);
      });
    }
  }
});
