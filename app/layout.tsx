import type { Metadata, Viewport } from 'next';
import { cookies } from 'next/headers';
import type { ReactNode } from 'react';
import './globals.css';

export const metadata: Metadata = {
  title: { default: 'Rimeline', template: '%s · Rimeline' },
  description: 'Service records for commercial refrigeration equipment.',
  icons: { icon: '/icons/icon.svg', apple: '/icons/apple-touch-icon.png' },
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1, themeColor: '#0f172a' };

export default async function RootLayout({ children }: { children: ReactNode }) {
  const contrast = (await cookies()).get('rl-contrast')?.value === 'high';
  return (
    <html lang="en" className={contrast ? 'contrast-high' : undefined}>
      <body className="min-h-screen bg-slate-50 font-sans text-slate-900 antialiased">
        {/* No app-wide providers: the query provider sits in the layouts of the pages that fetch in the browser. */}
        {children}
      </body>
    </html>
  );
}
