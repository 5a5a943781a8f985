import type { ReactNode } from 'react';
import { cn } from '@/lib/utils';

/**
 * A titled part of a page: a section named by its h2 (`id` ties them), with the section's links or
 * buttons beside the title, wrapping under it on a phone.
 */
export function Section({
  id,
  title,
  actions,
  align = 'center',
  children,
}: {
  id: string;
  title: ReactNode;
  actions?: ReactNode;
  align?: 'center' | 'end';
  children?: ReactNode;
}) {
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
