import type { ReactNode } from 'react';
import { SignedOutShell } from '@/components/ui/signed-out-shell';

export default function AuthLayout({ children }: { children: ReactNode }) {
  return <SignedOutShell>{children}</SignedOutShell>;
}
