// The visit report (e-mail and PDF) gives a reading's likely causes as the readings form does:
// labelled as a guide from common practice, never a verdict, with the reasoning and the checks.
import { execFileSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { KPA_PER_PSI, fahrenheitToCelsius } from '@/lib/calc/units';
import { deliverDueMail } from '@/lib/mail/outbox';
import type { Actor } from '@/lib/auth/actor';
import { closeVisit, ensureVisitReport } from '@/lib/visits/close';
import { addEntry } from '@/lib/visits/entries';
import { startVisit } from '@/lib/visits/service';
import { getObjectBytes, ensureBucket } from '@/storage/objects';
import { createTestDb } from '@/tests/helpers/db';
import { clearMail, waitForMail } from '@/tests/helpers/mail';
import { resetDemoWithCircuitEach, type CoolerCircuit } from '@/tests/helpers/registry';

const db = createTestDb();
let tech: Actor, office: Actor, circuit: CoolerCircuit;
resetDemoWithCircuitEach(db, (demo) => ({ tech, office, circuit } = demo));

describe('likely causes in the visit report', () => {
  it('a reading with high superheat and low subcooling: the e-mail and the PDF list its causes as a guide', async () => {
    await clearMail();
    await ensureBucket();
    const visit = await startVisit(tech, { siteId: circuit.siteId, reason: 'no_cooling' });
    // R-404A cooler: 60 psig suction (dew about 24 °F) with a 50 °F suction line, 250 psig head (bubble about
    // 104 °F, CoolProp) with a 103 °F liquid line: superheat about 26 °F, subcooling about 1 °F — high and low
    // against the common-practice bands, the pattern of a short charge.
    const data = {
      suctionKpaG: 60 * KPA_PER_PSI,
      dischargeKpaG: 250 * KPA_PER_PSI,
      suctionLineC: fahrenheitToCelsius(50),
      liquidLineC: fahrenheitToCelsius(103),
      boxC: fahrenheitToCelsius(45),
      ambientC: fahrenheitToCelsius(85),
    };
    const saved = await addEntry(tech, visit.id, { equipmentId: circuit.condensingUnitId, clientEntryId: randomUUID(), kind: 'reading' as const, data });
    const suggestions = (saved.computed as { suggestions?: { title: string }[] }).suggestions ?? [];
    expect(suggestions.length).toBeGreaterThan(0);
    const first = suggestions[0]!.title;
    expect(first).toMatch(/charge/i);

    await closeVisit(tech, visit.id, { summary: 'Charge low; leak search booked.', confirmBypassRemoved: false });
    await deliverDueMail();
    const mail = await waitForMail('owner@client-one.test', 15_000, (m) => (m.text ?? '').includes(`/visits/${visit.id}`));
    expect(mail.text).toContain('What these readings suggest (a guide from common practice, not a verdict; confirm before acting):');
    expect(mail.text).toContain(`1. ${first}.`);
    expect(mail.html).toContain('a guide from common practice, not a verdict');

    const pdf = Buffer.from(await getObjectBytes(await ensureVisitReport(office, visit.id)));
    const dir = mkdtempSync(path.join(tmpdir(), 'rl-visit-report-'));
    writeFileSync(path.join(dir, 'v.pdf'), pdf);
    const text = execFileSync('pdftotext', [path.join(dir, 'v.pdf'), '-']).toString().replace(/\s+/g, ' ');
    expect(text).toContain('What these readings suggest (a guide from common practice, not a verdict');
    expect(text).toContain(`1. ${first}.`);
    // Dates in the document carry the site's zone.
    expect(text).toMatch(/Started: \w{3} \d{1,2}, \d{4}, \d{1,2}:\d{2} [AP]M [A-Z]{2,5}/);
  });
});
