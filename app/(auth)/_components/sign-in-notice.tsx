import type { ReactNode } from 'react';
import { TextLink } from '@/components/ui/text-link';

/** A signed-out page that only tells something: its title, the text, and the way back to sign-in. */
export function SignInNotice({ title, backLabel, children }: { title: string; backLabel: string; children: ReactNode }) {
  return (
    <>
      <h1 className="mb-3 text-xl font-bold">{title}</h1>
      <p className="text-slate-700">{children}</p>
      <p className="mt-4">
        <TextLink href="/sign-in">{backLabel}</TextLink>
      </p>
    </>
  );
}
