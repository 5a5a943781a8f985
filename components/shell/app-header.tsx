import { BellRing, Building2, CalendarDays, ClipboardList, FileText, Gauge, Home, ListTodo, LogOut, MapPin, QrCode, Refrigerator, ScanLine, Settings, Snowflake, Sun } from 'lucide-react';
import Link from 'next/link';
import { ContrastButton, SignOutButton } from '@/components/shell/header-buttons';
import { MainNav } from '@/components/shell/main-nav';
import { roleLabels, type Role } from '@/lib/auth/permissions';
import type { NavItem } from '@/lib/navigation';

const icons = { home: Home, scan: ScanLine, sites: MapPin, equipment: Refrigerator, visits: ClipboardList, followUps: ListTodo, tags: QrCode, clients: Building2, settings: Settings, gauge: Gauge, requests: BellRing, reports: FileText, plans: CalendarDays } as const;

/**
 * The signed-in header, in every page: a server component, so only its buttons and the
 * navigation's current-place marking reach the browser as script.
 */
export function AppHeader({ items, name, role, highContrast }: { items: NavItem[]; name: string; role: Role; highContrast: boolean }) {
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
          <ContrastButton highContrast={highContrast}>
            <Sun aria-hidden className="size-5" />
            <span className="hidden sm:inline">{highContrast ? 'Normal contrast' : 'Sunlight mode'}</span>
            <span className="sr-only sm:hidden">High contrast</span>
          </ContrastButton>
          <span className="hidden text-right text-sm leading-tight text-slate-300 md:block">
            {name}
            <br />
            <span className="text-xs text-slate-400">{roleLabels[role]}</span>
          </span>
          <SignOutButton>
            <LogOut aria-hidden className="size-5" />
            Sign out
          </SignOutButton>
        </div>
        <MainNav
          items={items.map((item) => {
            const Icon = icons[item.icon];
            return { href: item.href, label: item.label, primary: Boolean(item.primary), icon: <Icon aria-hidden className="size-5" /> };
          })}
        />
      </div>
    </header>
  );
}
