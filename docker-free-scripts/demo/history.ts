// The demo's history: the refrigeration plant on every demo site, fifteen months of visits with
// readings, settings, findings, follow-ups, parts, refrigerant and leak work, a tag sheet and
// blank tags, photos and service requests from the owners, all dated back from "now" so the demo
// stays fresh. Everything goes through the app's services (see history/recorder.ts), so what the
// app computes and stores is its own. Loaded by `npm run db:seed` with a fresh demo only; the test
// scenario (resetToDemo) stays empty of equipment.
import { sql, type Kysely } from 'kysely';
import type { DB } from '@/db/schema.gen';
import { DEMO_COMPANY, demoUsers } from '@/docker-free-scripts/demo/scenario';
import { loadActor } from '@/docker-free-scripts/demo/history/actors';
import { addMinutes, daysBefore, siteTime } from '@/docker-free-scripts/demo/history/clock';
import { demoPlant } from '@/docker-free-scripts/demo/history/plant';
import { seededRandom } from '@/docker-free-scripts/demo/history/readings';
import type { DemoState, VisitLog } from '@/docker-free-scripts/demo/history/recorder';
import { writeStory } from '@/docker-free-scripts/demo/history/story';
import { addRelation, createEquipment } from '@/lib/equipment/service';
import { createEquipmentSchema, createRelationSchema } from '@/lib/equipment/schemas';
import { localDate } from '@/lib/format/dates';
import { addDays } from '@/lib/plans/days';
import { createPlanSchema } from '@/lib/plans/schemas';
import { createPlan } from '@/lib/plans/service';
import { createSystemSchema } from '@/lib/systems/schemas';
import { createRequest, updateRequest } from '@/lib/requests/service';
import { createRequestSchema, updateRequestSchema } from '@/lib/requests/schemas';
import { createSystem } from '@/lib/systems/service';
import { createPrintRun } from '@/lib/tags/print-runs';
import { attachTag } from '@/lib/tags/service';
import { createPrintRunSchema } from '@/lib/tags/schemas';

export interface HistoryCounts {
  systems: number;
  equipment: number;
  visits: number;
  photos: number;
  tags: number;
  requests: number;
}

/** The site whose equipment carries printed tags in the demo, so scanning a label works. */
export const TAGGED_SITE = 'Pell Street Kitchen';
const BLANK_TAG_SITE = 'Commissary';

