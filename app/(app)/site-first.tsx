import { SitePicker } from '@/components/sites/site-picker';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import type { Permission } from '@/lib/auth/permissions';
import { getSite, listSites } from '@/lib/sites/service';

/**
 * The first step of a page that works at one site (`path?siteId=…`, start or plan a visit): the
 * signed-in actor who may do it, sent back to the same site after signing in, and the site (404
 * when not theirs); with no site given, the picker that links back here with one.
 */
export async function siteFirst(path: string, permission: Permission, siteId: string | undefined, picker: { title: string; subtitle: string }) {
  const actor = await requirePageActor(`${path}${siteId ? `?siteId=${siteId}` : ''}`, permission);
  if (!siteId) {
    const sites = await listSites(actor, { limit: 200, archived: 'exclude' });
    return { actor, picker: <SitePicker title={picker.title} subtitle={picker.subtitle} sites={sites.items} path={path} /> };
  }
  return { actor, site: await orNotFound(getSite(actor, siteId)) };
}
