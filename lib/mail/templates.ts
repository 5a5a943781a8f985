import { escapeHtml } from '@/lib/mail/escape';

export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

function layout(title: string, body: string): string {
  return `<!doctype html><html><body style="font-family:system-ui,sans-serif;background:#f1f5f9;padding:24px;color:#0f172a">
<div style="max-width:560px;margin:auto;background:#fff;border-radius:8px;padding:24px">
<p style="font-weight:700;color:#0f3a56;margin:0 0 16px">Rimeline</p>
<h1 style="font-size:20px;margin:0 0 16px">${escapeHtml(title)}</h1>${body}</div></body></html>`;
}

function button(url: string, label: string): string {
  return `<p><a href="${escapeHtml(url)}" style="display:inline-block;background:#0f3a56;color:#fff;padding:12px 20px;border-radius:6px;text-decoration:none;font-weight:600">${escapeHtml(label)}</a></p>
<p style="font-size:13px;color:#475569">Or open this address: <a href="${escapeHtml(url)}">${escapeHtml(url)}</a></p>`;
}

export function magicLinkMail(name: string, url: string): MailContent {
  return {
    subject: 'Your Rimeline sign-in link',
    text: `Hello ${name},\n\nOpen this link to sign in to Rimeline. It works once and expires in 15 minutes.\n\n${url}\n\nIf you did not ask for it, ignore this message.`,
    html: layout(
      'Sign in to Rimeline',
      `<p>Hello ${escapeHtml(name)},</p><p>This link signs you in once and expires in 15 minutes.</p>${button(url, 'Sign in')}<p style="font-size:13px;color:#475569">If you did not ask for it, ignore this message.</p>`,
    ),
  };
}

export function invitationMail(input: { name: string; companyName: string; inviterName: string; roleLabel: string; url: string }): MailContent {
  return {
    subject: `${input.inviterName} invited you to ${input.companyName} on Rimeline`,
    text: `Hello ${input.name},\n\n${input.inviterName} invited you to join ${input.companyName} on Rimeline as ${input.roleLabel}.\nChoose your password here (the link expires in 7 days):\n\n${input.url}\n`,
    html: layout(
      `Join ${input.companyName} on Rimeline`,
      `<p>Hello ${escapeHtml(input.name)},</p><p>${escapeHtml(input.inviterName)} invited you to join <strong>${escapeHtml(input.companyName)}</strong> as ${escapeHtml(input.roleLabel)}. The link expires in 7 days.</p>${button(input.url, 'Accept the invitation')}`,
    ),
  };
}