/** Adds the history once; null when the demo company is missing or its plant is already there. */
export async function seedDemoHistory(db: Kysely<DB>, now = new Date()): Promise<HistoryCounts | null> {
  const company = await db.selectFrom('companies').select('id').where('name', '=', DEMO_COMPANY).executeTakeFirst();
  if (!company) return null;
  const first = demoPlant[0]!;
  const existing = await db
    .selectFrom('systems')
    .innerJoin('sites', 'sites.id', 'systems.site_id')
    .select('systems.id')
    .where('systems.company_id', '=', company.id)
    .where('sites.name', '=', first.site)
    .where('systems.name', '=', first.name)
    .executeTakeFirst();
  if (existing) return null;
  // The database's clock, since it stamps the outbox rows removed at the end.
  const startedAt = (await sql<{ now: Date }>`select now() as now`.execute(db)).rows[0]!.now;

  const role = (r: string) => demoUsers.find((u) => u.role === r)!.email;
  const state: DemoState = {
    db,
    now,
    tech: await loadActor(db, role('technician')),
    office: await loadActor(db, role('office')),
    sites: new Map(),
    equipment: new Map(),
    systems: new Map(),
    random: seededRandom(20_261_201),
    visitIds: [],
  };
  const siteRows = await db.selectFrom('sites').select(['id', 'name', 'time_zone', 'elevation_m']).where('company_id', '=', company.id).execute();
  for (const s of siteRows) state.sites.set(s.name, { id: s.id, name: s.name, timeZone: s.time_zone, elevationM: Number(s.elevation_m) });
  const areaRows = await db.selectFrom('areas').select(['id', 'site_id', 'name']).where('company_id', '=', company.id).execute();
  const areaId = (siteId: string, name: string) => {
    const area = areaRows.find((a) => a.site_id === siteId && a.name === name);
    if (!area) throw new Error(`The demo has no area "${name}" on that site.`);
    return area.id;
  };

  // The office registered the plant shortly before the first visits.
  for (const spec of demoPlant) {
    const site = state.sites.get(spec.site)!;
    const system = await createSystem(
      state.office,
      createSystemSchema.parse({
        siteId: site.id,
        areaId: areaId(site.id, spec.area),
        name: spec.name,
        refrigerant: spec.refrigerant,
        fullChargeKg: spec.fullChargeKg,
        application: 'commercial_refrigeration',
        designBoxTempC: spec.designBoxTempC,
        maintenanceIntervalDays: spec.maintenanceIntervalDays,
        notes: spec.notes,
      }),
      db,
    );
    state.systems.set(spec.key, { id: system.id, spec });
    for (const e of spec.equipment) {
      const created = await createEquipment(
        state.office,
        createEquipmentSchema.parse({
          siteId: site.id,
          areaId: areaId(site.id, e.area),
          systemId: system.id,
          type: e.type,
          name: e.name,
          make: e.make,
          model: e.model,
          serial: e.serial,
          installedOn: e.installedOn,
          condition: e.condition,
          nameplate: e.nameplate,
        }),
        db,
      );
      state.equipment.set(`${spec.key}.${e.key}`, created.id);
    }
    for (const [from, kind, to] of spec.relations) {
      await addRelation(state.office, state.equipment.get(`${spec.key}.${from}`)!, createRelationSchema.parse({ kind, otherId: state.equipment.get(`${spec.key}.${to}`)!, direction: 'from' }), db);
    }
  }
  const registeredAt = daysBefore(now, 460);
  const plantIds = [...state.equipment.values()];
  await db.updateTable('equipment').set({ created_at: registeredAt, updated_at: registeredAt }).where('id', 'in', plantIds).execute();
  await db.updateTable('systems').set({ created_at: registeredAt, updated_at: registeredAt }).where('id', 'in', [...state.systems.values()].map((s) => s.id)).execute();

  // A tag sheet for every unit on the first site, printed and put on before the first visit there.
  const taggedIds = demoPlant.filter((s) => s.site === TAGGED_SITE).flatMap((s) => s.equipment.map((e) => state.equipment.get(`${s.key}.${e.key}`)!));
  const sheet = await createPrintRun(state.office, createPrintRunSchema.parse({ kind: 'equipment', equipmentIds: taggedIds, layoutId: 'letter-30' }), db);
  const printedAt = daysBefore(now, 455);
  await db.updateTable('print_runs').set({ created_at: printedAt }).where('id', '=', sheet.id).execute();
  await db.updateTable('tags').set({ created_at: printedAt, updated_at: printedAt, attached_at: printedAt }).where('print_run_id', '=', sheet.id).execute();
  // Blank tags for the next site, one of which the technician claims on a visit.
  const blanks = await createPrintRun(state.office, createPrintRunSchema.parse({ kind: 'blank', siteId: state.sites.get(BLANK_TAG_SITE)!.id, count: 6, layoutId: 'letter-30' }), db);
  await db.updateTable('print_runs').set({ created_at: daysBefore(now, 445) }).where('id', '=', blanks.id).execute();
  await db.updateTable('tags').set({ created_at: daysBefore(now, 445), updated_at: daysBefore(now, 445) }).where('print_run_id', '=', blanks.id).execute();
  const claimBlankTag = async (v: VisitLog) => {
    const tag = await db.selectFrom('tags').select('code').where('print_run_id', '=', blanks.id).orderBy('code').executeTakeFirstOrThrow();
    await attachTag(state.tech, tag.code, { equipmentId: state.equipment.get('com-prep.evap')! }, db);
    await db.updateTable('tags').set({ attached_at: v.startedAt, updated_at: v.startedAt }).where('code', '=', tag.code).execute();
  };

  const pell = await writeStory(state, claimBlankTag);
  // Closing visits queued their report e-mails, about events that are already past. They are
  // removed rather than marked sent: nothing was delivered, and the visits remain the record.
  // This comes before the requests, whose own delivery pass would otherwise send them.
  await removeQueuedMail(db, company.id, startedAt);

  // Service requests from the owners: one just sent, one the office has seen, one done by a visit.
  const ownerOne = await loadActor(db, demoUsers.find((u) => u.client === 0)!.email);
  const ownerTwo = await loadActor(db, demoUsers.find((u) => u.client === 1)!.email);
  const request = async (owner: typeof ownerOne, site: string, key: string | null, description: string, urgency: 'emergency' | 'soon' | 'routine', at: Date) => {
    const created = await createRequest(owner, createRequestSchema.parse({ siteId: state.sites.get(site)!.id, equipmentId: key ? state.equipment.get(key)! : null, description, urgency }), db);
    await db.updateTable('service_requests').set({ created_at: at, updated_at: at }).where('id', '=', created.id).execute();
    return created.id;
  };
  const done = await request(ownerOne, TAGGED_SITE, 'pell-freezer.evap', 'The walk-in freezer is at 20 °F and the unit on the roof keeps clicking on and off. Product moved to the reach-ins.', 'emergency', addMinutes(pell.freezerCallAt, -95));
  await updateRequest(state.office, done, updateRequestSchema.parse({ status: 'done', visitId: pell.freezerCallVisitId, officeNote: 'Tomas got the freezer running with a hard-start kit the same morning. A replacement quote for the condensing unit follows.' }), db);
  await db.updateTable('service_requests').set({ updated_at: addMinutes(pell.freezerCallAt, 240) }).where('id', '=', done).execute();
  const linden = state.sites.get('Linden Avenue Market')!;
  const seen = await request(ownerTwo, 'Linden Avenue Market', 'linden-dairy.evap2', 'Dairy case 2 reads 41 °F on the top shelf this morning and the milk feels warm.', 'soon', siteTime(now, linden.timeZone, 2, 7, 40));
  await updateRequest(state.office, seen, updateRequestSchema.parse({ status: 'acknowledged', officeNote: 'The leak repair on this coil is being booked; Tomas will call the store manager with a morning before opening.' }), db);
  await db.updateTable('service_requests').set({ updated_at: siteTime(now, linden.timeZone, 2, 9, 5) }).where('id', '=', seen).execute();
  await request(ownerOne, TAGGED_SITE, null, 'The walk-in cooler door no longer closes by itself; the closer seems weak. Not urgent.', 'routine', new Date(now.getTime() - 3 * 3_600_000));

  // The week ahead: the office has planned the leak work the Linden owner was told about, and the
  // Commissary's next maintenance, each for the technician in a morning window of its site.
  const plan = async (site: string, systemKey: string, reason: 'leak_check' | 'maintenance', inDays: number, windowStart: string, windowEnd: string, note: string) => {
    const s = state.sites.get(site)!;
    const day = addDays(localDate(now, s.timeZone), inDays);
    await createPlan(state.office, createPlanSchema.parse({ siteId: s.id, systemIds: [state.systems.get(systemKey)!.id], reason, technicianId: state.tech.id, day, windowStart, windowEnd, note }), db, now);
  };
  await plan('Linden Avenue Market', 'linden-dairy', 'leak_check', 1, '06:00', '08:00', 'Before the store opens: repair and re-check the dairy case coil leak.');
  await plan(BLANK_TAG_SITE, 'com-prep', 'maintenance', 3, '09:00', '12:00', 'Quarterly maintenance of the prep room circuit.');

  // Visits and entries were written now; their own rows say when they happened.
  await db
    .updateTable('visits')
    .set({ created_at: sql`started_at`, updated_at: sql`coalesce(ended_at, started_at)` })
    .where('id', 'in', state.visitIds)
    .execute();
  await db.updateTable('entries').set({ created_at: sql`recorded_at` }).where('visit_id', 'in', state.visitIds).execute();

  // Recording a request starts a delivery pass in the background for its e-mail to the office;
  // once every pass has tried its message, the messages go the way of the visit reports.
  for (let tries = 0; tries < 50; tries++) {
    const untried = await db.selectFrom('mail_outbox').select('id').where('company_id', '=', company.id).where('created_at', '>=', startedAt).where('attempts', '=', 0).executeTakeFirst();
    if (!untried) break;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  await removeQueuedMail(db, company.id, startedAt);

  const count = async (table: 'photos' | 'tags' | 'service_requests') =>
    Number((await db.selectFrom(table).select((eb) => eb.fn.countAll<number>().as('n')).where('company_id', '=', company.id).executeTakeFirstOrThrow()).n);
  return {
    systems: state.systems.size,
    equipment: plantIds.length,
    visits: state.visitIds.length,
    photos: await count('photos'),
    tags: await count('tags'),
    requests: await count('service_requests'),
  };
}

async function removeQueuedMail(db: Kysely<DB>, companyId: string, since: Date) {
  await db.deleteFrom('mail_outbox').where('company_id', '=', companyId).where('created_at', '>=', since).execute();
}
