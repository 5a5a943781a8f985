// Every page of every role on a 360 px phone: no page wider than the screen, and every button,
// link-button and form control at least 44×44 px. The pages are found from app/(app) (so a new
// page is walked without editing this file), with ids made through the API the way the app would.
// The rule for what is measured is in DEVELOPERS.md ("Phone widths and touch targets").
import { expect, test, type Page } from '@playwright/test';
import { randomUUID } from 'node:crypto';
import { mkdirSync, readFileSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { siteLike } from '../helpers/sites';
import { apiAs, ok, screenshotDir, signIn } from './helpers';

const appDir = path.resolve(import.meta.dirname, '../../app/(app)');
const PHONE = 360;
const TARGET = 44;

/** Route patterns of the signed-in app: every page.tsx under app/(app), route groups and private folders left out. */
function routePatterns(dir = appDir, prefix = ''): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir).sort()) {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) {
      if (name.startsWith('_')) continue;
      const segment = /^\(.*\)$/.test(name) ? '' : `/${name}`;
      out.push(...routePatterns(full, prefix + segment));
    } else if (name === 'page.tsx') {
      out.push(prefix || '/');
      // A "new" page that starts from a site (a system, a unit, a plan) is walked that way too.
      if (prefix.endsWith('/new') && readFileSync(full, 'utf8').includes('siteId')) out.push(`${prefix}?siteId=[sites]`);
    }
  }
  return out;
}

type Role = 'admin' | 'office' | 'technician' | 'owner';
const emails: Record<Role, string> = {
  admin: 'admin@rimeline.test',
  office: 'office@rimeline.test',
  technician: 'tech@rimeline.test',
  owner: 'owner@client-one.test',
};

/** Real ids for each dynamic segment, keyed by the folder before it ("sites/[id]" → sites). */
interface Ids {
  clients: string;
  sites: string;
  systems: string;
  equipment: string;
  requests: string;
  visits: string;
  openVisit: string;
  runs: string;
  scan: string;
  blankCode: string;
  [other: string]: string;
}

let ids: Ids;

test.beforeAll(async ({ baseURL }) => {
  test.setTimeout(180_000);
  const office = await apiAs(baseURL!, emails.office);
  const tech = await apiAs(baseURL!, emails.technician);
  const owner = await apiAs(baseURL!, emails.owner);
  const label = randomUUID().slice(0, 6);
  // A site of its own for client one (so its owner walks it too): the visit left open here never
  // blocks another spec's visit at a demo site, and a rerun of this set-up gets a fresh one.
  const site = await siteLike(office, 'Orchard Row Bistro', label);
  // A client with a long name: the people page's client choice sizes to its longest option, and the
  // walk should not depend on which names other specs happened to leave behind.
  await ok(office.post('/api/clients', { data: { name: `Harbourside Cold Chain and Catering Supply Cooperative of the Lower Quays ${label}` } }));
  const system = await ok<{ id: string }>(
    office.post('/api/systems', { data: { siteId: site.id, name: `Walk-in cooler circuit with a long name ${label}`, refrigerant: 'R-404A', fullChargeKg: 6.5, application: 'commercial_refrigeration', designBoxTempC: 2 } }),
  );
  const unit = await ok<{ id: string }>(
    office.post('/api/equipment', { data: { siteId: site.id, systemId: system.id, type: 'condensing_unit', name: `Walk-in cooler condensing unit on the rear pad ${label}`, make: 'Kelvrin', serial: `KV-${label}-0042-LONGSERIAL`, installedOn: '2006-05-01', condition: 2 } }),
  );
  const control = await ok<{ id: string }>(
    office.post('/api/equipment', {
      data: { siteId: site.id, systemId: system.id, type: 'pressure_control', name: `Dual pressure control ${label}`, condition: 3, nameplate: { controlKind: 'dual', lowCutInKpa: 140, lowDifferentialKpa: 100, highCutOutKpa: 2700, highDifferentialKpa: 690 } },
    }),
  );
  await ok(office.post(`/api/equipment/${control.id}/relations`, { data: { kind: 'controls', direction: 'from', otherId: unit.id } }));
  const techId = (await ok<{ id: string }>(tech.get('/api/me'))).id;
  // A closed visit (what an owner may read) with a finding that raised a follow-up and refrigerant added.
  const visit = await ok<{ id: string }>(tech.post('/api/visits', { data: { siteId: site.id, reason: 'no_cooling' } }));
  await ok(tech.post(`/api/visits/${visit.id}/entries`, { data: { kind: 'finding', equipmentId: unit.id, clientEntryId: randomUUID(), data: { text: 'Condenser coil matted with grease from the kitchen exhaust; fan blade chipped', severity: 'degraded', raiseFollowUp: true, followUpTitle: `Replace condenser fan blade and clean the coil ${label}` } } }));
  await ok(tech.post(`/api/visits/${visit.id}/entries`, { data: { kind: 'refrigerant', equipmentId: unit.id, clientEntryId: randomUUID(), data: { direction: 'added', amountKg: 1.2, refrigerant: 'R-404A', cylinderId: 'CYL-2207' } } }));
  await ok(tech.post(`/api/visits/${visit.id}/close`, { data: { summary: 'Coil cleaned; charge topped up after a flare leak at the receiver was repaired.' } }));
  const open = await ok<{ id: string }>(tech.post('/api/visits', { data: { siteId: site.id, reason: 'maintenance' } }));
  await ok(tech.post(`/api/visits/${open.id}/entries`, { data: { kind: 'note', equipmentId: unit.id, clientEntryId: randomUUID(), data: { text: 'Box at 38 °F on arrival; door gasket torn at the hinge side.' } } }));
  const run = await ok<{ id: string }>(office.post('/api/print-runs', { data: { kind: 'equipment', equipmentIds: [unit.id, control.id], layoutId: 'letter-30' } }));
  const code = (await ok<{ tags: { code: string }[] }>(office.get(`/api/print-runs/${run.id}`))).tags[0]!.code;
  const blankRun = await ok<{ id: string }>(office.post('/api/print-runs', { data: { kind: 'blank', siteId: site.id, count: 2, layoutId: 'thermal-2x1' } }));
  const blankCode = (await ok<{ tags: { code: string }[] }>(office.get(`/api/print-runs/${blankRun.id}`))).tags[0]!.code;
  const request = await ok<{ id: string }>(
    owner.post('/api/requests', { data: { siteId: site.id, equipmentId: unit.id, description: 'The walk-in cooler reads 47 °F since this morning and the condensing unit on the rear pad hums but does not start; product moved to the reach-ins for now.', urgency: 'soon' } }),
  );
  ids = { clients: site.clientId, sites: site.id, systems: system.id, equipment: unit.id, requests: request.id, visits: visit.id, openVisit: open.id, runs: run.id, scan: code, blankCode };
  // Planned visits (helper pages added alongside): when the API exists, one plan to open.
  const plans = await office.get('/api/plans?limit=1');
  if (plans.ok()) {
    const tomorrow = new Date(Date.now() + 24 * 3600_000).toISOString().slice(0, 10);
    const made = await office.post('/api/plans', { data: { siteId: site.id, reason: 'maintenance', technicianId: techId, day: tomorrow, windowStart: '08:00', windowEnd: '10:00', systemIds: [system.id] } });
    if (made.ok()) ids.plans = ((await made.json()) as { id: string }).id;
    else {
      const first = ((await plans.json()) as { items: { id: string }[] }).items[0];
      if (first) ids.plans = first.id;
    }
  }
  await Promise.all([office.dispose(), tech.dispose(), owner.dispose()]);
});

