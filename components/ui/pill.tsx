import type { LucideIcon } from 'lucide-react';
import type { HTMLAttributes, ReactNode } from 'react';
import { cn } from '@/lib/utils';

/**
 * The rounded status badge used across the app. Status is never colour alone: every pill has an
 * icon and words, and `srPrefix` tells a screen reader what the word is the value of.
 */
export function Pill({
  Icon,
  box,
  srPrefix,
  size = 'md',
  iconClassName,
  className,
  children,
  ...rest
}: {
  Icon: LucideIcon;
  /** Border, background and text colours. */
  box: string;
  srPrefix?: string;
  size?: 'md' | 'lg';
  iconClassName?: string;
  children: ReactNode;
} & HTMLAttributes<HTMLSpanElement>) {
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border font-semibold',
        size === 'lg' ? 'px-3 py-1 text-base' : 'px-2 py-0.5 text-sm',
        box,
        className,
      )}
      {...rest}
    >
      <Icon aria-hidden className={cn(size === 'lg' ? 'size-5' : 'size-4', iconClassName)} />
      {srPrefix ? <span className="sr-only">{srPrefix} </span> : null}
      {children}
    </span>
  );
}
