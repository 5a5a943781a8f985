import { Snowflake } from 'lucide-react';
import type { ReactNode } from 'react';
import { cn } from '@/lib/utils';

/** The page around what a signed-out person sees (sign-in, invitations, a scanned tag): the name over one white card. */
export function SignedOutShell({ children, className }: { children: ReactNode; className?: string }) {
  return (
    <div className="flex min-h-screen flex-col bg-slate-900 px-4 py-10">
      <main className="mx-auto w-full max-w-md">
        <p className="mb-6 flex items-center gap-2 text-2xl font-bold text-white">
          <Snowflake aria-hidden className="size-7 text-ice-300" /> Rimeline
        </p>
        <div className={cn('rounded-lg bg-white p-5 shadow-lg sm:p-6', className)}>{children}</div>
      </main>
    </div>
  );
}