/** The addresses to open for one pattern: its dynamic segments filled with real ids (a visit twice: closed and open). */
function addressesFor(pattern: string, role: Role): string[] | { missing: string } {
  const [route = '', query] = pattern.split('?');
  if (query) {
    const filled = query.replace(/\[(\w+)\]/g, (_, key: string) => ids[key] ?? '');
    return filled.endsWith('=') ? { missing: pattern } : [`${route}?${filled}`];
  }
  const segments = route.split('/');
  let out = [''];
  for (let i = 1; i < segments.length; i++) {
    const seg = segments[i]!;
    const m = /^\[(.+)\]$/.exec(seg);
    if (!m) {
      out = out.map((p) => `${p}/${seg}`);
      continue;
    }
    const owner = segments[i - 1]!;
    const values = owner === 'visits' && role !== 'owner' ? [ids.visits, ids.openVisit] : owner === 'scan' ? [ids.scan, ids.blankCode] : [ids[owner]];
    if (values.some((v) => !v)) return { missing: `${pattern} (no id for ${owner}/${seg})` };
    out = out.flatMap((p) => values.map((v) => `${p}/${v}`));
  }
  return out.map((p) => p || '/');
}

interface Problem {
  kind: 'width' | 'target';
  what: string;
}

/** In the page: the document's width, what sticks out past the screen, and every target under 44×44. */
async function measure(page: Page): Promise<{ scrollWidth: number; problems: Problem[] }> {
  return page.evaluate(
    ({ phone, target }) => {
      const problems: { kind: 'width' | 'target'; what: string }[] = [];
      const name = (el: Element) => {
        const text = (el.getAttribute('aria-label') || (el as HTMLElement).innerText || el.getAttribute('title') || (el as HTMLInputElement).name || el.id || '').replace(/\s+/g, ' ').trim();
        return `<${el.tagName.toLowerCase()}${el.getAttribute('type') ? ` type=${el.getAttribute('type')}` : ''}> "${text.slice(0, 50)}"`;
      };
      const visible = (el: Element) => {
        const r = el.getBoundingClientRect();
        if (r.width <= 1 || r.height <= 1) return false;
        if (!el.checkVisibility({ checkVisibilityCSS: true })) return false;
        return !el.closest('[aria-hidden="true"], [inert]');
      };
      const big = (r: DOMRect) => r.width >= target - 0.5 && r.height >= target - 0.5;
      const scrollWidth = Math.max(document.documentElement.scrollWidth, document.body.scrollWidth);
      if (scrollWidth > phone) {
        // Name the widest things that reach past the screen (not those inside a sideways scroller).
        const wide = [...document.querySelectorAll('body *')]
          .filter((el) => el.getBoundingClientRect().right > phone + 0.5 && visible(el))
          .filter((el) => {
            for (let p = el.parentElement; p; p = p.parentElement) {
              const o = getComputedStyle(p).overflowX;
              if (o === 'auto' || o === 'scroll' || o === 'hidden' || o === 'clip') return false;
            }
            return true;
          })
          .filter((el, _, all) => !all.some((other) => other !== el && other.contains(el)))
          .slice(0, 4);
        problems.push({ kind: 'width', what: `page is ${scrollWidth} px wide; past the screen: ${wide.map((el) => `${name(el)} (right ${Math.round(el.getBoundingClientRect().right)} px, class "${(el.getAttribute('class') ?? '').slice(0, 80)}")`).join('; ')}` });
      }
      const controls = 'button, input:not([type="hidden"]), select, textarea, summary, [role="button"], [role="tab"], [role="switch"], a[href]';
      for (const el of document.querySelectorAll(controls)) {
        if (el.closest('.recharts-wrapper')) continue;
        // A check box or radio button is tapped through its label; a control hidden behind a
        // label styled as a button (a file input) is measured by that label.
        const labels = 'labels' in el && (el as HTMLInputElement).labels ? [...(el as HTMLInputElement).labels!] : [];
        if (!visible(el)) {
          const shown = labels.filter(visible);
          if (shown.length > 0 && !shown.some((l) => big(l.getBoundingClientRect()))) problems.push({ kind: 'target', what: `${name(shown[0]!)} for a hidden ${name(el)}: ${Math.round(shown[0]!.getBoundingClientRect().width)}×${Math.round(shown[0]!.getBoundingClientRect().height)}` });
          continue;
        }
        // Inline text links inside a paragraph of prose are exempt (WCAG 2.5.8's inline exception).
        if (el.tagName === 'A' && getComputedStyle(el).display === 'inline') {
          const p = el.closest('p');
          if (p && (p.textContent ?? '').trim().length > (el.textContent ?? '').trim().length) continue;
        }
        const boxes = [el.getBoundingClientRect(), ...labels.filter(visible).map((l) => l.getBoundingClientRect())];
        if (!boxes.some(big)) {
          const r = boxes[0]!;
          problems.push({ kind: 'target', what: `${name(el)}: ${Math.round(r.width)}×${Math.round(r.height)}` });
        }
      }
      return { scrollWidth, problems };
    },
    { phone: PHONE, target: TARGET },
  );
}

