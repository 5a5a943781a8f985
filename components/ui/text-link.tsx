import Link from 'next/link';
import type { ComponentProps } from 'react';
import { cn } from '@/lib/utils';

/**
 * A link that reads as text but stands on its own (a "see all", a unit's name in a list, a meta line
 * of a record): it gets a 44 px tall, at least 44 px wide target. Links inside a sentence of prose
 * stay plain inline links.
 */
export const textLinkClass = 'inline-flex min-h-11 min-w-11 items-center font-semibold text-ice-800 underline underline-offset-2';

export function TextLink({ className, ...props }: ComponentProps<typeof Link>) {
  return <Link className={cn(textLinkClass, className)} {...props} />;
}
