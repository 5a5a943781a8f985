'use client';

import { Menu, X } from 'lucide-react';
import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { useState, type ReactNode } from 'react';
import { cn } from '@/lib/utils';

export interface MainNavItem {
  href: string;
  label: string;
  primary: boolean;
  /** Rendered by the server, so the icons are not in the page's scripts. */
  icon: ReactNode;
}

function isActive(pathname: string, href: string): boolean {
  return href === '/' ? pathname === '/' : pathname === href || pathname.startsWith(`${href}/`);
}

/** The main navigation: the current place marked as the address changes, and the phone's "More". */
export function MainNav({ items }: { items: MainNavItem[] }) {
  const pathname = usePathname();
  const [moreOpen, setMoreOpen] = useState(false);
  return (
    <nav aria-label="Main" className="w-full pb-1">
      {/* Phones: the everyday places in one row of big targets, the rest behind "More". */}
      <ul className="-mx-1 flex flex-wrap gap-1">
        {items.map((item) => {
          const active = isActive(pathname, item.href);
          const hiddenOnPhone = !item.primary && !active && !moreOpen;
          return (
            <li key={item.href} className={cn(hiddenOnPhone ? 'hidden md:block' : '')}>
              <Link
                href={item.href}
                aria-current={active ? 'page' : undefined}
                onClick={() => setMoreOpen(false)}
                className={cn('flex min-h-11 shrink-0 items-center gap-2 rounded-md px-3 text-sm font-semibold', active ? 'bg-ice-100 text-ice-950' : 'text-slate-200 hover:bg-slate-800')}
              >
                {item.icon}
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
  );
}
