import Link from 'next/link';
import type { ReactNode } from 'react';
import { QueryProvider } from '@/components/query/query-provider';
import { requirePageActor } from '@/lib/auth';
import { can } from '@/lib/auth/access';
import { mailCatcherEnabled } from '@/lib/mail/catcher';

export default async function SettingsLayout({ children }: { children: ReactNode }) {
  const actor = await requirePageActor('/settings');
  const links = [
    { href: '/settings', label: 'My preferences', show: true },
    { href: '/settings/company', label: 'Company', show: can(actor, 'company.settings') },
    { href: '/settings/users', label: 'Users', show: can(actor, 'users.manage') },
    { href: '/settings/mail', label: 'Mail inbox (local)', show: can(actor, 'mail.inbox') && mailCatcherEnabled() },
    { href: '/settings/storage', label: 'Photo storage', show: can(actor, 'photos.maintain') },
  ].filter((l) => l.show);
  return (
    <div className="grid grid-cols-1 gap-6 md:grid-cols-[12rem_minmax(0,1fr)]">
      <nav aria-label="Settings" className="flex gap-1 overflow-x-auto md:flex-col">
        {links.map((l) => (
          <Link key={l.href} href={l.href} className="flex min-h-11 shrink-0 items-center rounded-md px-3 text-sm font-semibold text-slate-800 hover:bg-ice-50">
            {l.label}
          </Link>
        ))}
      </nav>
      <div className="min-w-0">
        {/* Settings forms fetch in the browser; the provider is per section (DEVELOPERS.md, "Phone pages"). */}
        <QueryProvider>{children}</QueryProvider>
      </div>
    </div>
  );
}
