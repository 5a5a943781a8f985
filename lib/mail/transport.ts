import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '@/lib/env';

const globalForMail = globalThis as unknown as { rimelineMail?: Transporter };

function createTransport(): Transporter {
  const url = new URL(env.SMTP_URL);
  const secure = url.protocol === 'smtps:';
  return nodemailer.createTransport({
    host: url.hostname,
    port: Number(url.port || (secure ? 465 : 25)),
    secure,
    // A plain smtp:// URL to a loopback catcher must not attempt STARTTLS.
    ignoreTLS: !secure && (url.hostname === '127.0.0.1' || url.hostname === 'localhost'),
    auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 10_000,
  });
}

export const mailTransport: Transporter = globalForMail.rimelineMail ?? createTransport();
globalForMail.rimelineMail = mailTransport;
