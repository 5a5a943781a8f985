import 'server-only';
import type { Db } from '@/db/types';

/** The addresses of the site's client's contacts who chose to receive reports (each once). */
export async function reportRecipients(db: Db, siteId: string): Promise<string[]> {
  const contacts = await db
    .selectFrom('client_contacts')
    .innerJoin('sites', 'sites.client_id', 'client_contacts.client_id')
    .select('client_contacts.email')
    .where('sites.id', '=', siteId)
    .where('client_contacts.receives_reports', '=', true)
    .where('client_contacts.email', 'is not', null)
    .execute();
  return [...new Set(contacts.map((c) => c.email ?? '').filter(Boolean))];
}
