import 'server-only';
import type { Kysely, Transaction } from 'kysely';
import type { DB } from '@/db/schema.gen';
import type { Actor } from '@/lib/auth/actor';
import { env } from '@/lib/env';
import { formatTimeWindow, formatWeekday } from '@/lib/format/local-times';
import { escapeHtml } from '@/lib/mail/escape';
import { enqueueMail } from '@/lib/mail/outbox';
import { reportRecipients } from '@/lib/mail/recipients';
import type { PlanDto } from '@/lib/plans/dto';
import { visitReasonLabels } from '@/lib/visits/terms';

export type PlanMailEvent = 'planned' | 'moved' | 'cancelled';

const headings: Record<PlanMailEvent, string> = {
  planned: 'Visit planned',
  moved: 'Planned visit moved',
  cancelled: 'Planned visit cancelled',
};

function when(plan: PlanDto): string {
  return `${formatWeekday(plan.day)}, ${formatTimeWindow(plan.windowStart, plan.windowEnd)} (site time)`;
}

/**
 * Queues the e-mail to the client's contacts who receive reports, when the company has turned
 * plan e-mails on. Written in the caller's transaction; returns how many addresses it went to.
 */
export async function queuePlanMail(actor: Actor, plan: PlanDto, event: PlanMailEvent, trx: Kysely<DB> | Transaction<DB>, before?: PlanDto): Promise<number> {
  const company = await trx.selectFrom('companies').select(['name', 'mail_visit_plans']).where('id', '=', actor.companyId).executeTakeFirstOrThrow();
  if (!company.mail_visit_plans) return 0;
  const to = await reportRecipients(trx, plan.siteId);
  if (to.length === 0) return 0;
  const heading = headings[event];
  const siteUrl = `${env.APP_URL}/sites/${plan.siteId}`;
  const facts: [string, string][] = [
    ['Site', `${plan.siteName} (${plan.clientName})`],
    [event === 'cancelled' ? 'Was planned for' : 'When', when(plan)],
    ...(event === 'moved' && before ? ([['Was', when(before)]] as [string, string][]) : []),
    ['Reason', visitReasonLabels[plan.reason]],
    ...(event === 'cancelled' ? [] : ([['Technician', plan.technicianName]] as [string, string][])),
    ...(plan.systems.length ? ([['Systems', plan.systems.map((s) => s.name).join(', ')]] as [string, string][]) : []),
    ...(plan.equipment.length ? ([['Units', plan.equipment.map((e) => e.name).join(', ')]] as [string, string][]) : []),
    ...(event === 'cancelled' && plan.cancelReason ? ([['Why', plan.cancelReason]] as [string, string][]) : []),
  ];
  const text = [`${heading} — ${company.name}`, '', ...facts.map(([k, v]) => `${k}: ${v}`), '', `See the site: ${siteUrl}`].join('\n');
  const html = `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#0f172a;background:#f1f5f9;padding:16px">
<div style="max-width:560px;margin:auto;background:#fff;border-radius:8px;padding:20px">
<p style="font-weight:700;color:#0f3a56;margin:0 0 8px">${escapeHtml(company.name)} · Rimeline</p>
<h1 style="font-size:20px;margin:0 0 12px">${escapeHtml(heading)}</h1>
<table style="border-collapse:collapse;margin-bottom:12px">${facts.map(([k, v]) => `<tr><th style="text-align:left;padding:2px 12px 2px 0;color:#475569">${escapeHtml(k)}</th><td>${escapeHtml(v)}</td></tr>`).join('')}</table>
<p><a href="${escapeHtml(siteUrl)}" style="color:#0f3a56;font-weight:600">See the site in Rimeline</a></p></div></body></html>`;
  await enqueueMail({ companyId: actor.companyId, kind: `visit_plan_${event}`, to, subject: `${heading}: ${plan.siteName}, ${formatWeekday(plan.day)}`, text, html }, trx);
  return to.length;
}
