// Local mail catcher for the embedded setup (dev, test and bench profiles).
//
// An SMTP server (smtp-server, no AUTH, no STARTTLS) accepts every message, parses it with
// mailparser and stores it as one JSON file per message in the mail directory, so the inbox
// survives restarts. A small JSON API on a second port lets the app's inbox page and the tests
// read it:
//
//   GET    /health             200 {"status":"ok","messages":N}
//   GET    /messages           newest first, full messages (text and html included);
//                              optional ?to=<address> (case-insensitive, envelope recipients)
//                              and ?limit=<n>
//   GET    /messages/:id       one full message, 404 when unknown
//   GET    /messages/:id/raw   the original message source (message/rfc822)
//   DELETE /messages           removes every message (tests use it), 200 {"deleted":N}
//   DELETE /messages/:id       removes one message
//
// Stored message: { id, to: string[] (envelope recipients, includes Cc and Bcc), from (the From
// header as written, e.g. "Rimeline <no-reply@rimeline.test>"), subject, date (ISO time the
// catcher received it), text, html (null when the mail has none), cc, headerTo, envelopeFrom,
// messageId, attachments: [{ filename, contentType, size }] }.
//
// Run: node_modules/.bin/tsx docker-free-scripts/mail-catcher.ts
//        [--smtp-port 1025] [--http-port 1080] [--dir .data/dev/mail]
// Defaults come from SMTP_URL, MAIL_CATCHER_URL and RIMELINE_DATA (see env.sh).
import { randomBytes } from 'node:crypto';
import { promises as fs } from 'node:fs';
import http from 'node:http';
import type { Server } from 'node:net';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { portFromUrl } from './port-from-url';

const HOST = '127.0.0.1';

const { values: args } = parseArgs({
  options: {
    'smtp-port': { type: 'string' },
    'http-port': { type: 'string' },
    dir: { type: 'string' },
  },
});

const smtpPort = Number(args['smtp-port'] ?? portFromUrl(process.env.SMTP_URL) ?? 1025);
const httpPort = Number(args['http-port'] ?? portFromUrl(process.env.MAIL_CATCHER_URL) ?? 1080);
const mailDir = path.resolve(
  args.dir ?? (process.env.RIMELINE_DATA ? path.join(process.env.RIMELINE_DATA, 'mail') : '.data/dev/mail'),
);

interface StoredMessage {
  id: string;
  to: string[];
  from: string;
  subject: string;
  date: string;
  text: string | null;
  html: string | null;
  cc: string[];
  headerTo: string[];
  envelopeFrom: string | null;
  messageId: string | null;
  attachments: { filename: string | null; contentType: string; size: number }[];
}

const ID_PATTERN = /^[0-9a-z]{1,40}-[0-9a-f]{1,16}$/;

function log(message: string): void {
  process.stdout.write(`${new Date().toISOString()} ${message}\n`);
}

// Ids sort by arrival time: a zero-padded base-36 millisecond stamp plus a random suffix.
function newId(): string {
  return `${Date.now().toString(36).padStart(10, '0')}-${randomBytes(4).toString('hex')}`;
}

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  if (!value) return [];
  const list = Array.isArray(value) ? value : [value];
  return list.flatMap((group) => group.value.map((a) => a.address ?? '')).filter((a) => a.length > 0);
}

async function writeAtomic(file: string, content: string | Buffer): Promise<void> {
  const tmp = `${file}.${process.pid}.tmp`;
  await fs.writeFile(tmp, content);
  await fs.rename(tmp, file);
}

async function storeMessage(raw: Buffer, envelopeTo: string[], envelopeFrom: string | null): Promise<StoredMessage> {
  const parsed = await simpleParser(raw);
  const id = newId();
  const message: StoredMessage = {
    id,
    to: envelopeTo.length > 0 ? envelopeTo : addresses(parsed.to),
    from: parsed.from?.text ?? envelopeFrom ?? '',
    subject: parsed.subject ?? '',
    date: new Date().toISOString(),
    text: parsed.text ?? null,
    html: typeof parsed.html === 'string' ? parsed.html : null,
    cc: addresses(parsed.cc),
    headerTo: addresses(parsed.to),
    envelopeFrom,
    messageId: parsed.messageId ?? null,
    attachments: parsed.attachments.map((a) => ({
      filename: a.filename ?? null,
      contentType: a.contentType,
      size: a.size,
    })),
  };
  await writeAtomic(path.join(mailDir, `${id}.eml`), raw);
  await writeAtomic(path.join(mailDir, `${id}.json`), JSON.stringify(message, null, 2));
  return message;
}

async function listIds(): Promise<string[]> {
  const names = await fs.readdir(mailDir);
  return names
    .filter((n) => n.endsWith('.json'))
    .map((n) => n.slice(0, -'.json'.length))
    .filter((id) => ID_PATTERN.test(id))
    .sort()
    .reverse();
}

async function readMessage(id: string): Promise<StoredMessage | null> {
  if (!ID_PATTERN.test(id)) return null;
  try {
    return JSON.parse(await fs.readFile(path.join(mailDir, `${id}.json`), 'utf8')) as StoredMessage;
  } catch {
    return null;
  }
}

async function deleteMessage(id: string): Promise<boolean> {
  if (!ID_PATTERN.test(id)) return false;
  let found = false;
  for (const ext of ['.json', '.eml']) {
    try {
      await fs.unlink(path.join(mailDir, `${id}${ext}`));
      found = true;
    } catch {
      // already gone
    }
  }
  return found;
}

