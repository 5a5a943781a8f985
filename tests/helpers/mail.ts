// Reads the local mail catcher's HTTP API (see docker-free-scripts/mail-catcher.ts).
export const mailApi = process.env.MAIL_CATCHER_URL ?? 'http://127.0.0.1:1081';

export interface CaughtMessage {
  id: string;
  to: string[];
  subject: string;
  text: string | null;
  html: string | null;
  messageId?: string;
}

export async function clearMail(): Promise<void> {
  await fetch(`${mailApi}/messages`, { method: 'DELETE' });
}

export async function mailTo(address: string): Promise<CaughtMessage[]> {
  const res = await fetch(`${mailApi}/messages?to=${encodeURIComponent(address)}`);
  return (await res.json()) as CaughtMessage[];
}

/** Waits until a message for the address arrives (the outbox sends asynchronously). */
/**
 * The newest message to `address` that `match` accepts. A message an earlier test queued can
 * still arrive after the inbox was emptied (closing a visit wakes the outbox in the background),
 * so a test names what it is waiting for.
 */
export async function waitForMail(address: string, timeoutMs = 15_000, match: (m: CaughtMessage) => boolean = () => true): Promise<CaughtMessage> {
  const end = Date.now() + timeoutMs;
  while (Date.now() < end) {
    const found = (await mailTo(address)).find(match);
    if (found) return found;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`No mail for ${address} within ${timeoutMs} ms`);
}

export function firstLink(text: string, pathPart: string): string {
  const match = text.match(new RegExp(`https?://[^\\s"<>]*${pathPart}[^\\s"<>]*`));
  if (!match) throw new Error(`No link containing ${pathPart} in: ${text}`);
  return match[0];
}
