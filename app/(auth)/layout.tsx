import type { ReactNode } from 'react';
import { Snowflake } from 'lucide-react';

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col bg-slate-900 px-4 py-10">
      <main className="mx-auto w-full max-w-md">
        <p className="mb-6 flex items-center gap-2 text-2xl font-bold text-white">
          <Snowflake aria-hidden className="size-7 text-ice-300" /> Rimeline
        </p>
        <div className="rounded-lg bg-white p-5 shadow-lg sm:p-6">{children}</div>
      </main>
    </div>
  );
}
