// The demo history's hands: every record goes through the service a person would use (so
// computed values, audit events, follow-ups and stored files are what the app itself makes),
// with inputs checked by the same zod schemas as the API. The services stamp rows with the
// current time; where the story happened earlier, the row's own timestamps are moved back to
// the story's time afterwards (audit events keep the real time they were written).
import { randomUUID } from 'node:crypto';
import type { Kysely } from 'kysely';
import type { DB } from '@/db/schema.gen';
import type { Actor } from '@/lib/auth/actor';
import { updateFollowUp } from '@/lib/follow-ups/service';
import { updateFollowUpSchema } from '@/lib/follow-ups/schemas';
import { uploadPhoto } from '@/lib/photos/service';
import type { PhotoKind } from '@/lib/photos/schemas';
import { closeVisit } from '@/lib/visits/close';
import { addEntry } from '@/lib/visits/entries';
import { markReviewed, startVisit } from '@/lib/visits/service';
import { closeVisitSchema, createEntrySchema, startVisitSchema, type EntryKind, type Severity, type VisitReason } from '@/lib/visits/schemas';
import { addMinutes, dayOfYear, siteDate } from '@/docker-free-scripts/demo/history/clock';
import type { SystemSpec } from '@/docker-free-scripts/demo/history/plant';
import { operatingReading, type Deviation } from '@/docker-free-scripts/demo/history/readings';

export interface SiteInfo {
  id: string;
  name: string;
  timeZone: string;
  elevationM: number;
}

export interface DemoState {
  db: Kysely<DB>;
  now: Date;
  tech: Actor;
  office: Actor;
  sites: Map<string, SiteInfo>;
  /** 'system-key.equipment-key' → the equipment's current record (a replacement takes the key over). */
  equipment: Map<string, string>;
  systems: Map<string, { id: string; spec: SystemSpec }>;
  random: () => number;
  visitIds: string[];
}

export function equipmentId(state: DemoState, key: string): string {
  const id = state.equipment.get(key);
  if (!id) throw new Error(`The demo plant has no equipment "${key}".`);
  return id;
}

function systemOf(state: DemoState, key: string): SystemSpec {
  const system = state.systems.get(key.split('.')[0]!);
  if (!system) throw new Error(`The demo plant has no system for "${key}".`);
  return system.spec;
}

/** One visit as the technician logs it; entries follow each other a few minutes apart. */
export class VisitLog {
  private clock: Date;

  constructor(
    private readonly state: DemoState,
    readonly id: string,
    readonly site: SiteInfo,
    readonly startedAt: Date,
  ) {
    this.clock = addMinutes(startedAt, 6);
  }

  private next(minutes = 4): Date {
    const at = this.clock;
    this.clock = addMinutes(this.clock, minutes);
    return at;
  }

  hasEquipment(key: string): boolean {
    return this.state.equipment.has(key);
  }

  get lastEntryAt(): Date {
    return this.clock;
  }

  private async entry(key: string, kind: EntryKind, data: object, minutes?: number) {
    const input = createEntrySchema.parse({ equipmentId: equipmentId(this.state, key), clientEntryId: randomUUID(), recordedAt: this.next(minutes).toISOString(), kind, data });
    return addEntry(this.state.tech, this.id, input, this.state.db);
  }

  /** Gauges and meters on the condensing unit, at the system's operating point for the day and season. */
  reading(systemKey: string, deviation: Deviation = {}) {
    const system = systemOf(this.state, systemKey);
    const data = operatingReading(system, this.site.elevationM, dayOfYear(this.clock, this.site.timeZone), this.state.random, deviation);
    return this.entry(`${systemKey}.cu`, 'reading', data, 8);
  }

  condition(key: string, rating: number, note?: string) {
    return this.entry(key, 'condition', { rating, ...(note ? { note } : {}) }, 1);
  }

  action(key: string, text: string) {
    return this.entry(key, 'action', { text }, 12);
  }

  note(key: string, text: string) {
    return this.entry(key, 'note', { text }, 2);
  }

