import 'server-only';
import type { Kysely, Transaction } from 'kysely';
import type { DB } from '@/db/schema.gen';
import type { Actor } from '@/lib/auth/actor';
import { env } from '@/lib/env';
import { escapeHtml } from '@/lib/mail/escape';
import { enqueueMail } from '@/lib/mail/outbox';
import { reportRecipients } from '@/lib/mail/recipients';
import { buildVisitReport } from '@/lib/visits/report-content';
import { getVisit } from '@/lib/visits/service';

/** Queues the report e-mail to the client's contacts who chose to receive reports. */
export async function queueVisitReport(actor: Actor, visitId: string, trx: Kysely<DB> | Transaction<DB>): Promise<number> {
  const visit = await getVisit(actor, visitId, trx);
  const to = await reportRecipients(trx, visit.siteId);
  if (to.length === 0) return 0;
  const company = await trx.selectFrom('companies').select(['name', 'default_units']).where('id', '=', actor.companyId).executeTakeFirstOrThrow();
  const report = buildVisitReport(visit, { units: company.default_units as 'imperial' | 'metric', metricPressure: 'kPa' }, company.name);
  const visitUrl = `${env.APP_URL}/visits/${visitId}`;
  const pdfUrl = `${env.APP_URL}/api/visits/${visitId}/report`;
  const text = [
    report.title,
    '',
    ...report.facts.map(([k, v]) => `${k}: ${v}`),
    '',
    `Summary: ${report.summary}`,
    '',
    ...report.sections.flatMap((s) => [s.heading, ...s.lines.map((l) => `  - ${l}`), '']),
    `View the visit: ${visitUrl}`,
    `Report (PDF): ${pdfUrl}`,
    '',
    report.caution,
  ].join('\n');
  const html = `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#0f172a;background:#f1f5f9;padding:16px">
<div style="max-width:640px;margin:auto;background:#fff;border-radius:8px;padding:20px">
<p style="font-weight:700;color:#0f3a56;margin:0 0 8px">${escapeHtml(company.name)} · Rimeline</p>
<h1 style="font-size:20px;margin:0 0 12px">${escapeHtml(report.title)}</h1>
<table style="border-collapse:collapse;margin-bottom:12px">${report.facts.map(([k, v]) => `<tr><th style="text-align:left;padding:2px 12px 2px 0;color:#475569">${escapeHtml(k)}</th><td>${escapeHtml(v)}</td></tr>`).join('')}</table>
<h2 style="font-size:16px">Summary</h2><p>${escapeHtml(report.summary)}</p>
${report.sections.map((s) => `<h2 style="font-size:16px;margin-top:16px">${escapeHtml(s.heading)}</h2><ul>${s.lines.map((l) => `<li>${escapeHtml(l)}</li>`).join('')}</ul>`).join('')}
<p><a href="${escapeHtml(visitUrl)}" style="color:#0f3a56;font-weight:600">View the visit in Rimeline</a> · <a href="${escapeHtml(pdfUrl)}" style="color:#0f3a56;font-weight:600">Download the PDF report</a></p>
<p style="font-size:12px;color:#475569">${escapeHtml(report.caution)}</p></div></body></html>`;
  await enqueueMail({ companyId: actor.companyId, kind: 'visit_report', to, subject: `${report.title} (${report.facts[4]![1]})`, text, html }, trx);
  return to.length;
}
