import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { Alert } from '@/components/ui/alert';
import { EmptyState, PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { isAppError } from '@/lib/errors';
import { getCaughtMail, listCaughtMail, mailCatcherEnabled, type CaughtMail } from '@/lib/mail/catcher';
import { formatStamp } from '@/lib/format/dates';

export const metadata: Metadata = { title: 'Mail inbox' };
export const dynamic = 'force-dynamic';

export default async function MailInboxPage({ searchParams }: { searchParams: Promise<{ id?: string }> }) {
  const actor = await requirePageActor('/settings/mail', 'mail.inbox');
  if (!mailCatcherEnabled()) notFound();
  const { id } = await searchParams;
  let messages: CaughtMail[] = [];
  let open: CaughtMail | null = null;
  let problem: string | null = null;
  try {
    messages = await listCaughtMail(actor);
    const chosen = id ?? messages[0]?.id;
    open = chosen ? await getCaughtMail(actor, chosen) : null;
  } catch (error) {
    problem = isAppError(error) ? error.message : 'The local mail catcher could not be read.';
  }
  return (
    <>
      <PageHeader title="Mail inbox" subtitle="Every message the app sent through the local mail catcher. Present only in the embedded setup." />
      {problem ? <Alert tone="warning" title={problem} /> : null}
      {messages.length === 0 && !problem ? <EmptyState title="No mail yet.">Invite someone or ask for a sign-in link, and the message appears here.</EmptyState> : null}
      {messages.length > 0 ? (
        <div className="grid gap-4 lg:grid-cols-[18rem_1fr]">
          <ul className="max-h-[70vh] divide-y divide-slate-200 overflow-y-auto rounded-lg border border-slate-200 bg-white" aria-label="Messages">
            {messages.map((m) => (
              <li key={m.id}>
                <a href={`/settings/mail?id=${encodeURIComponent(m.id)}`} aria-current={open?.id === m.id ? 'true' : undefined} className={`block px-3 py-2 hover:bg-ice-50 ${open?.id === m.id ? 'bg-ice-50' : ''}`}>
                  <span className="block truncate text-sm font-semibold">{m.subject}</span>
                  <span className="block truncate text-xs text-slate-600">To {m.to.join(', ')}</span>
                  <span className="block text-xs text-slate-600">{formatStamp(m.date)}</span>
                </a>
              </li>
            ))}
          </ul>
          {open ? (
            <article className="rounded-lg border border-slate-200 bg-white p-4" aria-label="Open message">
              <h2 className="text-lg font-semibold">{open.subject}</h2>
              <p className="text-sm text-slate-600">
                To {open.to.join(', ')} · From {open.from}
              </p>
              {open.html ? (
                // The catcher only holds mail this app generated; sandboxing still keeps its markup away from the page.
                <iframe title="Message body" sandbox="allow-popups allow-top-navigation-by-user-activation" srcDoc={`<base target="_top">${open.html}`} className="mt-3 h-[32rem] w-full rounded border border-slate-200" />
              ) : (
                <pre className="mt-3 whitespace-pre-wrap text-sm">{open.text}</pre>
              )}
              {open.text ? (
                <details className="mt-3">
                  <summary className="flex min-h-11 cursor-pointer items-center text-sm font-semibold">Plain text</summary>
                  <pre className="mt-2 whitespace-pre-wrap text-sm" data-testid="mail-text">{open.text}</pre>
                </details>
              ) : null}
            </article>
          ) : null}
        </div>
      ) : null}
    </>
  );
}
