// A phone may send the same entry twice at once: a retry after a timed-out request while the first
// is still being saved, or two open tabs retrying together. Both sends must get the one saved entry.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import type { Actor } from '@/lib/auth/actor';
import { addEntry } from '@/lib/visits/entries';
import { getVisit, startVisit } from '@/lib/visits/service';
import { actorFor, createTestDb, demoEmails, resetToDemo } from '@/tests/helpers/db';
import { createCoolerCircuit } from '@/tests/helpers/registry';

const db = createTestDb();
let tech: Actor;
let circuit: Awaited<ReturnType<typeof createCoolerCircuit>>;

beforeEach(async () => {
  await resetToDemo(db);
  tech = await actorFor(db, demoEmails.technician);
  circuit = await createCoolerCircuit(db);
});
afterAll(async () => {
  await db.destroy();
});

describe('saving one entry twice at the same moment', () => {
  it('answers both sends with the first save and stores it once', async () => {
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    for (let round = 0; round < 5; round += 1) {
      const input = { equipmentId: circuit.condensingUnitId, clientEntryId: randomUUID(), kind: 'note' as const, data: { text: `Same note, round ${round}` } };
      const [a, b] = await Promise.all([addEntry(tech, visit.id, input), addEntry(tech, visit.id, input)]);
      expect(a.id).toBe(b.id);
      expect(a.clientEntryId).toBe(input.clientEntryId);
    }
    const detail = await getVisit(tech, visit.id);
    expect(detail.entries.filter((e) => e.kind === 'note')).toHaveLength(5);
  });

  it('still refuses the same entry id on another visit', async () => {
    const first = await startVisit(tech, { siteId: circuit.siteId, reason: 'maintenance' });
    const input = { equipmentId: circuit.condensingUnitId, clientEntryId: randomUUID(), kind: 'note' as const, data: { text: 'Once' } };
    await addEntry(tech, first.id, input);
    const office = await actorFor(db, demoEmails.office);
    const other = await startVisit(office, { siteId: circuit.siteId, reason: 'inspection' });
    await expect(addEntry(office, other.id, input)).rejects.toMatchObject({ code: 'conflict' });
  });
});
