// A site of a spec's own for browser tests. A technician may hold one open visit per site, so a
// visit one spec leaves open at a shared demo site would make another spec's start a conflict
// (409). Every spec that starts visits does so at a site it made itself.
import { expect, type APIRequestContext } from '@playwright/test';

export interface OwnSite {
  id: string;
  name: string;
  clientId: string;
  timeZone: string;
  elevationM: number;
}

/**
 * A new site of the same client, time zone and elevation as the named demo site (so that client's
 * owner sees it and readings are judged at the same altitude), named `Annex <label>`: never the
 * demo site's name, so a page's links and text that name the demo site still find it once.
 * `request` must be signed in as the office.
 */
export async function siteLike(request: APIRequestContext, demoName: string, label: string): Promise<OwnSite> {
  const found = await request.get(`/api/sites?q=${encodeURIComponent(demoName)}`);
  expect(found.ok(), `GET sites ${demoName} → ${found.status()}`).toBe(true);
  const demo = ((await found.json()) as { items: OwnSite[] }).items.find((s) => s.name === demoName);
  if (!demo) throw new Error(`No demo site named ${demoName}`);
  const data = { clientId: demo.clientId, name: `Annex ${label}`, timeZone: demo.timeZone, elevationM: demo.elevationM };
  const made = await request.post('/api/sites', { data });
  expect(made.status(), `POST /api/sites → ${made.status()} ${await made.text()}`).toBe(201);
  return { ...data, id: ((await made.json()) as { id: string }).id };
}
