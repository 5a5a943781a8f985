import type { Metadata } from 'next';
import { requirePageActor } from '@/lib/auth';
import { ScanPageScanner } from '@/app/(app)/scan/_components/scan-page-scanner';

export const metadata: Metadata = { title: 'Scan' };

export default async function ScanPage() {
  await requirePageActor('/scan', 'tags.scan');
  return (
    // The scanner holds the page's heading: without signal it gives its place to the kept unit.
    <ScanPageScanner />
  );
}
