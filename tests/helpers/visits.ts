// Set-up for the visit and history browser tests, through the JSON API as a signed-in user
// (page.request shares the page's session). Makes and names are invented.
import { expect, type APIRequestContext } from '@playwright/test';
import { mailTo, type CaughtMessage } from './mail';
import { siteLike } from './sites';

export async function api<T>(request: APIRequestContext, method: 'GET' | 'POST' | 'PATCH', url: string, data?: unknown): Promise<T> {
  const res = await request.fetch(url, { method, ...(data !== undefined ? { data } : {}) });
  expect(res.ok(), `${method} ${url} → ${res.status()} ${await res.text()}`).toBe(true);
  return (await res.json()) as T;
}

export const circuitFacts = {
  refrigerant: 'R-404A',
  fullChargeKg: 13.6,
  designBoxTempC: 1.7,
  nameplateVoltage: 208,
  designPressureHighKpa: 2758,
} as const;

/**
 * A walk-in cooler system with its condensing unit and evaporator, on a site of its own made like
 * the named demo site (same client, time zone and elevation), so no visit left open elsewhere
 * blocks a visit started there. `request` must be signed in as the office.
 */
export async function createCircuit(request: APIRequestContext, likeSiteName: string, label: string) {
  const site = await siteLike(request, likeSiteName, label);
  const system = await api<{ id: string }>(request, 'POST', '/api/systems', {
    siteId: site.id,
    name: `Cooler circuit ${label}`,
    refrigerant: circuitFacts.refrigerant,
    fullChargeKg: circuitFacts.fullChargeKg,
    application: 'commercial_refrigeration',
    designBoxTempC: circuitFacts.designBoxTempC,
  });
  const condensingUnit = await api<{ id: string; name: string }>(request, 'POST', '/api/equipment', {
    siteId: site.id,
    systemId: system.id,
    type: 'condensing_unit',
    name: `Condensing unit ${label}`,
    make: 'Kelvrin',
    model: 'KCU-210',
    serial: `KV-${label}`,
    nameplate: { voltage: circuitFacts.nameplateVoltage, phase: '3', designPressureHighKpa: circuitFacts.designPressureHighKpa },
  });
  const evaporator = await api<{ id: string; name: string }>(request, 'POST', '/api/equipment', {
    siteId: site.id,
    systemId: system.id,
    type: 'evaporator',
    name: `Evaporator ${label}`,
    make: 'Frostwell',
    nameplate: {},
  });
  return { site, systemId: system.id, condensingUnit, evaporator };
}

/** Waits for the report e-mail of one visit; the catcher may hold other mail for the same address. */
export async function waitForVisitReport(address: string, visitId: string, timeoutMs = 30_000): Promise<CaughtMessage> {
  const end = Date.now() + timeoutMs;
  while (Date.now() < end) {
    const found = (await mailTo(address)).find((m) => (m.text ?? '').includes(`/visits/${visitId}`));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`No report for visit ${visitId} reached ${address} within ${timeoutMs} ms`);
}