async function settle(page: Page): Promise<void> {
  // Client parts fetch their data after the first paint; measure once the network is quiet.
  await page.waitForLoadState('networkidle', { timeout: 5_000 }).catch(() => undefined);
}

const roles: Role[] = ['admin', 'office', 'technician', 'owner'];

for (const role of roles) {
  test(`${role}: every page fits a 360 px phone and every target is at least 44×44 px @phone`, async ({ page }, info) => {
    test.skip(info.project.name !== 'phone', 'the walk is for the 360 px phone');
    test.setTimeout(15 * 60_000);
    expect(page.viewportSize()?.width).toBe(PHONE);
    const dir = path.join(screenshotDir, 'every-page');
    mkdirSync(dir, { recursive: true });
    await signIn(page, emails[role]);
    const patterns = routePatterns();
    // The walk really is over the app: the places every role has, and the dynamic pages.
    expect(patterns).toEqual(expect.arrayContaining(['/', '/sites', '/sites/[id]', '/equipment/[id]', '/visits/[id]', '/tags/runs/[id]', '/scan/[code]']));
    const missing: string[] = [];
    const found: string[] = [];
    let walked = 0;
    for (const pattern of patterns) {
      const addresses = addressesFor(pattern, role);
      if ('missing' in addresses) {
        missing.push(addresses.missing);
        continue;
      }
      for (const address of addresses) {
        const response = await page.goto(address);
        await settle(page);
        walked += 1;
        const url = new URL(page.url());
        const landed = url.pathname + url.search;
        const { problems } = await measure(page);
        const slug = `${role}${address.replace(/[^a-z0-9]+/gi, '-')}`.replace(/-$/, '').slice(0, 80);
        await page.screenshot({ path: path.join(dir, `${slug}.jpg`), fullPage: true, type: 'jpeg', quality: 60 });
        for (const p of problems) found.push(`${address}${landed !== address ? ` (→ ${landed})` : ''} [${response?.status() ?? '?'}] ${p.kind}: ${p.what}`);
      }
    }
    info.annotations.push({ type: 'walked', description: `${walked} pages as ${role}` });
    expect(missing, 'pages with a dynamic segment this walk has no id for: add one in beforeAll').toEqual([]);
    expect(walked).toBeGreaterThan(30);
    expect(found, `pages of ${role} wider than 360 px or with targets under 44×44 px`).toEqual([]);
  });
}
