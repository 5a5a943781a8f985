import { cookies, headers } from 'next/headers';
import type { ReactNode } from 'react';
import { OfflineSetup } from '@/components/offline/offline-setup';
import { AppHeader } from '@/components/shell/app-header';
import { OutboxRunner } from '@/components/visits/outbox-runner';
import { requirePageActor } from '@/lib/auth';
import { navFor } from '@/lib/navigation';

export default async function AppLayout({ children }: { children: ReactNode }) {
  const path = (await headers()).get('x-rimeline-path') ?? '/';
  const actor = await requirePageActor(path);
  const highContrast = (await cookies()).get('rl-contrast')?.value === 'high';
  return (
    <>
      <AppHeader items={navFor(actor.role)} name={actor.name} role={actor.role} highContrast={highContrast} />
      <OfflineSetup userId={actor.id} />
      {actor.role !== 'client' ? <OutboxRunner /> : null}
      <main id="main" className="mx-auto max-w-6xl px-3 py-5 sm:px-6 sm:py-8">
        {children}
      </main>
    </>
  );
}
