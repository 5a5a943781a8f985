import Link from 'next/link';
import type { ReactNode } from 'react';
import { cn } from '@/lib/utils';

/** The one text link a section may carry beside its title ("All sites"), a 44 px target. */
export function SectionLink({ href, children }: { href: string; children: ReactNode }) {
  return (
    <Link href={href} className="inline-flex min-h-11 items-center text-sm font-semibold text-ice-800 underline">
      {children}
    </Link>
  );
}

/**
 * A titled part of a page: a section named by its h2 (`id` ties them), with the section's links or
 * buttons beside the title, wrapping under it on a phone. `link` is the common case of one text
 * link to the whole list (aligned with the title's baseline); `actions` takes anything else.
 */
export function Section({
  id,
  title,
  link,
  actions: given,
  align = link ? 'end' : 'center',
  children,
}: {
  id: string;
  title: ReactNode;
  link?: { href: string; label: ReactNode };
  actions?: ReactNode;
  align?: 'center' | 'end';
  children?: ReactNode;
}) {
  const actions = link ? <SectionLink href={link.href}>{link.label}</SectionLink> : given;
  const heading = (
    <h2 id={id} className="text-lg font-semibold">
      {title}
    </h2>
  );
  return (
    <section aria-labelledby={id} className="space-y-3">
      {actions ? (
        <div className={cn('flex flex-wrap justify-between gap-2', align === 'end' ? 'items-end' : 'items-center')}>
          {heading}
          {actions}
        </div>
      ) : (
        heading
      )}
      {children}
    </section>
  );
}
