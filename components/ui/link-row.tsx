import { ChevronRight, type LucideIcon } from 'lucide-react';
import Link from 'next/link';
import type { ReactNode } from 'react';
import { cn } from '@/lib/utils';

/** One row of a bordered list that opens a record: icon, name, a line of detail, a chevron. */
export function LinkRow({
  href,
  icon: Icon,
  title,
  detail,
  tall = false,
  truncate = false,
}: {
  href: string;
  icon: LucideIcon;
  title: ReactNode;
  detail: ReactNode;
  tall?: boolean;
  truncate?: boolean;
}) {
  return (
    <li>
      <Link href={href} className={cn('flex items-center gap-3 px-4 py-3 hover:bg-ice-50', tall ? 'min-h-16' : 'min-h-14')}>
        <Icon aria-hidden className="size-5 shrink-0 text-ice-700" />
        <span className="min-w-0 flex-1">
          <span className="block font-semibold text-slate-900">{title}</span>
          <span className={cn('block text-sm text-slate-600', truncate && 'truncate')}>{detail}</span>
        </span>
        <ChevronRight aria-hidden className="size-5 text-slate-400" />
      </Link>
    </li>
  );
}
