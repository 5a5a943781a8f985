import { cva, type VariantProps } from 'class-variance-authority';
import Link from 'next/link';
import type { ButtonHTMLAttributes, ComponentProps } from 'react';
import { cn } from '@/lib/utils';

// Minimum 44 px targets (48 px "large") so gloved fingers hit them. Nothing to press on paper,
// and a filled button prints as white text on white, so buttons are left out of print.
export const buttonVariants = cva(
  'inline-flex min-w-11 items-center justify-center gap-2 rounded-md font-semibold transition-colors disabled:cursor-not-allowed disabled:opacity-60 print:hidden',
  {
    variants: {
      variant: {
        primary: 'bg-ice-900 text-white hover:bg-ice-800',
        secondary: 'border border-slate-300 bg-white text-slate-900 hover:bg-slate-100',
        danger: 'bg-red-700 text-white hover:bg-red-800',
        ghost: 'text-ice-900 hover:bg-ice-50',
      },
      // "sm" is a quieter button, never a smaller target: still 44 px tall.
      size: { md: 'min-h-11 px-4 text-sm', lg: 'min-h-12 px-5 text-base', sm: 'min-h-11 px-3 text-sm' },
    },
    defaultVariants: { variant: 'primary', size: 'md' },
  },
);

type Variants = VariantProps<typeof buttonVariants>;

export function Button({ className, variant, size, type = 'button', ...props }: ButtonHTMLAttributes<HTMLButtonElement> & Variants) {
  return <button type={type} className={cn(buttonVariants({ variant, size }), className)} {...props} />;
}

export function ButtonLink({ className, variant, size, ...props }: ComponentProps<typeof Link> & Variants) {
  return <Link className={cn(buttonVariants({ variant, size }), className)} {...props} />;
}
