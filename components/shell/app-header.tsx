'use client';

import { BellRing, Building2, CalendarDays, ClipboardList, FileText, Gauge, Home, ListTodo, MapPin, Menu, QrCode, Refrigerator, ScanLine, Settings, Snowflake, Sun, LogOut, X } from 'lucide-react';
import Link from 'next/link';
import { usePathname, useRouter } from 'next/navigation';
import { useState } from 'react';
import { roleLabels, type Role } from '@/lib/auth/permissions';
import type { NavItem } from '@/lib/navigation';
import { cn } from '@/lib/utils';
import { signOutWipe } from '@/lib/offline/user';

const icons = { home: Home, scan: ScanLine, sites: MapPin, equipment: Refrigerator, visits: ClipboardList, followUps: ListTodo, tags: QrCode, clients: Building2, settings: Settings, gauge: Gauge, requests: BellRing, reports: FileText, plans: CalendarDays } as const;

function isActive(pathname: string, href: string): boolean {
  return href === '/' ? pathname === '/' : pathname === href || pathname.startsWith(`${href}/`);
}

export function AppHeader({ items, name, role, highContrast }: { items: NavItem[]; name: string; role: Role; highContrast: boolean }) {
  const pathname = usePathname();
  const router = useRouter();
  const [moreOpen, setMoreOpen] = useState(false);

  function toggleContrast() {
    document.cookie = `rl-contrast=${highContrast ? 'normal' : 'high'}; path=/; max-age=31536000; samesite=lax`;
    router.refresh();
  }

  return (
    <header className="bg-slate-900 text-white print:hidden">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white focus:px-3 focus:py-2 focus:text-slate-900">
        Skip to content
      </a>
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-4 gap-y-2 px-3 py-2 sm:px-6">
        <Link href="/" className="flex min-h-11 items-center gap-2 text-lg font-bold">
          <Snowflake aria-hidden className="size-6 text-ice-300" />
          Rimeline
        </Link>
        <div className="ml-auto flex items-center gap-1">
          <button
            type="button"
            onClick={toggleContrast}
            aria-pressed={highContrast}
            className="flex min-h-11 min-w-11 items-center justify-center gap-1 rounded px-2 text-sm text-slate-200 hover:bg-slate-800"
          >
            <Sun aria-hidden className="size-5" />
            <span className="hidden sm:inline">{highContrast ? 'Normal contrast' : 'Sunlight mode'}</span>
            <span className="sr-only sm:hidden">High contrast</span>
          </button>
          <span className="hidden text-right text-sm leading-tight text-slate-300 md:block">
            {name}
            <br />
            <span className="text-xs text-slate-400">{roleLabels[role]}</span>
          </span>
          <button
            type="button"
            onClick={async () => {
              // The phone's kept sites and pages belong to this person: they go before the session does.
              await signOutWipe().catch(() => undefined);
              const { signOut } = await import('next-auth/react');
              await signOut({ callbackUrl: '/sign-in' });
            }}
            className="flex min-h-11 min-w-11 items-center justify-center gap-1 rounded px-2 text-sm text-slate-200 hover:bg-slate-800"
          >
            <LogOut aria-hidden className="size-5" />
            Sign out
          </button>
        </div>
        <nav aria-label="Main" className="w-full pb-1">
          {/* Phones: the everyday places in one row of big targets, the rest behind "More". */}
          <ul className="-mx-1 flex flex-wrap gap-1">
            {items.map((item) => {
              const Icon = icons[item.icon];
              const active = isActive(pathname, item.href);
              const hiddenOnPhone = !item.primary && !active && !moreOpen;
              return (
                <li key={item.href} className={cn(hiddenOnPhone ? 'hidden md:block' : '')}>
                  <Link
                    href={item.href}
                    aria-current={active ? 'page' : undefined}
                    onClick={() => setMoreOpen(false)}
                    className={cn(
                      'flex min-h-11 shrink-0 items-center gap-2 rounded-md px-3 text-sm font-semibold',
                      active ? 'bg-ice-100 text-ice-950' : 'text-slate-200 hover:bg-slate-800',
                    )}
                  >
                    <Icon aria-hidden className="size-5" />
                    {item.label}
                  </Link>
                </li>
              );
            })}
            <li className="md:hidden">
              <button
                type="button"
                aria-expanded={moreOpen}
                onClick={() => setMoreOpen((v) => !v)}
                className="flex min-h-11 items-center gap-2 rounded-md px-3 text-sm font-semibold text-slate-200 hover:bg-slate-800"
              >
                {moreOpen ? <X aria-hidden className="size-5" /> : <Menu aria-hidden className="size-5" />}
                {moreOpen ? 'Less' : 'More'}
              </button>
            </li>
          </ul>
        </nav>
      </div>
    </header>
  );
}