  /** A part; a whole component replaced leaves its record as removed and the key follows the new one. */
  async part(key: string, part: string, extra: { newSerial?: string; oldSerial?: string; replacesEquipment?: boolean } = {}) {
    const oldId = equipmentId(this.state, key);
    const entry = await this.entry(key, 'part', { part, quantity: 1, ...extra }, 20);
    if (!extra.replacesEquipment) return entry;
    const old = await this.state.db.selectFrom('equipment').select(['site_id', 'name', 'type']).where('id', '=', oldId).executeTakeFirstOrThrow();
    const replacement = await this.state.db
      .selectFrom('equipment')
      .select('id')
      .where('site_id', '=', old.site_id)
      .where('name', '=', old.name)
      .where('type', '=', old.type)
      .where('status', '=', 'in_service')
      .where('id', '<>', oldId)
      .where('deleted_at', 'is', null)
      .executeTakeFirstOrThrow();
    // The service dates a replacement today; in the story it went in on this visit.
    const at = new Date(entry.recordedAt);
    await this.state.db
      .updateTable('equipment')
      .set({ installed_on: siteDate(at, this.site.timeZone), created_at: at, updated_at: at })
      .where('id', '=', replacement.id)
      .execute();
    this.state.equipment.set(key, replacement.id);
    return entry;
  }

  setting(key: string, data: object) {
    return this.entry(key, 'setting_change', data, 6);
  }

  refrigerant(key: string, direction: 'added' | 'recovered', amountKg: number, cylinderId: string) {
    const system = systemOf(this.state, key);
    return this.entry(key, 'refrigerant', { direction, amountKg, refrigerant: system.refrigerant, cylinderId, technicianCert: 'UNIV-5531' }, 15);
  }

  leak(key: string, data: object) {
    return this.entry(key, 'leak', data, 15);
  }

  /** A finding; with a follow-up title it raises a follow-up, dated when it was found. */
  async finding(key: string, text: string, severity: Severity, followUpTitle?: string): Promise<string | null> {
    const entry = await this.entry(key, 'finding', { text, severity, raiseFollowUp: Boolean(followUpTitle), ...(followUpTitle ? { followUpTitle } : {}) }, 5);
    if (!followUpTitle) return null;
    const at = new Date(entry.recordedAt);
    const row = await this.state.db.updateTable('follow_ups').set({ created_at: at, updated_at: at }).where('entry_id', '=', entry.id).returning('id').executeTakeFirstOrThrow();
    return row.id;
  }

  /** Closes a follow-up with this visit's work. */
  async resolve(followUpId: string, resolution: string) {
    await updateFollowUp(this.state.tech, followUpId, updateFollowUpSchema.parse({ status: 'resolved', resolution, visitId: this.id }), this.state.db);
    const at = this.next(2);
    await this.state.db.updateTable('follow_ups').set({ closed_at: at, updated_at: at }).where('id', '=', followUpId).execute();
  }

  /** A photo taken on this visit: uploaded to the unit's gallery, then shown as an entry. */
  async photo(key: string, kind: PhotoKind, caption: string, image: (takenAt: string) => Promise<Buffer>, exifTime: (at: Date, timeZone: string) => string) {
    const at = this.next(3);
    const bytes = await image(exifTime(at, this.site.timeZone));
    const photo = await uploadPhoto(this.state.tech, { equipmentId: equipmentId(this.state, key), kind, caption, fileName: `IMG_${siteDate(at, this.site.timeZone).replace(/-/g, '')}_${at.getUTCHours()}${at.getUTCMinutes()}.jpg`, bytes }, this.state.db);
    await this.state.db.updateTable('photos').set({ created_at: addMinutes(at, 1) }).where('id', '=', photo.id).execute();
    await this.entry(key, 'photo', { photoId: photo.id, caption }, 1);
    return photo.id;
  }
}

export interface VisitPlan {
  site: string;
  daysAgo: number;
  /** Local start hour on the site's clock. */
  hour: number;
  reason: VisitReason;
  /** Null leaves the visit open (work in progress today). */
  summary: string | null;
  /** Whether the office has reviewed it (older visits have been). */
  reviewed?: boolean;
}

export async function logVisit(state: DemoState, plan: VisitPlan, work: (v: VisitLog) => Promise<void>, startedAt: Date): Promise<VisitLog> {
  const site = state.sites.get(plan.site);
  if (!site) throw new Error(`No demo site named ${plan.site}`);
  const visit = await startVisit(state.tech, startVisitSchema.parse({ siteId: site.id, reason: plan.reason, startedAt: startedAt.toISOString() }), state.db);
  const log = new VisitLog(state, visit.id, site, startedAt);
  await work(log);
  state.visitIds.push(visit.id);
  if (plan.summary === null) return log;
  const endedAt = addMinutes(log.lastEntryAt, 10);
  await closeVisit(state.tech, visit.id, closeVisitSchema.parse({ summary: plan.summary, endedAt: endedAt.toISOString() }), state.db, { report: 'on-download' });
  if (plan.reviewed) {
    await markReviewed(state.office, visit.id, state.db);
    await state.db.updateTable('visits').set({ reviewed_at: addMinutes(endedAt, 20 * 60) }).where('id', '=', visit.id).execute();
  }
  return log;
}
