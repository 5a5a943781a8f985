'use client';

import { useRouter } from 'next/navigation';
import type { ReactNode } from 'react';

// The header's two buttons, the only parts of it that need the browser; the server renders the
// rest (components/shell/app-header.tsx), so its icons and words cost no script.

const headerButton = 'flex min-h-11 min-w-11 items-center justify-center gap-1 rounded px-2 text-sm text-slate-200 hover:bg-slate-800';

export function ContrastButton({ highContrast, children }: { highContrast: boolean; children: ReactNode }) {
  const router = useRouter();
  return (
    <button
      type="button"
      onClick={() => {
        document.cookie = `rl-contrast=${highContrast ? 'normal' : 'high'}; path=/; max-age=31536000; samesite=lax`;
        router.refresh();
      }}
      aria-pressed={highContrast}
      className={headerButton}
    >
      {children}
    </button>
  );
}

export function SignOutButton({ children }: { children: ReactNode }) {
  return (
    <button
      type="button"
      onClick={async () => {
        // The phone's kept sites and pages belong to this person: they go before the session does.
        // Both modules load on the click, so no page carries them for a button rarely pressed.
        const { signOutWipe } = await import('@/lib/offline/user');
        await signOutWipe().catch(() => undefined);
        const { signOut } = await import('next-auth/react');
        await signOut({ callbackUrl: '/sign-in' });
      }}
      className={headerButton}
    >
      {children}
    </button>
  );
}
