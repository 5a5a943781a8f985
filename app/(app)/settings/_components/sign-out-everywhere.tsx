'use client';

import { LogOut } from 'lucide-react';
import { signOut } from 'next-auth/react';
import { signOutWipe } from '@/lib/offline/user';
import { useState, useTransition } from 'react';
import { Button } from '@/components/ui/button';
import { endSessionsAction } from '@/app/(app)/settings/actions';

/**
 * Ends every session of a person on the server. For oneself this includes this browser, which
 * then signs out too; for someone else (admins) it reports how many ended.
 */
export function SignOutEverywhere({ userId, self, name }: { userId: string; self: boolean; name?: string }) {
  const [pending, start] = useTransition();
  const [result, setResult] = useState<{ ok: boolean; message: string }>();
  return (
    <div className="flex flex-wrap items-center gap-2">
      <Button
        variant="secondary"
        disabled={pending}
        aria-label={self ? undefined : `Sign ${name ?? 'this person'} out everywhere`}
        onClick={() =>
          start(async () => {
            const outcome = await endSessionsAction(userId);
            setResult(outcome);
            if (outcome.ok && self) {
              await signOutWipe().catch(() => undefined);
              await signOut({ callbackUrl: '/sign-in' });
            }
          })
        }
      >
        <LogOut aria-hidden className="size-4" />
        {pending ? 'Signing out…' : 'Sign out everywhere'}
      </Button>
      {result ? (
        <p role={result.ok ? 'status' : 'alert'} className={`text-sm font-medium ${result.ok ? 'text-slate-700' : 'text-red-700'}`}>
          {result.message}
        </p>
      ) : null}
    </div>
  );
}
