// The demo scenario: an invented service company, two invented clients, their sites and areas,
// and one demo user per role. Every name here is made up for the demo.
import bcrypt from 'bcryptjs';
import type { Kysely } from 'kysely';
import type { DB } from '@/db/schema.gen';

export const DEMO_PASSWORD = 'rimeline-demo';
export const DEMO_COMPANY = 'Brackenfield Refrigeration Service';

export const demoUsers = [
  { email: 'admin@rimeline.test', name: 'Ada Kestrel', role: 'admin', client: null },
  { email: 'office@rimeline.test', name: 'Owen Pallister', role: 'office', client: null },
  { email: 'tech@rimeline.test', name: 'Tomas Rivane', role: 'technician', client: null },
  { email: 'owner@client-one.test', name: 'Clara Morrowby', role: 'client', client: 0 },
  { email: 'owner@client-two.test', name: 'Devi Tallowmere', role: 'client', client: 1 },
] as const;

const clients = [
  {
    name: 'Marrowgate Eatery Group',
    notes: 'Three kitchens and a commissary. Call the kitchen manager on arrival.',
    contacts: [{ name: 'Clara Morrowby', email: 'owner@client-one.test', phone: '555-0142', title: 'Operations director', receives_reports: true }],
    sites: [
      {
        name: 'Pell Street Kitchen',
        address_line1: '214 Pell Street',
        city: 'Larchmont Falls',
        region: 'CO',
        postal_code: '80990',
        time_zone: 'America/Denver',
        elevation_m: 1610,
        access_notes: 'Roof ladder behind the dish room; key with the kitchen manager.',
        areas: [
          ['Walk-in cooler', 'walk_in_cooler'],
          ['Walk-in freezer', 'walk_in_freezer'],
          ['Cook line reach-ins', 'reach_in'],
          ['Roof', 'roof'],
        ],
      },
      {
        name: 'Orchard Row Bistro',
        address_line1: '9 Orchard Row',
        city: 'Larchmont Falls',
        region: 'CO',
        postal_code: '80991',
        time_zone: 'America/Denver',
        elevation_m: 1598,
        access_notes: 'Condensing units on the pad by the loading door.',
        areas: [
          ['Walk-in cooler', 'walk_in_cooler'],
          ['Bar back', 'reach_in'],
          ['Rear pad', 'outdoor'],
        ],
      },
      {
        name: 'Commissary',
        address_line1: '77 Kiln Works Road',
        city: 'Brisco',
        region: 'CO',
        postal_code: '80995',
        time_zone: 'America/Denver',
        elevation_m: 1702,
        access_notes: 'Open 5 am – 2 pm. Sign in at the dock office.',
        areas: [
          ['Walk-in freezer 1', 'walk_in_freezer'],
          ['Walk-in freezer 2', 'walk_in_freezer'],
          ['Prep cooler', 'walk_in_cooler'],
          ['Mechanical room', 'mechanical_room'],
        ],
      },
    ],
  },
  {
    name: 'Tidewell Family Grocers',
    notes: 'Two neighbourhood stores. Sales floor work only before 8 am.',
    contacts: [{ name: 'Devi Tallowmere', email: 'owner@client-two.test', phone: '555-0187', title: 'Facilities lead', receives_reports: true }],
    sites: [
      {
        name: 'Linden Avenue Market',
        address_line1: '1450 Linden Avenue',
        city: 'Port Ambry',
        region: 'TX',
        postal_code: '77991',
        time_zone: 'America/Chicago',
        elevation_m: 12,
        access_notes: 'Roof hatch in the back stock room; store manager holds the key.',
        areas: [
          ['Dairy display cases', 'display_case'],
          ['Meat cooler', 'walk_in_cooler'],
          ['Frozen storage', 'walk_in_freezer'],
          ['Roof', 'roof'],
        ],
      },
      {
        name: 'Quarry Road Market',
        address_line1: '3 Quarry Road',
        city: 'Port Ambry',
        region: 'TX',
        postal_code: '77993',
        time_zone: 'America/Chicago',
        elevation_m: 18,
        access_notes: null,
        areas: [
          ['Produce cooler', 'walk_in_cooler'],
          ['Frozen aisle', 'display_case'],
          ['Machine room', 'mechanical_room'],
        ],
      },
    ],
  },
] as const;

/** Whether the scenario is already loaded (its admin exists). */
export async function demoExists(db: Kysely<DB>): Promise<boolean> {
  return Boolean(await db.selectFrom('users').select('id').where('email', '=', demoUsers[0].email).executeTakeFirst());
}

/** Loads the scenario once: returns false (and changes nothing) when it is already there. */
export async function seedDemo(db: Kysely<DB>): Promise<boolean> {
  if (await demoExists(db)) return false;
  const passwordHash = await bcrypt.hash(DEMO_PASSWORD, 11);
  await db.transaction().execute(async (trx) => {
    const company = await trx
      .insertInto('companies')
      .values({ name: DEMO_COMPANY, service_phone: '555-0100', label_line: 'Service: 555-0100 · call before opening', default_units: 'imperial' })
      .returning('id')
      .executeTakeFirstOrThrow();
    const clientIds: string[] = [];
    for (const c of clients) {
      const client = await trx.insertInto('clients').values({ company_id: company.id, name: c.name, notes: c.notes }).returning('id').executeTakeFirstOrThrow();
      clientIds.push(client.id);
      for (const contact of c.contacts) {
        await trx.insertInto('client_contacts').values({ company_id: company.id, client_id: client.id, ...contact }).execute();
      }
      for (const s of c.sites) {
        const { areas, ...site } = s;
        const row = await trx.insertInto('sites').values({ company_id: company.id, client_id: client.id, country: 'US', ...site }).returning('id').executeTakeFirstOrThrow();
        await trx
          .insertInto('areas')
          .values(areas.map(([name, kind]) => ({ company_id: company.id, site_id: row.id, name, kind })))
          .execute();
      }
    }
    await trx
      .insertInto('users')
      .values(
        demoUsers.map((u) => ({
          company_id: company.id,
          email: u.email,
          name: u.name,
          role: u.role,
          client_id: u.client === null ? null : (clientIds[u.client] ?? null),
          password_hash: passwordHash,
          email_verified_at: new Date(),
        })),
      )
      .execute();
  });
  return true;
}