// ---------------------------------------------------------------- SMTP
const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ['AUTH', 'STARTTLS'],
  hideSTARTTLS: true,
  logger: false,
  banner: 'Rimeline local mail catcher',
  size: 30 * 1024 * 1024,
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on('data', (chunk: Buffer) => chunks.push(chunk));
    stream.on('error', (err) => callback(err));
    stream.on('end', () => {
      const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
      const mailFrom = session.envelope.mailFrom;
      const envelopeFrom = mailFrom ? mailFrom.address : null;
      storeMessage(Buffer.concat(chunks), envelopeTo, envelopeFrom)
        .then((m) => {
          log(`stored ${m.id} to=${m.to.join(',')} subject=${JSON.stringify(m.subject)}`);
          callback(null, `Message queued as ${m.id}`);
        })
        .catch((err: unknown) => {
          log(`failed to store a message: ${String(err)}`);
          callback(err instanceof Error ? err : new Error(String(err)));
        });
    });
  },
});
smtp.on('error', (err) => log(`smtp error: ${err.message}`));

// ---------------------------------------------------------------- HTTP API
function sendJson(res: http.ServerResponse, status: number, body: unknown): void {
  const payload = JSON.stringify(body);
  res.writeHead(status, {
    'content-type': 'application/json; charset=utf-8',
    'content-length': Buffer.byteLength(payload),
    'cache-control': 'no-store',
  });
  res.end(payload);
}

async function handle(req: http.IncomingMessage, res: http.ServerResponse): Promise<void> {
  const url = new URL(req.url ?? '/', `http://${HOST}:${httpPort}`);
  const parts = url.pathname.split('/').filter((p) => p.length > 0);
  const method = req.method ?? 'GET';

  if (parts.length === 1 && parts[0] === 'health' && (method === 'GET' || method === 'HEAD')) {
    sendJson(res, 200, { status: 'ok', messages: (await listIds()).length });
    return;
  }

  if (parts[0] !== 'messages' || parts.length > 3) {
    sendJson(res, 404, { error: { code: 'not_found', message: 'Unknown path' } });
    return;
  }

  if (parts.length === 1) {
    if (method === 'GET') {
      const to = url.searchParams.get('to')?.toLowerCase();
      const limitParam = Number(url.searchParams.get('limit') ?? '');
      const limit = Number.isInteger(limitParam) && limitParam > 0 ? limitParam : Infinity;
      const out: StoredMessage[] = [];
      for (const id of await listIds()) {
        if (out.length >= limit) break;
        const message = await readMessage(id);
        if (!message) continue;
        if (to && !message.to.some((a) => a.toLowerCase() === to)) continue;
        out.push(message);
      }
      sendJson(res, 200, out);
      return;
    }
    if (method === 'DELETE') {
      let deleted = 0;
      for (const id of await listIds()) if (await deleteMessage(id)) deleted += 1;
      log(`cleared ${deleted} message(s)`);
      sendJson(res, 200, { deleted });
      return;
    }
    sendJson(res, 405, { error: { code: 'method_not_allowed', message: `${method} is not allowed here` } });
    return;
  }

  const id = parts[1] ?? '';
  if (parts.length === 3) {
    if (parts[2] !== 'raw' || method !== 'GET' || !ID_PATTERN.test(id)) {
      sendJson(res, 404, { error: { code: 'not_found', message: 'Unknown path' } });
      return;
    }
    try {
      const raw = await fs.readFile(path.join(mailDir, `${id}.eml`));
      res.writeHead(200, { 'content-type': 'message/rfc822', 'content-length': raw.length });
      res.end(raw);
    } catch {
      sendJson(res, 404, { error: { code: 'not_found', message: 'No such message' } });
    }
    return;
  }

  if (method === 'GET') {
    const message = await readMessage(id);
    if (message) sendJson(res, 200, message);
    else sendJson(res, 404, { error: { code: 'not_found', message: 'No such message' } });
    return;
  }
  if (method === 'DELETE') {
    if (await deleteMessage(id)) sendJson(res, 200, { deleted: 1 });
    else sendJson(res, 404, { error: { code: 'not_found', message: 'No such message' } });
    return;
  }
  sendJson(res, 405, { error: { code: 'method_not_allowed', message: `${method} is not allowed here` } });
}

const api = http.createServer((req, res) => {
  handle(req, res).catch((err: unknown) => {
    log(`http error: ${String(err)}`);
    if (!res.headersSent) sendJson(res, 500, { error: { code: 'internal', message: String(err) } });
    else res.end();
  });
});

function listen(server: Server, port: number): Promise<void> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, HOST, () => resolve());
  });
}

async function main(): Promise<void> {
  await fs.mkdir(mailDir, { recursive: true });
  await listen(smtp.server, smtpPort);
  await listen(api, httpPort);
  log(`mail catcher: SMTP on ${HOST}:${smtpPort}, API on http://${HOST}:${httpPort}, messages in ${mailDir}`);
}

let stopping = false;
function shutdown(signal: string): void {
  if (stopping) return;
  stopping = true;
  log(`received ${signal}, stopping`);
  api.close();
  api.closeAllConnections();
  smtp.close(() => process.exit(0));
  // Never hang on an open SMTP session.
  setTimeout(() => process.exit(0), 2000).unref();
}
process.on('SIGTERM', () => shutdown('SIGTERM'));
process.on('SIGINT', () => shutdown('SIGINT'));

main().catch((err: unknown) => {
  log(`mail catcher failed to start: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
