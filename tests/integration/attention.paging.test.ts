// The attention list paged by its keyset cursor is the whole ranked list, in order: units past
// their expected life and nothing else are ordered in SQL and merged with the units ranked in
// JavaScript, so the pages must agree with needsAttention at every boundary (ties on score broken
// by name and id, names differing only in case, a cursor inside the signalled units), with and
// without rows looked ahead.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { attentionPage, needsAttention } from '@/lib/attention/service';
import type { Actor } from '@/lib/auth/actor';
import { actorFor, createTestDb, demoEmails } from '@/tests/helpers/db';
import { demoWithCircuit } from '@/tests/helpers/registry';
import { call, mockAuthModule, session } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());

const db = createTestDb();
let office: Actor;
let owner: Actor;
let stranger: Actor;

beforeAll(async () => {
  const demo = await demoWithCircuit(db);
  ({ office, owner } = demo);
  const { circuit } = demo;
  stranger = await actorFor(db, demoEmails.clientTwo);
  // Twenty condensing units (expected life 20 years) installed 21 to 40 years ago, three of them
  // on the same day (same score: the name and then the id decide), names in mixed case.
  const today = new Date();
  const rows = Array.from({ length: 20 }, (_, i) => {
    const years = i < 3 ? 30 : 21 + i;
    const day = new Date(Date.UTC(today.getUTCFullYear() - years, 0, 15)).toISOString().slice(0, 10);
    const name = ['aged unit', 'Aged unit', 'Aged unit'][i] ?? `Aged unit ${String.fromCharCode(65 + i)}`;
    return { company_id: circuit.companyId, site_id: circuit.siteId, type: 'condensing_unit', name, installed_on: day };
  });
  const inserted = await db.insertInto('equipment').values(rows).returning('id').execute();
  // One aged unit also has an open safety finding: urgent, and never listed twice.
  const tech = await db.selectFrom('users').select('id').where('email', '=', demoEmails.technician).executeTakeFirstOrThrow();
  await db
    .insertInto('follow_ups')
    .values({ company_id: circuit.companyId, site_id: circuit.siteId, equipment_id: inserted[7]!.id, title: 'Guard missing on fan', severity: 'safety', created_by: tech.id })
    .execute();
  await db.insertInto('follow_ups').values({ company_id: circuit.companyId, site_id: circuit.siteId, equipment_id: circuit.evaporatorId, title: 'Heater wire exposed', severity: 'safety', created_by: tech.id }).execute();
});
afterAll(async () => {
  await db.destroy();
});

async function allPages(actor: Actor, limit: number, siteId: string | null = null, lookahead?: number) {
  const seen: string[] = [];
  const totals: (number | null)[] = [];
  let cursor: string | null = null;
  for (let guard = 0; guard < 100; guard++) {
    const page = await attentionPage(actor, { siteId, limit, cursor, lookahead });
    expect(page.items.length).toBeLessThanOrEqual(limit);
    seen.push(...page.items.map((u) => u.equipmentId));
    totals.push(page.total);
    if (!page.nextCursor) return { seen, totals };
    cursor = page.nextCursor;
  }
  throw new Error('the pages never ended');
}

describe('attention list pages', () => {
  it('pages through the same units in the same order as the whole list, for staff and owners', async () => {
    for (const actor of [office, owner]) {
      const whole = await needsAttention(actor);
      expect(whole.length).toBeGreaterThan(20);
      expect(whole.filter((u) => u.equipmentName.toLowerCase().startsWith('aged unit')).length).toBe(20);
      // No lookahead: the units with another reason among the age-ordered rows leave the page
      // short, and the age query is sent again without them.
      for (const lookahead of [undefined, 0]) {
        for (const limit of [1, 3, 7, 100]) {
          const { seen, totals } = await allPages(actor, limit, null, lookahead);
          expect(seen).toEqual(whole.map((u) => u.equipmentId));
          expect(new Set(totals)).toEqual(new Set([whole.length]));
        }
      }
    }
  });

  it('keeps a unit with a signal besides age once, ranked by its highest priority', async () => {
    const first = await attentionPage(office, { limit: 3 });
    const guarded = first.items.find((u) => u.reasons.some((r) => r.text.includes('Guard missing on fan')));
    expect(guarded?.priority).toBe('urgent');
    expect(guarded?.reasons.map((r) => r.kind)).toEqual(['open_safety_finding', 'past_expected_life']);
    const { seen } = await allPages(office, 4);
    expect(seen.filter((id) => id === guarded!.equipmentId)).toHaveLength(1);
  });

  it('orders equal scores by name in code-point order, then id', async () => {
    const whole = await needsAttention(office);
    const tied = whole.filter((u) => /^aged unit$/i.test(u.equipmentName));
    expect(tied.map((u) => u.equipmentName)).toEqual(['Aged unit', 'Aged unit', 'aged unit']);
    expect(tied[0]!.equipmentId < tied[1]!.equipmentId).toBe(true);
  });

  it('gives another client’s owner nothing, and the API refuses a made-up cursor', async () => {
    expect(await attentionPage(stranger, { limit: 5 })).toEqual({ items: [], total: 0, nextCursor: null });
    session.actor = office;
    const route = await import('@/app/api/overview/attention/route');
    const forged = Buffer.from(JSON.stringify({ k: '[2,"x"]', id: '00000000-0000-4000-8000-000000000000' })).toString('base64url');
    expect((await call(route.GET as never, { path: `/api/overview/attention?cursor=${forged}` })).status).toBe(400);
    const withoutTotal = await attentionPage(office, { limit: 2, withTotal: false });
    expect(withoutTotal.total).toBeNull();
    expect(withoutTotal.items).toHaveLength(2);
  });
});
